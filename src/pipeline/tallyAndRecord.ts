import { NumberSpill } from '../files/NumberSpill.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import type { Shape } from '../lexicon/Shape.js';
import { tokenize } from '../rules/tokenize.js';
import type { TextRules } from '../rules/TextRules.js';
import { Tally, type LabelledText } from '../tally/Tally.js';
import { rowWriter, type EncodeStats, type RowSink } from './encodeCorpus.js';
import { snippetKeeper, type CorpusTally } from './tallyCorpus.js';

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

/**
 * Tallies a stream of documents as `tallyCorpus` does (on this thread) and writes each document's
 * token numbers (see `Tally.numberOf`) to a spill file at `spillPath`, 4 bytes a token, so the corpus
 * can be encoded after freezing without a second pass. The caller removes the file with `discard`
 * if it does not encode.
 */
export async function tallyAndRecord(
  documents: AsyncIterable<string | LabelledText> | Iterable<string | LabelledText>,
  rules: TextRules,
  spillPath: string,
): Promise<RecordedTally> {
  const tally = new Tally(rules);
  const keeper = snippetKeeper();
  const labels: string[] = [];
  const labelIndex = new Map<string, number>();
  const spill = await NumberSpill.create(spillPath);
  let numbers = new Int32Array(1024);
  try {
    for await (const doc of documents) {
      const text = typeof doc === 'string' ? doc : doc.text;
      const label = typeof doc === 'string' ? undefined : doc.label;
      const tokens = tokenize(text, rules);
      if (tokens.length > numbers.length) numbers = new Int32Array(Math.max(tokens.length, numbers.length * 2));
      tally.addNumbered(tokens, label, numbers);
      keeper.see(text);
      let l = -1;
      if (label !== undefined) {
        l = labelIndex.get(label) ?? labels.length;
        if (l === labels.length) {
          labels.push(label);
          labelIndex.set(label, l);
        }
      }
      await spill.add(l, numbers, tokens.length);
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
        // Token number -> lexicon id, in one lookup per distinct token.
        const idOf = lexicon.idsOf([...tally.tokenList()]);
        const { stats, write } = rowWriter(lexicon, shape, sink);
        let ids = new Int32Array(1024);
        for await (const { label, numbers: n } of spill.documents()) {
          if (n.length > ids.length) ids = new Int32Array(Math.max(n.length, ids.length * 2));
          const row = ids.subarray(0, n.length);
          for (let i = 0; i < n.length; i++) row[i] = idOf[n[i] as number] as number;
          await write(row, label === -1 ? undefined : labels[label]);
        }
        return stats;
      } finally {
        await spill.remove();
      }
    },
    discard: () => spill.remove(),
  };
}
