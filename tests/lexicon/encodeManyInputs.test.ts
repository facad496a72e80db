// encodeMany takes any synchronous iterable of texts or { text, label } objects, and refuses, with a
// message that says what to do, what it cannot encode as asked: an async iterable such as
// readCorpus(...) (read it in batches with encodeBatches), one string (it would iterate its
// characters) and anything that is not iterable.
import { describe, expect, it } from 'vitest';
import { isLexlockError } from '../../src/LexlockError.js';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { fixtureFile } from '../corpus/corpusFixtures.js';

const texts = [
  { text: 'the ferry was late again', label: 'delays' },
  { text: 'lovely crew', label: 'praise' },
];
const lexicon = freeze(Tally.fromTexts(texts, resolveRules()), { shape: { length: 4, pad: 'end', cut: 'end' } });
const expected = lexicon.encodeMany(texts);

function refusal(input: unknown): { code: string; message: string } {
  try {
    // The wrong inputs a JavaScript caller (or a cast) can pass.
    lexicon.encodeMany(input as Iterable<string>);
  } catch (e) {
    if (isLexlockError(e)) return { code: e.code, message: e.message };
    return { code: 'not a LexlockError', message: (e as Error).message };
  }
  throw new Error('expected encodeMany to refuse');
}

describe('encodeMany inputs', () => {
  it.each<[string, () => Iterable<{ text: string; label?: string } | string>]>([
    ['an array', () => texts],
    ['a generator', () => (function* () { yield* texts; })()],
    ['a Set', () => new Set(texts)],
    ['Map values', () => new Map(texts.map((t, i) => [i, t])).values()],
    ['documents with keys and places', () => texts.map((t, i) => ({ ...t, key: String(i + 1), where: { file: 'x.csv', row: i + 1 } }))],
  ])('encodes %s like the same texts in an array', (_name, make) => {
    const batch = lexicon.encodeMany(make());
    expect(Array.from(batch.ids)).toEqual(Array.from(expected.ids));
    expect(Array.from(batch.labels ?? [])).toEqual([0, 1]);
  });

  it('refuses a corpus reader (an async iterable) and names encodeBatches', async () => {
    const path = await fixtureFile('notes.txt', 'late ferry\nlovely crew\n');
    expect(refusal(readCorpus(path))).toEqual({
      code: 'BAD_OPTION',
      message:
        'encodeMany takes texts it can read at once (an array, a Set, a generator), and this is an async iterable such as readCorpus(...): read it in batches with encodeBatches(corpus, lexicon, { rows }), or collect its texts into an array first',
    });
  });

  it.each<[string, unknown, string]>([
    ['one string', 'late again', 'encodeMany takes many texts, and this is one string (it would become one row a character): encode it with encode(text), or pass [text]'],
    ['a number', 42, 'encodeMany takes an iterable of texts or { text, label } objects, and this is a number'],
    ['null', null, 'encodeMany takes an iterable of texts or { text, label } objects, and this is null'],
    ['a plain object', { text: 'late' }, 'encodeMany takes an iterable of texts or { text, label } objects, and this is an object that is not iterable: wrap one document in an array'],
  ])('refuses %s', (_name, input, message) => {
    expect(refusal(input)).toEqual({ code: 'BAD_OPTION', message });
  });

  it.each<[string, unknown[], string]>([
    ['a number among texts', ['late', 7], 'document 2 is a number, not a text or a { text, label } object'],
    ['an object without text', [{ body: 'late' }], 'document 1 has undefined as its text; a text is a string'],
    ['a number label', ['late', { text: 'crew', label: 4 }], 'document 2 has a number as its label; a label is a string (write 4 as "4")'],
    ['a number key', [{ text: 'crew', key: 9 }], 'document 1 has a number as its key; a key is a string'],
  ])('refuses %s, naming the document (a number label would otherwise encode as -1 silently)', (_name, input, message) => {
    expect(refusal(input)).toEqual({ code: 'BAD_FIELD_TYPE', message });
  });
});
