import { isUtf8 } from 'node:buffer';
import { inputError, type Where } from '../LexlockError.js';
import type { CorpusStats } from './CorpusStats.js';
import { firstInvalidUtf8 } from '../artifact/firstInvalidUtf8.js';
import type { BadTextPolicy } from '../artifact/badTextPolicy.js';

export type { BadTextPolicy } from '../artifact/badTextPolicy.js';

/** Where a document's bytes start: 1-based line (and CSV row), absolute byte offset. */
export interface TextStart {
  line: number;
  byteOffset: number;
  row?: number;
}

/** How to decode: the policy, the counters to bump, and the file to name in errors. */
export interface DecodeSetup {
  readonly badText: BadTextPolicy;
  readonly stats: CorpusStats;
  readonly file: string;
}

// WHATWG decoder with replacement; ignoreBOM keeps a U+FEFF inside a file (only the file's own BOM is dropped).
const replacing = new TextDecoder('utf-8', { ignoreBOM: true });
const LF = 0x0a;

/**
 * Decodes one document's bytes under the bad-text policy: valid UTF-8 as is; otherwise `fail` throws
 * `BAD_UTF8` at the first bad byte, `replace` decodes with U+FFFD and counts `stats.replaced`, `skip`
 * counts `stats.skipped` and returns null.
 */
export function decodeText(bytes: Buffer, start: TextStart, setup: DecodeSetup): string | null {
  if (isUtf8(bytes)) return bytes.toString('utf8');
  if (setup.badText === 'replace') {
    setup.stats.replaced += 1;
    return replacing.decode(bytes);
  }
  if (setup.badText === 'skip') {
    setup.stats.skipped += 1;
    return null;
  }
  throw badUtf8Error(bytes, start, setup.file);
}

/**
 * The `BAD_UTF8` error for `bytes` that start at `start`: names the line of the first bad byte and
 * its absolute offset, e.g. `notes.txt line 3: invalid UTF-8 at byte 57; fix the file's encoding or ...`.
 * `advice` replaces the default what-to-do part.
 */
export function badUtf8Error(bytes: Buffer, start: TextStart, file: string, advice?: string) {
  const bad = Math.max(firstInvalidUtf8(bytes), 0);
  let line = start.line;
  for (let i = bytes.indexOf(LF); i !== -1 && i < bad; i = bytes.indexOf(LF, i + 1)) line += 1;
  const byteOffset = start.byteOffset + bad;
  const where: Where = { file, line, byteOffset };
  if (start.row !== undefined) where.row = start.row;
  return inputError(
    'BAD_UTF8',
    where,
    `invalid UTF-8 at byte ${byteOffset}; ${advice ?? "fix the file's encoding or pass --bad-text replace or --bad-text skip"}`,
  );
}
