import { LexlockError } from '../LexlockError.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { shapeInto, type Shape } from '../lexicon/Shape.js';
import type { LabelledText } from '../tally/Tally.js';
import { IN_FLIGHT_PER_THREAD, batchesOf, inOrder } from '../workers/batches.js';
import { WorkerPool } from '../workers/WorkerPool.js';
import { LoopTurns } from './loopTurns.js';
import { countRow, emptyEncodeStats, type EncodeStats, type RowFacts } from './EncodeStats.js';

/**
 * A document to encode: a text, or a text with a label and a key (a corpus reader's documents are such).
 * A document without a key is keyed by its place in the stream, 1 for the first, as a decimal string.
 */
export type EncodableDocument = string | (LabelledText & { key?: string });

/** Receives encoded rows in corpus order. */
export interface RowSink {
  /**
   * One document: `ids` (shaped when a shape was given, else variable length), how many of them are
   * tokens, its label id (-1 for a label the lexicon lacks, null for an unlabelled document), its
   * key (the document's own, or its place in the stream from 1) and what it had before it was
   * shaped (`facts`: its tokens and OOV tokens). `ids` and `facts` are reused for the next row:
   * copy them to keep them.
   */
  row(ids: Int32Array, kept: number, labelId: number | null, key: string, facts: RowFacts): Promise<void> | void;
}

export { countRow, emptyEncodeStats, type EncodeStats, type RowFacts } from './EncodeStats.js';

/** Options of {@link encodeCorpus}. */
export interface EncodeCorpusOptions {
  /** Worker threads to tokenize on (default 1: this thread). Rows and their order are the same for any count. */
  threads?: number;
}

/** Shapes one document's ids into the sink and counts what encoding it cost. */
export function rowWriter(lexicon: Lexicon, shape: Shape | null, sink: RowSink) {
  const stats = emptyEncodeStats(lexicon.labels.length);
  const facts: RowFacts = { tokens: 0, oovTokens: 0 };
  const shaped = shape === null ? null : new Int32Array(shape.length);
  const labels = new Map(lexicon.labels.map((l, i) => [l, i]));
  async function write(ids: Int32Array, label: string | undefined, key: string | undefined): Promise<void> {
    const rowKey = key ?? String(stats.documents + 1);
    let oov = 0;
    for (let i = 0; i < ids.length; i++) if (ids[i] === lexicon.oovId) oov += 1;
    facts.tokens = ids.length;
    facts.oovTokens = oov;
    const labelId = label === undefined ? null : (labels.get(label) ?? -1);
    countRow(stats, facts, shape, labelId);
    if (shape === null || shaped === null) {
      await sink.row(ids, ids.length, labelId, rowKey, facts);
      return;
    }
    shaped.fill(0);
    const kept = shapeInto(ids, shape, shaped, 0);
    await sink.row(shaped, kept, labelId, rowKey, facts);
  }
  return { stats, write };
}

/**
 * Encodes a stream of documents with a lexicon, row by row, into a sink: the same tokenize and id
 * path as `Lexicon.encode`, holding one row (or, with threads, a few batches) at a time. The event loop
 * gets a turn at least every 100 ms or so, a very long document included (LoopTurns).
 * @example
 * const rows: number[][] = [];
 * const stats = await encodeCorpus(readCorpus('held-out.jsonl'), lexicon, lexicon.shape, { row: (ids) => void rows.push([...ids]) });
 * stats.oovTokens / stats.tokens // the OOV rate of the held-out set
 */
export async function encodeCorpus(
  documents: AsyncIterable<EncodableDocument> | Iterable<EncodableDocument>,
  lexicon: Lexicon,
  shape: Shape | null,
  sink: RowSink,
  options: EncodeCorpusOptions = {},
): Promise<EncodeStats> {
  const { stats, write } = rowWriter(lexicon, shape, sink);
  const threads = options.threads ?? 1;
  if (threads <= 1) {
    const turns = new LoopTurns({ rules: lexicon.rules, strings: false });
    try {
      for await (const doc of documents) {
        const text = typeof doc === 'string' ? doc : doc.text;
        const wait = turns.before(text);
        if (wait !== null) await wait;
        await write(lexicon.encode(text, { shape: null }), typeof doc === 'string' ? undefined : doc.label, keyOf(doc));
      }
    } finally {
      turns.done();
    }
    return stats;
  }
  const pool = WorkerPool.start({ kind: 'encode', encoding: lexicon.encoding, fingerprint: lexicon.fingerprint }, threads, { lexicon });
  // Keys stay on this thread: noted as documents are batched, taken back as their rows come in order.
  const keys = new KeyQueue();
  try {
    await inOrder(
      batchesOf(documents, (_text, doc) => keys.push(keyOf(doc))),
      (b) => pool.submit(b),
      async (batch, reply) => {
        if (!('encoded' in reply)) throw lexlockBug(`an encode worker answered batch ${batch.id} without ids`);
        const { ids, lengths } = reply.encoded;
        let at = 0;
        for (let i = 0; i < lengths.length; i++) {
          const n = lengths[i] as number;
          await write(ids.subarray(at, at + n), batch.labels[i] ?? undefined, keys.take());
          at += n;
        }
      },
      threads * IN_FLIGHT_PER_THREAD,
    );
  } finally {
    await pool.close();
  }
  return stats;
}

/** An error that can only come from a mistake in lexlock itself. */
export function lexlockBug(what: string): LexlockError {
  return new LexlockError('IO', `${what}; this is a lexlock bug, please report it with the command you ran`);
}

/** A document's own key, or undefined (then its place in the stream keys it). */
export function keyOf(doc: EncodableDocument): string | undefined {
  return typeof doc === 'string' ? undefined : doc.key;
}

/**
 * The keys of documents sent to worker threads, first in first out: pushed as documents are batched,
 * taken as their rows come back in corpus order. Holds the keys of the batches in flight only.
 */
export class KeyQueue {
  private keys: Array<string | undefined> = [];
  private head = 0;

  push(key: string | undefined): void {
    this.keys.push(key);
  }

  take(): string | undefined {
    if (this.head >= this.keys.length) throw lexlockBug('a row came back for a document whose key was never noted');
    const key = this.keys[this.head];
    this.head += 1;
    if (this.head >= 4096 && this.head * 2 >= this.keys.length) {
      this.keys = this.keys.slice(this.head);
      this.head = 0;
    }
    return key;
  }
}
