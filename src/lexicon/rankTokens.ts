/**
 * Tokens ranked as the freeze rule says (encoding contract, rule 4): those counted fewer than
 * `minCount` times dropped, then count descending, ties broken by JavaScript's default string order
 * (UTF-16 code units).
 * @example rankTokens(new Map([['b', 2], ['a', 2], ['c', 5]]), 1) // [['c', 5], ['a', 2], ['b', 2]]
 */
export function rankTokens(counts: ReadonlyMap<string, number>, minCount = 1): Array<[string, number]> {
  const ranked: Array<[string, number]> = [];
  for (const entry of counts) if (entry[1] >= minCount) ranked.push(entry);
  ranked.sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
  return ranked;
}
