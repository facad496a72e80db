import { relative, resolve, sep } from 'node:path';

/**
 * `file` as a path relative to `folder`, with `/` separators: how an encoded folder's manifest names
 * the lexicon, so it holds no absolute path of the machine that wrote it (a lexicon on another
 * drive stays absolute, as `path.relative` gives it).
 * @example pathFrom('out/encoded', 'lexicon.json') // '../../lexicon.json'
 */
export function pathFrom(folder: string, file: string): string {
  return relative(resolve(folder), resolve(file)).split(sep).join('/');
}
