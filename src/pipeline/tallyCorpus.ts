import type { TextRules } from '../rules/TextRules.js';
import { Tally, type LabelledText } from '../tally/Tally.js';
import { IN_FLIGHT_PER_THREAD, batchesOf, inOrder } from '../workers/batches.js';
import type { WorkerReply } from '../workers/messages.js';
import { WorkerPool } from '../workers/WorkerPool.js';
import { LoopTurns } from './loopTurns.js';

/** How many corpus snippets a lexicon keeps as canaries, and how long each may be. */
const SNIPPETS = 3;
const SNIPPET_CHARS = 160;

/** A tally of a corpus plus a few short documents of it to keep as canaries. */
export interface CorpusTally {
  tally: Tally;
  snippets: string[];
}

/** Options of {@link tallyCorpus}. */
export interface TallyCorpusOptions {
  /** Worker threads to tokenize on (default 1: this thread). The tally is the same for any count. */
  threads?: number;
}

/**
 * Keeps the few smallest (in JavaScript string order) short, non-blank documents: a choice that does
 * not depend on document order, thread count or how a corpus was split into shards.
 */
export function snippetKeeper(): { snippets: string[]; see: (text: string) => void } {
  const snippets: string[] = [];
  return {
    snippets,
    see(text) {
      if (text.length > SNIPPET_CHARS || !/\S/.test(text) || snippets.includes(text)) return;
      if (snippets.length === SNIPPETS && !(text < (snippets[SNIPPETS - 1] as string))) return;
      let i = snippets.length;
      while (i > 0 && text < (snippets[i - 1] as string)) i--;
      snippets.splice(i, 0, text);
      if (snippets.length > SNIPPETS) snippets.pop();
    },
  };
}

/**
 * Tallies a stream of documents (a corpus reader, or any async iterable of texts) under `rules`,
 * holding only the counts, and keeps a few short documents as canary snippets. With
 * `threads` > 1 the documents are tokenized in worker threads in batches; the result is identical.
 * The event loop gets a turn at least every 100 ms or so, a very long document included (LoopTurns).
 * @example
 * const { tally, snippets } = await tallyCorpus(readCorpus('reviews.csv', { label: 'topic' }), resolveRules(), { threads: 4 });
 * const lexicon = freeze(tally, { cap: 12000, snippets });
 */
export async function tallyCorpus(
  documents: AsyncIterable<string | LabelledText> | Iterable<string | LabelledText>,
  rules: TextRules,
  options: TallyCorpusOptions = {},
): Promise<CorpusTally> {
  const tally = new Tally(rules);
  const keeper = snippetKeeper();
  const threads = options.threads ?? 1;
  if (threads <= 1) {
    const turns = new LoopTurns({ rules, strings: false });
    try {
      for await (const doc of documents) {
        const text = typeof doc === 'string' ? doc : doc.text;
        const wait = turns.before(text);
        if (wait !== null) await wait;
        tally.add(doc);
        keeper.see(text);
      }
    } finally {
      turns.done();
    }
    return { tally, snippets: keeper.snippets };
  }
  const pool = WorkerPool.start({ kind: 'tally', rules }, threads, { tally });
  const merge = (reply: WorkerReply) => {
    if ('tally' in reply) tally.mergeCounts(reply.tally);
  };
  try {
    await inOrder(batchesOf(documents, keeper.see), (b) => pool.submit(b), (_b, reply) => merge(reply), threads * IN_FLIGHT_PER_THREAD);
    for (const reply of await pool.flush()) merge(reply);
  } finally {
    await pool.close();
  }
  return { tally, snippets: keeper.snippets };
}
