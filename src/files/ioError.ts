import { inputError, type LexlockError } from '../LexlockError.js';

/**
 * Builds the `IO` error for a failed write of `path`: the system error's code and text, the step
 * that failed, and what to check. Example message:
 * `out/ids.npy: could not write the file (ENOENT: no such file or directory, while creating a temporary file beside it); …`
 */
export function ioError(path: string, step: string, cause: unknown): LexlockError {
  const error = inputError(
    'IO',
    { file: path },
    `could not write the file (${describeSystemError(cause)}, while ${step}); ` +
      'check that its folder exists, that you may write there and that the disk has room',
  );
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
