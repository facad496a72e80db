import type { TallyFile } from '../tally/tallyFile.js';
import { tallyFileLines } from '../tally/tallyFileText.js';
import { lockOutput } from './outputLock.js';
import { openAtomic } from './writeWhole.js';
import { assertWritable } from './refuseOverwrite.js';

/** Options of {@link saveTally}. */
export interface SaveTallyOptions {
  /** Replace an existing file (default false: refuse with OUTPUT_EXISTS). */
  force?: boolean;
}

/** Bytes gathered before each write. */
const CHUNK = 1 << 16;

/**
 * Writes a tally file atomically (temporary file in the same folder, fsync, rename), line by line
 * as it is produced, so a large vocabulary is never one string. Missing parent folders are created
 * (and removed again if the write fails); the file's lock is held meanwhile (see saveLexicon).
 * @example await saveTally('part-1.tally', { tally, snippets, fields: { text: 'text', label: null } });
 */
export async function saveTally(path: string, file: TallyFile, options: SaveTallyOptions = {}): Promise<void> {
  const lock = await lockOutput(path);
  let wrote = false;
  try {
    await assertWritable(path, options.force ?? false);
    await writeTallyFile(path, file);
    wrote = true;
  } finally {
    await lock.release(wrote);
  }
}

/** The atomic write of {@link saveTally} alone, for a caller that holds the lock and has checked the path. */
export async function writeTallyFile(path: string, file: TallyFile): Promise<void> {
  const out = await openAtomic(path);
  const encoder = new TextEncoder();
  try {
    let pending = '';
    for (const line of tallyFileLines(file)) {
      pending += line;
      if (pending.length >= CHUNK) {
        await out.write(encoder.encode(pending));
        pending = '';
      }
    }
    if (pending !== '') await out.write(encoder.encode(pending));
    await out.commit();
  } catch (e) {
    await out.abort();
    throw e;
  }
}
