import { LexlockError, inputError, type Where } from '../LexlockError.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { checkedItem, kindOf } from '../lexicon/manyTexts.js';
import { checkShape, type Shape } from '../lexicon/Shape.js';
import { BatchBuffer, type KeyedBatch } from './BatchBuffer.js';
import { Pcg32 } from './Pcg32.js';
import { RowPool } from './RowPool.js';

export type { KeyedBatch } from './BatchBuffer.js';

/** A document as encodeBatches takes it: a text, or an object such as a `CorpusDocument`. */
export type BatchDocument = string | { text: string; label?: string | undefined; key?: string | undefined; where?: Where | undefined };

/** Seeded shuffling within a pool of rows held back. */
export interface ShuffleOptions {
  /** Seeds the PCG32 generator (a whole number from 0 to 2^53 - 1): the same seed and corpus give the same order. */
  seed: number;
  /** Rows held back to draw from (at least 1): 4 x length + 8 bytes each, allocated when a pass starts. */
  pool: number;
}

/** Options of {@link encodeBatches}. */
export interface BatchOptions {
  /** Rows a batch (a whole number from 1); the last batch may have fewer. */
  rows: number;
  /** Default: the lexicon's own shape; one of the two is needed. */
  shape?: Shape | undefined;
  /** Rows in a seeded random order instead of corpus order; absent: corpus order. */
  shuffle?: ShuffleOptions | undefined;
  /**
   * Rows without a label are intended: they get label id -1. Without it, a document with no label
   * stops the stream (`MISSING_FIELD`) when the lexicon has labels, since a training run would
   * otherwise learn from rows whose labels were dropped on the way.
   */
  unlabelled?: boolean | undefined;
}

/** What a pass of an {@link encodeBatches} stream has read so far (restarted by each pass). */
export interface BatchCounts {
  documents: number;
  /** Documents whose label the lexicon does not know (label id -1). */
  unknownLabels: number;
  /** Documents with no label (label id -1). */
  unlabelled: number;
}

/** Batches of a corpus, read as they are iterated (`for await`); each iteration is a new pass from the corpus's start. */
export interface BatchStream extends AsyncIterable<KeyedBatch> {
  readonly counts: BatchCounts;
}

/**
 * Encodes any corpus in batches of `rows` rows for a training loop: a `readCorpus(...)` reader, or
 * any iterable or async iterable of texts or `{ text, label, key }` objects. Each batch's `keys` are
 * the documents' keys (for texts and objects without one, the position in the corpus from 1, as a
 * decimal string), its `labels` the lexicon's label ids (-1 for a label it does not know). Memory holds
 * one batch, plus the shuffle pool when there is one: never the corpus.
 * @example
 * for await (const batch of encodeBatches(readCorpus('train.csv', { label: 'topic' }), lexicon, { rows: 64 })) {
 *   const x = tf.tensor2d(batch.ids, [batch.rows, batch.length], 'int32');
 * }
 */
