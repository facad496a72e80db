import { inputError, type LexlockError } from '../LexlockError.js';
import { describeSystemError } from '../files/ioError.js';

/**
 * The `IO` error for a file or folder of a corpus that could not be read, e.g.
 * `reviews.csv: could not read it (EACCES: permission denied); check that it exists and that you may read it`.
 */
export function readError(path: string, cause: unknown): LexlockError {
  const error = inputError('IO', { file: path }, `could not read it (${describeSystemError(cause)}); check that it exists and that you may read it`);
  error.cause = cause;
  return error;
}
