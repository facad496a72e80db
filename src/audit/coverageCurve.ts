/** How many points a coverage curve has at most (plus the caps that must appear on it). */
const POINTS = 240;

/**
 * The coverage curve of counts in rank order: at each cap, the share of `total` the top `cap` tokens
 * cover. Every cap up to {@link POINTS} types, log-spaced caps beyond, always the last one and `extra`
 * caps (e.g. the chosen cap) when they are within range.
 */
export function coverageCurve(rankedCounts: ArrayLike<number>, total: number, extra: readonly number[] = []): Array<{ cap: number; share: number }> {
  const n = rankedCounts.length;
  const caps = new Set<number>();
  if (n <= POINTS) {
    for (let c = 1; c <= n; c++) caps.add(c);
  } else {
    for (let i = 0; i < POINTS; i++) caps.add(Math.max(1, Math.round(Math.exp((Math.log(n) * i) / (POINTS - 1)))));
    caps.add(n);
  }
  for (const c of extra) if (c >= 1 && c <= n) caps.add(c);
  const sorted = [...caps].sort((a, b) => a - b);
  const out: Array<{ cap: number; share: number }> = [];
  let covered = 0;
  let i = 0;
  for (const cap of sorted) {
    for (; i < cap; i++) covered += rankedCounts[i] as number;
    out.push({ cap, share: total === 0 ? 0 : covered / total });
  }
  return out;
}
