// Common practice (no published source): the id layout and sequence shapes that text classifiers are
// commonly fed. Id 0 is padding; one id stands for every out-of-vocabulary token; a vocabulary capped
// at N words therefore needs N + 2 ids (embedding rows); documents are made a fixed length by
// adding 0s at the start or end and by dropping tokens from the start or end. The exact numbers
// below (cap 20,000, length 80, the id of each word) follow from those conventions and from the
// encoding contract (README "How text becomes ids", rules 4 and 5), not from any outside table.
import { beforeAll, describe, expect, it } from 'vitest';
import { freeze } from '../../src/lexicon/freeze.js';
import type { Lexicon } from '../../src/lexicon/Lexicon.js';
import type { Shape } from '../../src/lexicon/Shape.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';

const CAP = 20_000;
const DISTINCT = 20_500;
const LENGTH = 80;

/** Token number i as a word: 'w' + i in base 26 with four letters, so string order = number order. */
function word(i: number): string {
  let s = '';
  let n = i;
  for (let k = 0; k < 4; k++) {
    s = String.fromCharCode(97 + (n % 26)) + s;
    n = Math.floor(n / 26);
  }
  return `w${s}`;
}

/**
 * Occurrences of token i: non-increasing in i, so with ties broken by string order (contract rule 4)
 * and names in string order, token i has rank i + 1. Small counts keep the tally quick to build.
 */
function countOf(i: number): number {
  return i < 5_000 ? 3 : i < 12_000 ? 2 : 1;
}

function buildTally(): Tally {
  const tally = new Tally(resolveRules());
  const tokens: string[] = [];
  for (let i = 0; i < DISTINCT; i++) for (let c = 0; c < countOf(i); c++) tokens.push(word(i));
  tally.addTokens(tokens);
  return tally;
}

// A document of 100 tokens spread over the ranks, with two OOV tokens: one counted but ranked past
// the cap (token 20,100) and one never seen ("zzzzz"). And one of 30 tokens.
const long: string[] = Array.from({ length: 100 }, (_, k) => (k === 50 ? word(20_100) : k === 99 ? 'zzzzz' : word(k * 201)));
const short: string[] = Array.from({ length: 30 }, (_, k) => word(19_999 - k * 7));

/** The id common practice gives token `t` in a layout, worked out from its rank (not from the lexicon). */
function expectedId(t: string, oov: 'first' | 'last'): number {
  // Read the token number back from its four base-26 letters; the unseen "zzzzz" has no number.
  const i = t === 'zzzzz' ? Number.POSITIVE_INFINITY : [...t.slice(1)].reduce((acc, ch) => acc * 26 + (ch.charCodeAt(0) - 97), 0);
  if (i >= CAP) return oov === 'first' ? 1 : CAP + 1;
  return oov === 'first' ? i + 2 : i + 1;
}

