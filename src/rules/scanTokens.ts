import type { TextRules } from './TextRules.js';
import { TokenScan } from './TokenScan.js';
import type { TokenSpans } from './TokenSpans.js';

const shared = new TokenScan();

/** One text's tokens found ahead of their use (see {@link keepPrepared}), until {@link scanTokens} takes them. */
let prepared: { text: string; rules: TextRules; spans: TokenSpans } | null = null;

/** Whether two sets of rules decide tokens alike (the same members; `drop` and `collapse` are kept sorted). */
function sameRules(a: TextRules, b: TextRules): boolean {
  return (
    a === b ||
    (a.level === b.level &&
      a.unicode === b.unicode &&
      a.case === b.case &&
      a.spaces === b.spaces &&
      a.tokenizer === b.tokenizer &&
      a.drop.join(',') === b.drop.join(',') &&
      a.collapse.join(',') === b.collapse.join(','))
  );
}

/**
 * Keeps `spans`, the finished tokens of `text` under `rules` (found with a {@link TokenScan}, in steps,
 * by a caller that must not block for long: src/pipeline does it for very long documents), so that
 * the next {@link scanTokens} of that same text under the same rules takes them instead of scanning
 * again. One text is kept at a time; keeping another, or {@link dropPrepared}, lets it go.
 */
export function keepPrepared(text: string, rules: TextRules, spans: TokenSpans): void {
  prepared = { text, rules, spans };
}

/** Whether the tokens of `text` under `rules` were found ahead (see {@link keepPrepared}) and wait for {@link scanTokens}. */
export function isPrepared(text: string, rules: TextRules): boolean {
  return prepared !== null && prepared.text === text && sameRules(prepared.rules, rules);
}

/** Lets go of the tokens {@link keepPrepared} kept, if nothing took them. */
export function dropPrepared(): void {
  prepared = null;
}

/**
 * Finds one text's tokens under the given rules (normalize, lower-case, tokenize: encoding contract,
 * rules 1 and 2) and leaves them in `out`. This is the only path from text to tokens: tally, encode,
 * canaries and audits all come through it (through {@link tokenize} where they need strings). It runs
 * a {@link TokenScan} to the end, or takes the tokens a caller found ahead with one (keepPrepared).
 *
 * With `mayFold`, ASCII text is not copied to be lower-cased: its spans are read lower-cased instead
 * (`out.folded`), so encoding such a text allocates nothing but its output. Other text is normalized
 * and lower-cased into a new string first.
 * @example scanTokens("Can't wait!", resolveRules(), out, true) // out holds 'ca', "n't", 'wait', '!'
 */
export function scanTokens(text: string, rules: TextRules, out: TokenSpans, mayFold: boolean): TokenSpans {
  if (prepared !== null && isPrepared(text, rules)) {
    out.takeFrom(prepared.spans);
    prepared = null;
    return out;
  }
  shared.begin(text, rules, out, mayFold);
  shared.step(Number.POSITIVE_INFINITY);
  return out;
}
