import { readdir, readFile, writeFile } from 'node:fs/promises';
import { basename, join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { realFileSystem, replaceFileSystem } from '../../src/files/fileSystem.js';
import { cli, freshFolderEachTest } from '../helpers/cli.js';

// A commit of several outputs that fails halfway must put back what it had already put in place:
// all of them or none. The failures are made through the writers' file-system seam
// (src/files/fileSystem.ts): a rename refused (EACCES, as rename(2) may answer when the folder is
// not writable; Linux man-pages) and a folder that cannot be flushed to disk (EIO, as fsync(2) may
// answer after a write-back error).

const tmp = freshFolderEachTest();
let restore: (() => void) | null = null;
afterEach(() => {
  restore?.();
  restore = null;
});

function systemError(code: string, syscall: string, text: string): NodeJS.ErrnoException {
  return Object.assign(new Error(`${code}: ${text}, ${syscall}`), { code, syscall });
}

/** Every file under `dir` with its bytes, as sorted lines. */
async function listing(dir: string): Promise<string[]> {
  const out: string[] = [];
  const walk = async (at: string, prefix: string): Promise<void> => {
    for (const entry of await readdir(at, { withFileTypes: true })) {
      if (entry.isDirectory()) await walk(join(at, entry.name), `${prefix}${entry.name}/`);
      else out.push(`${prefix}${entry.name} ${(await readFile(join(at, entry.name))).toString('base64')}`);
    }
  };
  await walk(dir, '');
  return out.sort();
}

async function oldOutputs(): Promise<void> {
  const lines = ['topic,text', ...Array.from({ length: 120 }, (_, i) => `${['delays', 'praise'][i % 2]},ferry ${['late', 'lovely', 'crossing'][i % 3]} pier${i % 17}`)];
  await writeFile(tmp.path('m.csv'), `${lines.join('\n')}\n`);
  for (const out of ['out', 'rows.jsonl']) {
    const r = await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--length', '4', '--encode', tmp.path(out), '--force');
    expect([r.code, r.stderr]).toEqual([0, '']);
  }
}

const build = (out: string) => ['build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--length', '7', '--force', '--encode', tmp.path(out)];

describe('build --encode: the second output cannot be put in place', () => {
  it.each([['out'], ['rows.jsonl']])('the lexicon rename is refused: %s goes back to its old self, exit 1', async (out) => {
    await oldOutputs();
    const before = await listing(tmp.dir);
    restore = replaceFileSystem({
      renameSync: (from, to) => {
        if (to === tmp.path('lex.json')) throw systemError('EACCES', 'rename', 'permission denied');
        realFileSystem.renameSync(from, to);
      },
    });
    const r = await cli(...build(out));
    expect([r.code, r.stderr]).toEqual([
      1,
      `lexlock build: ${tmp.path('lex.json')}: not written: permission denied (EACCES while renaming the temporary file over it); name a folder you may write to, or change its permissions; ${tmp.path(out)} was not written either\n`,
    ]);
    expect(await listing(tmp.dir)).toEqual(before);
  });

  it.each([['out'], ['rows.jsonl']])('the lexicon folder cannot be flushed: both put back (%s), exit 1', async (out) => {
    await oldOutputs();
    const before = await listing(tmp.dir);
    let flushes = 0;
    restore = replaceFileSystem({
      syncFolderSync: (path) => {
        flushes += 1;
        // The encoded output's folder is flushed first, then the lexicon's (the same folder here).
        if (flushes === 2) throw systemError('EIO', 'fsync', 'i/o error');
        realFileSystem.syncFolderSync(path);
      },
    });
    const r = await cli(...build(out));
    expect([r.code, r.stderr]).toEqual([
      1,
      `lexlock build: ${tmp.path('lex.json')}: not written: the device reported an input/output error (EIO while flushing its folder to disk); check the disk; ${tmp.path(out)} was not written either\n`,
    ]);
    expect(await listing(tmp.dir)).toEqual(before);
  });
});

describe('a folder output that cannot be renamed into place', () => {
  it('puts the old folder back, exit 1', async () => {
    await oldOutputs();
    const before = await listing(tmp.dir);
    restore = replaceFileSystem({
      renameSync: (from, to) => {
        if (to === tmp.path('out') && basename(from).endsWith('.new')) throw systemError('EXDEV', 'rename', 'cross-device link not permitted');
        realFileSystem.renameSync(from, to);
      },
    });
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), '--force');
    expect([r.code, r.stderr]).toEqual([
      1,
      `lexlock encode: ${tmp.path('out')}: not written: it is on another file system (EXDEV while renaming the new folder into place); name an output on the same file system\n`,
    ]);
    expect(await listing(tmp.dir)).toEqual(before);
  });

  it('says where the old folder is when it cannot be put back either', async () => {
    await oldOutputs();
    restore = replaceFileSystem({
      renameSync: (from, to) => {
        if (to === tmp.path('out')) throw systemError('EIO', 'rename', 'i/o error');
        realFileSystem.renameSync(from, to);
      },
    });
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), '--force');
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(
      new RegExp(`^lexlock encode: ${tmp.path('out')}: not written: the device reported an input/output error \\(EIO while renaming the new folder into place\\); check the disk; the old folder could not be put back either: it is at ${tmp.dir}/\\.out\\.${process.pid}\\.[0-9a-f]{12}\\.old\n$`),
    );
    restore?.();
    restore = null;
    // The new folder is gone, the old one is still aside: once this process has ended, the next run
    // puts it back (removeStaleTemps), so the old set is not lost.
    expect((await readdir(tmp.dir)).filter((n) => n.startsWith('.out.')).map((n) => n.replace(/[0-9a-f]{12}/, '<random>'))).toEqual([`.out.${process.pid}.<random>.old`]);
  });
});
