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

/**
 * A long text of about `bytes` UTF-8 bytes, made of service texts of 50 words (see {@link serviceText})
 * one after another, cut at a space: the long messages shaped encodes keep only a window of. With
 * `accented`, one word in twenty gets an accent (`é`), so the text must be normalized.
 */
export function longServiceText(lexicon: Lexicon, bytes: number, seed: number, accented: boolean): string {
  const random = seededRandom(seed);
  const parts: string[] = [];
  let size = 0;
  for (let i = 0; size < bytes; i++) {
    let part = serviceText(lexicon, 50, seed + i);
    if (accented) part = part.split(' ').map((w) => (random() < 0.05 ? `${w}é` : w)).join(' ');
    parts.push(part);
    size += Buffer.byteLength(part) + 1;
  }
  const text = parts.join(' ');
  const cut = text.lastIndexOf(' ', bytes);
  return Buffer.byteLength(text) <= bytes ? text : text.slice(0, cut > 0 ? cut : bytes);
}
