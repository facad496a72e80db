import { inputError, type LexlockError } from '../LexlockError.js';

/** A system error code in plain words, and what to do about it. */
const PLAIN: Record<string, [reason: string, advice: string]> = {
  ENOSPC: ['the disk is full', 'free some space there, or name an output on another disk'],
  EDQUOT: ['your disk quota is used up', 'free some space within your quota, or name an output elsewhere'],
  EFBIG: ['the file would be larger than this file system allows', 'name an output on another file system'],
  EROFS: ['the file system is read-only', 'name an output on a writable file system'],
  EACCES: ['permission denied', 'name a folder you may write to, or change its permissions'],
  EPERM: ['the system does not permit it', 'name a folder you may write to, or change its permissions'],
  ENOTDIR: ['a part of the path is a file, not a folder', 'fix the path, or move that file away'],
  EISDIR: ['it is a folder', 'name a file, or move the folder away'],
  ENOENT: ['a folder on the way does not exist', 'check the path'],
  EEXIST: ['something is already there', 'name another output, or move what is there away'],
  ENOTEMPTY: ['a folder there is not empty', 'name another output, or move that folder away'],
  ENAMETOOLONG: ['the name is too long for the file system', 'use a shorter path'],
  ELOOP: ['there are too many symbolic links on the way', 'fix the path'],
  EMFILE: ['too many files are open', 'close other programs, or raise the limit on open files (ulimit -n)'],
  ENFILE: ['too many files are open on this system', 'close other programs, then run it again'],
  EBUSY: ['it is in use', 'close what uses it, or name another output'],
  EXDEV: ['it is on another file system', 'name an output on the same file system'],
  EIO: ['the device reported an input/output error', 'check the disk'],
};

/**
 * Builds the `IO` error for a failed write of `path` (as the user named it): what happened in plain
 * words, the system's code and the step that failed, and what to do. Example message:
 * `out/ids.npy: not written: the disk is full (ENOSPC while writing); free some space there, or name an output on another disk`.
 * A cause without a system code (a write the system took nothing of) gives its own message instead.
 */
export function ioError(path: string, step: string, cause: unknown): LexlockError {
  const code = cause instanceof Error ? (cause as NodeJS.ErrnoException).code : undefined;
  const plain = code === undefined ? undefined : PLAIN[code];
  const detail =
    plain !== undefined
      ? `${plain[0]} (${code} while ${step}); ${plain[1]}`
      : code !== undefined
        ? `${describeSystemError(cause)} (while ${step}); check that its folder exists, that you may write there and that the disk has room`
        : `${cause instanceof Error ? cause.message : String(cause)} (while ${step}); check that the disk has room and works`;
  const error = inputError('IO', { file: path }, `not written: ${detail}`);
  error.cause = cause;
  return error;
}

/**
 * `ENOENT: no such file or directory` from a Node system error, without the syscall and path that
 * Node appends (the path would name our temporary file, not the user's).
 */
export function describeSystemError(cause: unknown): string {
  if (!(cause instanceof Error)) return String(cause);
  const { code, syscall } = cause as NodeJS.ErrnoException;
  const message = cause.message;
  if (code === undefined || !message.startsWith(`${code}: `)) return message;
  let text = message.slice(code.length + 2);
  if (syscall !== undefined) {
    const at = text.indexOf(`, ${syscall}`);
    if (at >= 0) text = text.slice(0, at);
  }
  return `${code}: ${text}`;
}
