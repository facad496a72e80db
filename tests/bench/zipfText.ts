import { open } from 'node:fs/promises';
import { inventedWord } from './inventedWord.js';
import type { WrittenCorpus } from './mailCorpus.js';
import { randomInt, seededRandom } from './seededRandom.js';
import { zipfRank } from './zipfRank.js';

/** Options of {@link writeZipfText}. */
export interface ZipfTextOptions {
  /** Stop at the first line end at or past this many bytes. */
  bytes: number;
  seed: number;
  /** Size of the rank space tokens are drawn from (default 20 million: a very long tail). */
  ranks?: number;
  /** Zipf exponent (default 1.12). */
  exponent?: number;
}

/** A written large-vocabulary corpus, with the number of distinct tokens it holds. */
export interface WrittenZipfText extends WrittenCorpus {
  distinctTokens: number;
}

/**
 * Writes a `.txt` corpus (one document a line) of invented words whose ranks follow Zipf's law over a
 * huge rank space, so the vocabulary has a long tail of rare words: about 236 MB give about 3.5 million
 * distinct tokens with the defaults. Counts distinct tokens as it goes. Same seed, same bytes.
 */
export async function writeZipfText(path: string, options: ZipfTextOptions): Promise<WrittenZipfText> {
  const random = seededRandom(options.seed);
  const ranks = options.ranks ?? 20_000_000;
  const exponent = options.exponent ?? 1.12;
  const seen = new Uint8Array(ranks + 1);
  let distinctTokens = 0;
  let documents = 0;
  let bytes = 0;
  const file = await open(path, 'w');
  try {
    while (bytes < options.bytes) {
      let chunk = '';
      while (chunk.length < 1 << 20 && bytes + chunk.length < options.bytes) {
        const n = randomInt(random, 10, 120);
        const words: string[] = [];
        for (let i = 0; i < n; i++) {
          const rank = zipfRank(random, ranks, exponent);
          if (seen[rank] === 0) {
            seen[rank] = 1;
            distinctTokens += 1;
          }
          words.push(inventedWord(rank - 1));
        }
        chunk += words.join(' ') + '\n';
        documents += 1;
      }
      const data = Buffer.from(chunk, 'utf8'); // ASCII only: bytes = characters
      bytes += data.byteLength;
      await file.write(data);
    }
  } finally {
    await file.close();
  }
  return { documents, bytes, distinctTokens };
}
