type EngineStrings = string & { isWellFormed(): boolean; toWellFormed(): string };

const LONE_SURROGATES = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;
const engineHasIt = typeof (String.prototype as { toWellFormed?: unknown }).toWellFormed === 'function';

/**
 * `text` with every lone surrogate replaced by U+FFFD, as a UTF-8 encoder would write it; the same
 * string when it has none. The first step of the text rules (encoding contract, rule 1, as lexlock
 * defines it): JavaScript strings may hold lone surrogates (a JSONL `"\ud800"` escape, text cut in the
 * middle of a pair), files and lexicons cannot, so no token ever holds one.
 * @example wellFormed('a\uD800b') // 'a\uFFFDb'
 */
export function wellFormed(text: string): string {
  if (engineHasIt) {
    const s = text as EngineStrings;
    return s.isWellFormed() ? text : s.toWellFormed();
  }
  return text.replace(LONE_SURROGATES, '\uFFFD');
}
