import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { shapeInto, type Shape } from '../../src/lexicon/Shape.js';

const rules = resolveRules();
const tally = Tally.fromTexts(
  [
    { text: 'the ferry was late again', label: 'delays' },
    { text: 'the ferry was lovely', label: 'praise' },
    { text: 'late late late', label: 'delays' },
  ],
  rules,
);
// Hand-ranked: late 4, ferry 2, the 2, was 2, again 1, lovely 1 -> ids 2..7 (OOV 1).
const lex = freeze(tally);

describe('Lexicon', () => {
  it('maps tokens to ids and back', () => {
    expect(lex.encoding.tokens).toEqual(['late', 'ferry', 'the', 'was', 'again', 'lovely']);
    expect(Array.from(lex.encode('The ferry was LATE, sadly'))).toEqual([4, 3, 5, 2, 1, 1]);
    expect(lex.decode([0, 0, 4, 3, 1])).toEqual(['the', 'ferry', '<oov>']);
    expect(lex.decode([1], '?')).toEqual(['?']);
    expect([lex.tokenAt(0), lex.tokenAt(1), lex.tokenAt(2), lex.tokenAt(7)]).toEqual([null, null, 'late', 'lovely']);
    expect(() => lex.tokenAt(8)).toThrow('id 8 is outside 0…7; was it made with another lexicon?');
  });

  it.each<[Shape, number[]]>([
    [{ length: 8, pad: 'start', cut: 'start' }, [0, 0, 4, 3, 5, 2, 1, 1]],
    [{ length: 8, pad: 'end', cut: 'start' }, [4, 3, 5, 2, 1, 1, 0, 0]],
    [{ length: 3, pad: 'start', cut: 'start' }, [2, 1, 1]],
    [{ length: 3, pad: 'start', cut: 'end' }, [4, 3, 5]],
  ])('shapes with %j', (shape, expected) => {
    expect(Array.from(lex.encode('The ferry was LATE, sadly', { shape }))).toEqual(expected);
  });

  it('encodes many texts into one row-major batch with lengths and label ids', () => {
    const batch = lex.encodeMany([{ text: 'late ferry', label: 'praise' }, { text: 'the the the the the' }, { text: 'again', label: 'refunds' }], {
      shape: { length: 4, pad: 'end', cut: 'end' },
    });
    expect(batch.rows).toBe(3);
    expect(batch.length).toBe(4);
    expect(Array.from(batch.ids)).toEqual([2, 3, 0, 0, 4, 4, 4, 4, 6, 0, 0, 0]);
    expect(Array.from(batch.lengths)).toEqual([2, 4, 1]);
    expect(Array.from(batch.labels!)).toEqual([1, -1, -1]); // no label, and a label the lexicon lacks: -1
    expect(batch.ids.buffer.byteLength).toBe(3 * 4 * 4);
  });

  it('pads a batch to its longest text when no shape is set', () => {
    const batch = lex.encodeMany(['late', 'the ferry was']);
    expect(batch.length).toBe(3);
    expect(Array.from(batch.ids)).toEqual([2, 0, 0, 4, 3, 5]);
    expect(batch.labels).toBeUndefined();
  });

  it('refuses labels it does not know', () => {
    expect(() => lex.labelId('refunds')).toThrow('label "refunds" is not one of the lexicon\'s 2 labels; rebuild the lexicon with it or drop those documents');
  });

  it('encodes object-key tokens like any other', () => {
    const t = Tally.fromTexts(['constructor tostring valueof hasownproperty constructor'], rules);
    const l = freeze(t, { reserved: ['__proto__'] });
    expect(Array.from(l.encode('constructor toString valueOf __proto__ prototype'))).toEqual([3, 5, 6, 1, 1, 1, 1, 1, 1]);
    expect(l.idOf('__proto__')).toBe(2);
    expect(l.idOf('prototype')).toBe(1);
  });
});

describe('shapes (property)', () => {
  const shapeArb = fc.record({ length: fc.integer({ min: 1, max: 20 }), pad: fc.constantFrom('start', 'end'), cut: fc.constantFrom('start', 'end') }) as fc.Arbitrary<Shape>;
  const words = fc.array(fc.constantFrom('late', 'ferry', 'the', 'was', 'again', 'lovely', 'zzz', 'constructor'), { maxLength: 30 });

  it('every encoding has the shape length, ids in range, padding on the padding side, order kept', () => {
    fc.assert(
      fc.property(words, shapeArb, (ws, shape) => {
        const ids = lex.encode(ws.join(' '), { shape });
        const raw = lex.encode(ws.join(' '), { shape: null });
        expect(ids.length).toBe(shape.length);
        for (const id of ids) expect(id >= 0 && id < lex.size).toBe(true);
        const kept = Math.min(raw.length, shape.length);
        const tokens = shape.pad === 'start' ? ids.slice(shape.length - kept) : ids.slice(0, kept);
        const padding = shape.pad === 'start' ? ids.slice(0, shape.length - kept) : ids.slice(kept);
        expect(padding.every((v) => v === 0)).toBe(true);
        expect(tokens.every((v) => v !== 0)).toBe(true);
        const expected = raw.length <= shape.length ? raw : shape.cut === 'start' ? raw.slice(raw.length - shape.length) : raw.slice(0, shape.length);
        expect(Array.from(tokens)).toEqual(Array.from(expected));
      }),
      { numRuns: 300 },
    );
  });

  it('shapeInto returns how many ids it kept', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: 99 }), { maxLength: 30 }), shapeArb, (ids, shape) => {
        const out = new Int32Array(shape.length);
        expect(shapeInto(ids, shape, out, 0)).toBe(Math.min(ids.length, shape.length));
      }),
    );
  });
});
