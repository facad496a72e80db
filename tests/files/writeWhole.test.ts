import { chmod, mkdir, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { isLexlockError, type LexlockError } from '../../src/LexlockError.js';
import { openAtomic, writeWhole } from '../../src/files/writeWhole.js';
import { tempPathFor } from '../../src/files/AtomicFile.js';
import { caughtError } from '../helpers/caughtError.js';

// What "atomic" means here is POSIX rename(2): "If newpath already exists, it will be atomically
// replaced, so that there is no point at which another process attempting to access newpath will
// find it missing" (Linux man-pages, rename(2); quoted from memory). The checks below look at what
// a reader of the folder sees before, during and after a write.

let root: string;
let n = 0;
/** A fresh empty folder per test. */
async function folder(): Promise<string> {
  n += 1;
  const dir = join(root, `case-${n}`);
  await mkdir(dir);
  return dir;
}



beforeAll(async () => {
  root = await mkdtemp(join(tmpdir(), 'lexlock-atomic-'));
});
afterAll(async () => {
  await chmod(root, 0o755).catch(() => undefined);
  await rm(root, { recursive: true, force: true });
});

describe('writeWhole', () => {
  it.each([
    ['a string, as UTF-8', 'ferry timetable: späť\n', new TextEncoder().encode('ferry timetable: späť\n')],
    ['bytes, as given', new Uint8Array([0, 255, 10, 13]), new Uint8Array([0, 255, 10, 13])],
    ['nothing', '', new Uint8Array(0)],
  ])('writes %s and leaves no temporary file', async (_what, data, bytes) => {
    const dir = await folder();
    const path = join(dir, 'lex.json');
    await writeWhole(path, data);
    expect(new Uint8Array(await readFile(path))).toEqual(bytes);
    expect(await readdir(dir)).toEqual(['lex.json']);
  });

  it('replaces an existing file whole', async () => {
    const dir = await folder();
    const path = join(dir, 'lex.json');
    await writeFile(path, 'old contents that are longer than the new ones');
    await writeWhole(path, 'new');
    expect(await readFile(path, 'utf8')).toBe('new');
    expect(await readdir(dir)).toEqual(['lex.json']);
  });

  it('fails with IO naming the path when the parent folder does not exist', async () => {
    const dir = await folder();
    const path = join(dir, 'missing', 'lex.json');
    const error = await caughtError(() => writeWhole(path, 'x'));
    expect(error.code).toBe('IO');
    // "no such file or directory" is the C library's strerror(ENOENT) text, which libuv reports (common practice).
    expect(error.message).toBe(
      `${path}: not written: a folder on the way does not exist (ENOENT while creating a temporary file beside it); check the path`,
    );
    expect(error.where).toEqual({ file: path });
    expect(await readdir(dir)).toEqual([]);
  });

  it('fails with IO, removes the temporary file and keeps the folder when the destination is a folder', async () => {
    const dir = await folder();
    const path = join(dir, 'out');
    await mkdir(join(path, 'inside'), { recursive: true });
    const error = await caughtError(() => writeWhole(path, 'x'));
    // rename(2): EISDIR "newpath is an existing directory, but oldpath is not a directory" (Linux man-pages).
    expect(error.message).toBe(`${path}: not written: it is a folder (EISDIR while renaming the temporary file over it); name a file, or move the folder away`);
    expect(await readdir(dir)).toEqual(['out']);
    expect(await readdir(path)).toEqual(['inside']);
  });

  // A read-only folder stops everyone but root (POSIX permissions). Run as root (CI is), the write is
  // made by a child process that drops to the unprivileged user 65534 ("nobody") before trying.
  it('fails with IO in a read-only folder and leaves nothing behind', async () => {
    const dir = await folder();
    const path = join(dir, 'lex.json');
    await writeFile(path, 'old');
    await chmod(dir, 0o555);
    try {
      let message: string;
      if (process.getuid?.() !== 0) {
        message = (await caughtError(() => writeWhole(path, 'new'))).message;
      } else {
        for (let d = dir; d !== dirname(d); d = dirname(d)) if (d.startsWith(tmpdir()) && d !== tmpdir()) await chmod(d, d === dir ? 0o555 : 0o755);
        const module = pathToFileURL(join(fileURLToPath(import.meta.url), '../../../src/files/writeWhole.ts')).href;
        // The module is loaded before the child drops to nobody: the checkout may sit in a folder only root
        // may enter (mktemp -d makes mode 700), which nobody could not read.
        const script = `const { writeWhole } = await import(${JSON.stringify(module)}); process.setgid(65534); process.setuid(65534); try { await writeWhole(${JSON.stringify(path)}, 'new'); } catch (e) { process.stdout.write(e.message); }`;
        const child = spawnSync(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', script], { encoding: 'utf8', cwd: join(fileURLToPath(import.meta.url), '../../..') });
        expect(child.stderr).toBe('');
        message = child.stdout;
      }
      expect(message).toBe(`${path}: not written: permission denied (EACCES while creating a temporary file beside it); name a folder you may write to, or change its permissions`);
      expect(await readdir(dir)).toEqual(['lex.json']);
      expect(await readFile(path, 'utf8')).toBe('old');
    } finally {
      await chmod(dir, 0o755);
    }
  });

  it('round-trips any bytes (property)', async () => {
    const dir = await folder();
    const path = join(dir, 'blob.bin');
    await fc.assert(
      fc.asyncProperty(fc.uint8Array({ maxLength: 5000 }), async (bytes) => {
        await writeWhole(path, bytes);
        expect(new Uint8Array(await readFile(path))).toEqual(bytes);
        expect(await readdir(dir)).toEqual(['blob.bin']);
      }),
      { numRuns: 40 },
    );
  });
});

describe('openAtomic', () => {
  it('names the temporary file .<base>.<pid>.<random>.tmp in the same folder', () => {
    const temp = tempPathFor(join('out', 'ids.npy'));
    expect(temp).toMatch(new RegExp(`^out[/\\\\]\\.ids\\.npy\\.${process.pid}\\.[0-9a-f]{12}\\.tmp$`));
    expect(tempPathFor('ids.npy')).not.toBe(tempPathFor('ids.npy'));
  });

  it('shows nothing at the destination until commit, then only the destination', async () => {
    const dir = await folder();
    const path = join(dir, 'ids.bin');
    const file = await openAtomic(path);
    await file.write(new Uint8Array([1, 2, 3]));
    const during = await readdir(dir);
    expect(during).toHaveLength(1);
    expect(join(dir, during[0] ?? '')).toBe(file.tempPath);
    await file.commit();
    expect(await readdir(dir)).toEqual(['ids.bin']);
    expect(new Uint8Array(await readFile(path))).toEqual(new Uint8Array([1, 2, 3]));
  });

  it('keeps the old file intact until commit, and after abort', async () => {
    const dir = await folder();
    const path = join(dir, 'lex.json');
    await writeFile(path, 'old');
    const file = await openAtomic(path);
    await file.write(new TextEncoder().encode('half of a new fi'));
    expect(await readFile(path, 'utf8')).toBe('old');
    await file.abort();
    await file.abort(); // a second abort is harmless
    expect(await readFile(path, 'utf8')).toBe('old');
    expect(await readdir(dir)).toEqual(['lex.json']);
  });

  it('patches earlier bytes with writeAt without moving the append point', async () => {
    const dir = await folder();
    const path = join(dir, 'patched.bin');
    const file = await openAtomic(path);
    await file.write(new Uint8Array([0, 0, 0, 0]));
    await file.writeAt(new Uint8Array([7, 8]), 1);
    await file.write(new Uint8Array([9]));
    await file.commit();
    expect([...(await readFile(path))]).toEqual([0, 7, 8, 0, 9]);
  });

  it('writes calls that are not awaited in call order', async () => {
    const dir = await folder();
    const path = join(dir, 'order.bin');
    const file = await openAtomic(path);
    const writes = Array.from({ length: 50 }, (_, i) => file.write(new Uint8Array([i])));
    await Promise.all(writes);
    await file.commit();
    expect([...(await readFile(path))]).toEqual(Array.from({ length: 50 }, (_, i) => i));
  });

  it('on a failed write removes the temporary file, keeps the old file and repeats the error later', async () => {
    const dir = await folder();
    const path = join(dir, 'lex.json');
    await writeFile(path, 'old');
    const file = await openAtomic(path);
    await file.write(new Uint8Array([1]));
    const error = await caughtError(() => file.writeAt(new Uint8Array([2]), -1));
    expect(error.code).toBe('IO');
    expect(error.message).toBe(`${path}: not written: position -1 is not a byte offset from 0 up (while writing); check that the disk has room and works`);
    expect(await readdir(dir)).toEqual(['lex.json']);
    expect(await readFile(path, 'utf8')).toBe('old');
    expect(await caughtError(() => file.commit())).toBe(error);
    expect(await readFile(path, 'utf8')).toBe('old');
  });

  it.each([
    ['write', (f: Awaited<ReturnType<typeof openAtomic>>) => f.write(new Uint8Array(1))],
    ['writeAt', (f: Awaited<ReturnType<typeof openAtomic>>) => f.writeAt(new Uint8Array(1), 0)],
    ['commit', (f: Awaited<ReturnType<typeof openAtomic>>) => f.commit()],
  ])('refuses %s after commit with WRITER_CLOSED, and abort then leaves the file', async (_name, call) => {
    const dir = await folder();
    const path = join(dir, 'done.bin');
    const file = await openAtomic(path);
    await file.write(new Uint8Array([5]));
    await file.commit();
    const error = await caughtError(() => call(file));
    expect(error.code).toBe('WRITER_CLOSED');
    expect(error.message).toBe(`${path}: the file was already committed; open a new one to write again`);
    await file.abort();
    expect([...(await readFile(path))]).toEqual([5]);
  });

  it('refuses writes after abort with WRITER_CLOSED', async () => {
    const dir = await folder();
    const path = join(dir, 'gone.bin');
    const file = await openAtomic(path);
    await file.abort();
    const error = await caughtError(() => file.write(new Uint8Array(1)));
    expect(error.message).toBe(`${path}: the file was already aborted; open a new one to write again`);
    expect(await readdir(dir)).toEqual([]);
  });
});
