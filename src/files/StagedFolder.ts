import { lstatSync } from 'node:fs';
import { chmod, lstat, mkdir, rm } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import type { CommitStep } from './commitAll.js';
import { fileSystem } from './fileSystem.js';
import { ioError } from './ioError.js';
import { trackTemp, untrackTemp } from './openTemps.js';
import { stepSync } from './testSteps.js';
import { swapPaths } from './tempNames.js';

/**
 * A folder output written whole under a hidden name beside its destination, then put in place by
 * renaming folders, so the destination holds one run's complete set of files or the old set, never
 * a mix. rename(2) cannot replace a folder that has files in it (ENOTEMPTY), so the commit is: old
 * folder renamed aside (`.<base>.<pid>.<random>.old`), new one renamed in, old one removed. A run
 * killed between the two renames leaves no destination, the old folder aside and the new one
 * staged: the next run's clean-up (removeStaleTemps) puts the old one back.
 * @example
 * const staged = await StagedFolder.create('encoded');
 * await writeWhole... (files at staged.pathOf('ids.npy'), made with openInPlace)
 * await staged.seal(); await commitAll([staged.commitStep()]);
 */
export class StagedFolder {
  /** The destination, as given. */
  readonly destination: string;
  /** The hidden folder the files are written into. */
  readonly path: string;
  private readonly aside: string;
  private state: 'open' | 'sealed' | 'applied' | 'done' | 'aborted' = 'open';
  private hadOld = false;

  private constructor(destination: string, path: string, aside: string) {
    this.destination = destination;
    this.path = path;
    this.aside = aside;
  }

  /**
   * Makes the hidden folder beside `destination` (its parent must exist); it is on this process's
   * list of temporary things a signal removes. An existing destination folder's permissions are copied.
   */
  static async create(destination: string): Promise<StagedFolder> {
    const { staging, aside } = swapPaths(destination);
    trackTemp(staging, destination, true);
    try {
      await mkdir(staging);
    } catch (e) {
      untrackTemp(staging);
      throw ioError(destination, 'creating a hidden folder beside it to write into', e);
    }
    const old = await lstat(destination).catch(() => null);
    if (old !== null && old.isDirectory()) await chmod(staging, old.mode & 0o7777).catch(() => undefined);
    return new StagedFolder(destination, staging, aside);
  }

  /** Where a file of the folder is written now. */
  pathOf(name: string): string {
    return join(this.path, name);
  }

  /** Where it will be once committed: the path to name in messages. */
  reportOf(name: string): string {
    return join(this.destination, name);
  }

  /** Flushes the folder's list of files to disk (its files must be sealed already). */
  async seal(): Promise<void> {
    try {
      const handle = await fileSystem.open(this.path, 'r');
      try {
        await fileSystem.sync(handle);
      } finally {
        await handle.close();
      }
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code ?? '';
      // A platform that cannot fsync a folder (EINVAL, EISDIR, ...): nothing more can be done there.
      if (!['EINVAL', 'EISDIR', 'EPERM', 'EACCES', 'EBADF', 'ENOTSUP', 'EOPNOTSUPP'].includes(code)) {
        throw ioError(this.destination, 'flushing the new folder to disk', e);
      }
    }
    this.state = 'sealed';
  }

  /** The step that swaps the folders (see commitAll). */
  commitStep(): CommitStep {
    return {
      destination: this.destination,
      folder: dirname(this.path),
      apply: () => this.apply(),
      undo: () => this.undo(),
      settle: () => this.settle(),
      abort: () => this.abort(),
    };
  }

  /** Removes the hidden folder and all in it; the destination is untouched. Never throws. */
  async abort(): Promise<void> {
    if (this.state === 'applied' || this.state === 'done') return;
    this.state = 'aborted';
    await rm(this.path, { recursive: true, force: true }).catch(() => undefined);
    untrackTemp(this.path);
  }

  private apply(): void {
    if (this.state !== 'sealed') throw new Error(`${this.destination}: the new folder must be sealed before it is put in place`);
    const old = lstatSync(this.destination, { throwIfNoEntry: false });
    this.hadOld = old !== undefined;
    if (this.hadOld) {
      try {
        fileSystem.renameSync(this.destination, this.aside);
      } catch (e) {
        throw ioError(this.destination, 'setting the old folder aside', e);
      }
      trackTemp(this.aside, null, true);
      stepSync(`old ${basename(this.destination)} set aside`);
    }
    try {
      fileSystem.renameSync(this.path, this.destination);
    } catch (e) {
      const error = ioError(this.destination, 'renaming the new folder into place', e);
      if (this.hadOld) {
        try {
          fileSystem.renameSync(this.aside, this.destination);
        } catch {
          untrackTemp(this.aside);
          error.message += `; the old folder could not be put back either: it is at ${this.aside}`;
          throw error;
        }
        untrackTemp(this.aside);
      }
      throw error;
    }
    untrackTemp(this.path);
    this.state = 'applied';
  }

  private undo(): void {
    fileSystem.renameSync(this.destination, this.path);
    trackTemp(this.path, this.destination, true);
    this.state = 'sealed';
    if (this.hadOld) {
      fileSystem.renameSync(this.aside, this.destination);
      untrackTemp(this.aside);
    }
  }

  private async settle(): Promise<void> {
    this.state = 'done';
    if (!this.hadOld) return;
    await rm(this.aside, { recursive: true, force: true }).catch(() => undefined);
    untrackTemp(this.aside);
  }
}
