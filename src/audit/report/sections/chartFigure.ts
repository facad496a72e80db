import { escapeHtml } from '../escapeHtml.js';

/**
 * A `<figure>` with a visible chart title, the chart's SVG and a caption (`caption` is escaped text).
 * @example chartFigure('Coverage by cap', svg, 'Bins of 10 tokens.')
 */
export function chartFigure(title: string, svg: string, caption: string): string {
  return `<figure class="chart-figure"><h3 class="chart-title">${escapeHtml(title)}</h3>${svg}<figcaption>${escapeHtml(caption)}</figcaption></figure>`;
}
