const ONSETS = ['b', 'c', 'd', 'f', 'g', 'h', 'j', 'k', 'l', 'm', 'n', 'p', 'r', 's', 't', 'v', 'w', 'z', 'br', 'st', 'tr', 'pl', 'gr', 'sk'];
const VOWELS = ['a', 'e', 'i', 'o', 'u', 'ai', 'ou', 'ea'];
const SYLLABLES: readonly string[] = ONSETS.flatMap((o) => VOWELS.map((v) => o + v));

/**
 * The invented word of a rank: its digits in base 192 spelled as syllables, so every rank has its own
 * word, low ranks get short words and the words look like text to a tokenizer (letters only).
 * @example inventedWord(0) // 'ba'; inventedWord(500) gives a two-syllable word
 */
export function inventedWord(rank: number): string {
  let n = rank;
  let word = '';
  do {
    word = (SYLLABLES[n % SYLLABLES.length] ?? '') + word;
    n = Math.floor(n / SYLLABLES.length);
  } while (n > 0);
  return word;
}
