import { LexlockError, isLexlockError } from '../LexlockError.js';
import { fileSystem } from './fileSystem.js';
import { ioError } from './ioError.js';
import { noteWritten } from './openTemps.js';
import { step, stepSync } from './testSteps.js';

/**
 * One output ready to be put in place: written whole and flushed to disk under a temporary name.
 * `apply` and `undo` are synchronous, so no signal handler can run between the renames they make.
 */
export interface CommitStep {
  /** The output as the user named it. */
  readonly destination: string;
  /** The folder whose entries `apply` changes (flushed to disk once every step is applied). */
  readonly folder: string;
  /**
   * Puts the new output in place, keeping the old one aside so {@link CommitStep.undo} can bring it
   * back. Throws an `IO` LexlockError and leaves everything as it was when it fails.
   */
  apply(): void;
  /** Puts the old output back after `apply`; throws when the system refuses. */
  undo(): void;
  /** After a commit: removes what was kept aside. Never throws (a dead run's leftovers are removed by the next run). */
  settle(): Promise<void>;
  /** Removes the new output's temporary files (before `apply`, or after `undo`). Never throws. */
  abort(): Promise<void>;
}

/** Error codes of a folder fsync that only mean "this platform or file system cannot do that". */
const DIR_SYNC_UNSUPPORTED = new Set(['EINVAL', 'EISDIR', 'EPERM', 'EACCES', 'EBADF', 'ENOTSUP', 'EOPNOTSUPP']);

/**
 * Puts several outputs in place as one: all of them, or (when one fails) none, the ones already
 * applied put back. The renames run in one synchronous stretch, so a signal is handled before or
 * after it, never inside; the folders are flushed to disk before it counts as done. On failure every
 * step's temporary files are removed and the first error is thrown.
 * @example await commitAll([encoded.commitStep(), lexiconFile.commitStep()]);
 */
export async function commitAll(steps: readonly CommitStep[]): Promise<void> {
  await step(`commit ${steps.map((s) => s.destination).join(', ')}`);
  const failure = commitNow(steps);
  if (failure !== null) {
    await Promise.all(steps.map((s) => s.abort()));
    throw failure;
  }
  await step('committed; removing what was set aside');
  await Promise.all(steps.map((s) => s.settle()));
}

/** The synchronous part: apply each step and flush its folder, then note them written; on failure undo. */
function commitNow(steps: readonly CommitStep[]): LexlockError | null {
  const applied: CommitStep[] = [];
  let current = steps[0];
  try {
    for (const s of steps) {
      current = s;
      stepSync(`put ${s.destination} in place`);
      s.apply();
      applied.push(s);
      stepSync(`flush the folder of ${s.destination}`);
      syncFolder(s);
    }
  } catch (e) {
    const error = isLexlockError(e) ? e : ioError(current?.destination ?? '', 'putting it in place', e);
    const stuck: string[] = [];
    for (const s of applied.reverse()) {
      try {
        stepSync(`put the old ${s.destination} back`);
        s.undo();
      } catch (u) {
        stuck.push(`${s.destination} (${ioError(s.destination, 'putting the old one back', u).message})`);
      }
    }
    if (stuck.length === 0) return error;
    return new LexlockError('IO', `${error.message}; and these were already written and could not be put back: ${stuck.join('; ')}`, error.where);
  }
  for (const s of steps) noteWritten(s.destination);
  return null;
}

/** fsyncs the step's folder so its renames survive a crash; a no-op where the platform cannot. */
function syncFolder(s: CommitStep): void {
  try {
    fileSystem.syncFolderSync(s.folder);
  } catch (e) {
    if (DIR_SYNC_UNSUPPORTED.has((e as NodeJS.ErrnoException).code ?? '')) return;
    throw ioError(s.destination, 'flushing its folder to disk', e);
  }
}
