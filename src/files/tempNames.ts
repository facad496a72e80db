import { randomBytes } from 'node:crypto';
import { basename, dirname, join } from 'node:path';

// The names of lexlock's own temporary files and folders beside a destination `<folder>/<base>`, in
// one place, so the writers that make them and the clean-up that removes a dead run's leftovers
// cannot disagree:
//   `.<base>.<pid>.<12 lower-case hex>.tmp`  an atomic write in progress (AtomicFile), or the file a lock is made from
//   `.<base>.<pid>.numbers.tmp`              the token numbers of `build --encode` (NumberSpill)
//   `.<base>.<pid>.<12 hex>.new`             a folder output being written (StagedFolder)
//   `.<base>.<pid>.<12 hex>.old`             the previous output, set aside while the new one is put in place
//   `.<base>.lock`                           held while a run writes the destination (outputLock)

/** What a temporary name is. */
export type TempKind = 'tmp' | 'numbers' | 'new' | 'old';

/** The end of a temporary name after `.<base>.`: the writing process's id, then what kind of file it is. */
const TAIL = /^([1-9][0-9]{0,9})\.(?:([0-9a-f]{12})\.(tmp|new|old)|numbers\.tmp)$/;

/** The end of a spill's name, for finding the destination a spill stands for. */
const SPILL = /^\.(.+)\.[1-9][0-9]{0,9}\.numbers\.tmp$/;

/** Twelve random lower-case hex digits. */
function tag(): string {
  return randomBytes(6).toString('hex');
}

/**
 * The temporary path for an atomic write of `destination`: hidden, in the same folder, unique per
 * process and call. @example atomicTempPath('out/ids.npy') // 'out/.ids.npy.4711.3f9a0c1be277.tmp'
 */
export function atomicTempPath(destination: string): string {
  return join(dirname(destination), `.${basename(destination)}.${process.pid}.${tag()}.tmp`);
}

/**
 * Where a new folder output is written before it takes the place of `destination`, and where the
 * old one goes meanwhile: twins with one random part, so a clean-up can tell that they belong together.
 * @example swapPaths('enc/out') // { staging: 'enc/.out.4711.3f9a0c1be277.new', aside: 'enc/.out.4711.3f9a0c1be277.old' }
 */
export function swapPaths(destination: string): { staging: string; aside: string } {
  const stem = join(dirname(destination), `.${basename(destination)}.${process.pid}.${tag()}`);
  return { staging: `${stem}.new`, aside: `${stem}.old` };
}

/** Where an old file is kept while a commit may still be undone. @example asidePath('rows.jsonl') // '.rows.jsonl.4711.3f9a0c1be277.old' */
export function asidePath(destination: string): string {
  return join(dirname(destination), `.${basename(destination)}.${process.pid}.${tag()}.old`);
}

/** The lock file a run holds while it writes `destination`. @example lockPathFor('models/lex.json') // 'models/.lex.json.lock' */
export function lockPathFor(destination: string): string {
  return join(dirname(destination), `.${basename(destination)}.lock`);
}

/**
 * Where a build that also encodes keeps its token numbers: a hidden file beside the lexicon.
 * @example spillPathFor('models/lex.json') // 'models/.lex.json.4711.numbers.tmp'
 */
export function spillPathFor(lexiconPath: string): string {
  return join(dirname(lexiconPath), `.${basename(lexiconPath)}.${process.pid}.numbers.tmp`);
}

/** What {@link tempName} finds in a name: the process that made it, its kind, and the random part (null for a spill). */
export interface TempName {
  pid: number;
  kind: TempKind;
  tag: string | null;
}

/** The parts of `name` when it is exactly one of lexlock's temporary names for a destination called `base`, else null. */
export function tempName(name: string, base: string): TempName | null {
  const head = `.${base}.`;
  if (base === '' || !name.startsWith(head)) return null;
  const match = TAIL.exec(name.slice(head.length));
  if (match === null) return null;
  const pid = Number(match[1]);
  return match[2] === undefined ? { pid, kind: 'numbers', tag: null } : { pid, kind: match[3] as TempKind, tag: match[2] };
}

/**
 * The id of the process that made `name` when it is exactly one of lexlock's temporary names for a
 * destination called `base` (any kind), else null. @example tempOwner('.lex.json.4711.numbers.tmp', 'lex.json') // 4711
 */
export function tempOwner(name: string, base: string): number | null {
  return tempName(name, base)?.pid ?? null;
}

/** The destination a spill path stands for (`dir/.lex.json.4711.numbers.tmp` -> `dir/lex.json`), or null for another name. */
export function spillDestination(spillPath: string): string | null {
  const match = SPILL.exec(basename(spillPath));
  return match === null ? null : join(dirname(spillPath), match[1] as string);
}
