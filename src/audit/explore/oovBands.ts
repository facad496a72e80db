import type { Lexicon } from '../../lexicon/Lexicon.js';
import type { Tally } from '../../tally/Tally.js';

/** OOV tokens whose count falls in one band: how many, their share of OOV occurrences, a few of them. */
export interface OovBand {
  /** The band's name on the page: `once`, `twice`, `3-9 times`, `10+ times`. */
  name: string;
  from: number;
  to: number;
  types: number;
  occurrences: number;
  /** The first few of its tokens in JavaScript string order. */
  sample: string[];
}

/** The bands: once, twice, 3 to 9 times, 10 times or more. */
const BANDS: ReadonlyArray<[string, number, number]> = [
  ['once', 1, 1],
  ['twice', 2, 2],
  ['3-9 times', 3, 9],
  ['10+ times', 10, Infinity],
];

/**
 * OOV tokens by how often they occur: what a list of the most frequent says little about when they
 * all share one count (often 1 on a small corpus). Each band keeps a sample of `sample` tokens, the
 * first in string order, chosen while counting (no token list is sorted).
 * @example oovBands(report.tally, lexicon, 5)[0] // { name: 'once', from: 1, to: 1, types: 812, ... }
 */
export function oovBands(tally: Tally, lexicon: Lexicon, sample = 5): OovBand[] {
  const bands: OovBand[] = BANDS.map(([name, from, to]) => ({ name, from, to, types: 0, occurrences: 0, sample: [] }));
  tally.forEachCount((token, count) => {
    if (count === 0 || lexicon.has(token)) return;
    const band = bands.find((b) => count >= b.from && count <= b.to) as OovBand;
    band.types += 1;
    band.occurrences += count;
    const kept = band.sample;
    if (kept.length === sample && !(token < (kept[sample - 1] as string))) return;
    let at = kept.length;
    while (at > 0 && token < (kept[at - 1] as string)) at--;
    kept.splice(at, 0, token);
    if (kept.length > sample) kept.pop();
  });
  return bands;
}
