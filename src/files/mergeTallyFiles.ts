import { createReadStream } from 'node:fs';
import { LexlockError } from '../LexlockError.js';
import { JSON_FILE_MOST_BYTES } from '../artifact/jsonFileLimit.js';
import { mergeTallyLines, type MergedTallyHeader } from '../tally/mergeTallyLines.js';
import { badTally } from '../tally/TallyCountsCheck.js';
import { TALLY_COUNTS_CLOSE, TALLY_COUNTS_OPEN, tallyHeaderLines } from '../tally/tallyFileText.js';
import { openAtomic, type AtomicFile } from './AtomicFile.js';

/** The most characters of one line of a tally file: a line is one string, so the longest string V8 makes. */
const LINE_MOST_CHARS = JSON_FILE_MOST_BYTES;
/** Bytes read from a part at a time: what each part holds besides its current entry. */
const READ_BYTES = 1 << 16;

/**
 * A tally file's lines (without their line feeds) in groups, one group for each 64 KiB read, decoded
 * as UTF-8 (a character split between two reads is put together first). The lines are slices of the
 * text read, so a part holds one read's text and no object for each line. A file that cannot be read
 * is `IO` in loadTally's words; a line longer than one string can be, `BAD_TALLY`.
 */
export async function* tallyFileLineGroups(path: string): AsyncGenerator<string[], void, undefined> {
  let rest = '';
  let line = 1;
  try {
    for await (const chunk of createReadStream(path, { encoding: 'utf8', highWaterMark: READ_BYTES })) {
      const text = chunk as string;
      if (rest.length + text.length > LINE_MOST_CHARS) {
        throw badTally({ file: path, line }, 'counts', `this line has more than ${LINE_MOST_CHARS.toLocaleString('en-US')} characters, more than one string holds`);
      }
      const lines = (rest + text).split('\n');
      rest = lines.pop() as string;
      line += lines.length;
      if (lines.length > 0) yield lines;
    }
  } catch (e) {
    if (e instanceof LexlockError) throw e;
    const err = e as NodeJS.ErrnoException;
    const what = err.code === 'ENOENT' ? 'no such file' : err.code === 'EISDIR' ? 'is a folder, not a tally file' : err.message;
    throw new LexlockError('IO', `${path}: cannot read the tally (${what}); pass the path of a file written by lexlock tally or lexlock merge`, { file: path });
  }
  if (rest !== '') yield [rest];
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
