import { readFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { describeSystemError, ioError } from '../../src/files/ioError.js';

describe('describeSystemError', () => {
  it('keeps the code and text of a Node system error and drops the syscall and path', async () => {
    // Node's fs errors read "<CODE>: <strerror text>, <syscall> '<path>'" (Node.js docs, "Class: SystemError").
    const error = await readFile('/definitely/not/here/lexlock').catch((e: unknown) => e);
    expect(describeSystemError(error)).toBe('ENOENT: no such file or directory');
  });

  it.each([
    ['an error without a code', new Error('disk on fire'), 'disk on fire'],
    ['an error whose message does not start with its code', Object.assign(new Error('odd'), { code: 'EIO' }), 'odd'],
    ['a thrown string', 'plain', 'plain'],
  ])('falls back to the message for %s', (_what, cause, text) => {
    expect(describeSystemError(cause)).toBe(text);
  });
});

describe('ioError', () => {
  it('says what, where and what to do, and keeps the cause', () => {
    const cause = Object.assign(new Error("ENOSPC: no space left on device, write"), { code: 'ENOSPC', syscall: 'write' });
    const error = ioError('out/ids.npy', 'writing', cause);
    expect(error.code).toBe('IO');
    expect(error.where).toEqual({ file: 'out/ids.npy' });
    expect(error.message).toBe(
      'out/ids.npy: not written: the disk is full (ENOSPC while writing); free some space there, or name an output on another disk',
    );
    expect(error.cause).toBe(cause);
  });
});
