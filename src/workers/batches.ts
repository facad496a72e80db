import type { LabelledText } from '../tally/Tally.js';
import type { Batch } from './messages.js';

/**
 * Documents a batch holds at most, and characters. Small batches keep threads evenly busy and little
 * text in flight (a 32 MB mail corpus: 2 M characters a batch took 2.46 s and 300 MiB to encode on 2
 * threads, 250 k characters 1.99 s and 217 MiB); tally and audit jobs keep counts across batches, so
 * a batch costs no merge.
 */
const BATCH_DOCUMENTS = 2000;
const BATCH_CHARS = 250_000;

/** Batches sent ahead per thread while the oldest is awaited (bounds the text in flight). */
export const IN_FLIGHT_PER_THREAD = 8;

/**
 * Groups a stream of documents into numbered batches for worker threads, calling `each` on every
 * document in order on the way (the main thread keeps what needs corpus order, such as snippets or keys).
 */
export async function* batchesOf<D extends string | LabelledText>(
  documents: AsyncIterable<D> | Iterable<D>,
  each: (text: string, document: D) => void = () => undefined,
): AsyncGenerator<Batch> {
  let batch: Batch = { id: 0, texts: [], labels: [] };
  let chars = 0;
  for await (const doc of documents) {
    const text = typeof doc === 'string' ? doc : doc.text;
    each(text, doc);
    batch.texts.push(text);
    batch.labels.push(typeof doc === 'string' ? null : (doc.label ?? null));
    chars += text.length;
    if (batch.texts.length >= BATCH_DOCUMENTS || chars >= BATCH_CHARS) {
      yield batch;
      batch = { id: batch.id + 1, texts: [], labels: [] };
      chars = 0;
    }
  }
  if (batch.texts.length > 0) yield batch;
}

/**
 * Sends batches to `submit` with at most `inFlight` outstanding and hands each reply to `take` in
 * batch order, so results never depend on which thread finished first.
 */
export async function inOrder<R>(batches: AsyncIterable<Batch>, submit: (b: Batch) => Promise<R>, take: (b: Batch, r: R) => Promise<void> | void, inFlight: number): Promise<void> {
  const pending: Array<[Batch, Promise<R>]> = [];
  for await (const b of batches) {
    // A turn of the event loop first: replies already back are taken in, so a worker that is free
    // counts as free (a reader that never waits on the loop would otherwise hide it).
    await new Promise((resolve) => setImmediate(resolve));
    const p = submit(b);
    p.catch(() => undefined); // awaited below, in order; this only keeps an early failure from going unhandled
    pending.push([b, p]);
    while (pending.length >= inFlight) {
      const [head, promise] = pending.shift() as [Batch, Promise<R>];
      await take(head, await promise);
    }
  }
  while (pending.length > 0) {
    const [head, promise] = pending.shift() as [Batch, Promise<R>];
    await take(head, await promise);
  }
}
