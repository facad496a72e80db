import { LexlockError } from '../LexlockError.js';

/** One document as encodeMany and encodeBatches take it: a text, or a text with a label and a key. */
export type TextItem = string | { text: string; label?: string | undefined; key?: string | undefined };

/**
 * Checks that `texts` can be read at once (a synchronous iterable other than a string), throwing
 * `BAD_OPTION` that says what to do instead: an async iterable (a corpus reader) is read with
 * encodeBatches, one string is encoded with encode.
 */
export function checkManyTexts(texts: unknown): void {
  if (typeof texts === 'string') {
    throw new LexlockError(
      'BAD_OPTION',
      'encodeMany takes many texts, and this is one string (it would become one row a character): encode it with encode(text), or pass [text]',
      {},
    );
  }
  if (isObject(texts)) {
    if (typeof (texts as { [Symbol.iterator]?: unknown })[Symbol.iterator] === 'function') return;
    if (typeof (texts as { [Symbol.asyncIterator]?: unknown })[Symbol.asyncIterator] === 'function') {
      throw new LexlockError(
        'BAD_OPTION',
        'encodeMany takes texts it can read at once (an array, a Set, a generator), and this is an async iterable such as readCorpus(...): read it in batches with encodeBatches(corpus, lexicon, { rows }), or collect its texts into an array first',
        {},
      );
    }
    throw new LexlockError('BAD_OPTION', 'encodeMany takes an iterable of texts or { text, label } objects, and this is an object that is not iterable: wrap one document in an array', {});
  }
  throw new LexlockError('BAD_OPTION', `encodeMany takes an iterable of texts or { text, label } objects, and this is ${kindOf(texts)}`, {});
}

/**
 * The text and label of the `position`-th (1-based) document, checked: a string, or an object whose
 * `text` is a string and whose `label` and `key`, when present, are strings (`BAD_FIELD_TYPE` otherwise).
 */
export function checkedItem(item: unknown, position: number): { text: string; label: string | undefined; key: string | undefined } {
  if (typeof item === 'string') return { text: item, label: undefined, key: undefined };
  if (!isObject(item)) throw badItem(position, `is ${kindOf(item)}, not a text or a { text, label } object`);
  const { text, label, key } = item as { text?: unknown; label?: unknown; key?: unknown };
  if (typeof text !== 'string') throw badItem(position, `has ${kindOf(text)} as its text; a text is a string`);
  if (label !== undefined && typeof label !== 'string') throw badItem(position, `has ${kindOf(label)} as its label; a label is a string (write 4 as "4")`);
  if (key !== undefined && typeof key !== 'string') throw badItem(position, `has ${kindOf(key)} as its key; a key is a string`);
  return { text, label, key };
}

function badItem(position: number, what: string): LexlockError {
  return new LexlockError('BAD_FIELD_TYPE', `document ${position} ${what}`, {});
}

function isObject(value: unknown): value is object {
  return (typeof value === 'object' && value !== null) || typeof value === 'function';
}

/** A value's kind in words, for messages: `a number`, `null`, `an object`. */
export function kindOf(value: unknown): string {
  if (value === null) return 'null';
  if (value === undefined) return 'undefined';
  if (Array.isArray(value)) return 'an array';
  const type = typeof value;
  return type === 'object' ? 'an object' : `a ${type}`;
}
