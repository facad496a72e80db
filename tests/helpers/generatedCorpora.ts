import { createWriteStream } from 'node:fs';
import { once } from 'node:events';

/** A whole number written in letters (a, b, …, z, ba, bb, …), so wink-tokenizer keeps it one word. */
export function letters(n: number): string {
  let out = '';
  do {
    out = String.fromCharCode(97 + (n % 26)) + out;
    n = Math.floor(n / 26);
  } while (n > 0);
  return out;
}

/** A seeded generator of numbers in [0, 1) (a linear congruential generator, Numerical Recipes' constants). */
export function seeded(seed: number): () => number {
  let x = seed >>> 0 || 1;
  return () => ((x = (Math.imul(x, 1664525) + 1013904223) >>> 0), x / 2 ** 32);
}

/** Writes `lines` lines, a line at a time from `line(i)`, without holding the file in memory. */
export async function writeLines(path: string, lines: number, line: (i: number) => string): Promise<void> {
  const out = createWriteStream(path);
  let chunk = '';
  for (let i = 0; i < lines; i++) {
    chunk += `${line(i)}\n`;
    if (chunk.length >= 1 << 16) {
      if (!out.write(chunk)) await once(out, 'drain');
      chunk = '';
    }
  }
  out.end(chunk);
  await once(out, 'close');
}

/**
 * A flat corpus: `lines` lines of `perLine` words, every word of the file distinct (`w` + a number in
 * letters), so every token occurs once: the hardest case for counting in bounded memory.
 */
export function writeFlatCorpus(path: string, lines: number, perLine = 10): Promise<void> {
  return writeLines(path, lines, (i) => Array.from({ length: perLine }, (_, k) => `w${letters(i * perLine + k)}`).join(' '));
}

/**
 * A corpus with Zipf-like word frequencies (Zipf 1949: word r about 1/r as often): `lines` lines of 12
 * words drawn from `vocabulary` made-up words, so a few words are common and most are rare.
 */
export function writeZipfCorpus(path: string, lines: number, vocabulary: number, seed: number): Promise<void> {
  const next = seeded(seed);
  return writeLines(path, lines, () => Array.from({ length: 12 }, () => `z${letters(Math.floor(vocabulary ** next()))}`).join(' '));
}
