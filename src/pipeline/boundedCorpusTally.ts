import type { TextRules } from '../rules/TextRules.js';
import { boundedTally } from '../tally/boundedTally.js';
import type { LabelledText } from '../tally/Tally.js';
import type { MeasuredFit } from '../lexicon/measuredFit.js';
import { withTurns } from './loopTurns.js';
import { snippetKeeper, type CorpusTally } from './tallyCorpus.js';

/** What {@link boundedCorpusTally} needs: the lexicon's cap, min count, reserved tokens, and the limit. */
export interface BoundedCorpusOptions {
  cap: number;
  minCount: number;
  reserved: readonly string[];
  memoryLimitMiB: number;
}

/** A bounded count of a corpus: the tally to freeze, the fit figures it measured, canary snippets. */
export interface BoundedCorpusTally extends CorpusTally {
  measured: MeasuredFit;
}

/**
 * `tallyCorpus` within a memory limit (see boundedTally, and memoryPlan for how the limit is spent):
 * one or two passes over the corpus (`open` must give the same documents each time), exact for every
 * token the lexicon keeps, with the fit's figures of the whole corpus in `measured` (pass it to
 * freeze), canary snippets kept as tallyCorpus keeps them.
 * @example
 * const { tally, measured } = await boundedCorpusTally(() => readCorpus('big.txt'), resolveRules(), { cap: 50000, minCount: 1, reserved: [], memoryLimitMiB: 256 });
 * const lexicon = freeze(tally, { cap: 50000, measured });
 */
export async function boundedCorpusTally(
  open: () => AsyncIterable<string | LabelledText>,
  rules: TextRules,
  options: BoundedCorpusOptions,
): Promise<BoundedCorpusTally> {
  const keeper = snippetKeeper();
  let pass = 0;
  const bounded = await boundedTally(
    () => {
      // Each pass gives the event loop a turn every 100 ms or so between documents. No document is
      // tokenized ahead (that would hold all its tokens at once, past the memory plan): boundedTally
      // takes a long one a piece at a time (scanPieces), as one step.
      const documents = withTurns(open(), null);
      pass += 1;
      if (pass > 1) return documents;
      return (async function* () {
        for await (const d of documents) {
          keeper.see(typeof d === 'string' ? d : d.text);
          yield d;
        }
      })();
    },
    rules,
    { cap: options.cap, minCount: options.minCount, reserved: options.reserved, memoryLimitMiB: options.memoryLimitMiB },
  );
  return { tally: bounded.tally, snippets: keeper.snippets, measured: bounded.measured };
}
