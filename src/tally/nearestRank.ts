/**
 * The p-th percentile (0 < p <= 100) of a multiset given as a histogram value -> count, by the
 * nearest-rank method: the smallest value whose cumulative count reaches ceil(p/100 * N).
 * p = 0 gives the minimum. Returns 0 for an empty histogram.
 * @example nearestRank(new Map([[15, 1], [20, 1], [35, 1], [40, 1], [50, 1]]), 40) // 20
 */
export function nearestRank(histogram: ReadonlyMap<number, number>, p: number): number {
  const values = [...histogram.keys()].sort((a, b) => a - b);
  let total = 0;
  for (const v of values) total += histogram.get(v) ?? 0;
  if (total === 0) return 0;
  const rank = Math.max(1, Math.ceil((p / 100) * total));
  let seen = 0;
  for (const v of values) {
    seen += histogram.get(v) ?? 0;
    if (seen >= rank) return v;
  }
  return values[values.length - 1] ?? 0;
}

/** The length summary lexlock reports everywhere: min, p50, p90, p95, p99, max (nearest-rank). */
export interface LengthSummary {
  min: number;
  p50: number;
  p90: number;
  p95: number;
  p99: number;
  max: number;
}

/** Summarizes a length histogram with {@link nearestRank}.
 */
export function summarizeLengths(histogram: ReadonlyMap<number, number>): LengthSummary {
  return {
    min: nearestRank(histogram, 0),
    p50: nearestRank(histogram, 50),
    p90: nearestRank(histogram, 90),
    p95: nearestRank(histogram, 95),
    p99: nearestRank(histogram, 99),
    max: nearestRank(histogram, 100),
  };
}
