import { rmSync, unlinkSync } from 'node:fs';
import { describeSystemError } from './ioError.js';

// Every temporary file and folder this process has right now, with the destination it stands for,
// and the outputs this process has already put in place, so the executable can remove the first
// and name both when a signal stops it (src/bin.ts). Only the executable acts on it: the library
// just keeps the lists current, which costs a map entry per open file.

/** Temporary path -> the destination it stands for (null: none the user named, or one already written) and whether it is a folder. */
const open = new Map<string, { destination: string | null; folder: boolean }>();

/** Outputs put in place by this process, in order. */
const written: string[] = [];

/**
 * Notes a temporary file (or, with `folder`, a folder and all in it) about to be created for
 * `destination`; call {@link untrackTemp} once it is renamed or removed.
 */
export function trackTemp(tempPath: string, destination: string | null, folder = false): void {
  open.set(tempPath, { destination, folder });
  // Being written again: no longer as this process last left it.
  const at = destination === null ? -1 : written.indexOf(destination);
  if (at >= 0) written.splice(at, 1);
}

/** Forgets a temporary file or folder that was renamed into place or removed. */
export function untrackTemp(tempPath: string): void {
  open.delete(tempPath);
}

/** Notes an output this process has put in place (a signal after this must not say it was left as it was). */
export function noteWritten(destination: string): void {
  if (!written.includes(destination)) written.push(destination);
}

/** What {@link removeOpenTemps} did. */
export interface RemovedTemps {
  /** The destinations of the removed files, each once, in the order their files were opened: none of them was written. */
  destinations: string[];
  /** Temporary files that could not be removed, with the system's reason. */
  failed: Array<{ path: string; reason: string }>;
  /** Outputs this process had already put in place, whole. */
  written: string[];
}

/**
 * Removes every tracked temporary file and folder at once, synchronously (for a signal handler that
 * exits right after), and forgets them. A file already gone is not a failure.
 * @example process.on('SIGINT', () => { const { destinations } = removeOpenTemps(); process.exit(130); });
 */
export function removeOpenTemps(): RemovedTemps {
  const destinations = new Set<string>();
  const failed: RemovedTemps['failed'] = [];
  for (const [path, { destination, folder }] of open) {
    try {
      if (folder) rmSync(path, { recursive: true, force: true });
      else unlinkSync(path);
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== 'ENOENT') failed.push({ path, reason: describeSystemError(e) });
    }
    if (destination !== null && !written.includes(destination)) destinations.add(destination);
  }
  open.clear();
  const done = [...written];
  written.length = 0;
  return { destinations: [...destinations], failed, written: done };
}
