import winkTokenizer from 'wink-tokenizer';

const wink = winkTokenizer();
const ALIEN = /[\p{sc=Han}\p{sc=Hiragana}\p{sc=Katakana}]|(?:(?![\p{sc=Han}\p{sc=Hiragana}\p{sc=Katakana}])[\p{L}\p{M}\p{N}])+|\S/gu;

/**
 * The plain per-document tokenizer the benchmark compares against, written out by hand: NFKC,
 * lower-case, wink-tokenizer, alien tokens split again. No options, no tally, no checks.
 */
export function plainTokens(text: string): string[] {
  const out: string[] = [];
  for (const { value, tag } of wink.tokenize(text.normalize('NFKC').toLowerCase())) {
    if (value === '') continue;
    if (tag === 'alien') for (const m of value.matchAll(ALIEN)) out.push(m[0]);
    else out.push(value);
  }
  return out;
}
