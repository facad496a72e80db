import { unlinkSync } from 'node:fs';
import { unlink, type FileHandle } from 'node:fs/promises';
import { basename, dirname } from 'node:path';
import { LexlockError } from '../LexlockError.js';
import { commitAll, type CommitStep } from './commitAll.js';
import { fileSystem } from './fileSystem.js';
import { ioError } from './ioError.js';
import { trackTemp, untrackTemp } from './openTemps.js';
import { assertNotSymlink } from './refuseSymlink.js';
import { removeStaleTemps } from './removeStaleTemps.js';
import { asidePath, atomicTempPath } from './tempNames.js';
import { stepSync } from './testSteps.js';
import { writeFully } from './writeFully.js';

/**
 * A file being written under a temporary name beside its destination. Nothing appears at the
 * destination until {@link AtomicFile.commit}; readers see the old file or the whole new one.
 * Any failed step removes the temporary file and throws `IO`.
 */
export interface AtomicFile {
  /** The destination, as given. */
  readonly path: string;
  /** The temporary file in the same folder: `.<base>.<pid>.<random>.tmp` (for a file made in place: the file itself). */
  readonly tempPath: string;
  /** Appends bytes after everything written so far (every byte: a short write is continued). */
  write(bytes: Uint8Array): Promise<void>;
  /** Writes bytes at a byte position (for patching a header already written); does not move the append point. */
  writeAt(bytes: Uint8Array, position: number): Promise<void>;
  /** Flushes to disk, checks that the file holds every byte written, and closes it: ready to commit. */
  seal(): Promise<void>;
  /** The step that renames the sealed file over the destination, for {@link commitAll} with other outputs. */
  commitStep(): CommitStep;
  /** Seals, renames over the destination and flushes the folder. */
  commit(): Promise<void>;
  /** Closes and removes the temporary file; the destination is untouched. Never throws; no-op after commit. */
  abort(): Promise<void>;
}

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
  return new OpenAtomicFile(path, tempPath, handle, true);
}

/**
 * Creates `path` itself (refused if anything is there) for a file inside a folder that is put in
 * place as a whole (StagedFolder): `commit` only seals it. Errors name `report`, the path the user
 * knows. The folder, not the file, is on the list of temporary things to remove on a signal.
 * @example const file = await openInPlace('out/.enc.4711.3f9a0c1be277.new/ids.npy', 'out/enc/ids.npy');
 */
export async function openInPlace(path: string, report: string): Promise<AtomicFile> {
  try {
    return new OpenAtomicFile(report, path, await fileSystem.open(path, 'wx'), false);
  } catch (e) {
    throw ioError(report, 'creating it', e);
  }
}

type State = 'open' | 'sealed' | 'committed' | 'aborted';

/** The one implementation of {@link AtomicFile}; operations run one after another in call order. */
class OpenAtomicFile implements AtomicFile {
  readonly path: string;
  readonly tempPath: string;
  /** False for a file made in place: no rename, no tracking. */
  private readonly renamed: boolean;
  private handle: FileHandle | null;
  private state: State = 'open';
  /** The error that ended this file, rethrown by later calls. */
  private failure: LexlockError | null = null;
  /** Where the next `write` lands. */
  private end = 0;
  /** Settles when every operation queued so far has finished. */
  private tail: Promise<void> = Promise.resolve();

  constructor(path: string, tempPath: string, handle: FileHandle, renamed: boolean) {
    this.path = path;
    this.tempPath = tempPath;
    this.handle = handle;
    this.renamed = renamed;
  }

  write(bytes: Uint8Array): Promise<void> {
    // The position is taken now, so calls that are not awaited still land in call order.
    const position = this.end;
    this.end += bytes.byteLength;
    return this.run('writing', (handle) => writeFully(handle, bytes, position));
  }

  writeAt(bytes: Uint8Array, position: number): Promise<void> {
    return this.run('writing', async (handle) => {
      // Node reads a negative position as "the current position"; refuse it instead of appending.
      if (!Number.isSafeInteger(position) || position < 0) throw new Error(`position ${position} is not a byte offset from 0 up`);
      if (position + bytes.byteLength > this.end) throw new Error(`bytes ${position} to ${position + bytes.byteLength} go past the end of what was written (${this.end})`);
      await writeFully(handle, bytes, position);
    });
  }

