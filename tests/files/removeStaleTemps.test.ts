import { spawnSync } from 'node:child_process';
import { mkdir, readdir, readFile, symlink, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { NumberSpill } from '../../src/files/NumberSpill.js';
import { writeWhole } from '../../src/files/writeWhole.js';
import { removeStaleTemps } from '../../src/files/removeStaleTemps.js';
import { spillPathFor } from '../../src/files/tempNames.js';
import { caseFolders } from '../helpers/caseFolders.js';

const folder = caseFolders('stale');

// A process id that no process can have: Linux process ids go up to /proc/sys/kernel/pid_max, which
// "can be set to any value up to 2^22 (PID_MAX_LIMIT, approximately 4 million)" on 64-bit systems
// (proc(5), Linux man-pages). kill(2) answers ESRCH for it.
const NEVER = 2 ** 22 + 1;

/** The id of a process that has run and exited (ids are not reused this soon; checked below with kill(2)). */
function exitedPid(): number {
  const child = spawnSync(process.execPath, ['-e', '0']);
  return child.pid as number;
}

function runs(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code !== 'ESRCH';
  }
}

describe('removeStaleTemps', () => {
  it('removes exactly the temporary files of dead runs for this destination, and nothing else', async () => {
    const dir = await folder();
    const exited = exitedPid();
    expect(runs(exited)).toBe(false);
    expect(runs(process.ppid)).toBe(true);
    const stale = [`.lex.json.${NEVER}.0123456789ab.tmp`, `.lex.json.${NEVER}.numbers.tmp`, `.lex.json.${exited}.abcdefabcdef.tmp`];
    const kept = [
      'lex.json',
      `.lex.json.${process.ppid}.0123456789ab.tmp`, // a running process's
      `.lex.json.${process.pid}.numbers.tmp`, // this process's
      `.other.json.${NEVER}.0123456789ab.tmp`, // another destination's
      `.lex.json.${NEVER}.0123456789AB.tmp`, // not a name lexlock makes
      `lex.json.${NEVER}.0123456789ab.tmp`,
      `.lex.json.${NEVER}.0123456789ab.tmp.bak`,
      '.lex.json.0.0123456789ab.tmp',
      'notes.txt',
    ];
    for (const name of [...stale, ...kept]) await writeFile(join(dir, name), 'x');
    await mkdir(join(dir, `.lex.json.${NEVER + 1}.numbers.tmp`)); // a folder of that name is left alone
    await symlink(join(dir, 'notes.txt'), join(dir, `.lex.json.${NEVER + 2}.0123456789ab.tmp`)); // and a link
    const removed = await removeStaleTemps(join(dir, 'lex.json'));
    expect(removed.sort()).toEqual(stale.map((name) => join(dir, name)).sort());
    expect((await readdir(dir)).sort()).toEqual([...kept, `.lex.json.${NEVER + 1}.numbers.tmp`, `.lex.json.${NEVER + 2}.0123456789ab.tmp`].sort());
    expect(await readFile(join(dir, 'notes.txt'), 'utf8')).toBe('x');
  });

  it('never throws: a missing folder gives nothing removed', async () => {
    const dir = await folder();
    await expect(removeStaleTemps(join(dir, 'missing', 'lex.json'))).resolves.toEqual([]);
  });

  it('runs before every atomic write, for the destination written', async () => {
    const dir = await folder();
    await writeFile(join(dir, `.lex.json.${NEVER}.0123456789ab.tmp`), 'half of an old write');
    await writeFile(join(dir, `.lex.json.${NEVER}.numbers.tmp`), 'numbers of a killed build --encode');
    await writeFile(join(dir, `.ids.npy.${NEVER}.0123456789ab.tmp`), 'another destination');
    await writeWhole(join(dir, 'lex.json'), 'new');
    expect((await readdir(dir)).sort()).toEqual([`.ids.npy.${NEVER}.0123456789ab.tmp`, 'lex.json']);
  });

  it('runs when a spill named for a lexicon is created, and not for a spill of another name', async () => {
    const dir = await folder();
    await writeFile(join(dir, `.lex.json.${NEVER}.numbers.tmp`), 'old numbers');
    await writeFile(join(dir, `.lex.json.${NEVER}.0123456789ab.tmp`), 'old write');
    const other = await NumberSpill.create(join(dir, 'train.numbers.tmp'));
    expect((await readdir(dir)).sort()).toEqual([`.lex.json.${NEVER}.0123456789ab.tmp`, `.lex.json.${NEVER}.numbers.tmp`, 'train.numbers.tmp']);
    await other.remove();
    const spill = await NumberSpill.create(spillPathFor(join(dir, 'lex.json')));
    expect(await readdir(dir)).toEqual([`.lex.json.${process.pid}.numbers.tmp`]);
    await spill.remove();
    expect(await readdir(dir)).toEqual([]);
  });

  it("removes a dead run's hidden folders and kept-aside files, and puts back an old folder it had set aside", async () => {
    const dir = await folder();
    const staged = `.out.${NEVER}.0123456789ab.new`;
    const aside = `.out.${NEVER}.0123456789ab.old`;
    await mkdir(join(dir, staged));
    await writeFile(join(dir, staged, 'ids.npy'), 'new rows');
    await mkdir(join(dir, aside));
    await writeFile(join(dir, aside, 'ids.npy'), 'old rows');
    await mkdir(join(dir, `.out.${process.ppid}.abcdefabcdef.new`)); // a running process's: kept
    await writeFile(join(dir, `.lex.json.${NEVER}.abcdefabcdef.old`), 'old lexicon kept aside');
    // Killed between the two renames: no `out`; the old folder goes back.
    const removed = await removeStaleTemps(join(dir, 'out'));
    expect(removed.sort()).toEqual([join(dir, aside), join(dir, staged)].sort());
    expect((await readdir(dir)).sort()).toEqual([`.lex.json.${NEVER}.abcdefabcdef.old`, `.out.${process.ppid}.abcdefabcdef.new`, 'out']);
    expect(await readFile(join(dir, 'out', 'ids.npy'), 'utf8')).toBe('old rows');
    // With `out` in place (the swap was done), a set-aside folder is only removed.
    await mkdir(join(dir, aside));
    expect(await removeStaleTemps(join(dir, 'out'))).toEqual([join(dir, aside)]);
    expect(await readFile(join(dir, 'out', 'ids.npy'), 'utf8')).toBe('old rows');
    // A file kept aside during a commit is removed, never put back.
    expect(await removeStaleTemps(join(dir, 'lex.json'))).toEqual([join(dir, `.lex.json.${NEVER}.abcdefabcdef.old`)]);
    expect((await readdir(dir)).sort()).toEqual([`.out.${process.ppid}.abcdefabcdef.new`, 'out']);
  });
});
