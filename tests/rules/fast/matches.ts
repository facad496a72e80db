// Every match of one of wink's rules in a text, found the pattern's way or a finder's, for comparing them.
import type { Finder, Found } from '../../../src/rules/fast/Finder.js';

/** Every match a finder finds searching from the start, as wink's global search takes them. */
export function matchesOf(find: Finder, text: string): [number, number][] {
  const found: Found = { start: 0, end: 0 };
  const all: [number, number][] = [];
  for (let at = 0; find(text, at, found); at = found.end) all.push([found.start, found.end]);
  return all;
}

/** Every match of a global pattern, as String.prototype.match finds them. */
export function patternMatches(pattern: RegExp, text: string): [number, number][] {
  return [...text.matchAll(pattern)].map((m) => [m.index, m.index + m[0].length]);
}

