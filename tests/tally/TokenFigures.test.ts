// TokenFigures: occurrences and document frequency per token number, what Tally and AuditCounts keep.
// Checked against the definition (encoding contract, rule 3: a token's document frequency is the number
// of documents it occurs in), computed with plain Maps and Sets in the test.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { COUNT, DOCUMENTS, TokenFigures } from '../../src/tally/TokenFigures.js';

describe('TokenFigures', () => {
  it('counts a hand-checked example', () => {
    const figures = new TokenFigures(1);
    figures.occur(0, 1);
    figures.occur(0, 1);
    figures.occur(2, 1);
    figures.occur(0, 2);
    figures.add(2, 5, 3); // counted elsewhere; document 2 then counts as a new one for token 2
    figures.occur(2, 2);
    expect([0, 1, 2].map((n) => [figures.at(n, COUNT), figures.at(n, DOCUMENTS)])).toEqual([[3, 2], [0, 0], [7, 5]]);
    expect([...figures.column(COUNT, 4)]).toEqual([3, 0, 7, 0]);
    expect(figures.at(99, COUNT)).toBe(0);
    figures.clear(2);
    figures.clear(99);
    expect([figures.at(2, COUNT), figures.at(2, DOCUMENTS)]).toEqual([0, 0]);
  });

  it('gives the occurrences and documents of every token, through growth (property, against Maps)', () => {
    // Documents of token numbers, some added as counts made elsewhere between documents.
    const step = fc.oneof(
      fc.record({ tokens: fc.array(fc.nat({ max: 40 }), { maxLength: 12 }) }),
      fc.record({ token: fc.nat({ max: 40 }), count: fc.integer({ min: 1, max: 9 }), documents: fc.integer({ min: 1, max: 3 }) }),
    );
    fc.assert(
      fc.property(fc.array(step, { maxLength: 40 }), fc.integer({ min: 1, max: 8 }), (steps, room) => {
        const figures = new TokenFigures(room);
        const count = new Map<number, number>();
        const documents = new Map<number, number>();
        let document = 0;
        for (const s of steps) {
          if ('tokens' in s) {
            document += 1;
            for (const n of s.tokens) figures.occur(n, document);
            for (const n of s.tokens) count.set(n, (count.get(n) ?? 0) + 1);
            for (const n of new Set(s.tokens)) documents.set(n, (documents.get(n) ?? 0) + 1);
          } else {
            figures.add(s.token, s.count, s.documents);
            count.set(s.token, (count.get(s.token) ?? 0) + s.count);
            documents.set(s.token, (documents.get(s.token) ?? 0) + s.documents);
          }
        }
        for (let n = 0; n <= 41; n++) expect([figures.at(n, COUNT), figures.at(n, DOCUMENTS)]).toEqual([count.get(n) ?? 0, documents.get(n) ?? 0]);
        expect([...figures.column(DOCUMENTS, 42)]).toEqual(Array.from({ length: 42 }, (_, n) => documents.get(n) ?? 0));
      }),
      { numRuns: 300 },
    );
  });
});
