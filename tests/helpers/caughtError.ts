import { isLexlockError, type LexlockError } from '../../src/LexlockError.js';

/** Runs `fn` and returns the LexlockError it throws; fails the test when it throws anything else or nothing. */
export async function caughtError(fn: () => Promise<unknown>): Promise<LexlockError> {
  try {
    await fn();
  } catch (e) {
    if (isLexlockError(e)) return e;
    throw e;
  }
  throw new Error('expected a LexlockError, nothing was thrown');
}
