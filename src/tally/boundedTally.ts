import { LexlockError } from '../LexlockError.js';
import { rankTokens } from '../lexicon/rankTokens.js';
import { tokenize } from '../rules/tokenize.js';
import type { TextRules } from '../rules/TextRules.js';
import { SpaceSaving } from './SpaceSaving.js';
import { Tally, type LabelledText } from './Tally.js';

/** Bytes one Space-Saving counter costs in V8, token text included (measured on short tokens; generous). */
export const BYTES_PER_COUNTER = 200;

const times = (n: number) => (n === 1 ? 'once' : `${n.toLocaleString('en-US')} times`);

/** What {@link boundedTally} needs to know. */
export interface BoundedTallyOptions {
  /** Ranked tokens the lexicon will keep (reserved ones not included). */
  cap: number;
  minCount: number;
  /** Reserved tokens: they leave the ranking, so one more ranked token each must be exact. */
  reserved?: readonly string[];
  /** Memory for the counters, in bytes. */
  budgetBytes: number;
}

/** A tally whose counts are exact for every token that can make the cap, counted in bounded memory. */
export interface BoundedTally {
  tally: Tally;
  /** Counters the budget allowed. */
  capacity: number;
  /** The most any token left out of `tally.counts` occurred. */
  floor: number;
}

/**
 * Pass 1: a Space-Saving summary of `capacity` counters, then only the tokens that could still rank in
 * the first `places`: a monitored token's true count lies between `count - error` and `count`, so one
 * whose `count` is below the `places`-th largest `count - error` is beaten by `places` tokens for sure
 * and need not be counted again. The summary itself is dropped on return: pass 2 holds only these.
 */
async function candidatesOf(
  documents: AsyncIterable<string | LabelledText> | Iterable<string | LabelledText>,
  rules: TextRules,
  capacity: number,
  places: number,
  minCount: number,
): Promise<{ candidates: Set<string>; floor: number; total: number }> {
  const summary = new SpaceSaving(capacity);
  for await (const doc of documents) {
    for (const t of tokenize(typeof doc === 'string' ? doc : doc.text, rules)) summary.offer(t);
  }
  const monitored = [...summary.entries()];
  const lowerBounds = Float64Array.from(monitored, (e) => e.count - e.error).sort().reverse();
  const bar = Math.max(minCount, lowerBounds.length >= places ? (lowerBounds[places - 1] as number) : 0);
  const candidates = new Set<string>();
  for (const e of monitored) if (e.count >= bar) candidates.add(e.token);
  return { candidates, floor: summary.floor, total: summary.total };
}

/**
 * Counts a corpus too large for an exact in-memory tally, in two passes and bounded memory, and proves
 * the result is the exact top `cap`: pass 1 finds candidates with Space-Saving (Metwally, Agrawal, El
 * Abbadi 2005), pass 2 counts the candidates exactly; every token that could rank in the cap is then
 * counted exactly, because the cap-th exact count exceeds the most any other token can have. When that
 * cannot be shown, it throws `MEMORY_LIMIT` with the budget that would suffice. `open` must give the same
 * documents each time it is called.
 * @example
 * const { tally } = await boundedTally(() => readCorpus('big.txt'), resolveRules(), { cap: 50000, minCount: 1, budgetBytes: 200 * 2 ** 20 });
 */
export async function boundedTally(
  open: () => AsyncIterable<string | LabelledText> | Iterable<string | LabelledText>,
  rules: TextRules,
  options: BoundedTallyOptions,
): Promise<BoundedTally> {
  const capacity = Math.max(1, Math.floor(options.budgetBytes / BYTES_PER_COUNTER));
  const reserved = new Set(options.reserved ?? []);
  const { candidates, floor, total } = await candidatesOf(open(), rules, capacity, options.cap + reserved.size, options.minCount);
  const tally = new Tally(rules);
  for await (const doc of open()) {
    const tokens = tokenize(typeof doc === 'string' ? doc : doc.text, rules);
    tally.addSome(tokens, typeof doc === 'string' ? undefined : doc.label, candidates);
  }
  const ranked = rankTokens(tally.entries(), options.minCount).filter(([t]) => !reserved.has(t));
  const last = ranked[options.cap - 1];
  const proven = last === undefined ? floor < options.minCount : last[1] > floor;
  if (!proven) {
    const threshold = last === undefined ? options.minCount : last[1];
    const needed = Math.ceil(total / Math.max(threshold, 1)) + 1;
    const mib = Math.ceil((needed * BYTES_PER_COUNTER) / 2 ** 20);
    throw new LexlockError(
      'MEMORY_LIMIT',
      `the memory limit holds ${capacity.toLocaleString('en-US')} counters, too few to prove the top ${options.cap.toLocaleString('en-US')} tokens exact on this corpus: ` +
        `the last of them occurs ${times(threshold)}, but a token not followed may have occurred up to ${times(floor)}; about ${needed.toLocaleString('en-US')} counters would do: try --memory-limit ${mib}`,
      { field: '--memory-limit' },
    );
  }
  return { tally, capacity, floor };
}
