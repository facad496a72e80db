import { PALETTE } from './palette.js';
import { placeLabels, type LabelRequest } from './placeLabels.js';
import { svgTag, svgText } from './svgTag.js';
import type { VerticalMarker } from './VerticalMarker.js';

/** Height of one row of marker labels above a plot. */
export const MARKER_ROW = 14;

/** Suggestion lines closer than this (SVG units) share one label. */
const SAME_PLACE = 8;

/** A label and the marker kind it stands for. */
interface MarkerLabel extends LabelRequest {
  kind: VerticalMarker['kind'];
  live?: string | undefined;
}

/**
 * The labels to place, suggestions first (short, nearest the plot), then chosen markers, whose
 * longer labels go above them. Suggestions at nearly the same place share one label ("90 % · 95 %").
 */
function markerLabels(markers: readonly VerticalMarker[], position: (x: number) => number): MarkerLabel[] {
  const suggestions = markers
    .filter((m) => m.kind === 'suggestion')
    .map((m) => ({ x: position(m.x), text: m.label }))
    .sort((a, b) => a.x - b.x);
  const merged: MarkerLabel[] = [];
  let lastX = -Infinity;
  for (const s of suggestions) {
    const previous = merged[merged.length - 1];
    if (previous !== undefined && s.x - lastX < SAME_PLACE) previous.text += ` · ${s.text}`;
    else merged.push({ ...s, kind: 'suggestion' });
    lastX = s.x;
  }
  const chosen = markers.filter((m) => m.kind === 'chosen').map((m): MarkerLabel => ({ x: position(m.x), text: m.label, kind: 'chosen', live: m.live }));
  return [...merged, ...chosen];
}

/** How many label rows the markers need above a plot, once placed within [minX, maxX]. */
export function markerRows(markers: readonly VerticalMarker[], position: (x: number) => number, minX: number, maxX: number): number {
  return placeLabels(markerLabels(markers, position), minX, maxX).reduce((rows, p) => Math.max(rows, p.row + 1), 0);
}

/**
 * Marker lines from `y1` up to their labels, which sit in rows above `y0` (row 0 just above it).
 * `yPosition` maps a marker's `y` to a pixel row for its dot. `scales` (attributes of the markers'
 * group) tell the page's script how to place a moved marker: see {@link scaleAttribute}.
 */
export function markerMarkup(
  markers: readonly VerticalMarker[],
  position: (x: number) => number,
  yPosition: (y: number) => number,
  edges: { y0: number; y1: number; minX: number; maxX: number },
  scales: Record<string, string> = {},
): string {
  const labels = markerLabels(markers, position);
  const placed = placeLabels(labels, edges.minX, edges.maxX);
  /** The label row a marker's line rises to: its own label's, or the shared one's nearest it. */
  const rowOf = (marker: VerticalMarker): number => {
    const x = position(marker.x);
    let best: { row: number; distance: number } = { row: 0, distance: Infinity };
    placed.forEach((p, i) => {
      if (labels[i]?.kind !== marker.kind) return;
      const distance = Math.abs(p.x - x);
      if (distance < best.distance) best = { row: p.row, distance };
    });
    return best.row;
  };
  let lines = '';
  for (const marker of [...markers].sort((a, b) => (a.kind === b.kind ? 0 : a.kind === 'chosen' ? 1 : -1))) {
    const strong = marker.kind === 'chosen';
    const x = position(marker.x);
    const top = edges.y0 - rowOf(marker) * MARKER_ROW - 13;
    lines += svgTag('line', {
      x1: x,
      x2: x,
      y1: top,
      y2: edges.y1,
      stroke: strong ? PALETTE.ink : PALETTE.suggestion,
      'stroke-width': strong ? 2 : 1,
      'stroke-dasharray': strong ? undefined : '4 3',
      'data-live-line': marker.live,
    });
    if (marker.y !== undefined) {
      lines += svgTag('circle', { cx: x, cy: yPosition(marker.y), r: strong ? 4 : 2.5, fill: strong ? PALETTE.ink : PALETTE.suggestion, stroke: '#ffffff', 'stroke-width': 1, 'data-live-dot': marker.live });
    }
  }
  let texts = '';
  placed.forEach((p, i) => {
    const strong = labels[i]?.kind === 'chosen';
    texts += svgText(
      { x: p.textX, y: edges.y0 - p.row * MARKER_ROW - 4, 'text-anchor': p.anchor, class: strong ? 'marker marker-chosen' : 'marker marker-suggestion', 'data-live': labels[i]?.live },
      p.text,
    );
  });
  return svgTag('g', { class: 'markers', ...scales }, lines + texts);
}

/**
 * A scale as the page's script reads it: `log` or `linear`, the domain's ends, the range's ends
 * (pixels), space-separated.
 * @example scaleAttribute('log', 1, 1000, 60, 650) // 'log 1 1000 60 650'
 */
export function scaleAttribute(kind: 'log' | 'linear', d0: number, d1: number, r0: number, r1: number): string {
  return `${kind} ${d0} ${d1} ${r0} ${r1}`;
}
