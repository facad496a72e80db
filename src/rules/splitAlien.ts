import { WHITE_SPACE_TABLE } from './fast/whiteSpaceTable.js';

/**
 * How a token wink-tokenizer tags `alien` is split again (encoding contract, rule 2): each Han,
 * Hiragana or Katakana character alone; a maximal run of other letters, marks and digits; any other
 * non-space character alone. The definition; {@link splitAlien} gives its matches without running it.
 */
export const ALIEN_SPLIT =
  /[\p{sc=Han}\p{sc=Hiragana}\p{sc=Katakana}]|(?:(?![\p{sc=Han}\p{sc=Hiragana}\p{sc=Katakana}])[\p{L}\p{M}\p{N}])+|\S/gu;

const KANA_OR_HAN = /^[\p{sc=Han}\p{sc=Hiragana}\p{sc=Katakana}]$/u;
const LETTER_MARK_DIGIT = /^[\p{L}\p{M}\p{N}]$/u;

// What a code point is to ALIEN_SPLIT: white space (skipped), Han or kana (alone), another letter,
// mark or digit (in a run), anything else (alone).
const SPACE = 1;
const ALONE_HAN = 2;
const IN_RUN = 3;
const ALONE = 4;

/** The class of each code point below U+10000 once asked (0: not yet), from the engine's own properties. */
const CLASS = new Uint8Array(0x10000);

function classOf(cp: number): number {
  if (cp < 0x10000) {
    const known = CLASS[cp] as number;
    if (known !== 0) return known;
    const found = WHITE_SPACE_TABLE[cp] === 1 ? SPACE : classOfChar(String.fromCharCode(cp));
    CLASS[cp] = found;
    return found;
  }
  return classOfChar(String.fromCodePoint(cp));
}

function classOfChar(ch: string): number {
  if (KANA_OR_HAN.test(ch)) return ALONE_HAN;
  return LETTER_MARK_DIGIT.test(ch) ? IN_RUN : ALONE;
}

/**
 * Splits one alien token into the contract's pieces (the matches of {@link ALIEN_SPLIT}, in order),
 * appending them to `out`, in time linear in its length. The pattern run as it is keeps a saved
 * state a character of a run (its lookahead), and V8 gives up on a run of a few million letters
 * ("Maximum call stack size exceeded"); here each code point is classed once (with the engine's own
 * Unicode properties, remembered for the first plane) and the runs are cut where the pattern cuts
 * them. A lone surrogate is a code point of its own, as for the pattern with flag `u`.
 * @example splitAlien('東京へ行く', []) // ['東', '京', 'へ', '行', 'く']
 */
export function splitAlien(value: string, out: string[]): string[] {
  const n = value.length;
  let i = 0;
  while (i < n) {
    const cp = value.codePointAt(i) as number;
    const width = cp > 0xffff ? 2 : 1;
    const kind = classOf(cp);
    if (kind === SPACE) {
      i += width;
      continue;
    }
    if (kind !== IN_RUN) {
      out.push(value.slice(i, i + width));
      i += width;
      continue;
    }
    const start = i;
    i += width;
    while (i < n) {
      const next = value.codePointAt(i) as number;
      if (classOf(next) !== IN_RUN) break;
      i += next > 0xffff ? 2 : 1;
    }
    out.push(value.slice(start, i));
  }
  return out;
}
