import { extent, linearScale, logScale, logTicks, niceTicks } from './axis.js';
import { bottomAxis, leftAxis, leftMarginFor } from './axisMarkup.js';
import { chartSvg } from './chartSvg.js';
import { MARKER_ROW, markerMarkup, markerRows, scaleAttribute } from './markerMarkup.js';
import { PALETTE } from './palette.js';
import { CHART_WIDTH, plotEdges, type PlotArea } from './PlotArea.js';
import { px, svgTag } from './svgTag.js';
import type { VerticalMarker } from './VerticalMarker.js';

/** A line chart: points in x order, axes with titles, an optional log x axis and vertical markers. */
export interface LineChartSpec {
  id: string;
  title: string;
  description: string;
  points: ReadonlyArray<{ x: number; y: number }>;
  xTitle: string;
  yTitle: string;
  /** Log-10 x axis; points and markers with x <= 0 are left out. */
  xLog: boolean;
  xFormat: (value: number) => string;
  /** The x range shown; defaults to the points' extent. */
  xDomain?: readonly [number, number];
  y: { min: number; max: number; format: (value: number) => string };
  markers: readonly VerticalMarker[];
}

/** Renders a {@link LineChartSpec} as an accessible SVG, the curve over a light fill. */
export function lineChart(spec: LineChartSpec): string {
  const points = spec.xLog ? spec.points.filter((p) => p.x > 0) : [...spec.points];
  const [xMin, xMax] = spec.xDomain ?? extent(points.map((p) => p.x)) ?? [1, 10];
  const markers = spec.markers.filter((m) => m.x >= xMin && m.x <= xMax);
  const yTicks = niceTicks(spec.y.min, spec.y.max, 5).map((v) => ({ value: v, label: spec.y.format(v) }));
  const base: PlotArea = { width: CHART_WIDTH, height: 300, left: leftMarginFor(yTicks), right: 24, top: 16, bottom: 46 };
  const probe = plotEdges(base);
  const xScaleFor = (x0: number, x1: number): ((v: number) => number) =>
    spec.xLog ? logScale(xMin, xMax, x0, x1) : linearScale(xMin, xMax, x0, x1);
  const rows = markerRows(markers, xScaleFor(probe.x0, probe.x1), 2, probe.x1 + base.right - 2);
  const area: PlotArea = { ...base, top: base.top + rows * MARKER_ROW, height: base.height + rows * MARKER_ROW };
  const { x0, x1, y0, y1 } = plotEdges(area);
  const x = xScaleFor(x0, x1);
  const y = linearScale(spec.y.min, spec.y.max, y1, y0);

  const xTicks = spec.xLog ? logTicks(xMin, xMax) : { major: niceTicks(xMin, xMax, 6), minor: [] };
  let body = leftAxis(area, y, yTicks, spec.yTitle);
  body += bottomAxis(area, x, xTicks.major.map((v) => ({ value: v, label: spec.xFormat(v) })), spec.xTitle, { minor: xTicks.minor, grid: true });
  if (points.length > 0) {
    const line = points.map((p, i) => `${i === 0 ? 'M' : 'L'}${px(x(p.x))} ${px(y(p.y))}`).join(' ');
    const first = points[0];
    const last = points[points.length - 1];
    if (first !== undefined && last !== undefined) {
      const fill = `${line} L${px(x(last.x))} ${px(y1)} L${px(x(first.x))} ${px(y1)} Z`;
      body += svgTag('path', { d: fill, fill: PALETTE.primaryLight, 'fill-opacity': 0.6, stroke: 'none' });
    }
    body += svgTag('path', { d: line, fill: 'none', stroke: PALETTE.primary, 'stroke-width': 2.25, 'stroke-linejoin': 'round', class: 'series' });
  }
  body += markerMarkup(markers, x, y, { y0, y1, minX: 2, maxX: x1 + area.right - 2 }, {
    'data-x-scale': scaleAttribute(spec.xLog ? 'log' : 'linear', xMin, xMax, x0, x1),
    'data-y-scale': scaleAttribute('linear', spec.y.min, spec.y.max, y1, y0),
  });
  return chartSvg({ id: spec.id, width: area.width, height: area.height, title: spec.title, description: spec.description, body });
}
