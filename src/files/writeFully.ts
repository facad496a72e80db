import type { FileHandle } from 'node:fs/promises';
import { fileSystem } from './fileSystem.js';

/**
 * Writes every byte of `bytes` at `position`. write(2) may take fewer bytes than asked (a disk
 * filling up, a signal): the rest is written by the next call, which then fails with the system's
 * error (ENOSPC) if nothing more fits. A call that takes nothing at all is an error too, rather than
 * a loop that never ends.
 * @example await writeFully(handle, header, 0);
 */
export async function writeFully(handle: FileHandle, bytes: Uint8Array, position: number): Promise<void> {
  let done = 0;
  while (done < bytes.byteLength) {
    const taken = await fileSystem.write(handle, bytes, done, bytes.byteLength - done, position + done);
    if (!(taken > 0)) throw new Error(`the system took none of ${bytes.byteLength - done} bytes`);
    done += taken;
  }
}

/** Reads exactly `bytes.byteLength` bytes at `position`, or fewer only where the file ends: the count read. */
export async function readFully(handle: FileHandle, bytes: Uint8Array, position: number): Promise<number> {
  let done = 0;
  while (done < bytes.byteLength) {
    const got = await fileSystem.read(handle, bytes, done, bytes.byteLength - done, position + done);
    if (!(got > 0)) break;
    done += got;
  }
  return done;
}
