/**
 * The nearest-rank percentile `p` (0-100) of values sorted ascending; 0 for no values.
 * @example percentile([1, 2, 3, 4], 50) // 2
 */
export function percentile(sorted: ArrayLike<number>, p: number): number {
  if (sorted.length === 0) return 0;
  const rank = Math.max(1, Math.ceil((p / 100) * sorted.length));
  return sorted[rank - 1] ?? 0;
}
