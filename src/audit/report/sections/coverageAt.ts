/**
 * The covered share at `cap` read off a coverage curve: the share of the last point whose cap is at
 * most `cap` (the curve is a step function of the cap), or 0 before the first point.
 */
export function coverageAt(curve: ReadonlyArray<{ cap: number; share: number }>, cap: number): number {
  let share = 0;
  let best = -Infinity;
  for (const point of curve) {
    if (point.cap <= cap && point.cap >= best) {
      best = point.cap;
      share = point.share;
    }
  }
  return share;
}
