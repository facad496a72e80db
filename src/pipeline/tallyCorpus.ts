import type { TextRules } from '../rules/TextRules.js';
import { Tally, type LabelledText } from '../tally/Tally.js';

/** How many corpus snippets a lexicon keeps as canaries, and how long each may be. */
const SNIPPETS = 3;
const SNIPPET_CHARS = 160;

/** A tally of a corpus plus a few short documents of it to keep as canaries. */
export interface CorpusTally {
  tally: Tally;
  snippets: string[];
}

/**
 * Tallies a stream of documents (a corpus reader, or any async iterable of texts) under `rules`,
 * holding only the counts, and keeps the first few short documents as canary snippets.
 */
export async function tallyCorpus(documents: AsyncIterable<string | LabelledText> | Iterable<string | LabelledText>, rules: TextRules): Promise<CorpusTally> {
  const tally = new Tally(rules);
  const snippets: string[] = [];
  for await (const doc of documents) {
    const tokens = tally.add(doc);
    if (snippets.length < SNIPPETS) {
      const text = typeof doc === 'string' ? doc : doc.text;
      if (text.length <= SNIPPET_CHARS && tokens.length > 0 && !snippets.includes(text)) snippets.push(text);
    }
  }
  return { tally, snippets };
}
