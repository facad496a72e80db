/**
 * What a cap does to a group of tokens that share one count (encoding contract, rule 4): when the
 * cap falls inside such a group, the group's first tokens in string order are kept and the rest left
 * out, which looks alphabetical to a user. Null when the cap keeps or leaves whole counts.
 */
export interface CapTie {
  /** The cap, in ranked tokens (reserved tokens not counted). */
  cap: number;
  /** How often each token of the group occurs. */
  count: number;
  /** How many tokens share that count. */
  tokens: number;
  /** Of them, kept by the cap (the first in string order). */
  kept: number;
  /** Of them, left out. */
  left: number;
  /** The nearest cap below that keeps whole counts (`cap - kept`: the group left out). */
  below: number;
  /** The nearest cap above that keeps whole counts (`below + tokens`: the group kept). */
  above: number;
}

/** The nearest caps at or below and at or above a cap that keep whole counts (the same when it does). */
export interface WholeCaps {
  below: number;
  above: number;
}

/**
 * The nearest caps around `cap` that end on a count boundary, given `n` ranked tokens whose counts
 * (descending) `countAt` gives. A cap of `n` or more, or 0, keeps whole counts.
 * @example wholeCapsAround(5, (i) => [9, 4, 4, 4, 1][i], 2) // { below: 1, above: 4 }
 */
export function wholeCapsAround(n: number, countAt: (i: number) => number, cap: number): WholeCaps {
  if (cap <= 0 || cap >= n || countAt(cap - 1) !== countAt(cap)) return { below: cap, above: cap };
  const count = countAt(cap);
  let below = cap - 1;
  while (below > 0 && countAt(below - 1) === count) below -= 1;
  let above = cap + 1;
  while (above < n && countAt(above) === count) above += 1;
  return { below, above };
}

/**
 * How `cap` cuts `n` ranked tokens whose counts (descending) `countAt` gives: the group it falls
 * inside, or null when it keeps whole counts.
 * @example capTie(5, (i) => [9, 4, 4, 4, 1][i], 2) // { cap: 2, count: 4, tokens: 3, kept: 1, left: 2, below: 1, above: 4 }
 */
export function capTie(n: number, countAt: (i: number) => number, cap: number): CapTie | null {
  const { below, above } = wholeCapsAround(n, countAt, cap);
  if (below === above) return null;
  return { cap, count: countAt(cap), tokens: above - below, kept: cap - below, left: above - cap, below, above };
}
