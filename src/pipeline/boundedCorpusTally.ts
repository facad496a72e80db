import type { TextRules } from '../rules/TextRules.js';
import { boundedTally } from '../tally/boundedTally.js';
import type { LabelledText } from '../tally/Tally.js';
import { withTurns } from './loopTurns.js';
import { snippetKeeper, type CorpusTally } from './tallyCorpus.js';

/** Share of `--memory-limit` given to the counters; the rest is the runtime, buffers and the lexicon. */
const COUNTER_SHARE = 0.5;

/** What {@link boundedCorpusTally} needs: the lexicon's cap, min count, reserved tokens, and the limit. */
export interface BoundedCorpusOptions {
  cap: number;
  minCount: number;
  reserved: readonly string[];
  memoryLimitMiB: number;
}

/**
 * `tallyCorpus` within a memory limit: two passes over the corpus (`open` must give the same documents
 * each time), exact for every token that can make the cap (see boundedTally), canary snippets kept as
 * tallyCorpus keeps them. Counts of tokens that cannot make the cap are left out, so the fit's `types`
 * and coverage speak only of the tokens counted.
 * @example
 * const { tally, snippets } = await boundedCorpusTally(() => readCorpus('big.txt'), resolveRules(), { cap: 50000, minCount: 1, reserved: [], memoryLimitMiB: 256 });
 */
export async function boundedCorpusTally(
  open: () => AsyncIterable<string | LabelledText>,
  rules: TextRules,
  options: BoundedCorpusOptions,
): Promise<CorpusTally> {
  const keeper = snippetKeeper();
  let pass = 0;
  const bounded = await boundedTally(
    () => {
      // Each pass gives the event loop a turn every 100 ms or so, a very long document included.
      const documents = withTurns(open(), { rules, strings: true });
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
    { cap: options.cap, minCount: options.minCount, reserved: options.reserved, budgetBytes: options.memoryLimitMiB * 2 ** 20 * COUNTER_SHARE },
  );
  return { tally: bounded.tally, snippets: keeper.snippets };
}
