import { describe, expect, it } from 'vitest';
import { AuditCounts } from '../../src/audit/AuditCounts.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally, type TallyCounts } from '../../src/tally/Tally.js';
import { KEPT_TYPES, batchHandler } from '../../src/workers/batchHandler.js';
import type { Batch, WorkerReply } from '../../src/workers/messages.js';

const rules = resolveRules();
const batch = (id: number, texts: string[]): Batch => ({ id, texts, labels: texts.map((_, i) => (i % 2 === 0 ? 'even' : null)) });
/** Word number `i` in letters only (a, b, ..., z, ba, bb, ...): each is one token. */
const word = (i: number): string => (i < 26 ? '' : word(Math.floor(i / 26))) + String.fromCharCode(97 + (i % 26));
/** A text of `n` distinct words, numbered from `from`. */
const distinct = (from: number, n: number) => Array.from({ length: n }, (_, i) => word(from + i)).join(' ');

function countsOf(reply: WorkerReply): TallyCounts {
  if (!('tally' in reply)) throw new Error(`expected counts, got ${JSON.stringify(reply)}`);
  return reply.tally;
}

/** The tally of `batches` counted on one thread, as flat counts. */
function expected(...batches: Batch[]): TallyCounts {
  const tally = new Tally(rules);
  for (const b of batches) b.texts.forEach((text, i) => tally.add({ text, label: b.labels[i] ?? undefined }));
  return tally.toCounts();
}

// Common practice: counts kept across batches and sent later must add up to the counts of the batches.
describe('batchHandler, tally jobs', () => {
  it('keeps counts across batches, answering kept, and sends them all on a flush, then forgets them', () => {
    const handler = batchHandler({ kind: 'tally', rules });
    const a = batch(0, ['the ferry is late', 'late again']);
    const b = batch(1, ['the ferry left', 'no ferry today']);
    expect(handler.handle(a)).toEqual({ id: 0, kept: true });
    expect(handler.handle(b)).toEqual({ id: 1, kept: true });
    expect(countsOf(handler.flush(-1))).toEqual(expected(a, b));
    expect(handler.flush(-2)).toEqual({ id: -2, kept: true });
  });

  it(`sends its counts with a batch's reply once they reach ${KEPT_TYPES} distinct tokens`, () => {
    const handler = batchHandler({ kind: 'tally', rules });
    const small = batch(0, [distinct(0, 10)]);
    const big = batch(1, [distinct(5, KEPT_TYPES)]);
    expect(handler.handle(small)).toEqual({ id: 0, kept: true });
    const reply = handler.handle(big);
    expect(reply.id).toBe(1);
    expect(countsOf(reply)).toEqual(expected(small, big));
    expect(countsOf(reply).types).toHaveLength(KEPT_TYPES + 5);
    const after = batch(2, ['a a']);
    expect(handler.handle(after)).toEqual({ id: 2, kept: true });
    expect(countsOf(handler.flush(-1))).toEqual(expected(after));
  });

  it('counts straight into a target tally, never sending it, however large it grows', () => {
    const target = new Tally(rules);
    const handler = batchHandler({ kind: 'tally', rules }, { tally: target });
    const big = batch(0, [distinct(0, KEPT_TYPES + 1)]);
    expect(handler.handle(big)).toEqual({ id: 0, kept: true });
    expect(handler.flush(-1)).toEqual({ id: -1, kept: true });
    expect(target.toCounts()).toEqual(expected(big));
  });
});

describe('batchHandler, audit and encode jobs', () => {
  const lexicon = freeze(new Tally(rules).addTokens(['the', 'ferry', 'late']), {});
  const setup = { encoding: lexicon.encoding, fingerprint: lexicon.fingerprint };

  it('keeps audit counts until a flush, equal to counting the batches on one thread', () => {
    const handler = batchHandler({ kind: 'audit', ...setup, length: 3 });
    const a = batch(0, ['the ferry is late', 'late']);
    const b = batch(1, ['no ferry']);
    expect(handler.handle(a)).toEqual({ id: 0, kept: true });
    expect(handler.handle(b)).toEqual({ id: 1, kept: true });
    const reply = handler.flush(-1);
    const one = new AuditCounts(lexicon, 3);
    for (const x of [a, b]) x.texts.forEach((text, i) => one.add(text, x.labels[i] ?? undefined));
    expect('audit' in reply && reply.audit).toEqual(one.parts());
  });

  it('encodes each batch at once with the encoding it was given (ids worked out by hand: padding 0, OOV 1, then by count)', () => {
    const handler = batchHandler({ kind: 'encode', ...setup });
    // freeze ranks the three tokens (one count each) in string order: ferry 2, late 3, the 4.
    const reply = handler.handle(batch(7, ['the ferry is late', 'late']));
    expect(reply).toEqual({ id: 7, encoded: { ids: Int32Array.from([4, 2, 1, 3, 3]), lengths: Int32Array.from([4, 1]) } });
    expect(handler.flush(-1)).toEqual({ id: -1, kept: true });
  });
});