  seal(): Promise<void> {
    if (this.state === 'sealed') return this.tail;
    return this.run('flushing it to disk', async (handle) => {
      await fileSystem.sync(handle);
      const size = await fileSystem.size(handle);
      if (size !== this.end) throw new Error(`the disk holds ${size} of its ${this.end} bytes after writing`);
      this.handle = null;
      await handle.close();
      this.state = 'sealed';
    });
  }

  commitStep(): CommitStep {
    if (this.state !== 'sealed') throw this.closedError('sealed before it is committed');
    return new RenameStep(this);
  }

  async commit(): Promise<void> {
    await this.seal();
    if (!this.renamed) {
      this.state = 'committed';
      return;
    }
    await commitAll([this.commitStep()]);
  }

  /** Called by the rename step once the file is in place. */
  committed(): void {
    this.state = 'committed';
    untrackTemp(this.tempPath);
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
      if (this.state !== 'open' || this.handle === null) throw this.closedError(null);
      try {
        await operation(this.handle);
      } catch (e) {
        const error = ioError(this.path, step, e);
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

  private closedError(need: string | null): LexlockError {
    const was = this.state === 'committed' ? 'already committed' : this.state === 'aborted' ? 'already aborted' : this.state === 'sealed' ? 'already sealed' : 'still open';
    const what = need === null ? 'open a new one to write again' : `it must be ${need}`;
    return new LexlockError('WRITER_CLOSED', `${this.path}: the file was ${was}; ${what}`, { file: this.path });
  }

  /** Closes and unlinks the temporary file, ignoring every error. */
  async discard(): Promise<void> {
    if (this.state === 'committed') return;
    this.state = 'aborted';
    const handle = this.handle;
    this.handle = null;
    if (handle !== null) await handle.close().catch(() => undefined);
    await unlink(this.tempPath).catch(() => undefined);
    untrackTemp(this.tempPath);
  }
}

/** Link errors that mean "this file system keeps no second name for a file": the old file then cannot be kept aside. */
const NO_LINKS = new Set(['EPERM', 'ENOTSUP', 'EOPNOTSUPP', 'EXDEV', 'EMLINK', 'ENOSYS', 'EACCES']);

/** Renames a sealed temporary file over its destination, keeping the old file under a second name until settled. */
class RenameStep implements CommitStep {
  readonly destination: string;
  readonly folder: string;
  private readonly file: OpenAtomicFile;
  /** The old file's second name, once it has one. */
  private aside: string | null = null;
  /** Whether there was an old file, and why it could not be kept if so. */
  private old: 'none' | 'kept' | Error = 'none';

  constructor(file: OpenAtomicFile) {
    this.file = file;
    this.destination = file.path;
    this.folder = dirname(file.path);
  }

  apply(): void {
    const aside = asidePath(this.destination);
    try {
      fileSystem.linkSync(this.destination, aside);
      trackTemp(aside, null);
      this.aside = aside;
      this.old = 'kept';
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code ?? '';
      if (code === 'ENOENT') this.old = 'none';
      else if (NO_LINKS.has(code)) this.old = e as Error;
      else throw ioError(this.destination, 'keeping the old file aside', e);
    }
    if (this.old === 'kept') stepSync(`old ${basename(this.destination)} kept aside`);
    try {
      fileSystem.renameSync(this.file.tempPath, this.destination);
    } catch (e) {
      this.dropAside();
      throw ioError(this.destination, 'renaming the temporary file over it', e);
    }
    this.file.committed();
  }

  undo(): void {
    if (this.old instanceof Error) throw this.old;
    if (this.old === 'none') unlinkSync(this.destination);
    else if (this.aside !== null) {
      fileSystem.renameSync(this.aside, this.destination);
      untrackTemp(this.aside);
      this.aside = null;
    }
  }

  async settle(): Promise<void> {
    const aside = this.aside;
    this.aside = null;
    if (aside === null) return;
    await unlink(aside).catch(() => undefined);
    untrackTemp(aside);
  }

  async abort(): Promise<void> {
    await this.file.discard();
  }

  private dropAside(): void {
    if (this.aside === null) return;
    try {
      unlinkSync(this.aside);
    } catch {
      // Left for the next run's clean-up.
    }
    untrackTemp(this.aside);
    this.aside = null;
  }
}