describe('common practice: a 20,000-word vocabulary', () => {
  let tally: Tally;
  let last: Lexicon;
  let first: Lexicon;

  beforeAll(() => {
    tally = buildTally();
    last = freeze(tally, { cap: CAP, oov: 'last' });
    first = freeze(tally, { cap: CAP, oov: 'first' });
  });

  it('the tally holds the synthetic corpus', () => {
    expect(tally.types).toBe(DISTINCT);
    expect(tally.counts.get(word(0))).toBe(3);
    expect(tally.counts.get(word(DISTINCT - 1))).toBe(1);
    expect(word(0)).toBe('waaaa');
    expect(word(27)).toBe('waabb');
  });

  describe('oov: last', () => {
    it('padding is 0, the words are 1…20,000, OOV is 20,001, 20,002 ids in all (rows for an embedding)', () => {
      expect(last.idOf(word(0))).toBe(1);
      expect(last.idOf(word(1))).toBe(2);
      expect(last.idOf(word(CAP - 1))).toBe(CAP);
      expect(last.oovId).toBe(CAP + 1);
      expect(last.idOf(word(CAP))).toBe(CAP + 1);
      expect(last.idOf('zzzzz')).toBe(CAP + 1);
      expect(last.size).toBe(CAP + 2);
      expect(last.encoding.tokens).toHaveLength(CAP);
    });

    it.each([
      [0, null],
      [1, 'waaaa'],
      [CAP, word(CAP - 1)],
      [CAP + 1, null],
    ])('id %i is %j', (id, token) => {
      expect(last.tokenAt(id)).toBe(token);
    });

    it('id 20,002 is outside the layout', () => {
      expect(() => last.tokenAt(CAP + 2)).toThrow('id 20002 is outside 0…20001; was it made with another lexicon?');
    });

    it('every word gets the id of its rank', () => {
      for (let i = 0; i < DISTINCT; i += 97) expect(last.idOf(word(i))).toBe(expectedId(word(i), 'last'));
    });
  });

  describe('oov: first', () => {
    it('padding is 0, OOV is 1, the words are 2…20,001, 20,002 ids in all (rows for an embedding)', () => {
      expect(first.oovId).toBe(1);
      expect(first.idOf('zzzzz')).toBe(1);
      expect(first.idOf(word(CAP))).toBe(1);
      expect(first.idOf(word(0))).toBe(2);
      expect(first.idOf(word(CAP - 1))).toBe(CAP + 1);
      expect(first.size).toBe(CAP + 2);
    });

    it.each([
      [0, null],
      [1, null],
      [2, 'waaaa'],
      [CAP + 1, word(CAP - 1)],
    ])('id %i is %j', (id, token) => {
      expect(first.tokenAt(id)).toBe(token);
    });

    it('id 20,002 is outside the layout', () => {
      expect(() => first.tokenAt(CAP + 2)).toThrow('id 20002 is outside 0…20001; was it made with another lexicon?');
    });
  });

  it('the out-of-vocabulary share in the fit: the 500 tokens ranked past the cap, once each', () => {
    expect(last.fit?.oovTokens).toBe(DISTINCT - CAP);
    expect(last.fit?.types).toBe(DISTINCT);
  });

  describe('sequences of 80 ids', () => {
    const longText = long.join(' ');
    const shortText = short.join(' ');

    it('the documents have 100 and 30 tokens', () => {
      expect(last.tokenize(longText)).toEqual(long);
      expect(first.tokenize(shortText)).toEqual(short);
    });

    // Expected rows: ids from the ranks above; 0s where padding goes; the cut end's tokens dropped.
    const cases: Array<[string, Shape]> = [
      ['pad start, cut start', { length: LENGTH, pad: 'start', cut: 'start' }],
      ['pad start, cut end', { length: LENGTH, pad: 'start', cut: 'end' }],
      ['pad end, cut start', { length: LENGTH, pad: 'end', cut: 'start' }],
      ['pad end, cut end', { length: LENGTH, pad: 'end', cut: 'end' }],
    ];

    it.each(cases)('%s: the 100-token document loses 20 tokens at the cut end', (_name, shape) => {
      for (const [lexicon, oov] of [[last, 'last'], [first, 'first']] as const) {
        const all = long.map((t) => expectedId(t, oov));
        const kept = shape.cut === 'start' ? all.slice(100 - LENGTH) : all.slice(0, LENGTH);
        const row = [...lexicon.encode(longText, { shape })];
        expect(row).toEqual(kept);
        expect(row).toHaveLength(LENGTH);
        expect(row.includes(0)).toBe(false);
        // The OOV tokens at positions 50 and 99 of the document.
        const oovId = oov === 'first' ? 1 : CAP + 1;
        expect(row[shape.cut === 'start' ? 50 - 20 : 50]).toBe(oovId);
        if (shape.cut === 'start') expect(row[LENGTH - 1]).toBe(oovId);
        else expect(row[LENGTH - 1]).toBe(expectedId(word(79 * 201), oov));
      }
    });

    it.each(cases)('%s: the 30-token document gets 50 zeros on the padding side', (_name, shape) => {
      for (const [lexicon, oov] of [[last, 'last'], [first, 'first']] as const) {
        const ids = short.map((t) => expectedId(t, oov));
        const zeros = new Array<number>(LENGTH - 30).fill(0);
        const expected = shape.pad === 'start' ? [...zeros, ...ids] : [...ids, ...zeros];
        expect([...lexicon.encode(shortText, { shape })]).toEqual(expected);
      }
    });

    it('a batch of both documents is row-major, 2 x 80, with 80 and 30 real tokens', () => {
      const shape: Shape = { length: LENGTH, pad: 'start', cut: 'start' };
      const batch = last.encodeMany([longText, shortText], { shape });
      expect(batch.rows).toBe(2);
      expect(batch.length).toBe(LENGTH);
      expect(batch.ids).toHaveLength(2 * LENGTH);
      expect([...batch.lengths]).toEqual([LENGTH, 30]);
      expect([...batch.ids.slice(0, LENGTH)]).toEqual(long.slice(20).map((t) => expectedId(t, 'last')));
      expect([...batch.ids.slice(LENGTH)]).toEqual([...new Array<number>(50).fill(0), ...short.map((t) => expectedId(t, 'last'))]);
      // Every id is below size (N + 2).
      expect(Math.max(...batch.ids)).toBeLessThan(last.size);
    });
  });
});
