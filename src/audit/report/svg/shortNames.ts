/**
 * Names cut to at most `max` characters with an ellipsis in the middle, keeping both ends. Where
 * cut names would look alike, more of their ends is kept (less of their starts) until they differ,
 * as far as a 3-character start allows.
 * @example shortNames(['lost-property-north-pier', 'lost-property-south-pier'], 12) // ['los…rth-pier', 'los…uth-pier']
 */
export function shortNames(names: readonly string[], max: number): string[] {
  const cut = (name: string, tail: number): string => {
    const chars = [...name];
    if (chars.length <= max) return name;
    const head = max - 1 - tail;
    return `${chars.slice(0, head).join('')}…${chars.slice(chars.length - tail).join('')}`;
  };
  const firstTail = Math.floor((max - 1) / 2);
  for (let tail = firstTail; tail <= max - 4; tail++) {
    const out = names.map((n) => cut(n, tail));
    if (new Set(out).size === new Set(names).size || tail === max - 4) return out;
  }
  return names.map((n) => cut(n, firstTail));
}
