import type { Lexicon } from 'lexlock/node';
import { inventedWord } from './inventedWord.js';
import { randomInt, seededRandom } from './seededRandom.js';

/**
 * A text of `words` words as a service would get it: mostly tokens of the lexicon (any rank), about
 * one in ten unknown to it, with some capitals and punctuation so normalization and lower-casing work.
 */
export function serviceText(lexicon: Lexicon, words: number, seed: number): string {
  const random = seededRandom(seed);
  const out: string[] = [];
  const first = lexicon.oovId === 1 ? 2 : 1;
  for (let i = 0; i < words; i++) {
    const token = random() < 0.1 ? `${inventedWord(randomInt(random, 50_000_000, 90_000_000))}` : (lexicon.tokenAt(randomInt(random, first, first + lexicon.size - 3)) ?? 'ferry');
    out.push(i % 12 === 0 ? token.charAt(0).toUpperCase() + token.slice(1) : token);
  }
  return out.join(' ') + '.';
}
