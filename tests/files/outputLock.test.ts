import { mkdir, readdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { lockOutput, lockOutputs, withLocks } from '../../src/files/outputLock.js';
import { caughtError } from '../helpers/caughtError.js';
import { freshFolderEachTest } from '../helpers/cli.js';

// One writer per output: an exclusive-create lock file beside it holding the writer's process id
// (link(2) fails with EEXIST when the name exists, so two runs cannot both make it; Linux man-pages),
// taken over when that process no longer runs (kill(2) with signal 0 answers ESRCH). Lock files
// holding a process id are common practice for programs that must not run twice on the same thing.

const tmp = freshFolderEachTest();
// No process can have this id: Linux process ids stop at 2^22 (proc(5), /proc/sys/kernel/pid_max).
const NEVER = 2 ** 22 + 1;

describe('lockOutput', () => {
  it('holds .<base>.lock with this process id, refuses a second writer, and is gone once released', async () => {
    const lock = await lockOutput(tmp.path('lex.json'));
    expect(await readFile(tmp.path('.lex.json.lock'), 'utf8')).toBe(`${process.pid}\n`);
    const error = await caughtError(() => lockOutput(tmp.path('lex.json')));
    expect([error.code, error.message, error.where]).toEqual([
      'OUTPUT_BUSY',
      `${tmp.path('lex.json')} is being written by this same lexlock process; wait until it ends, or name another output (if no lexlock is running, remove ${tmp.path('.lex.json.lock')})`,
      { file: tmp.path('lex.json') },
    ]);
    await lock.release(true);
    expect(await readdir(tmp.dir)).toEqual([]);
    await (await lockOutput(tmp.path('lex.json'))).release(true);
  });

  it('names another running process that holds it', async () => {
    await writeFile(tmp.path('.out.lock'), `${process.ppid}\n`);
    const error = await caughtError(() => lockOutput(tmp.path('out')));
    expect(error.message).toBe(`${tmp.path('out')} is being written by another lexlock run (process ${process.ppid}); wait until it ends, or name another output (if no lexlock is running, remove ${tmp.path('.out.lock')})`);
    expect(await readdir(tmp.dir)).toEqual(['.out.lock']);
  });

  it.each([
    ['a process that no longer runs', `${NEVER}\n`],
    ['nothing readable', 'not a process id'],
    ['nothing at all', ''],
  ])('takes over a lock naming %s', async (_what, content) => {
    await writeFile(tmp.path('.out.lock'), content);
    const lock = await lockOutput(tmp.path('out'));
    expect(await readFile(tmp.path('.out.lock'), 'utf8')).toBe(`${process.pid}\n`);
    await lock.release(true);
    expect(await readdir(tmp.dir)).toEqual([]);
  });

  it('makes the folders an output needs, and removes them again when the run wrote nothing', async () => {
    const lock = await lockOutput(tmp.path('models/ferry/lex.json'));
    expect(await readdir(tmp.path('models/ferry'))).toEqual(['.lex.json.lock']);
    await lock.release(false);
    expect(await readdir(tmp.dir)).toEqual([]);
    const kept = await lockOutput(tmp.path('models/ferry/lex.json'));
    await writeFile(tmp.path('models/ferry/lex.json'), 'written');
    await kept.release(false); // not empty: kept
    expect(await readdir(tmp.path('models/ferry'))).toEqual(['lex.json']);
  });

  it('names the part of the path that is a file', async () => {
    await writeFile(tmp.path('notes.txt'), 'x');
    const error = await caughtError(() => lockOutput(tmp.path('notes.txt/deeper/out')));
    expect(error.message).toBe(`${tmp.path('notes.txt/deeper/out')}: not written: ${tmp.path('notes.txt')} is a file, not a folder; fix the path, or move that file away`);
  });
});

describe('lockOutputs and withLocks', () => {
  it('take every lock or none', async () => {
    await mkdir(tmp.path('b'));
    await writeFile(tmp.path('b/.out.lock'), `${process.ppid}\n`);
    const error = await caughtError(() => lockOutputs([tmp.path('a/lex.json'), tmp.path('b/out')]));
    expect(error.code).toBe('OUTPUT_BUSY');
    expect((await readdir(tmp.dir)).sort()).toEqual(['b']); // a/ was made for the lock and removed with it
  });

  it('release the locks after the work, whether it succeeds or fails', async () => {
    expect(await withLocks([tmp.path('x.json'), tmp.path('y')], async () => (await readdir(tmp.dir)).sort())).toEqual(['.x.json.lock', '.y.lock']);
    await expect(withLocks([tmp.path('x.json')], async () => Promise.reject(new Error('failed work')))).rejects.toThrow('failed work');
    expect(await readdir(tmp.dir)).toEqual([]);
  });
});
