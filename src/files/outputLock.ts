import { readFileSync, unlinkSync } from 'node:fs';
import { mkdir, rmdir, stat } from 'node:fs/promises';
import { dirname, relative, sep } from 'node:path';
import { LexlockError } from '../LexlockError.js';
import { fileSystem } from './fileSystem.js';
import { ioError } from './ioError.js';
import { trackTemp, untrackTemp } from './openTemps.js';
import { isRunning } from './removeStaleTemps.js';
import { atomicTempPath, lockPathFor } from './tempNames.js';
import { step } from './testSteps.js';
import { writeFully } from './writeFully.js';

/** A destination this process alone writes until {@link OutputLock.release}. */
export interface OutputLock {
  readonly destination: string;
  /**
   * Removes the lock file. With `wrote` false (the run failed or was refused), also removes the
   * folders the lock had to create for the destination, where they are still empty.
   */
  release(wrote: boolean): Promise<void>;
}

/** Link errors that mean "no hard links on this file system": the lock file is then created in place. */
const NO_LINKS = new Set(['EPERM', 'ENOTSUP', 'EOPNOTSUPP', 'ENOSYS', 'EMLINK']);

/**
 * Makes this process the one writer of `destination` (a file or a folder) until released: creates
 * `.<base>.lock` beside it, holding this process's id, or fails at once with `OUTPUT_BUSY` when a
 * running process holds it. A lock whose process no longer runs is stale and taken over. The
 * destination's folder is created if need be. The lock file is made whole under a temporary name
 * and linked into place (link(2) fails if the name exists), so it is never seen empty.
 * A process id from another machine sharing the folder cannot be told from a dead one.
 * @example const lock = await lockOutput('models/lex.json'); try { ... ; await lock.release(true); } catch (e) { await lock.release(false); throw e; }
 */
export async function lockOutput(destination: string): Promise<OutputLock> {
  const folder = dirname(destination);
  let created: string | undefined;
  try {
    created = await mkdir(folder, { recursive: true });
  } catch (e) {
    throw await folderError(destination, folder, e);
  }
  const lock = lockPathFor(destination);
  try {
    await acquire(destination, lock);
  } catch (e) {
    await removeCreated(created, folder);
    throw e;
  }
  trackTemp(lock, null);
  let released = false;
  return {
    destination,
    async release(wrote) {
      if (released) return;
      released = true;
      if (holder(lock) === process.pid) {
        try {
          unlinkSync(lock);
        } catch {
          // Gone already; a stale lock left behind is taken over by the next run anyway.
        }
      }
      untrackTemp(lock);
      if (!wrote) await removeCreated(created, folder);
    },
  };
}

/**
 * Locks every destination (in the order given), or none: the first that is busy releases those
 * already taken and throws. @example const locks = await lockOutputs(['lex.json', 'encoded']);
 */
export async function lockOutputs(destinations: readonly string[]): Promise<{ release(wrote: boolean): Promise<void> }> {
  const held: OutputLock[] = [];
  const release = async (wrote: boolean) => {
    for (const lock of held.reverse()) await lock.release(wrote);
  };
  try {
    for (const destination of destinations) held.push(await lockOutput(destination));
  } catch (e) {
    await release(false);
    throw e;
  }
  return { release };
}

async function acquire(destination: string, lock: string): Promise<void> {
  const mine = atomicTempPath(destination);
  trackTemp(mine, null);
  try {
    const pid = new TextEncoder().encode(`${process.pid}\n`);
    try {
      const handle = await fileSystem.open(mine, 'wx');
      try {
        await writeFully(handle, pid, 0);
      } finally {
        await handle.close();
      }
    } catch (e) {
      throw ioError(destination, 'creating its lock file', e);
    }
    for (let attempt = 0; ; attempt++) {
      try {
        fileSystem.linkSync(mine, lock);
        return;
      } catch (e) {
        const code = (e as NodeJS.ErrnoException).code ?? '';
        if (NO_LINKS.has(code)) {
          if (await createInPlace(lock, pid).catch((c: unknown) => Promise.reject(ioError(destination, 'creating its lock file', c)))) return;
        } else if (code !== 'EEXIST') {
          throw ioError(destination, 'creating its lock file', e);
        }
      }
      // Held: by a running process (busy), by one that ended (stale: taken over), or gone meanwhile.
      const owner = holder(lock);
      if (owner !== null && owner !== 'gone' && isRunning(owner)) throw busy(destination, lock, owner);
      if (attempt >= 3) throw busy(destination, lock, owner === 'gone' ? null : owner);
      if (owner !== 'gone') takeOver(destination, lock, owner);
    }
  } finally {
    try {
      unlinkSync(mine);
    } catch {
      // Gone already.
    }
    untrackTemp(mine);
  }
}

