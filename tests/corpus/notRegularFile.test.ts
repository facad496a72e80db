import { spawn, spawnSync } from 'node:child_process';
import { rm } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { listFolder } from '../../src/corpus/listFolder.js';
import { readFileWithin, readFileWithinSync } from '../../src/corpus/readFileWithin.js';
import { caughtError } from '../helpers/caughtError.js';
import { fixture } from './corpusFixtures.js';

const child = join(fileURLToPath(import.meta.url), '../folderFilesChild.ts');
const hasMkfifo = spawnSync('mkfifo', ['--version']).status === 0;

/** folderFiles in a child process; a child still running after `limitMs` was hung in a read and is killed. */
function readInChild(root: string, paths: string[], slowReadMs: number, limitMs = 30_000): Promise<unknown> {
  return new Promise((resolve, reject) => {
    const started = spawn(process.execPath, ['--import', 'tsx', child, root, String(slowReadMs), ...paths], { stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    started.stdout.on('data', (d: Buffer) => (out += d.toString()));
    started.stderr.on('data', (d: Buffer) => (err += d.toString()));
    const timer = setTimeout(() => started.kill('SIGKILL'), limitMs);
    started.on('close', (code, signal) => {
      clearTimeout(timer);
      if (signal === 'SIGKILL') reject(new Error(`the read hung: still running after ${limitMs} ms`));
      else if (code !== 0) reject(new Error(`the child exited with ${code}: ${err}`));
      else resolve(JSON.parse(out));
    });
  });
}

const notRegular = (file: string, what: string) =>
  `${file}: this is ${what}, not a regular file; a folder corpus reads only regular files (each one document), ` +
  'so move it out of the folder or put a file in its place';

// A folder is listed first and read afterwards: in between, a listed file can be replaced by
// something that is not a file. Opening a named pipe (FIFO) for reading waits for a writer, forever
// (POSIX open(2), O_NONBLOCK: "an open() for reading-only shall return without delay").
describe.skipIf(!hasMkfifo)('a listed file replaced by something that is not a regular file', () => {
  it.each([
    ['synchronously', Number.POSITIVE_INFINITY],
    ['in the background', -1],
  ])('a named pipe is refused, naming it, rather than waited on, read %s', async (_how, slowReadMs) => {
    const root = await fixture({ 'calm/a.txt': 'Flat sea all morning', 'calm/b.txt': 'Smooth crossing', 'rough/c.txt': 'Swell at the harbour mouth' });
    const paths = await listFolder(root);
    await rm(join(root, 'calm/b.txt'));
    expect(spawnSync('mkfifo', [join(root, 'calm/b.txt')]).status).toBe(0);
    expect(await readInChild(root, paths, slowReadMs)).toEqual({
      read: ['Flat sea all morning'],
      error: { code: 'NOT_A_FILE', message: notRegular(`${root}/calm/b.txt`, 'a named pipe (FIFO)'), where: { file: `${root}/calm/b.txt` } },
    });
  });

  it.each([
    ['a named pipe (FIFO)', 'fifo'],
    ['a character device', '/dev/null'],
    ['a folder', 'folder'],
  ])('readFileWithin refuses %s, in both forms', async (what, name) => {
    const root = await fixture({ 'folder/x.txt': 'x' });
    if (name === 'fifo') expect(spawnSync('mkfifo', [join(root, 'fifo')]).status).toBe(0);
    const path = name.startsWith('/') ? name : join(root, name);
    // The synchronous form runs in-process only once the child shows it cannot hang.
    if (name === 'fifo') await readInChild(root, ['fifo'], Number.POSITIVE_INFINITY);
    const sync = await caughtError(async () => readFileWithinSync(path, 1000));
    const background = await caughtError(() => readFileWithin(path, 1000));
    for (const error of [sync, background]) {
      expect(error.code).toBe('NOT_A_FILE');
      expect(error.message).toBe(notRegular(path, what));
      expect(error.where).toEqual({ file: path });
    }
  });
});
