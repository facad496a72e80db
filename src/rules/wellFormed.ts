type EngineStrings = string & { isWellFormed(): boolean; toWellFormed(): string };

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
const LONE_SURROGATES = new RegExp(LONE_SURROGATE.source, 'g');
const engineHasIt = typeof (String.prototype as { toWellFormed?: unknown }).toWellFormed === 'function';

/**
 * True when `text` holds no lone surrogate (the engine's own check where it has one: ES2024).
 * @example isWellFormed('a\uD800') // false
 */
export function isWellFormed(text: string): boolean {
  return engineHasIt ? (text as EngineStrings).isWellFormed() : !LONE_SURROGATE.test(text);
}

/**
 * `text` with every lone surrogate replaced by U+FFFD, as a UTF-8 encoder would write it; the same
 * string when it has none. The first step of the text rules (encoding contract, rule 1, as lexlock
 * defines it): JavaScript strings may hold lone surrogates (a JSONL `"\ud800"` escape, text cut in the
 * middle of a pair), files and lexicons cannot, so no token ever holds one.
 * @example wellFormed('a\uD800b') // 'a\uFFFDb'
 */
export function wellFormed(text: string): string {
  if (isWellFormed(text)) return text;
  return engineHasIt ? (text as EngineStrings).toWellFormed() : text.replace(LONE_SURROGATES, '\uFFFD');
}
