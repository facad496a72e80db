import type { Lexicon } from '../lexicon/Lexicon.js';
import { hasFields } from './corpusKind.js';
import { readCorpus, type CorpusOptions, type CorpusReader } from './readCorpus.js';

/** What a lexicon says about reading a corpus with it: its fields and its bad-text policy. */
export type LexiconReadDefaults = Pick<CorpusOptions, 'text' | 'label' | 'badText'>;

/**
 * How to read the corpus at `path` with `lexicon` when nothing else is said: the text and label fields
 * the lexicon was built from, where the corpus kind has fields (a .txt or folder corpus gets none), and
 * the bad-text policy its corpus was read with (`lexicon.badText`).
 * @example lexiconReadDefaults('held-out.csv', lexicon) // { text: 'text', label: 'topic', badText: 'replace' }
 */
export function lexiconReadDefaults(path: string, lexicon: Lexicon): LexiconReadDefaults {
  const fit = hasFields(readCorpus(path).kind) ? lexicon.fit : null;
  const out: LexiconReadDefaults = { badText: lexicon.badText };
  if (fit?.textField != null) out.text = fit.textField;
  if (fit?.labelField != null) out.label = fit.labelField;
  return out;
}

/**
 * Opens a corpus to be read with a lexicon, as `lexlock encode` and `audit` read it: the lexicon's
 * fields and bad-text policy ({@link lexiconReadDefaults}) unless `options` names others.
 * @example for await (const { text } of readCorpusFor('live.jsonl', lexicon)) lexicon.encode(text);
 */
export function readCorpusFor(path: string, lexicon: Lexicon, options: CorpusOptions = {}): CorpusReader {
  return readCorpus(path, { ...lexiconReadDefaults(path, lexicon), ...options });
}
