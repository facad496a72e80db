import { open } from 'node:fs/promises';
import { inventedWord } from './inventedWord.js';
import type { WrittenCorpus } from './mailCorpus.js';
import { pickOne, randomInt, seededRandom, type Random } from './seededRandom.js';
import { zipfRank } from './zipfRank.js';

const OPINION = ['great', 'late', 'friendly', 'cold', 'clean', 'slow', 'lovely', 'awful', 'fine', 'noisy', 'quick', 'rude', 'helpful', 'cramped'];
const COMMON = ['the', 'and', 'was', 'a', 'to', 'very', 'not', 'but', 'crew', 'ferry', 'cabin', 'deck', 'food', 'staff', 'trip', 'seats', 'again'];

function reviewText(random: Random): string {
  const sentences: string[] = [];
  const n = randomInt(random, 1, 9);
  for (let s = 0; s < n; s++) {
    const words: string[] = [];
    const len = randomInt(random, 4, 18);
    for (let i = 0; i < len; i++) {
      const r = random();
      if (r < 0.4) words.push(pickOne(random, COMMON));
      else if (r < 0.5) words.push(pickOne(random, OPINION));
      else if (r < 0.97) words.push(inventedWord(zipfRank(random, 20_000, 1.05) - 1));
      else if (r < 0.985) words.push(`"${pickOne(random, OPINION)}"`);
      else words.push(`${randomInt(random, 1, 12)}/10`);
    }
    sentences.push(words.join(random() < 0.2 ? ', ' : ' ') + pickOne(random, ['.', '!', '...', '?']));
  }
  return sentences.join(random() < 0.1 ? '\n' : ' ');
}

/** A CSV field, quoted (quotes doubled) when it holds a comma, quote or line break (RFC 4180). */
function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/**
 * One row of the review-like CSV (`id,stars,text`, no line end): an invented review of a ferry trip
 * with 1 to 5 stars; the text has commas, quotes and the odd line break, so many rows are quoted.
 */
export function reviewRow(random: Random, id: number): string {
  return `${id},${randomInt(random, 1, 5)},${csvField(reviewText(random))}`;
}

/**
 * Writes a review-like CSV with a header row and `rows` rows, `stars` being the label column. The same
 * seed always writes the same bytes.
 */
export async function writeReviewCsv(path: string, options: { rows: number; seed: number }): Promise<WrittenCorpus> {
  const random = seededRandom(options.seed);
  const file = await open(path, 'w');
  let bytes = 0;
  try {
    let chunk = 'id,stars,text\n';
    for (let i = 0; i < options.rows; i++) {
      chunk += reviewRow(random, i + 1) + '\n';
      if (chunk.length > 1 << 20 || i === options.rows - 1) {
        const data = Buffer.from(chunk, 'utf8');
        bytes += data.byteLength;
        await file.write(data);
        chunk = '';
      }
    }
    if (chunk !== '') {
      const data = Buffer.from(chunk, 'utf8');
      bytes += data.byteLength;
      await file.write(data);
    }
  } finally {
    await file.close();
  }
  return { documents: options.rows, bytes };
}
