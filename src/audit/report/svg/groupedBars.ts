import { escapeHtml } from '../escapeHtml.js';
import { linearScale, zeroAxis } from './axis.js';
import { bottomAxis } from './axisMarkup.js';
import { chartSvg } from './chartSvg.js';
import { hatchPattern } from './hatchPattern.js';
import { legendMarkup } from './legendMarkup.js';
import { PALETTE } from './palette.js';
import { labelWidth } from './placeLabels.js';
import { CHART_WIDTH, plotEdges, type PlotArea } from './PlotArea.js';
import { shortNames } from './shortNames.js';
import { svgTag, svgText } from './svgTag.js';

/** One series of bars: its legend name, a short tag written before each value, and its look. */
export interface BarSeries {
  name: string;
  tag: string;
  colour: string;
  /** Hatched (striped) instead of solid, so series differ by more than colour. */
  hatched: boolean;
}

/** One group of bars (e.g. a label): its name, an optional note under it, one value per series. */
export interface BarGroup {
  name: string;
  note?: string;
  values: readonly number[];
}

/** Horizontal bars, one group per row, one bar per series in each group, values written at bar ends. */
export interface GroupedBarsSpec {
  id: string;
  title: string;
  description: string;
  series: readonly BarSeries[];
  groups: readonly BarGroup[];
  xTitle: string;
  /** Formats the values written at bar ends. */
  format: (value: number) => string;
  /** Formats axis ticks; defaults to `format`. */
  tickFormat?: (value: number) => string;
  /** The axis's top value before rounding up; defaults to the largest value. */
  max?: number;
}

const BAR = 12;
const BAR_GAP = 3;
const GROUP_GAP = 14;
const NAME_CHARS = 24;

/** Renders a {@link GroupedBarsSpec} as an accessible SVG. */
export function groupedBars(spec: GroupedBarsSpec): string {
  const names = shortNames(spec.groups.map((g) => g.name), NAME_CHARS);
  let longest = 4;
  spec.groups.forEach((group, g) => {
    longest = Math.max(longest, labelWidth(names[g] ?? ''), labelWidth(group.note ?? ''));
  });
  const groupHeight = spec.series.length * (BAR + BAR_GAP) - BAR_GAP + GROUP_GAP;
  const top = 34;
  const bottom = 46;
  const area: PlotArea = {
    width: CHART_WIDTH,
    height: top + spec.groups.length * groupHeight + bottom,
    left: Math.min(200, Math.ceil(longest) + 18),
    right: 86,
    top,
    bottom,
  };
  const { x0, x1, y0 } = plotEdges(area);
  let dataMax = spec.max ?? 0;
  for (const group of spec.groups) for (const v of group.values) dataMax = Math.max(dataMax, v);
  const xAxis = zeroAxis(dataMax);
  const x = linearScale(0, xAxis.top, x0, x1);
  const defs = spec.series.map((s, i) => (s.hatched ? hatchPattern(`${spec.id}-s${String(i)}`, s.colour, '#ffffff') : '')).join('');
  const fillOf = (i: number, s: BarSeries): string => (s.hatched ? `url(#${spec.id}-s${String(i)})` : s.colour);

  let body = bottomAxis(area, x, xAxis.ticks.map((v) => ({ value: v, label: (spec.tickFormat ?? spec.format)(v) })), spec.xTitle, { grid: true });
  spec.groups.forEach((group, g) => {
    const gy = y0 + GROUP_GAP / 2 + g * groupHeight;
    const middle = gy + (groupHeight - GROUP_GAP) / 2;
    let row = svgTag('title', {}, escapeHtml(group.name));
    const nameY = group.note === undefined ? middle + 4 : middle - 1;
    row += svgText({ x: x0 - 8, y: nameY, 'text-anchor': 'end', class: 'group-name' }, names[g] ?? group.name);
    if (group.note !== undefined) row += svgText({ x: x0 - 8, y: middle + 11, 'text-anchor': 'end', class: 'group-note' }, group.note);
    spec.series.forEach((series, i) => {
      const value = group.values[i] ?? 0;
      const by = gy + i * (BAR + BAR_GAP);
      const width = Math.max(value > 0 ? 1 : 0, x(value) - x0);
      row += svgTag('rect', { x: x0, y: by, width, height: BAR, fill: fillOf(i, series), stroke: series.colour, 'stroke-width': 1 });
      row += svgText({ x: x0 + width + 4, y: by + BAR - 2, class: 'bar-value' }, `${series.tag} ${spec.format(value)}`);
    });
    body += svgTag('g', { class: 'bar-group' }, row);
  });
  body += legendMarkup(
    spec.series.map((s, i) => ({ name: s.name, fill: fillOf(i, s), stroke: s.colour })),
    8,
    16,
  );
  return chartSvg({ id: spec.id, width: area.width, height: area.height, title: spec.title, description: spec.description, defs, body });
}

