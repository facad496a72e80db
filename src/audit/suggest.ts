import { wholeCapsAround } from '../lexicon/capTie.js';
import { nearestRank } from '../tally/nearestRank.js';
import type { Suggestions } from './CoverageReport.js';

/**
 * The smallest number of top-ranked tokens whose counts reach `percent` % of `total`, given counts in
 * rank order (descending). Exact: compares integers, no floating-point shares.
 * @example capForShare([5, 3, 2], 10, 80) // 2 (5 + 3 = 8 of 10)
 */
export function capForShare(rankedCounts: ArrayLike<number>, total: number, percent: number): number {
  if (total === 0) return 0;
  let covered = 0;
  for (let i = 0; i < rankedCounts.length; i++) {
    covered += rankedCounts[i] as number;
    if (covered * 100 >= percent * total) return i + 1;
  }
  return rankedCounts.length;
}

/**
 * Caps for 90/95/99 % of token occurrences (with the nearest caps around each that keep whole counts)
 * and lengths for 90/95/99 % of documents (the cut end is advised by `cutAdvice`, from where OOV tokens are).
 */
export function suggest(rankedCounts: ArrayLike<number>, total: number, lengths: ReadonlyMap<number, number>): Omit<Suggestions, 'cut'> {
  const capFor90 = capForShare(rankedCounts, total, 90);
  const capFor95 = capForShare(rankedCounts, total, 95);
  const capFor99 = capForShare(rankedCounts, total, 99);
  const whole = (cap: number) => wholeCapsAround(rankedCounts.length, (i) => rankedCounts[i] as number, cap);
  return {
    capFor90,
    capFor95,
    capFor99,
    wholeCapsFor90: whole(capFor90),
    wholeCapsFor95: whole(capFor95),
    wholeCapsFor99: whole(capFor99),
    lengthFor90: nearestRank(lengths, 90),
    lengthFor95: nearestRank(lengths, 95),
    lengthFor99: nearestRank(lengths, 99),
  };
}
