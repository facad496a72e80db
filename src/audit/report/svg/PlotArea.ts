/** A chart's size in SVG user units and the margins around its plotting area. */
export interface PlotArea {
  width: number;
  height: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
}

/** The plotting area's edges: x from `x0` to `x1`, y from `y0` (top) to `y1` (bottom). */
export function plotEdges(area: PlotArea): { x0: number; x1: number; y0: number; y1: number } {
  return { x0: area.left, x1: area.width - area.right, y0: area.top, y1: area.height - area.bottom };
}

/** Chart width in SVG user units: the printable width of an A4 page (210 mm less 2 × 14 mm) at 96 dpi. */
export const CHART_WIDTH = 680;
