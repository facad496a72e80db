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
  it('tally a stream and keep short non-empty documents as snippets', async () => {
    const { tally, snippets } = await tallyCorpus(docs(), resolveRules());
    expect(tally.documents).toBe(4);
    expect(tally.counts.get('late')).toBe(3);
    expect(snippets).toEqual(['late late ferry', 'the ferry was late again and again', 'new label']);
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
    const shape = { length: 4, pad: 'post', cut: 'post' } as const;
    const rows: Array<[number[], number, number | null]> = [];
    const stats = await encodeCorpus(docs(), lexicon, shape, { row: (ids, kept, label) => void rows.push([Array.from(ids), kept, label]) });
    const texts = ['late late ferry', '', 'the ferry was late again and again', 'new label'];
    expect(rows.map((r) => r[0])).toEqual(texts.map((t) => Array.from(lexicon.encode(t, { shape }))));
    expect(rows.map((r) => [r[1], r[2]])).toEqual([[3, 0], [0, 1], [4, 0], [2, -1]]);
    // Hand-counted: 3 + 0 + 7 + 2 = 12 tokens; OOV: the, was, again, and, again, new, label = 7.
    expect(stats).toEqual({ documents: 4, tokens: 12, oovTokens: 7, truncatedDocuments: 1, droppedTokens: 3, unknownLabels: 1, labelled: 4 });
  });
});