export function encodeBatches(
  documents: AsyncIterable<BatchDocument> | Iterable<BatchDocument>,
  lexicon: Lexicon,
  options: BatchOptions,
): BatchStream {
  checkDocuments(documents);
  // Read through a possibly missing object: a JavaScript caller may leave the options out.
  const asked = (options as Partial<BatchOptions> | undefined)?.rows;
  if (asked === undefined || !Number.isSafeInteger(asked) || asked < 1) {
    throw new LexlockError('BAD_OPTION', `rows: ${String(asked)} is not a whole number of rows from 1`, { field: 'rows' });
  }
  const rows: number = asked;
  const given = options.shape ?? lexicon.shape;
  if (given === null) {
    throw new LexlockError('BAD_OPTION', 'shape: the lexicon stores no shape, so the rows have no length; pass { shape: { length, pad, cut } }', { field: 'shape' });
  }
  const shape: Shape = checkShape(given);
  const shuffle = options.shuffle;
  if (shuffle !== undefined) {
    if (!Number.isSafeInteger(shuffle.pool) || shuffle.pool < 1) {
      throw new LexlockError('BAD_OPTION', `shuffle.pool: ${String(shuffle.pool)} is not a whole number of rows from 1`, { field: 'shuffle.pool' });
    }
    if (!Number.isSafeInteger(shuffle.seed) || shuffle.seed < 0) {
      throw new LexlockError('BAD_OPTION', `shuffle.seed: ${String(shuffle.seed)} is not a whole number from 0 to 2^53 - 1`, { field: 'shuffle.seed' });
    }
  }
  const unlabelledOk = options.unlabelled === true;
  const labelIds = new Map(lexicon.labels.map((label, id) => [label, id]));
  const counts: BatchCounts = { documents: 0, unknownLabels: 0, unlabelled: 0 };

  async function* pass(): AsyncGenerator<KeyedBatch> {
    counts.documents = 0;
    counts.unknownLabels = 0;
    counts.unlabelled = 0;
    const batch = new BatchBuffer(rows, shape.length);
    const pool = shuffle === undefined ? null : new RowPool(shuffle.pool, shape.length, new Pcg32(shuffle.seed));
    for await (const item of documents) {
      const position = counts.documents + 1;
      const { text, label, key } = checkedItem(item, position);
      counts.documents = position;
      const rowKey = key ?? String(position);
      let labelId = -1;
      if (label === undefined) {
        if (labelIds.size > 0 && !unlabelledOk) throw missingLabel(item, rowKey, lexicon.labels);
        counts.unlabelled += 1;
      } else {
        labelId = labelIds.get(label) ?? -1;
        if (labelId === -1) counts.unknownLabels += 1;
      }
      const ids = lexicon.encode(text, { shape });
      const kept = tokensIn(ids);
      if (pool === null) batch.put(ids, 0, kept, labelId, rowKey);
      else pool.offer(ids, kept, labelId, rowKey, batch);
      if (batch.full) yield batch.take();
    }
    if (pool !== null) {
      while (pool.size > 0) {
        pool.drawInto(batch);
        if (batch.full) yield batch.take();
      }
    }
    if (batch.rows > 0) yield batch.take();
  }

  return { counts, [Symbol.asyncIterator]: () => pass() };
}

/** Ids of a shaped row that are tokens: every id but padding (0, which no token has). */
function tokensIn(ids: Int32Array): number {
  let kept = 0;
  for (let i = 0; i < ids.length; i++) if (ids[i] !== 0) kept += 1;
  return kept;
}

function checkDocuments(documents: unknown): void {
  const iterable =
    typeof documents === 'object' &&
    documents !== null &&
    (typeof (documents as { [Symbol.iterator]?: unknown })[Symbol.iterator] === 'function' ||
      typeof (documents as { [Symbol.asyncIterator]?: unknown })[Symbol.asyncIterator] === 'function');
  if (!iterable) {
    const what = typeof documents === 'string' ? 'one string (it would become one row a character): pass [text]' : kindOf(documents);
    throw new LexlockError('BAD_OPTION', `encodeBatches takes a corpus (readCorpus(...), or an iterable of texts or { text, label, key } objects), and this is ${what}`, {});
  }
}

function missingLabel(item: BatchDocument, key: string, labels: readonly string[]): LexlockError {
  const where = typeof item === 'object' && item.where !== undefined ? item.where : {};
  const shown = labels.length <= 3 ? labels.join(', ') : `${labels.slice(0, 3).join(', ')}…`;
  return inputError(
    'MISSING_FIELD',
    where,
    `the document keyed "${key}" has no label, and the lexicon has ${labels.length} (${shown}): give every document its label (readCorpus(path, { label: FIELD }), or { text, label }), or pass { unlabelled: true } if rows with label -1 are intended`,
  );
}
