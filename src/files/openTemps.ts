import { unlinkSync } from 'node:fs';
import { describeSystemError } from './ioError.js';

// Every temporary file this process has open right now, with the destination it stands for, so the
// executable can remove them all when a signal stops it (src/bin.ts). Only the executable acts on
// it: the library just keeps the list current, which costs a map entry per open file.

/** Temporary path -> the destination it stands for (null: none the user named). */
const open = new Map<string, string | null>();

/** Notes a temporary file about to be created for `destination`; call {@link untrackTemp} once it is renamed or removed. */
export function trackTemp(tempPath: string, destination: string | null): void {
  open.set(tempPath, destination);
}

/** Forgets a temporary file that was renamed into place or removed. */
export function untrackTemp(tempPath: string): void {
  open.delete(tempPath);
}

/** What {@link removeOpenTemps} did. */
export interface RemovedTemps {
  /** The destinations of the removed files, each once, in the order their files were opened: none of them was written. */
  destinations: string[];
  /** Temporary files that could not be removed, with the system's reason. */
  failed: Array<{ path: string; reason: string }>;
}

/**
 * Removes every tracked temporary file at once, synchronously (for a signal handler that exits
 * right after), and forgets them. A file already gone is not a failure.
 * @example process.on('SIGINT', () => { const { destinations } = removeOpenTemps(); process.exit(130); });
 */
export function removeOpenTemps(): RemovedTemps {
  const destinations = new Set<string>();
  const failed: RemovedTemps['failed'] = [];
  for (const [path, destination] of open) {
    try {
      unlinkSync(path);
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== 'ENOENT') failed.push({ path, reason: describeSystemError(e) });
    }
    if (destination !== null) destinations.add(destination);
  }
  open.clear();
  return { destinations: [...destinations], failed };
}
