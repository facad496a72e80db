import { createReadStream } from 'node:fs';
import { LexlockError } from '../LexlockError.js';
import { JSON_FILE_MOST_BYTES } from '../artifact/jsonFileLimit.js';
import { badTally } from '../tally/TallyCountsCheck.js';

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
  // The start of a line no read has ended yet, in pieces: joined once its end comes, so a long line
  // costs its length once, not once a read.
  let pieces: string[] = [];
  let held = 0;
  let line = 1;
  try {
    for await (const chunk of createReadStream(path, { encoding: 'utf8', highWaterMark: READ_BYTES })) {
      const text = chunk as string;
      const lf = text.indexOf('\n');
      if (held + (lf === -1 ? text.length : lf) > LINE_MOST_CHARS) {
        throw badTally({ file: path, line }, 'counts', `this line has more than ${LINE_MOST_CHARS.toLocaleString('en-US')} characters, more than one string holds`);
      }
      if (lf === -1) {
        pieces.push(text);
        held += text.length;
        continue;
      }
      pieces.push(text.slice(0, lf));
      const lines = [pieces.join(''), ...text.slice(lf + 1).split('\n')];
      const rest = lines.pop() as string;
      pieces = [rest];
      held = rest.length;
      line += lines.length;
      yield lines;
    }
  } catch (e) {
    if (e instanceof LexlockError) throw e;
    throw tallyReadError(path, e as NodeJS.ErrnoException);
  }
  const last = pieces.join('');
  if (last !== '') yield [last];
}

/**
 * `IO` for a part that cannot be read, in loadTally's words; when the process has too many files open
 * (a merge holds every part open), what to do about that instead.
 */
export function tallyReadError(path: string, err: NodeJS.ErrnoException): LexlockError {
  if (err.code === 'EMFILE' || err.code === 'ENFILE') {
    return new LexlockError(
      'IO',
      `${path}: cannot read the tally (too many files open: merge keeps every part open); merge fewer parts at once and merge the results (any grouping gives the same file), or raise the limit of open files (ulimit -n)`,
      { file: path },
    );
  }
  const what = err.code === 'ENOENT' ? 'no such file' : err.code === 'EISDIR' ? 'is a folder, not a tally file' : err.message;
  return new LexlockError('IO', `${path}: cannot read the tally (${what}); pass the path of a file written by lexlock tally or lexlock merge`, { file: path });
}
