import { lstat, readdir, unlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { tempOwner } from './tempNames.js';

/**
 * Removes what a lexlock process that no longer runs left beside `destination`: files named exactly
 * as lexlock names its temporary files for that destination (see tempNames.ts) whose process id is
 * not a running process. Nothing else is touched: not another destination's files, not a live
 * process's, not a folder or link of that name. Never throws; resolves to the paths removed.
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
    const pid = tempOwner(name, base);
    if (pid === null || pid === process.pid || isRunning(pid)) continue;
    const path = join(folder, name);
    try {
      if (!(await lstat(path)).isFile()) continue;
      await unlink(path);
      removed.push(path);
    } catch {
      // Gone already (another run cleaned it), or not ours to remove: leave it.
    }
  }
  return removed;
}

/** False only when the system says no process has this id (kill(2) with signal 0: ESRCH). */
function isRunning(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    // EPERM: it runs, as another user. Anything else (an id the system refuses): assume it runs.
    return (e as NodeJS.ErrnoException).code !== 'ESRCH';
  }
}
