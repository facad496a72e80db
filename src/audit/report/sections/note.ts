import { escapeHtml } from '../escapeHtml.js';

/** A short paragraph of escaped text, e.g. why a chart is missing. */
export function note(text: string): string {
  return `<p class="note">${escapeHtml(text)}</p>`;
}
