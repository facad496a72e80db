import { lstat, readdir, rename, rm, unlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { tempName } from './tempNames.js';

/**
 * Removes what a lexlock process that no longer runs left beside `destination`: files and folders
 * named exactly as lexlock names its temporary things for that destination (see tempNames.ts) whose
 * process id is not a running process. A run killed in the middle of putting a new folder in place
 * (the old one set aside as `.old`, the destination missing) is undone: the old folder goes back. Nothing else is touched: not another destination's files, not a live
 * process's, not a link of such a name. Never throws; resolves to the paths removed or put back.
 * A process id from another machine or container sharing the folder cannot be told from a dead one.
 * @example await removeStaleTemps('models/lex.json') // ['models/.lex.json.4711.5c0ffee0a1b2.tmp']
 */
export async function removeStaleTemps(destination: string): Promise<string[]> {
  const folder = dirname(destination);
  const base = basename(destination);
  let names: string[];
  try {
    names = await readdir(folder);
  } catch {
    return [];
  }
  const removed: string[] = [];
  for (const name of names) {
    const found = tempName(name, base);
    if (found === null || found.pid === process.pid || isRunning(found.pid)) continue;
    const path = join(folder, name);
    try {
      const stat = await lstat(path);
      if (stat.isSymbolicLink()) continue;
      const folderKind = found.kind === 'new' || found.kind === 'old';
      if (stat.isDirectory() !== folderKind && !(found.kind === 'old' && stat.isFile())) continue;
      if (found.kind === 'old' && stat.isDirectory() && !(await exists(destination))) {
        // Killed between setting the old folder aside and putting the new one in (or unable to put it
        // back): the old one goes back rather than being lost.
        await rename(path, destination);
      } else if (stat.isDirectory()) {
        await rm(path, { recursive: true, force: true });
      } else {
        await unlink(path);
      }
      removed.push(path);
    } catch {
      // Gone already (another run cleaned it), or not ours to remove: leave it.
    }
  }
  return removed;
}

async function exists(path: string): Promise<boolean> {
  try {
    await lstat(path);
    return true;
  } catch {
    return false;
  }
}

/** False only when the system says no process has this id (kill(2) with signal 0: ESRCH). */
export function isRunning(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    // EPERM: it runs, as another user. Anything else (an id the system refuses): assume it runs.
    return (e as NodeJS.ErrnoException).code !== 'ESRCH';
  }
}
