/**
 * The last segment of a path (`/` or `\` separated; separators at the end ignored): what a lexicon
 * records of the corpus it was built from, so the file never carries the folders of the machine
 * that built it. A path of separators only is kept as it is. Browser-safe.
 * @example corpusName('/home/build/data/reviews.csv') // 'reviews.csv'
 */
export function corpusName(path: string): string {
  const trimmed = path.replace(/[\\/]+$/, '');
  const name = trimmed.slice(Math.max(trimmed.lastIndexOf('/'), trimmed.lastIndexOf('\\')) + 1);
  return name === '' ? path : name;
}
