import { createReadStream } from 'node:fs';
import { LexlockError } from '../LexlockError.js';
import { JSON_FILE_MOST_BYTES } from '../artifact/jsonFileLimit.js';
import { readLines } from '../corpus/lines.js';
import { mergeTallyLines, type MergedTallyHeader } from '../tally/mergeTallyLines.js';
import { badTally } from '../tally/TallyCountsCheck.js';
import { TALLY_COUNTS_CLOSE, TALLY_COUNTS_OPEN, tallyHeaderLines } from '../tally/tallyFileText.js';
import { openAtomic, type AtomicFile } from './AtomicFile.js';

/** The most bytes of one line of a tally file: a line is one string, so the longest string V8 makes. */
const LINE_MOST_BYTES = JSON_FILE_MOST_BYTES;

/**
 * A tally file's lines in groups (about 64 KiB each), decoded as UTF-8, read as they are needed. A
 * file that cannot be read is `IO` in loadTally's words; a line past {@link LINE_MOST_BYTES}, `BAD_TALLY`.
 */
export async function* tallyFileLineGroups(path: string): AsyncGenerator<string[], void, undefined> {
  try {
    for await (const group of readLines(createReadStream(path), { maxBytes: LINE_MOST_BYTES, file: path })) {
      yield group.map((l) => l.bytes.toString('utf8'));
    }
  } catch (e) {
    if (e instanceof LexlockError) {
      if (e.code !== 'RECORD_TOO_LARGE') throw e;
      throw badTally({ file: path, line: e.where.line ?? 0 }, 'counts', `this line has more than ${LINE_MOST_BYTES.toLocaleString('en-US')} bytes, more than one string holds`);
    }
    const err = e as NodeJS.ErrnoException;
    const what = err.code === 'ENOENT' ? 'no such file' : err.code === 'EISDIR' ? 'is a folder, not a tally file' : err.message;
    throw new LexlockError('IO', `${path}: cannot read the tally (${what}); pass the path of a file written by lexlock tally or lexlock merge`, { file: path });
  }
}

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
