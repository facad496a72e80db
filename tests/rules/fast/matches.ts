// Every match of one of wink's rules in a text, found the pattern's way or a finder's, for comparing them.
import type { Finder, Found } from '../../../src/rules/fast/Finder.js';

/**
 * Every match a finder finds searching from the start, as wink's global search takes them; with
 * `window`, each search may stop `window` code units on and is taken up again where it stopped.
 */
export function matchesOf(find: Finder, text: string, window = Number.POSITIVE_INFINITY): [number, number][] {
  const found: Found = { start: 0, end: 0 };
  const all: [number, number][] = [];
  let from = 0;
  for (;;) {
    const limit = Math.min(text.length, from + window);
    if (find(text, from, found, limit)) {
      all.push([found.start, found.end]);
      from = found.end;
    } else if (found.start >= text.length) return all;
    else {
      if (found.start < limit || found.start <= from) throw new Error(`the search stopped at ${found.start}, before its limit ${limit}`);
      from = found.start;
    }
  }
}

/** Every match of a global pattern, as String.prototype.match finds them. */
export function patternMatches(pattern: RegExp, text: string): [number, number][] {
  return [...text.matchAll(pattern)].map((m) => [m.index, m.index + m[0].length]);
}

/**
 * What `f` gives, or 'RangeError' when the engine gives up ("Maximum call stack size exceeded": V8 on
 * Node 20 keeps a saved state a character for some patterns and stops at a few million).
 */
export function orRangeError<T>(f: () => T): T | 'RangeError' {
  try {
    return f();
  } catch (e) {
    if (e instanceof RangeError) return 'RangeError';
    throw e;
  }
}
