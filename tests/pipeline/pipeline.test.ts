import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { freeze } from '../../src/lexicon/freeze.js';
import { encodeCorpus } from '../../src/pipeline/encodeCorpus.js';
import { tallyCorpus } from '../../src/pipeline/tallyCorpus.js';
import { resolveRules } from '../../src/rules/TextRules.js';

async function* docs() {
  yield { text: 'late late ferry', label: 'delays' };
  yield { text: '', label: 'praise' };
  yield { text: 'the ferry was late again and again', label: 'delays' };
  yield { text: 'new label', label: 'refunds' };
}

describe('tallyCorpus and encodeCorpus', () => {
  it('tally a stream and keep the smallest short non-blank documents as snippets', async () => {
    const { tally, snippets } = await tallyCorpus(docs(), resolveRules());
    expect(tally.documents).toBe(4);
    expect(tally.counts.get('late')).toBe(3);
    // The three smallest in string order, whatever the document order: '' is blank and left out.
    expect(snippets).toEqual(['late late ferry', 'new label', 'the ferry was late again and again']);
  });

  it('encode row by row with the same ids as Lexicon.encode, counting OOV, cuts and unknown labels', async () => {
    const { tally } = await tallyCorpus(
      (async function* () {
        yield { text: 'late late ferry', label: 'delays' };
        yield { text: 'lovely', label: 'praise' };
      })(),
      resolveRules(),
    );
    const lexicon = freeze(tally);
    const shape = { length: 4, pad: 'end', cut: 'end' } as const;
    const rows: Array<[number[], number, number | null]> = [];
    const stats = await encodeCorpus(docs(), lexicon, shape, { row: (ids, kept, label) => void rows.push([Array.from(ids), kept, label]) });
    const texts = ['late late ferry', '', 'the ferry was late again and again', 'new label'];
    expect(rows.map((r) => r[0])).toEqual(texts.map((t) => Array.from(lexicon.encode(t, { shape }))));
    expect(rows.map((r) => [r[1], r[2]])).toEqual([[3, 0], [0, 1], [4, 0], [2, -1]]);
    // Hand-counted: 3 + 0 + 7 + 2 = 12 tokens; OOV: the, was, again, and, again, new, label = 7.
    // Rows per label id: delays (0) twice, praise (1) once; the unknown label is not a label's row.
    expect(stats).toEqual({ documents: 4, tokens: 12, oovTokens: 7, truncatedDocuments: 1, droppedTokens: 3, unknownLabels: 1, labelled: 4, labelRows: [2, 1] });
  });

  it('keep the same snippets in any document order (property)', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.string({ maxLength: 12 }), { maxLength: 20 }), fc.infiniteStream(fc.nat()), async (texts, order) => {
        const it = order[Symbol.iterator]();
        const shuffled = texts.map((t) => [it.next().value as number, t] as const).sort((a, b) => a[0] - b[0]).map(([, t]) => t);
        const a = await tallyCorpus(texts, resolveRules());
        const b = await tallyCorpus(shuffled, resolveRules());
        expect(b.snippets).toEqual(a.snippets);
      }),
      { numRuns: 100 },
    );
  });
});
