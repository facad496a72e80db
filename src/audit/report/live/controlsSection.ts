import type { PageData } from '../../explore/PageData.js';
import { stopsOf } from '../../explore/StopGrid.js';
import { escapeHtml } from '../escapeHtml.js';
import { formatCount } from '../formatCount.js';

/** The words of the `lexlock build` line for a cap and a length (null: none set), as the page's script writes them. */
export function buildLineWords(data: PageData, cap: number, length: number | null): string[] {
  const shape = length === null ? [] : ['--length', String(length), '--pad', data.pad, '--cut', data.cut];
  return ['lexlock', 'build', ...data.build.head, '--cap', String(cap), ...shape, ...data.build.tail];
}

/**
 * The build line's words as the page shows them: each in a span kept on one line (a browser would
 * otherwise break a flag after its hyphen), spaces between; the text is the line itself.
 */
export function buildLineMarkup(words: readonly string[]): string {
  return words.map((w) => `<span>${escapeHtml(w)}</span>`).join(' ');
}

/** The index of the stop nearest a value (the lower of two as near). */
function nearest(stops: readonly number[], value: number): number {
  let best = 0;
  stops.forEach((s, i) => {
    if (Math.abs(s - value) < Math.abs((stops[best] as number) - value)) best = i;
  });
  return best;
}

/** What the cap control's stops are, in words: exact everywhere, or where the steps begin. */
function capStopsNote(data: PageData): string {
  const g = data.cap.grid;
  const basis =
    data.ranking === 'corpus'
      ? "Caps rank this corpus's tokens as lexlock build would (count, then string order)."
      : "Caps keep the lexicon's first tokens in its own order (reserved tokens always): what this corpus would lose with a smaller lexicon.";
  if (g.step === 1) return `${basis} Every cap from 1 to ${formatCount(g.last)} is exact.`;
  const extra = g.extra.length === 0 ? '' : ` and at ${g.extra.map((e) => formatCount(e)).join(', ')} (the audited cap)`;
  return `${basis} Caps above ${formatCount(g.exactTo)} move in steps of ${formatCount(g.step)}${extra}, up to ${formatCount(g.last)}: every figure is exact at each stop.`;
}

function lengthStopsNote(data: PageData): string {
  const g = data.length.grid;
  if (g.step === 1) return `Every length from 1 to ${formatCount(g.last)} is exact.`;
  return `Lengths above ${formatCount(g.exactTo)} move in steps of ${formatCount(g.step)}, up to ${formatCount(g.last)}: every figure is exact at each stop.`;
}

/** A range slider and a number box for one setting, labelled, keyboard accessible (arrow keys move one stop). */
function control(id: string, name: string, stops: readonly number[], at: number): string {
  const value = stops[at] ?? 0;
  return (
    `<div class="control"><label for="${id}-range">${escapeHtml(name)}</label>` +
    `<input type="range" id="${id}-range" min="1" max="${Math.max(1, stops.length - 1)}" step="1" value="${at}" aria-valuetext="${escapeHtml(`${id} ${formatCount(value)}`)}">` +
    `<input type="number" id="${id}-number" aria-label="${escapeHtml(name)}, exact value" min="1" max="${stops[stops.length - 1] ?? 1}" step="1" value="${value}"></div>`
  );
}

/**
 * The section that lets a reader try other caps and lengths: the two controls (hidden until the
 * page's script shows them, so a page whose script is blocked, or a printout, shows the audited cap
 * and length only), where their stops are, and the `lexlock build` line for the chosen pair.
 */
export function controlsSection(data: PageData, fallbackLength: number): string {
  const capStops = stopsOf(data.cap.grid);
  const lengthStops = stopsOf(data.length.grid);
  const capAt = Math.max(1, nearest(capStops, data.cap.chosen));
  const lengthAt = Math.max(1, nearest(lengthStops, data.length.chosen ?? fallbackLength));
  const leftOut =
    data.labelsLeftOut === 0 ? '' : ` The ${formatCount(data.labelsLeftOut)} labels with the fewest documents keep the audited figures (the page holds the figures of ${formatCount(data.labels.length)}).`;
  return [
    '<section id="explore">',
    '<h2>Try another cap and length</h2>',
    '<div id="controls" class="controls" hidden>',
    control('cap', 'Vocabulary cap (tokens kept)', capStops, capAt),
    control('length', 'Sequence length (tokens per row)', lengthStops, lengthAt),
    `<p class="note">${escapeHtml(capStopsNote(data))} ${escapeHtml(lengthStopsNote(data))}</p>`,
    `<p class="note">The controls move the summary's OOV, truncation, dropped and padding figures, the OOV rate, truncated share, dropped tokens and padding share of each label, and the chosen markers of the coverage chart and the length histogram; the other charts and tables stay at the audited cap and length.${escapeHtml(leftOut)}</p>`,
    '</div>',
    '<p class="note" id="controls-off">This page shows the audited cap and length; open it in a browser that runs its script to try others.</p>',
    `<p class="build-line">To build a lexicon with these settings: <code id="build-line">${buildLineMarkup(buildLineWords(data, data.cap.chosen, data.length.chosen))}</code></p>`,
    '</section>',
  ].join('\n');
}
