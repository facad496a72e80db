// encodeBatches: any corpus in batches of rows for a training loop, with keys, label ids as the
// lexicon numbers them, buffers each batch owns, and an optional seeded shuffle in bounded memory.
import { readFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { freeze } from '../../src/lexicon/freeze.js';
import type { Shape } from '../../src/lexicon/Shape.js';
import { tallyCorpus } from '../../src/pipeline/tallyCorpus.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { encodeBatches, type BatchDocument, type BatchOptions, type KeyedBatch } from '../../src/training/encodeBatches.js';
import { Pcg32 } from '../../src/training/Pcg32.js';
import { caughtError } from '../helpers/caughtError.js';
import { fixtureFile } from '../corpus/corpusFixtures.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const rules = resolveRules();
const shape: Shape = { length: 4, pad: 'start', cut: 'end' };
const docs = [
  { text: 'the ferry was late again', label: 'delays' },
  { text: 'lovely crew', label: 'praise' },
  { text: 'late late late', label: 'delays' },
  { text: 'refund please', label: 'refunds' },
  { text: 'the crew was lovely and the ferry was on time', label: 'praise' },
  { text: 'where is my refund', label: 'refunds' },
  { text: 'late', label: 'delays' },
];
const lexicon = freeze(Tally.fromTexts(docs, rules), { shape });
const plain = freeze(Tally.fromTexts(docs.map((d) => d.text), rules), { shape });

async function all(stream: AsyncIterable<KeyedBatch>): Promise<KeyedBatch[]> {
  const out: KeyedBatch[] = [];
  for await (const b of stream) out.push(b);
  return out;
}

/** Every row of some batches as [key, ids, length, label]. */
function rowsOf(batches: readonly KeyedBatch[]): Array<[string, number[], number, number]> {
  return batches.flatMap((b) =>
    b.keys.map((key, r) => [key, Array.from(b.ids.subarray(r * b.length, (r + 1) * b.length)), b.lengths[r] as number, b.labels[r] as number] as [string, number[], number, number]),
  );
}

describe('encodeBatches', () => {
  it('gives batches of the rows asked for, in corpus order, the last one short', async () => {
    const batches = await all(encodeBatches(docs, lexicon, { rows: 3 }));
    expect(batches.map((b) => [b.rows, b.length, b.ids.length, b.lengths.length, b.labels.length, b.keys.length])).toEqual([
      [3, 4, 12, 3, 3, 3],
      [3, 4, 12, 3, 3, 3],
      [1, 4, 4, 1, 1, 1],
    ]);
    // Each row is what encode gives the same text; lengths count its tokens, up to the length.
    expect(rowsOf(batches)).toEqual(
      docs.map((d, i) => [String(i + 1), Array.from(lexicon.encode(d.text)), Math.min(lexicon.encode(d.text, { shape: null }).length, 4), lexicon.labelId(d.label)]),
    );
  });

  it('gives each batch buffers of its own, exactly as long as its rows, unchanged by later batches', async () => {
    const batches = await all(encodeBatches(docs, lexicon, { rows: 2 }));
    const before = batches.map((b) => [Array.from(b.ids), Array.from(b.lengths), Array.from(b.labels), [...b.keys]]);
    const buffers = batches.flatMap((b) => [b.ids.buffer, b.lengths.buffer, b.labels.buffer]);
    expect(new Set(buffers).size).toBe(buffers.length);
    for (const b of batches) {
      for (const [array, size] of [[b.ids, b.rows * b.length], [b.lengths, b.rows], [b.labels, b.rows]] as const) {
        expect([array.byteOffset, array.length, array.buffer.byteLength]).toEqual([0, size, size * 4]);
      }
    }
    await all(encodeBatches(docs, lexicon, { rows: 2 })); // another pass
    expect(batches.map((b) => [Array.from(b.ids), Array.from(b.lengths), Array.from(b.labels), [...b.keys]])).toEqual(before);
  });

  it('takes async iterables, generators, plain strings and objects with keys alike', async () => {
    const expected = rowsOf(await all(encodeBatches(docs, lexicon, { rows: 3 })));
    async function* slowly() {
      for (const d of docs) yield await Promise.resolve(d);
    }
    expect(rowsOf(await all(encodeBatches(slowly(), lexicon, { rows: 3 })))).toEqual(expected);
    expect(rowsOf(await all(encodeBatches(new Set(docs), lexicon, { rows: 5 })))).toEqual(expected);
    // Plain strings: the position as the key, label -1 (a lexicon without labels asks for none).
    const strings = rowsOf(await all(encodeBatches(docs.map((d) => d.text), plain, { rows: 3 })));
    expect(strings.map(([key, , , label]) => [key, label])).toEqual(docs.map((_, i) => [String(i + 1), -1]));
    const keyed = rowsOf(await all(encodeBatches(docs.map((d, i) => ({ ...d, key: `m${i}` })), lexicon, { rows: 4 })));
    expect(keyed.map(([key]) => key)).toEqual(docs.map((_, i) => `m${i}`));
  });

  it('reads readCorpus as it streams: each row equals encode of the text a plain reader finds by its key', async () => {
    const path = join(root, 'corpora-demo', 'ferry-messages.jsonl');
    const { tally } = await tallyCorpus(readCorpus(path, { label: 'topic' }), rules);
    const demo = freeze(tally, { cap: 500, shape: { length: 24, pad: 'end', cut: 'start' } });
    // The plain reader: one JSON object a line, the key its line number (the file has no blank lines).
    const lines = (await readFile(path, 'utf8')).split('\n').filter((l) => l !== '');
    const byKey = new Map(lines.map((l, i) => [String(i + 1), JSON.parse(l) as { text: string; topic: string }]));
    const stream = encodeBatches(readCorpus(path, { label: 'topic' }), demo, { rows: 64 });
    const rows = rowsOf(await all(stream));
    expect(rows).toHaveLength(300);
    expect(stream.counts).toEqual({ documents: 300, unknownLabels: 0, unlabelled: 0 });
    for (const [key, ids, , label] of rows) {
      const doc = byKey.get(key)!;
      expect(ids).toEqual(Array.from(demo.encode(doc.text)));
      expect(label).toBe(demo.labelId(doc.topic));
    }
    expect(rows.map(([key]) => key)).toEqual(lines.map((_, i) => String(i + 1)));
  });

  it('gives an unknown label -1 and counts it', async () => {
    const stream = encodeBatches([{ text: 'late', label: 'delays' }, { text: 'cabin', label: 'cabins' }], lexicon, { rows: 8 });
    const [batch] = await all(stream);
    expect(Array.from(batch!.labels)).toEqual([0, -1]);
    expect(stream.counts).toEqual({ documents: 2, unknownLabels: 1, unlabelled: 0 });
  });

  it('stops at a document without a label when the lexicon has labels, naming where, unless unlabelled rows are intended', async () => {
    const input = [{ text: 'late', label: 'delays' }, 'no label here'];
    const error = await caughtError(() => all(encodeBatches(input, lexicon, { rows: 8 })));
    expect([error.code, error.message]).toEqual([
      'MISSING_FIELD',
      'the document keyed "2" has no label, and the lexicon has 3 (delays, praise, refunds): give every document its label (readCorpus(path, { label: FIELD }), or { text, label }), or pass { unlabelled: true } if rows with label -1 are intended',
    ]);
    // A corpus read without its label field: the message starts with the file and line.
    const path = await fixtureFile('rows.csv', 'text,topic\nlate ferry,delays\n');
    const fromFile = await caughtError(() => all(encodeBatches(readCorpus(path), lexicon, { rows: 8 })));
    expect(fromFile.message).toBe(`${path} line 2 (row 1): the document keyed "1" has no label, and the lexicon has 3 (delays, praise, refunds): give every document its label (readCorpus(path, { label: FIELD }), or { text, label }), or pass { unlabelled: true } if rows with label -1 are intended`);
    const stream = encodeBatches(input, lexicon, { rows: 8, unlabelled: true });
    expect(Array.from((await all(stream))[0]!.labels)).toEqual([0, -1]);
    expect(stream.counts).toEqual({ documents: 2, unknownLabels: 0, unlabelled: 1 });
  });

  it('takes a shape when the lexicon has none, and refuses to guess one', async () => {
    const unshaped = freeze(Tally.fromTexts(docs, rules));
    const [batch] = await all(encodeBatches(docs.slice(0, 1), unshaped, { rows: 1, shape: { length: 3, pad: 'end', cut: 'start' } }));
    expect(Array.from(batch!.ids)).toEqual(Array.from(unshaped.encode(docs[0]!.text, { shape: { length: 3, pad: 'end', cut: 'start' } })));
    expect(() => encodeBatches(docs, unshaped, { rows: 1 })).toThrow('shape: the lexicon stores no shape, so the rows have no length; pass { shape: { length, pad, cut } }');
  });

  it.each<[string, unknown, BatchOptions, string]>([
    ['rows 0', docs, { rows: 0 }, 'rows: 0 is not a whole number of rows from 1'],
    ['rows 2.5', docs, { rows: 2.5 }, 'rows: 2.5 is not a whole number of rows from 1'],
    ['a bad pad', docs, { rows: 2, shape: { length: 3, pad: 'left' as 'start', cut: 'end' } }, 'pad: "left" is not an end of a row; use start (zeros before the tokens) or end (zeros after them)'],
    ['pool 0', docs, { rows: 2, shuffle: { seed: 1, pool: 0 } }, 'shuffle.pool: 0 is not a whole number of rows from 1'],
    ['seed -1', docs, { rows: 2, shuffle: { seed: -1, pool: 8 } }, 'shuffle.seed: -1 is not a whole number from 0 to 2^53 - 1'],
    ['one string', 'late ferry', { rows: 2 }, 'encodeBatches takes a corpus (readCorpus(...), or an iterable of texts or { text, label, key } objects), and this is one string (it would become one row a character): pass [text]'],
    ['null', null, { rows: 2 }, 'encodeBatches takes a corpus (readCorpus(...), or an iterable of texts or { text, label, key } objects), and this is null'],
    ['no options', docs, undefined as unknown as BatchOptions, 'rows: undefined is not a whole number of rows from 1'],
  ])('refuses %s when called', (_name, input, options, message) => {
    expect(() => encodeBatches(input as BatchDocument[], lexicon, options)).toThrow(message);
  });

  it('restarts with each pass: the same batches and counts again', async () => {
    const stream = encodeBatches(docs, lexicon, { rows: 3, shuffle: { seed: 5, pool: 4 } });
    const first = rowsOf(await all(stream));
    expect(rowsOf(await all(stream))).toEqual(first);
    expect(stream.counts.documents).toBe(7);
  });
});

describe('encodeBatches shuffled', () => {
  /** The streaming shuffle as plainly as it can be written: arrays, splice, and the same generator. */
  function plainShuffle<T>(items: readonly T[], pool: number, seed: number): T[] {
    const rng = new Pcg32(seed);
    const held: T[] = [];
    const out: T[] = [];
    for (const item of items) {
      if (held.length < pool) {
        held.push(item);
        continue;
      }
      const j = rng.below(pool);
      out.push(held[j] as T);
      held[j] = item;
    }
    while (held.length > 0) {
      const j = held.length === 1 ? 0 : rng.below(held.length);
      out.push(held[j] as T);
      held[j] = held[held.length - 1] as T;
      held.pop();
    }
    return out;
  }

  it('orders rows as the plain streaming shuffle does, each row still its own document (property)', async () => {
    const texts = Array.from({ length: 60 }, (_, i) => docs[i % docs.length]!);
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 0, max: 60 }), fc.integer({ min: 1, max: 70 }), fc.integer({ min: 1, max: 9 }), fc.maxSafeNat(), async (n, pool, rows, seed) => {
        const input = texts.slice(0, n);
        const got = rowsOf(await all(encodeBatches(input, lexicon, { rows, shuffle: { seed, pool } })));
        const keys = plainShuffle(input.map((_, i) => String(i + 1)), pool, seed);
        expect(got.map(([key]) => key)).toEqual(keys);
        for (const [key, ids, , label] of got) {
          const doc = input[Number(key) - 1]!;
          expect(ids).toEqual(Array.from(lexicon.encode(doc.text)));
          expect(label).toBe(lexicon.labelId(doc.label));
        }
      }),
      { numRuns: 60 },
    );
  });

  it('gives the same order for the same seed, another for another seed', async () => {
    const many = Array.from({ length: 40 }, (_, i) => docs[i % docs.length]!.text);
    const order = async (seed: number) => rowsOf(await all(encodeBatches(many, plain, { rows: 8, shuffle: { seed, pool: 16 } }))).map(([key]) => key);
    expect(await order(11)).toEqual(await order(11));
    expect(await order(11)).not.toEqual(await order(12));
    expect([...(await order(11))].sort()).toEqual(many.map((_, i) => String(i + 1)).sort());
  });

  it.each<[string, BatchOptions, number]>([
    ['in corpus order, a batch of 3 after 3 documents', { rows: 3 }, 3],
    ['shuffled with a pool of 5, a batch of 1 after 6 documents', { rows: 1, shuffle: { seed: 1, pool: 5 } }, 6],
    ['shuffled with a pool of 5, a batch of 4 after 9 documents', { rows: 4, shuffle: { seed: 1, pool: 5 } }, 9],
  ])('streams: %s', async (_name, options, read) => {
    let pulled = 0;
    function* counted() {
      for (let i = 0; i < 1000; i++) {
        pulled += 1;
        yield 'late ferry';
      }
    }
    for await (const batch of encodeBatches(counted(), plain, options)) {
      expect(batch.rows).toBe(options.rows);
      break;
    }
    expect(pulled).toBe(read);
  });
});
