import { PALETTE } from './palette.js';
import { plotEdges, type PlotArea } from './PlotArea.js';
import type { Scale } from './axis.js';
import { labelWidth } from './placeLabels.js';
import { svgTag, svgText } from './svgTag.js';

/** A labelled tick: its value on the axis and the text written beside it. */
export interface Tick {
  value: number;
  label: string;
}

/** The horizontal axis at the bottom of the plot: line, ticks, labels, optional grid and its title. */
export function bottomAxis(area: PlotArea, scale: Scale, ticks: readonly Tick[], title: string, options: { minor?: readonly number[]; grid?: boolean } = {}): string {
  const { x0, x1, y0, y1 } = plotEdges(area);
  let out = '';
  for (const value of options.minor ?? []) {
    const x = scale(value);
    out += svgTag('line', { x1: x, x2: x, y1: y1, y2: y1 + 3, stroke: PALETTE.muted, 'stroke-width': 0.75 });
  }
  for (const tick of ticks) {
    const x = scale(tick.value);
    if (options.grid === true) out += svgTag('line', { x1: x, x2: x, y1: y0, y2: y1, stroke: PALETTE.grid, 'stroke-width': 1 });
    out += svgTag('line', { x1: x, x2: x, y1: y1, y2: y1 + 5, stroke: PALETTE.ink, 'stroke-width': 1 });
    out += svgText({ x, y: y1 + 17, 'text-anchor': 'middle', class: 'tick' }, tick.label);
  }
  out += svgTag('line', { x1: x0, x2: x1, y1: y1, y2: y1, stroke: PALETTE.ink, 'stroke-width': 1 });
  out += svgText({ x: (x0 + x1) / 2, y: area.height - 8, 'text-anchor': 'middle', class: 'axis-title' }, title);
  return svgTag('g', { class: 'axis axis-x' }, out);
}

/** The left margin a vertical axis needs for its title and its widest tick label. */
export function leftMarginFor(ticks: readonly Tick[]): number {
  let widest = 0;
  for (const tick of ticks) widest = Math.max(widest, labelWidth(tick.label));
  return Math.ceil(34 + widest);
}

/** The vertical axis at the left of the plot: line, ticks, labels, horizontal grid lines and its title. */
export function leftAxis(area: PlotArea, scale: Scale, ticks: readonly Tick[], title: string): string {
  const { x0, x1, y0, y1 } = plotEdges(area);
  let out = '';
  for (const tick of ticks) {
    const y = scale(tick.value);
    out += svgTag('line', { x1: x0, x2: x1, y1: y, y2: y, stroke: PALETTE.grid, 'stroke-width': 1 });
    out += svgTag('line', { x1: x0 - 5, x2: x0, y1: y, y2: y, stroke: PALETTE.ink, 'stroke-width': 1 });
    out += svgText({ x: x0 - 8, y: y + 4, 'text-anchor': 'end', class: 'tick' }, tick.label);
  }
  out += svgTag('line', { x1: x0, x2: x0, y1: y0, y2: y1, stroke: PALETTE.ink, 'stroke-width': 1 });
  const cy = (y0 + y1) / 2;
  out += svgText({ x: 14, y: cy, 'text-anchor': 'middle', class: 'axis-title', transform: `rotate(-90 14 ${String(Math.round(cy))})` }, title);
  return svgTag('g', { class: 'axis axis-y' }, out);
}
