import type { Where } from '../LexlockError.js';

/**
 * One document of a corpus: its text, its label when the corpus has labels, and where it starts
 * (`{file, line, byteOffset}`, plus `row` for CSV/TSV; `{file}` for a file of a folder corpus).
 */
export interface CorpusDocument {
  text: string;
  label?: string;
  where: Where;
}
