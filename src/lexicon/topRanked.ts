/** Whether token `a` with count `m` ranks after token `b` with count `n` (encoding contract, rule 4). */
function ranksAfter(a: string, m: number, b: string, n: number): boolean {
  return m < n || (m === n && a > b);
}

/**
 * The first `n` tokens in rank order (encoding contract, rule 4: count descending, ties in JavaScript's
 * default string order, UTF-16 code units) among those `accept` takes, with their counts. `each` hands
 * every token and its count to a visitor once. Memory holds `n` tokens whatever their number: a heap
 * of the best so far, the worst of them on top, which a better token replaces (so a tally of fifty
 * million tokens is ranked for a cap of thirty thousand without an array of fifty million pairs).
 * @example topRanked((visit) => { visit('b', 2); visit('a', 2); visit('c', 5); }, 2) // [['c', 5], ['a', 2]]
 */
export function topRanked(
  each: (visit: (token: string, count: number) => void) => void,
  n: number,
  accept: (token: string, count: number) => boolean = () => true,
): Array<[string, number]> {
  if (n <= 0) return [];
  if (n === Number.POSITIVE_INFINITY) return allRanked(each, accept);
  // A binary heap ordered so that the token ranking last is at the root.
  const tokens: string[] = [];
  const counts: number[] = [];
  const worse = (i: number, j: number) => ranksAfter(tokens[i] as string, counts[i] as number, tokens[j] as string, counts[j] as number);
  const swap = (i: number, j: number) => {
    const t = tokens[i] as string;
    tokens[i] = tokens[j] as string;
    tokens[j] = t;
    const c = counts[i] as number;
    counts[i] = counts[j] as number;
    counts[j] = c;
  };
  const down = (from: number) => {
    for (let i = from; ; ) {
      const l = 2 * i + 1;
      const r = l + 1;
      let top = i;
      if (l < tokens.length && worse(l, top)) top = l;
      if (r < tokens.length && worse(r, top)) top = r;
      if (top === i) return;
      swap(i, top);
      i = top;
    }
  };
  each((token, count) => {
    // Whether it would rank in is cheaper to ask than `accept` (a lookup, for an audit): asked first.
    if (tokens.length === n && !ranksAfter(tokens[0] as string, counts[0] as number, token, count)) return;
    if (!accept(token, count)) return;
    if (tokens.length < n) {
      tokens.push(token);
      counts.push(count);
      for (let i = tokens.length - 1; i > 0; ) {
        const parent = (i - 1) >> 1;
        if (!worse(i, parent)) break;
        swap(i, parent);
        i = parent;
      }
    } else if (ranksAfter(tokens[0] as string, counts[0] as number, token, count)) {
      tokens[0] = token;
      counts[0] = count;
      down(0);
    }
  });
  const out: Array<[string, number]> = tokens.map((t, i) => [t, counts[i] as number]);
  return out.sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
}

/**
 * Every accepted token in rank order: grouped by count, the counts descending, each group sorted by
 * the built-in string sort (UTF-16 code units, the order `<` gives). Ranking all tokens this way
 * compares strings only within a count (most tokens of a corpus share a few small counts) and in
 * native code, where a heap of every token would compare them all in script.
 */
function allRanked(each: (visit: (token: string, count: number) => void) => void, accept: (token: string, count: number) => boolean): Array<[string, number]> {
  const groups = new Map<number, string[]>();
  each((token, count) => {
    if (!accept(token, count)) return;
    const group = groups.get(count);
    if (group === undefined) groups.set(count, [token]);
    else group.push(token);
  });
  const out: Array<[string, number]> = [];
  for (const count of [...groups.keys()].sort((a, b) => b - a)) {
    for (const token of (groups.get(count) as string[]).sort()) out.push([token, count]);
  }
  return out;
}