/** Creates the lock file in place where hard links are not available; false when it exists. */
async function createInPlace(lock: string, pid: Uint8Array): Promise<boolean> {
  let handle;
  try {
    handle = await fileSystem.open(lock, 'wx');
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'EEXIST') return false;
    throw e;
  }
  try {
    await writeFully(handle, pid, 0);
  } finally {
    await handle.close();
  }
  return true;
}

/**
 * Moves a stale lock out of the way. It is renamed (atomic) rather than unlinked, and what was moved
 * is checked: if another run took the lock over in the meantime, its lock is put back.
 */
function takeOver(destination: string, lock: string, stale: number | null): void {
  const grave = atomicTempPath(destination);
  trackTemp(grave, null);
  try {
    fileSystem.renameSync(lock, grave);
  } catch {
    untrackTemp(grave);
    return; // gone already: try again
  }
  const moved = holder(grave);
  if (moved !== stale && moved !== null && moved !== 'gone' && isRunning(moved)) {
    try {
      fileSystem.linkSync(grave, lock);
    } catch {
      // A third run holds it now; it is the writer.
    }
    unlinkQuietly(grave);
    untrackTemp(grave);
    throw busy(destination, lock, moved);
  }
  unlinkQuietly(grave);
  untrackTemp(grave);
}

/** The process id a lock file names; null for one that names none; 'gone' when it no longer exists. */
function holder(lock: string): number | null | 'gone' {
  let text: string;
  try {
    text = readFileSync(lock, 'utf8');
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'ENOENT' ? 'gone' : null;
  }
  const match = /^([1-9][0-9]{0,9})\n$/.exec(text);
  return match === null ? null : Number(match[1]);
}

function busy(destination: string, lock: string, pid: number | null): LexlockError {
  const who = pid === process.pid ? 'this same lexlock process' : pid === null ? 'another lexlock run' : `another lexlock run (process ${pid})`;
  return new LexlockError(
    'OUTPUT_BUSY',
    `${destination} is being written by ${who}; wait until it ends, or name another output (if no lexlock is running, remove ${lock})`,
    { file: destination },
  );
}

function unlinkQuietly(path: string): void {
  try {
    unlinkSync(path);
  } catch {
    // Gone already.
  }
}

/** Removes the folders mkdir created for `folder` (from `created` down to `folder`), deepest first, where empty. */
async function removeCreated(created: string | undefined, folder: string): Promise<void> {
  if (created === undefined) return;
  const below = relative(created, folder);
  const chain = [created];
  if (below !== '') for (const part of below.split(sep)) chain.push(`${chain[chain.length - 1] as string}${sep}${part}`);
  for (const dir of chain.reverse()) {
    try {
      await rmdir(dir);
    } catch {
      return; // not empty (or gone): leave it and everything above
    }
  }
}

/**
 * Runs `work` holding the locks of `destinations` (lockOutputs), released afterwards; when `work`
 * fails, the folders the locks created are removed again where empty.
 * @example return withLocks([output], async () => { ...; await writeWhole(output, text); });
 */
export async function withLocks<T>(destinations: readonly string[], work: () => Promise<T>): Promise<T> {
  const locks = await lockOutputs(destinations);
  let wrote = false;
  try {
    if (destinations.length > 0) await step(`locked ${destinations.join(', ')}`);
    const result = await work();
    wrote = true;
    if (destinations.length > 0) await step('done; unlocking');
    return result;
  } finally {
    await locks.release(wrote);
  }
}

/** The error for a destination whose folder cannot be made: names the part of the path that is a file, if one is. */
async function folderError(destination: string, folder: string, cause: unknown): Promise<LexlockError> {
  const code = (cause as NodeJS.ErrnoException).code;
  if (code === 'EEXIST' || code === 'ENOTDIR') {
    for (let at = folder; at !== dirname(at); at = dirname(at)) {
      const found = await stat(at).catch(() => null);
      if (found !== null && !found.isDirectory()) {
        return new LexlockError('IO', `${destination}: not written: ${at} is a file, not a folder; fix the path, or move that file away`, { file: destination });
      }
    }
  }
  return ioError(destination, 'creating its folder', cause);
}
