/**
 * A record's own entries in JavaScript's default string order of their keys (UTF-16 code units);
 * keys such as `__proto__` or `constructor` are ordinary entries here.
 */
export function sortedEntries<T>(record: Readonly<Record<string, T>>): Array<[string, T]> {
  return Object.entries(record).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
}
