import { labelWidth } from './placeLabels.js';
import { svgTag, svgText } from './svgTag.js';

/** One legend entry: a swatch filled with `fill` (a colour or `url(#pattern)`) and its name. */
export interface LegendEntry {
  name: string;
  fill: string;
  stroke: string;
}

/** A one-line legend starting at (x, y): swatch, name, swatch, name… */
export function legendMarkup(entries: readonly LegendEntry[], x: number, y: number): string {
  let out = '';
  let at = x;
  for (const entry of entries) {
    out += svgTag('rect', { x: at, y: y - 9, width: 14, height: 10, fill: entry.fill, stroke: entry.stroke, 'stroke-width': 1 });
    out += svgText({ x: at + 19, y, class: 'legend' }, entry.name);
    at += 19 + labelWidth(entry.name) + 18;
  }
  return svgTag('g', { class: 'legend' }, out);
}
