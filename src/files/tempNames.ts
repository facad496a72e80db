import { randomBytes } from 'node:crypto';
import { basename, dirname, join } from 'node:path';

// The names of lexlock's own temporary files beside a destination `<folder>/<base>`, in one place, so
// the writers that make them and the clean-up that removes a dead run's leftovers cannot disagree:
//   `.<base>.<pid>.<12 lower-case hex>.tmp`  an atomic write in progress (AtomicFile)
//   `.<base>.<pid>.numbers.tmp`              the token numbers of `build --encode` (NumberSpill)

/** The end of a temporary name after `.<base>.`: the writing process's id, then what kind of file it is. */
const TAIL = /^([1-9][0-9]{0,9})\.(?:[0-9a-f]{12}|numbers)\.tmp$/;

/** The end of a spill's name, for finding the destination a spill stands for. */
const SPILL = /^\.(.+)\.[1-9][0-9]{0,9}\.numbers\.tmp$/;

/**
 * The temporary path for an atomic write of `destination`: hidden, in the same folder, unique per
 * process and call. @example atomicTempPath('out/ids.npy') // 'out/.ids.npy.4711.3f9a0c1be277.tmp'
 */
export function atomicTempPath(destination: string): string {
  return join(dirname(destination), `.${basename(destination)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
}

/**
 * Where a build that also encodes keeps its token numbers: a hidden file beside the lexicon.
 * @example spillPathFor('models/lex.json') // 'models/.lex.json.4711.numbers.tmp'
 */
export function spillPathFor(lexiconPath: string): string {
  return join(dirname(lexiconPath), `.${basename(lexiconPath)}.${process.pid}.numbers.tmp`);
}

/**
 * The id of the process that made `name` when it is exactly one of lexlock's temporary names for a
 * destination called `base` (either kind), else null. @example tempOwner('.lex.json.4711.numbers.tmp', 'lex.json') // 4711
 */
export function tempOwner(name: string, base: string): number | null {
  const head = `.${base}.`;
  if (base === '' || !name.startsWith(head)) return null;
  const match = TAIL.exec(name.slice(head.length));
  return match === null ? null : Number(match[1]);
}

/** The destination a spill path stands for (`dir/.lex.json.4711.numbers.tmp` -> `dir/lex.json`), or null for another name. */
export function spillDestination(spillPath: string): string | null {
  const match = SPILL.exec(basename(spillPath));
  return match === null ? null : join(dirname(spillPath), match[1] as string);
}
