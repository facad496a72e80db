import { inputError } from '../LexlockError.js';
import { NumberSpill } from '../files/NumberSpill.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import type { Shape } from '../lexicon/Shape.js';
import type { TextRules } from '../rules/TextRules.js';
import { Tally } from '../tally/Tally.js';
import { IN_FLIGHT_PER_THREAD, batchesOf, inOrder } from '../workers/batches.js';
import type { WorkerReply } from '../workers/messages.js';
import { WorkerPool } from '../workers/WorkerPool.js';
import { LoopTurns } from './loopTurns.js';
import { KeyQueue, keyOf, lexlockBug, rowWriter, type EncodableDocument, type EncodeStats, type RowSink } from './encodeCorpus.js';
import { snippetKeeper, type CorpusTally, type TallyCorpusOptions } from './tallyCorpus.js';

/** A tally that also kept every document as token numbers, to encode them once a lexicon is made. */
export interface RecordedTally extends CorpusTally {
  /**
   * Encodes the counted documents, in corpus order, with a lexicon made from this tally: the same
   * rows as `encodeCorpus` on the corpus, without reading or tokenizing it again. Once only.
   */
  encode(lexicon: Lexicon, shape: Shape | null, sink: RowSink): Promise<EncodeStats>;
  /** Deletes the spill file (also done by `encode` when it ends). */
  discard(): Promise<void>;
}

/** Label strings as small numbers, in the order first seen (-1: no label). */
class LabelNumbers {
  readonly labels: string[] = [];
  private readonly numbers = new Map<string, number>();

  of(label: string | undefined): number {
    if (label === undefined) return -1;
    let n = this.numbers.get(label);
    if (n === undefined) {
      n = this.labels.length;
      this.labels.push(label);
      this.numbers.set(label, n);
    }
    return n;
  }
}

/**
 * Tallies a stream of documents as `tallyCorpus` does and writes each document's token numbers (4
 * bytes a token) and key to a spill file at `spillPath`, so the corpus can be encoded after freezing
 * without a second pass, its rows keyed as `encodeCorpus` keys them. Numbers are those of the final tally (`Tally.numberOf`) for documents counted on this
 * thread; a worker's are those of the counts it keeps, mapped once it sends them. The caller removes
 * the file with `discard` if it does not encode.
 * @example
 * const recorded = await tallyAndRecord(readCorpus('train.csv', { label: 'topic' }), resolveRules(), 'train.numbers.tmp');
 * const lexicon = freeze(recorded.tally, { cap: 12000, shape: { length: 96, pad: 'start', cut: 'end' } });
 * await recorded.encode(lexicon, lexicon.shape, { row: (ids) => void train.push([...ids]) });
 */
export async function tallyAndRecord(
  documents: AsyncIterable<EncodableDocument> | Iterable<EncodableDocument>,
  rules: TextRules,
  spillPath: string,
  options: TallyCorpusOptions = {},
): Promise<RecordedTally> {
  const tally = new Tally(rules);
  const keeper = snippetKeeper();
  const labels = new LabelNumbers();
  // Group -> (a worker's token number -> the final tally's number); group 0 is the final tally's own.
  const groups = new Map<number, Int32Array>();
  const spill = await NumberSpill.create(spillPath);
  const threads = options.threads ?? 1;
  try {
    if (threads <= 1) {
      let place = 0;
      const turns = new LoopTurns({ rules, strings: false });
      try {
        for await (const doc of documents) {
          place += 1;
          const text = typeof doc === 'string' ? doc : doc.text;
          const label = typeof doc === 'string' ? undefined : doc.label;
          const wait = turns.before(text);
          if (wait !== null) await wait;
          const numbers = tally.addNumberedText(text, label);
          keeper.see(text);
          await spill.add(labels.of(label), 0, numbers, numbers.length, keyOf(doc) ?? String(place));
        }
      } finally {
        turns.done();
      }
    } else {
      const pool = WorkerPool.start({ kind: 'tally', rules, numbered: true }, threads, { tally });
      // Keys stay on this thread: noted as documents are batched, taken back as their numbers come in order.
      const keys = new KeyQueue();
      let place = 0;
      const merge = (reply: WorkerReply) => {
        if (!('tally' in reply)) return;
        const map = new Int32Array(reply.tally.types.length);
        tally.mergeCounts(reply.tally, map);
        groups.set(reply.group, map);
      };
      try {
        await inOrder(
          batchesOf(documents, (text, doc) => {
            keeper.see(text);
            place += 1;
            keys.push(keyOf(doc) ?? String(place));
          }),
          (b) => pool.submit(b),
          async (batch, reply) => {
            merge(reply);
            if (!('numbered' in reply) || reply.numbered === undefined) throw lexlockBug(`a tally worker answered batch ${batch.id} without token numbers`);
            const { numbers, lengths, group } = reply.numbered;
            let at = 0;
            for (let i = 0; i < lengths.length; i++) {
              const n = lengths[i] as number;
              await spill.add(labels.of(batch.labels[i] ?? undefined), group, numbers.subarray(at, at + n), n, keys.take() as string);
              at += n;
            }
          },
          threads * IN_FLIGHT_PER_THREAD,
        );
        for (const reply of await pool.flush()) merge(reply);
      } finally {
        await pool.close();
      }
    }
  } catch (e) {
    await spill.remove();
    throw e;
  }
  return {
    tally,
    snippets: keeper.snippets,
    async encode(lexicon, shape, sink) {
      try {
        // Final tally number -> lexicon id, in one lookup per distinct token; then per group.
        const idOf = lexicon.idsOf([...tally.tokenList()]);
        const idsOfGroup = new Map<number, Int32Array>([[0, idOf]]);
        for (const [group, map] of groups) idsOfGroup.set(group, map.map((n) => idOf[n] as number));
        const { stats, write } = rowWriter(lexicon, shape, sink);
        let ids = new Int32Array(1024);
        for await (const { label, group, numbers, key } of spill.documents()) {
          const table = idsOfGroup.get(group);
          if (table === undefined) {
            throw inputError('IO', { file: spill.path }, `a document's token numbers are of group ${group}, which no counts came with; something else changed the temporary file, or this is a lexlock bug`);
          }
          if (numbers.length > ids.length) ids = new Int32Array(Math.max(numbers.length, ids.length * 2));
          const row = ids.subarray(0, numbers.length);
          for (let i = 0; i < numbers.length; i++) row[i] = table[numbers[i] as number] as number;
          await write(row, label === -1 ? undefined : labels.labels[label], key);
        }
        return stats;
      } finally {
        await spill.remove();
      }
    },
    discard: () => spill.remove(),
  };
}
