import { WordScan } from './fast/scanWordTokens.js';
import { normalize } from './normalize.js';
import { CharScan } from './scanCharTokens.js';
import type { TextRules } from './TextRules.js';
import type { TokenSpans } from './TokenSpans.js';

/** True when every code unit of `text` is ASCII: normalization (NFC or NFKC) leaves such text as it is. */
function isAscii(text: string): boolean {
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) > 0x7f) return false;
  return true;
}

/**
 * Whether a code point stops everything that could join it to what comes before it: not a surrogate,
 * not a Hangul jamo, not a mark (normalization composes only marks and jamo with what precedes them:
 * Unicode's NFC_Quick_Check=Maybe characters), and neither cased nor case-ignorable (lower-casing's only
 * rule that looks around a letter, the final sigma, looks through case-ignorable characters to cased
 * ones, so it stops here). Unicode's properties come from the engine.
 */
function standsAlone(cp: number): boolean {
  if (cp >= 0xd800 && cp <= 0xdfff) return false;
  if ((cp >= 0x1100 && cp <= 0x11ff) || (cp >= 0xd7b0 && cp <= 0xd7ff)) return false;
  return !/[\p{Cased}\p{Case_Ignorable}\p{M}]/u.test(String.fromCodePoint(cp));
}

const CUT_UNKNOWN = 0;
const CUT_YES = 1;
const CUT_NO = 2;
/** Whether a text may be cut before each code unit (see {@link mayCutBefore}), worked out when first asked. */
const CUT_BEFORE = new Uint8Array(0x10000);

/**
 * Whether a text may be cut before code unit `code` and each piece normalized and lower-cased alone,
 * with the same result as the whole: the character and the first character of its NFC and NFKC forms
 * each stand alone (see {@link standsAlone}). Then lone surrogates, normalization and lower-casing
 * treat the text on each side of the cut as they would within the whole (tests/rules/TokenScan.test.ts
 * checks it on the traps: Hangul compatibility jamo, whose NFKC forms join a syllable before them,
 * final sigma, marks, surrogates, U+FDFA).
 */
export function mayCutBefore(code: number): boolean {
  let known = CUT_BEFORE[code] as number;
  if (known === CUT_UNKNOWN) {
    const ch = String.fromCharCode(code);
    const nfc = ch.normalize('NFC');
    const nfkc = ch.normalize('NFKC');
    const yes = standsAlone(code) && nfc.length > 0 && standsAlone(nfc.codePointAt(0) as number) && nfkc.length > 0 && standsAlone(nfkc.codePointAt(0) as number);
    known = yes ? CUT_YES : CUT_NO;
    CUT_BEFORE[code] = known;
  }
  return known === CUT_YES;
}

/**
 * Where the piece of `text` that starts at `from` may end: the first place from `from + length` on
 * where the text may be cut (see {@link mayCutBefore}), or its end.
 */
export function pieceEnd(text: string, from: number, length: number): number {
  for (let i = from + length; i < text.length; i++) if (mayCutBefore(text.charCodeAt(i))) return i;
  return text.length;
}

/**
 * One text's tokens under the rules (encoding contract, rules 1 and 2), found in steps of bounded
 * work, so that a caller can pause between them (a text of many megabytes, or a hostile one, takes
 * seconds). This is the work {@link scanTokens} does, step by step: normalization (in pieces, cut only before
 * characters where that changes nothing: see {@link mayCutBefore}), then
 * the word level ({@link WordScan}) or the character level ({@link CharScan}). With `mayFold`, ASCII
 * text is read lower-cased instead of being copied (`out.folded`).
 * @example const scan = new TokenScan(); scan.begin(text, rules, out, true); while (!scan.step(1 << 18)) {} // out holds the tokens
 */
export class TokenScan {
  readonly #words = new WordScan();
  readonly #chars = new CharScan();
  #out: TokenSpans | null = null;
  #rules: TextRules | null = null;
  /** Normalizing: the text, how far it has been normalized, and the pieces so far. */
  #raw: string | null = null;
  #at = 0;
  #pieces: string[] = [];

  /** Starts on `text`, whose tokens go to `out` (begun here). */
  begin(text: string, rules: TextRules, out: TokenSpans, mayFold: boolean): void {
    this.#out = out;
    this.#rules = rules;
    if (mayFold && isAscii(text)) {
      out.begin(text, rules.case === 'lower', rules);
      this.#startTokens();
    } else {
      this.#raw = text;
      this.#at = 0;
      this.#pieces.length = 0;
    }
  }

  /**
   * Goes on for about `budget` units of work (Infinity: to the end): a piece of about that many code
   * units normalized, or that much tokenizing. True once every token is in `out`.
   */
  step(budget: number): boolean {
    const out = this.#out as TokenSpans;
    const rules = this.#rules as TextRules;
    const raw = this.#raw;
    if (raw !== null) {
      let normal: string;
      if (budget === Number.POSITIVE_INFINITY) normal = normalize(raw, rules);
      else {
        const end = pieceEnd(raw, this.#at, budget);
        this.#pieces.push(normalize(raw.slice(this.#at, end), rules));
        this.#at = end;
        if (end < raw.length) return false;
        normal = this.#pieces.length === 1 ? (this.#pieces[0] as string) : this.#pieces.join('');
        this.#pieces.length = 0;
      }
      this.#raw = null;
      out.begin(normal, false, rules);
      this.#startTokens();
      if (budget !== Number.POSITIVE_INFINITY) return false;
    }
    return rules.level === 'char' ? this.#chars.step(budget) : this.#words.step(budget);
  }

  #startTokens(): void {
    const out = this.#out as TokenSpans;
    const rules = this.#rules as TextRules;
    if (rules.level === 'char') this.#chars.begin(out, rules.spaces === 'drop' ? 'drop' : 'keep');
    else this.#words.begin(out);
  }
}
