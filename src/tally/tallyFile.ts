import type { Tally } from './Tally.js';

/** How many canary snippets a tally file keeps at most (as many as a corpus build keeps). */
export const TALLY_SNIPPETS = 3;

/**
 * What a tally file holds: the tally, a few short corpus documents to keep as canaries, and the
 * corpus fields its text and labels came from (null: none, or merged parts that disagreed).
 * @example const file: TallyFile = { tally, snippets, fields: { text: 'text', label: 'topic' } };
 */
export interface TallyFile {
  tally: Tally;
  snippets: readonly string[];
  fields: { text: string | null; label: string | null };
}

/** JavaScript's default string order (UTF-16 code units), as a comparator. */
export function tallyFileOrder(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
