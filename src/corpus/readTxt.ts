import type { CorpusDocument } from './CorpusDocument.js';
import type { ReadContext } from './ReadContext.js';
import { readLineCorpus, type LineCorpus } from './readLineCorpus.js';

const TXT: LineCorpus = {
  blank: (bytes) => bytes.length === 0,
  document: (text, where) => ({ text, key: String(where.line), where }),
  reason: 'the file has no non-empty lines',
  advice: 'put one document on each line',
};

/**
 * A `.txt` corpus: each line that is not empty (after dropping a trailing CR) is one document;
 * white-space-only lines count.
 */
export function readTxt(context: ReadContext): AsyncGenerator<CorpusDocument[], void, undefined> {
  return readLineCorpus(context, TXT);
}
