import { open, rename, unlink, type FileHandle } from 'node:fs/promises';
import { fileSystem } from './fileSystem.js';
import { dirname } from 'node:path';
import { LexlockError } from '../LexlockError.js';
import { ioError } from './ioError.js';
import { trackTemp, untrackTemp } from './openTemps.js';
import { assertNotSymlink } from './refuseSymlink.js';
import { removeStaleTemps } from './removeStaleTemps.js';
import { atomicTempPath } from './tempNames.js';

/**
 * A file being written under a temporary name beside its destination. Nothing appears at the
 * destination until {@link AtomicFile.commit}; readers see the old file or the whole new one.
 * Any failed step removes the temporary file and throws `IO`.
 */
export interface AtomicFile {
  /** The destination, as given. */
  readonly path: string;
  /** The temporary file in the same folder: `.<base>.<pid>.<random>.tmp`. */
  readonly tempPath: string;
  /** Appends bytes after everything written so far. */
  write(bytes: Uint8Array): Promise<void>;
  /** Writes bytes at a byte position (for patching a header already written); does not move the append point. */
  writeAt(bytes: Uint8Array, position: number): Promise<void>;
  /** Flushes to disk, renames over the destination and flushes the folder. */
  commit(): Promise<void>;
  /** Closes and removes the temporary file; the destination is untouched. Never throws; no-op after commit. */
  abort(): Promise<void>;
}

/** Error codes of a folder fsync that only mean "this platform or file system cannot do that". */
const DIR_SYNC_UNSUPPORTED = new Set(['EINVAL', 'EISDIR', 'EPERM', 'EACCES', 'EBADF', 'ENOTSUP', 'EOPNOTSUPP']);

/** The temporary name for a destination: hidden, in the same folder, unique per process and call. */
export function tempPathFor(path: string): string {
  return atomicTempPath(path);
}

/**
 * Opens a temporary file beside `path` for an atomic write. Refuses a `path` that is a symbolic link
 * (`OUTPUT_SYMLINK`), first removes what dead lexlock runs left beside `path` (removeStaleTemps), and
 * keeps the temporary file in this process's list of open ones (openTemps) until commit or abort.
 * @example
 * const file = await openAtomic('out/ids.npy');
 * try { await file.write(bytes); await file.commit(); } catch (e) { await file.abort(); throw e; }
 */
export async function openAtomic(path: string): Promise<AtomicFile> {
  await assertNotSymlink(path);
  await removeStaleTemps(path);
  const tempPath = tempPathFor(path);
  // Listed before it exists, so a signal that comes while it is being created still removes it.
  trackTemp(tempPath, path);
  let handle: FileHandle;
  try {
    handle = await fileSystem.open(tempPath, 'wx');
  } catch (e) {
    untrackTemp(tempPath);
    throw ioError(path, 'creating a temporary file beside it', e);
  }
  return new OpenAtomicFile(path, tempPath, handle);
}

type State = 'open' | 'committed' | 'aborted';

/** The one implementation of {@link AtomicFile}; operations run one after another in call order. */
class OpenAtomicFile implements AtomicFile {
  readonly path: string;
  readonly tempPath: string;
  private handle: FileHandle | null;
  private state: State = 'open';
  /** The error that ended this file, rethrown by later calls. */
  private failure: LexlockError | null = null;
  /** Where the next `write` lands. */
  private end = 0;
  /** Settles when every operation queued so far has finished. */
  private tail: Promise<void> = Promise.resolve();

  constructor(path: string, tempPath: string, handle: FileHandle) {
    this.path = path;
    this.tempPath = tempPath;
    this.handle = handle;
  }

  write(bytes: Uint8Array): Promise<void> {
    // The position is taken now, so calls that are not awaited still land in call order.
    const position = this.end;
    this.end += bytes.byteLength;
    return this.run('writing', (handle) => writeAll(handle, bytes, position));
  }

  writeAt(bytes: Uint8Array, position: number): Promise<void> {
    return this.run('writing', async (handle) => {
      // Node reads a negative position as "the current position"; refuse it instead of appending.
      if (!Number.isSafeInteger(position) || position < 0) throw new Error(`position ${position} is not a byte offset from 0 up`);
      await writeAll(handle, bytes, position);
    });
  }

  commit(): Promise<void> {
    return this.run('flushing it to disk', async (handle) => {
      await fileSystem.sync(handle);
      this.handle = null;
      await handle.close();
      try {
        await rename(this.tempPath, this.path);
      } catch (e) {
        throw new StepError('renaming the temporary file over it', e);
      }
      this.state = 'committed';
      untrackTemp(this.tempPath);
      await syncFolder(dirname(this.path)).catch((e: unknown) => {
        throw new StepError('flushing its folder to disk', e);
      });
    });
  }

  abort(): Promise<void> {
    const done = this.tail.then(() => this.discard());
    this.tail = done;
    return done;
  }

  /** Queues an operation; on failure discards the temporary file and throws `IO`. */
  private run(step: string, operation: (handle: FileHandle) => Promise<void>): Promise<void> {
    const result = this.tail.then(async () => {
      if (this.failure !== null) throw this.failure;
      if (this.state !== 'open' || this.handle === null) {
        throw new LexlockError(
          'WRITER_CLOSED',
          `${this.path}: the file was already ${this.state === 'committed' ? 'committed' : 'aborted'}; open a new one to write again`,
          { file: this.path },
        );
      }
      try {
        await operation(this.handle);
      } catch (e) {
        const error = e instanceof StepError ? ioError(this.path, e.step, e.cause) : ioError(this.path, step, e);
        if (this.state === 'open') {
          this.failure = error;
          await this.discard();
        }
        throw error;
      }
    });
    this.tail = result.then(
      () => undefined,
      () => undefined,
    );
    return result;
  }

  /** Closes and unlinks the temporary file, ignoring every error. */
  private async discard(): Promise<void> {
    if (this.state === 'committed') return;
    this.state = 'aborted';
    const handle = this.handle;
    this.handle = null;
    if (handle !== null) await handle.close().catch(() => undefined);
    await unlink(this.tempPath).catch(() => undefined);
    untrackTemp(this.tempPath);
  }
}

/** Carries the step that failed inside a multi-step operation. */
class StepError extends Error {
  readonly step: string;
  constructor(step: string, cause: unknown) {
    super(step, { cause });
    this.step = step;
  }
}

/** Writes every byte at `position`, looping over short writes. */
async function writeAll(handle: FileHandle, bytes: Uint8Array, position: number): Promise<void> {
  let done = 0;
  while (done < bytes.byteLength) {
    const bytesWritten = await fileSystem.write(handle, bytes, done, bytes.byteLength - done, position + done);
    done += bytesWritten;
  }
}

/** fsyncs a folder so a rename inside it survives a crash; a no-op where the platform cannot. */
async function syncFolder(folder: string): Promise<void> {
  let handle: FileHandle;
  try {
    handle = await open(folder, 'r');
  } catch (e) {
    if (DIR_SYNC_UNSUPPORTED.has((e as NodeJS.ErrnoException).code ?? '')) return;
    throw e;
  }
  try {
    await handle.sync();
  } catch (e) {
    if (!DIR_SYNC_UNSUPPORTED.has((e as NodeJS.ErrnoException).code ?? '')) throw e;
  } finally {
    await handle.close().catch(() => undefined);
  }
}
