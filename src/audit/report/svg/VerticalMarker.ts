/**
 * A vertical line across a chart at data value `x` with a label above the plot: `chosen` is drawn
 * strong (the setting in use), `suggestion` light and dashed. `y`, when given, adds a dot on the line.
 */
export interface VerticalMarker {
  x: number;
  y?: number;
  label: string;
  kind: 'chosen' | 'suggestion';
  /** A name the page's script finds the marker by (`data-live` on its label, line and dot) to move it. */
  live?: string;
}
