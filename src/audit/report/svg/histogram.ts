import { linearScale, niceTicks, zeroAxis } from './axis.js';
import { bottomAxis, leftAxis, leftMarginFor } from './axisMarkup.js';
import { chartSvg } from './chartSvg.js';
import { hatchPattern } from './hatchPattern.js';
import { legendMarkup } from './legendMarkup.js';
import { MARKER_ROW, markerMarkup, markerRows, scaleAttribute } from './markerMarkup.js';
import { PALETTE } from './palette.js';
import { CHART_WIDTH, plotEdges, type PlotArea } from './PlotArea.js';
import { svgTag } from './svgTag.js';
import type { VerticalMarker } from './VerticalMarker.js';

/** One bar: whole values `from`…`to` (inclusive), split into a `base` part and an `over` part stacked on it. */
export interface HistogramBin {
  from: number;
  to: number;
  base: number;
  over: number;
}

/** A histogram of whole values with a two-part stack per bar (e.g. kept and truncated documents). */
export interface HistogramSpec {
  id: string;
  title: string;
  description: string;
  bins: readonly HistogramBin[];
  xTitle: string;
  yTitle: string;
  format: (value: number) => string;
  baseName: string;
  overName: string;
  markers: readonly VerticalMarker[];
}

/**
 * Renders a {@link HistogramSpec}: bars centred on whole values (a bin spans from - 0.5 to to + 0.5),
 * the `over` part hatched in a second colour. Non-empty bars are at least one unit high, so a long thin
 * tail stays visible.
 */
export function histogram(spec: HistogramSpec): string {
  const first = spec.bins[0];
  const last = spec.bins[spec.bins.length - 1];
  const dMin = (first?.from ?? 0) - 0.5;
  const dMax = (last?.to ?? 1) + 0.5;
  const markers = spec.markers.filter((m) => m.x >= dMin && m.x <= dMax);
  let yTop = 0;
  for (const bin of spec.bins) yTop = Math.max(yTop, bin.base + bin.over);
  const yAxis = zeroAxis(yTop);
  const yTicks = yAxis.ticks.map((v) => ({ value: v, label: spec.format(v) }));
  const base: PlotArea = { width: CHART_WIDTH, height: 300, left: leftMarginFor(yTicks), right: 24, top: 36, bottom: 46 };
  const probe = plotEdges(base);
  const rows = markerRows(markers, linearScale(dMin, dMax, probe.x0, probe.x1), 2, probe.x1 + base.right - 2);
  const area: PlotArea = { ...base, top: base.top + rows * MARKER_ROW, height: base.height + rows * MARKER_ROW };
  const { x0, x1, y0, y1 } = plotEdges(area);
  const x = linearScale(dMin, dMax, x0, x1);
  const y = linearScale(0, yAxis.top, y1, y0);

  const overFill = `${spec.id}-over`;
  const defs = hatchPattern(overFill, PALETTE.accent, PALETTE.accentLight);
  const xTicks = niceTicks(Math.max(0, dMin), dMax, 8).filter((v) => Number.isInteger(v));
  let body = leftAxis(area, y, yTicks, spec.yTitle);
  let bars = '';
  for (const bin of spec.bins) {
    const left = x(bin.from - 0.5);
    const full = x(bin.to + 0.5) - left;
    const width = full > 3 ? full - 0.6 : Math.max(0.5, full);
    const total = bin.base + bin.over;
    if (total === 0) continue;
    const top = Math.min(y(total), y1 - 1);
    const split = bin.over === 0 ? top : bin.base === 0 ? y1 : Math.min(y(bin.base), y1 - 0.5);
    if (bin.base > 0) bars += svgTag('rect', { x: left, y: split, width, height: y1 - split, fill: PALETTE.primary });
    if (bin.over > 0) bars += svgTag('rect', { x: left, y: top, width, height: Math.max(0.5, split - top), fill: `url(#${overFill})`, stroke: PALETTE.accent, 'stroke-width': 0.5 });
  }
  body += svgTag('g', { class: 'bars' }, bars);
  body += bottomAxis(area, x, xTicks.map((v) => ({ value: v, label: spec.format(v) })), spec.xTitle);
  body += markerMarkup(markers, x, y, { y0, y1, minX: 2, maxX: x1 + area.right - 2 }, { 'data-x-scale': scaleAttribute('linear', dMin, dMax, x0, x1) });
  body += legendMarkup(
    [
      { name: spec.baseName, fill: PALETTE.primary, stroke: PALETTE.primary },
      { name: spec.overName, fill: `url(#${overFill})`, stroke: PALETTE.accent },
    ],
    x0,
    14,
  );
  return chartSvg({ id: spec.id, width: area.width, height: area.height, title: spec.title, description: spec.description, defs, body });
}
