import { inputError } from '../LexlockError.js';

/** The kinds of corpus lexlock reads. */
export type CorpusKind = 'csv' | 'tsv' | 'jsonl' | 'txt' | 'folder';

/** True for the kinds whose documents have named fields (`--text`, `--label`): csv, tsv, jsonl. */
export function hasFields(kind: CorpusKind): boolean {
  return kind === 'csv' || kind === 'tsv' || kind === 'jsonl';
}

const BY_EXTENSION = new Map<string, CorpusKind>([
  ['.csv', 'csv'],
  ['.tsv', 'tsv'],
  ['.jsonl', 'jsonl'],
  ['.ndjson', 'jsonl'],
  ['.txt', 'txt'],
]);

/**
 * The kind of a corpus file from its extension (any letter case), or `CORPUS_KIND` naming the file
 * and the kinds lexlock reads. A folder is always `folder`.
 */
export function corpusKind(path: string, isFolder: boolean): CorpusKind {
  if (isFolder) return 'folder';
  const name = path.slice(Math.max(path.lastIndexOf('/'), path.lastIndexOf('\\')) + 1);
  const dot = name.lastIndexOf('.');
  const extension = dot > 0 ? name.slice(dot).toLowerCase() : '';
  const kind = BY_EXTENSION.get(extension);
  if (kind !== undefined) return kind;
  const what = extension === '' ? 'a file without an extension' : `"${name.slice(dot)}" files`;
  throw inputError(
    'CORPUS_KIND',
    { file: path },
    `cannot read ${what}; a corpus is a .csv, .tsv, .jsonl, .ndjson or .txt file, or a folder with one document per file`,
  );
}
