import { createReadStream } from 'node:fs';
import { isLexlockError } from '../LexlockError.js';
import type { CorpusStats } from './CorpusStats.js';
import { readError } from './readError.js';

/**
 * The bytes of a file, `chunkSize` at a time, streamed (memory does not grow with the file); adds
 * each chunk's length to `stats.bytes`. Read failures become `IO` errors naming `path`.
 */
export async function* fileChunks(path: string, chunkSize: number, stats: Pick<CorpusStats, 'bytes'>): AsyncGenerator<Buffer, void, undefined> {
  const stream = createReadStream(path, { highWaterMark: chunkSize });
  try {
    for await (const chunk of stream) {
      const bytes = chunk as Buffer; // no encoding was set, so the stream gives Buffers
      stats.bytes += bytes.length;
      yield bytes;
    }
  } catch (e) {
    throw isLexlockError(e) ? e : readError(path, e);
  } finally {
    stream.destroy();
  }
}
