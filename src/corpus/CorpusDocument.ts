import type { Where } from '../LexlockError.js';

/**
 * One document of a corpus: its text, its label when the corpus has labels, its key, and where it
 * starts (`{file, line, byteOffset}`, plus `row` for CSV/TSV/JSONL; `{file}` for a file of a folder
 * corpus).
 */
export interface CorpusDocument {
  text: string;
  label?: string;
  /**
   * What traces a row back to its document, unique in the corpus: the path relative to the folder
   * (with `/`) for a folder corpus, the line number for `.txt`, the data-row number for CSV/TSV/JSONL
   * (the header is row 0; blank lines are no rows; a row left out for bad text still counts), as a
   * decimal string; or, read with a key field (`CorpusOptions.key`), that field's value.
   */
  key: string;
  where: Where;
}
