/**
 * Tokens ranked as the freeze rule says (encoding contract, rule 4): those counted fewer than
 * `minCount` times dropped, then count descending, ties broken by JavaScript's default string order
 * (UTF-16 code units). Only the first `orderedFirst` places need that tie order (a lexicon keeps the
 * first `cap`): a group of equal counts that starts later stays in the order counted, which saves
 * sorting the many one-off tokens of a large corpus; counts are descending throughout.
 * @example rankTokens(new Map([['b', 2], ['a', 2], ['c', 5]]), 1) // [['c', 5], ['a', 2], ['b', 2]]
 */
export function rankTokens(counts: Iterable<readonly [string, number, ...unknown[]]>, minCount = 1, orderedFirst = Infinity): Array<[string, number]> {
  // Grouped by count, then each group in the engine's own string sort (the default sort compares
  // UTF-16 code units, as the rule says): far faster than one comparator over every token when most
  // tokens share a count, as the one-off tokens of a large corpus do.
  const byCount = new Map<number, string[]>();
  for (const entry of counts) {
    const token = entry[0];
    const n = entry[1];
    if (n < minCount) continue;
    const group = byCount.get(n);
    if (group === undefined) byCount.set(n, [token]);
    else group.push(token);
  }
  const ranked: Array<[string, number]> = [];
  for (const n of [...byCount.keys()].sort((a, b) => b - a)) {
    const group = byCount.get(n) as string[];
    if (ranked.length < orderedFirst) group.sort();
    for (const token of group) ranked.push([token, n]);
  }
  return ranked;
}
