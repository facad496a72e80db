import type { Fit } from '../artifact/schema.js';
import type { CapTie } from './capTie.js';
import type { SeenTokens } from './SeenTokens.js';

/** Caps at which the fit records coverage (besides the chosen cap and all tokens). */
export const COVERAGE_CAPS = [10, 100, 1000, 2000, 5000, 10000, 20000, 30000, 50000, 100000, 200000, 500000, 1000000];

/**
 * The fit figures of a whole corpus measured by a count that holds only some of its tokens (a
 * bounded build): freeze takes these instead of working them out from the tally.
 */
export interface MeasuredFit {
  /** Distinct tokens of the corpus. */
  types: number;
  /** True when `types` is an estimate (the count could not hold every distinct token). */
  typesEstimated: boolean;
  coverage: Fit['coverage'];
  capTie: CapTie | null;
  /** A filter of every token of the corpus, or null when it has too many for one. */
  seen: SeenTokens | null;
}

/**
 * The fit's coverage points (encoding contract, rule 4's ranking): the share of `tokens` the top `cap`
 * tokens cover, at each of {@link COVERAGE_CAPS} up to the number of ranked counts, at the chosen
 * `cap`, and, when `all` (the counts are every token's), at all of them. `rankedCounts` are counts,
 * most first; when not `all` they are the corpus's largest counts, every one of them.
 * @example coveragePoints([5, 3, 1, 1], 10, 2, true) // [{ cap: 2, share: 0.8 }, { cap: 4, share: 1 }]
 */
export function coveragePoints(rankedCounts: ArrayLike<number>, tokens: number, cap: number | null, all: boolean): Fit['coverage'] {
  const n = rankedCounts.length;
  const caps = new Set(COVERAGE_CAPS.filter((c) => c <= n));
  if (cap !== null) caps.add(Math.min(cap, n));
  if (all) caps.add(n);
  const out: Fit['coverage'] = [];
  let covered = 0;
  let i = 0;
  for (const c of [...caps].sort((a, b) => a - b)) {
    for (; i < c; i++) covered += rankedCounts[i] as number;
    out.push({ cap: c, share: tokens === 0 ? 0 : covered / tokens });
  }
  return out;
}
