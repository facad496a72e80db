/** A label wanted beside a vertical marker line at a horizontal position. */
export interface LabelRequest {
  x: number;
  text: string;
}

/**
 * A placed label: `row` counts up from the plot's top edge (0 = nearest), `anchor` says on which side
 * of its line the text runs, from `textX`. A marker's line rises from the plot to its label's row.
 */
export interface PlacedLabel extends LabelRequest {
  row: number;
  anchor: 'start' | 'end';
  textX: number;
}

/** How far (SVG units) a marker line must pass from the end of another marker's label text. */
export const LINE_CLEARANCE = 1;

/** Width of a label in SVG user units, estimated from its length at the report's 11-unit font. */
export function labelWidth(text: string, charWidth = 6.6): number {
  return [...text].length * charWidth;
}

/**
 * Places labels in rows above a plot, in request order (earlier ones nearer the plot): on the lowest
 * row and side where the text stays within [minX, maxX] (if either side can), overlaps no label, is
 * crossed by no other marker's line and its own line crosses no label below it; when no row allows
 * that, the rules relax step by step (see `Tier`).
 */
export function placeLabels(requests: readonly LabelRequest[], minX: number, maxX: number, gap = 6): PlacedLabel[] {
  const placed: Array<PlacedLabel & { from: number; to: number }> = [];
  requests.forEach((request, index) => {
    const later = requests.slice(index + 1).map((r) => r.x);
    const width = labelWidth(request.text);
    const both = (['start', 'end'] as const).map((anchor): Side => {
      const textX = anchor === 'start' ? request.x + 4 : request.x - 4;
      const from = anchor === 'start' ? textX : textX - width;
      return { anchor, textX, from, to: from + width };
    });
    const inside = both.filter((s) => s.from >= minX && s.to <= maxX);
    const sides = inside.length > 0 ? inside : both;
    const crosses = (x: number, side: Side): boolean => x >= side.from - LINE_CLEARANCE && x <= side.to + LINE_CLEARANCE;
    const fits = (row: number, side: Side, tier: Tier): boolean =>
      !(tier === 'wary' && later.some((x) => crosses(x, side))) &&
      !placed.some(
        (p) =>
          (p.row === row && side.to + gap > p.from && side.from < p.to + gap) ||
          (tier !== 'loose' && p.row > row && crosses(p.x, side)) ||
          (tier !== 'loose' && p.row < row && crosses(request.x, p)),
      );
    placed.push(firstFit(request, sides, fits, placed.length));
  });
  return placed.map(({ x, text, row, anchor, textX }) => ({ x, text, row, anchor, textX }));
}

/** A side's text span and anchor. */
interface Side {
  anchor: 'start' | 'end';
  textX: number;
  from: number;
  to: number;
}

/**
 * How hard a label avoids lines: `wary` also keeps clear of markers not placed yet (their lines may
 * rise past it), `strict` only of placed ones, `loose` only avoids labels on its own row.
 */
type Tier = 'wary' | 'strict' | 'loose';

/**
 * The lowest row and side that fits at the hardest tier that can; a row above all `placedCount`
 * labels is always free at the `loose` tier, so the last loop ends.
 */
function firstFit(
  request: LabelRequest,
  sides: readonly Side[],
  fits: (row: number, side: Side, tier: Tier) => boolean,
  placedCount: number,
): PlacedLabel & { from: number; to: number } {
  for (const tier of ['wary', 'strict'] as const) {
    for (let row = 0; row <= placedCount; row++) {
      const side = sides.find((s) => fits(row, s, tier));
      if (side !== undefined) return { ...request, row, ...side };
    }
  }
  for (let row = 0; ; row++) {
    const side = sides.find((s) => fits(row, s, 'loose'));
    if (side !== undefined) return { ...request, row, ...side };
  }
}
