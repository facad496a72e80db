import { createReadStream } from 'node:fs';
import { mergeTallyLines, type MergedTallyHeader } from '../tally/mergeTallyLines.js';
import { TALLY_COUNTS_CLOSE, TALLY_COUNTS_OPEN, tallyHeaderLines } from '../tally/tallyFileText.js';
import { openAtomic, type AtomicFile } from './AtomicFile.js';
import { tallyFileLineGroups } from './tallyFileLineGroups.js';

/**
 * Merges tally files into `output` in memory that does not grow with them (mergeTallyLines: one
 * entry a part at a time), byte for byte the file tallyFileMerge and saveTally would write. The
 * merged counts go to a temporary file beside `output` first (the file names its number of tokens
 * before its counts), then the output is written atomically from the merged header and that file;
 * both temporary files are removed whatever happens, so a broken part leaves no output at all.
 * The caller holds the output's lock and has checked that it may be written.
 * @example const { file, types } = await mergeTallyFiles(['a.tally', 'b.tally'], 'all.tally');
 */
export async function mergeTallyFiles(paths: readonly string[], output: string): Promise<MergedTallyHeader> {
  const encoder = new TextEncoder();
  const counts = await openAtomic(output);
  let out: AtomicFile | null = null;
  try {
    const merged = await mergeTallyLines(
      paths.map((name) => ({ name, lines: tallyFileLineGroups(name) })),
      (text) => counts.write(encoder.encode(text)),
    );
    await counts.seal();
    out = await openAtomic(output);
    let head = '';
    for (const line of tallyHeaderLines(merged.file, merged.types)) head += line;
    await out.write(encoder.encode(head + TALLY_COUNTS_OPEN));
    for await (const chunk of createReadStream(counts.tempPath)) await out.write(chunk as Buffer);
    await out.write(encoder.encode(TALLY_COUNTS_CLOSE));
    await out.commit();
    return merged;
  } catch (e) {
    await out?.abort();
    throw e;
  } finally {
    await counts.abort();
  }
}
