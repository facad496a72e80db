import { readdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { NumberSpill } from '../../src/files/NumberSpill.js';
import { realFileSystem, replaceFileSystem } from '../../src/files/fileSystem.js';
import { cli, freshFolderEachTest } from '../helpers/cli.js';
import { caughtError } from '../helpers/caughtError.js';

// A disk that takes only part of a write, or fills up halfway, through the writers' file-system seam
// (src/files/fileSystem.ts). What the system may do is POSIX write(2): "the number of bytes actually
// written ... may be less than nbyte" when there is not room for all of them, and a later write then
// fails with ENOSPC ("no free space ... remaining on the device"; Linux man-pages write(2)). A careful
// writer continues a short write and treats a failed one as an error: common practice.

const tmp = freshFolderEachTest();
let restore: (() => void) | null = null;
afterEach(() => {
  restore?.();
  restore = null;
});

/** The error Node gives for a write to a full disk (its code, errno and syscall as libuv reports them). */
function enospc(): NodeJS.ErrnoException {
  return Object.assign(new Error('ENOSPC: no space left on device, write'), { code: 'ENOSPC', errno: -28, syscall: 'write' });
}

/** A disk that takes at most `most` bytes a call. */
function stingyDisk(most: number): void {
  restore = replaceFileSystem({ write: (h, bytes, offset, length, position) => realFileSystem.write(h, bytes, offset, Math.min(length, most), position) });
}

/** A disk with room for `budget` more bytes: the write that reaches the end is short, the next fails with ENOSPC. */
function diskWithRoom(budget: number): { used: () => number } {
  let used = 0;
  restore = replaceFileSystem({
    write: async (h, bytes, offset, length, position) => {
      if (used >= budget) throw enospc();
      const done = await realFileSystem.write(h, bytes, offset, Math.min(length, budget - used), position);
      used += done;
      return done;
    },
  });
  return { used: () => used };
}

/** Every file under `dir` (relative paths, sorted) with its bytes; the times a lexicon or an audit page records are blanked. */
async function snapshot(dir: string): Promise<Map<string, string>> {
  const out = new Map<string, string>();
  const walk = async (at: string, prefix: string): Promise<void> => {
    for (const entry of (await readdir(at, { withFileTypes: true })).sort((a, b) => (a.name < b.name ? -1 : 1))) {
      const path = join(at, entry.name);
      if (entry.isDirectory()) {
        out.set(`${prefix}${entry.name}/`, '');
        await walk(path, `${prefix}${entry.name}/`);
      } else {
        const bytes = await readFile(path);
        const text = /\.(json|html)$/.test(entry.name) ? bytes.toString('utf8').replace(/\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z/g, '<time>') : null;
        out.set(`${prefix}${entry.name}`, text ?? bytes.toString('base64'));
      }
    }
  };
  await walk(dir, '');
  return out;
}

/** A small labelled corpus of the invented ferry operator, enough for a few kilobytes of output. */
async function corpus(): Promise<void> {
  const topics = ['delays', 'praise', 'refunds'];
  const words = 'ferry harbour ticket late crossing deck cabin ramp tide pier north south island refund storm'.split(' ');
  const lines = ['topic,text'];
  for (let i = 0; i < 300; i++) {
    const text = Array.from({ length: 3 + (i % 11) }, (_, j) => words[(i * 7 + j * 3) % words.length]).join(' ');
    lines.push(`${topics[i % 3]},${text} r${i % 37}`);
  }
  await writeFile(tmp.path('m.csv'), `${lines.join('\n')}\n`);
  await writeFile(tmp.path('m2.csv'), `${lines.slice(0, 40).join('\n')}\n`);
  // Old outputs a failed run must leave as they were.
  expect((await cli('build', tmp.path('m.csv'), '-o', tmp.path('old.json'), '--label', 'topic', '--length', '6', '--cap', '5')).code).toBe(0);
  expect((await cli('tally', tmp.path('m.csv'), '-o', tmp.path('part.tally'), '--label', 'topic')).code).toBe(0);
  expect((await cli('tally', tmp.path('m2.csv'), '-o', tmp.path('part2.tally'), '--label', 'topic')).code).toBe(0);
  for (const [from, to] of [['old.json', 'lex.json'], ['part.tally', 'all.tally']]) await writeFile(tmp.path(to as string), await readFile(tmp.path(from as string)));
  expect((await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('old.json'), '-o', tmp.path('out'))).code).toBe(0);
  expect((await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('old.json'), '-o', tmp.path('rows.jsonl'))).code).toBe(0);
  await writeFile(tmp.path('report.html'), 'old report');
}

/** Each command writing over the old outputs (with --force), with new settings so new differs from old. */
const COMMANDS: Array<[string, () => string[]]> = [
  ['build', () => ['build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--length', '9', '--force']],
  ['build --encode to a folder', () => ['build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--length', '9', '--force', '--encode', tmp.path('out')]],
  ['build --encode to a .jsonl file', () => ['build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--force', '--encode', tmp.path('rows.jsonl')]],
  ['build --encode on 2 threads', () => ['build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--length', '9', '--force', '--threads', '2', '--encode', tmp.path('out')]],
  ['encode to a folder', () => ['encode', tmp.path('m.csv'), '--lexicon', tmp.path('old.json'), '-o', tmp.path('out'), '--text', 'topic', '--force']],
  ['encode to a .jsonl file', () => ['encode', tmp.path('m.csv'), '--lexicon', tmp.path('old.json'), '-o', tmp.path('rows.jsonl'), '--force', '--text', 'topic']],
  ['tally', () => ['tally', tmp.path('m.csv'), '-o', tmp.path('all.tally'), '--force']],
  ['merge', () => ['merge', tmp.path('part.tally'), tmp.path('part2.tally'), '-o', tmp.path('all.tally'), '--force']],
  ['audit --report', () => ['audit', tmp.path('m.csv'), '--cap', '5', '--report', tmp.path('report.html'), '--force']],
];

describe('a disk that takes part of each write', () => {
  it.each(COMMANDS)('%s writes the same bytes as on a generous disk', { timeout: 60_000 }, async (_what, args) => {
    await corpus();
    const generous = await cli(...args());
    expect([generous.code, generous.stderr]).toEqual([0, '']);
    const expected = await snapshot(tmp.dir);
    for (const most of [1000, 7]) {
      stingyDisk(most);
      const r = await cli(...args());
      restore?.();
      restore = null;
      expect([most, r.code, r.stderr]).toEqual([most, 0, '']);
      const got = await snapshot(tmp.dir);
      expect(got).toEqual(expected);
    }
  });

  it('NumberSpill gives back every document across blocks, each block written a few bytes at a time', async () => {
    stingyDisk(4093);
    const spill = await NumberSpill.create(tmp.path('spill'));
    const documents = 3000;
    const numbers = Int32Array.from({ length: 1000 }, (_, i) => i * 7);
    for (let d = 0; d < documents; d++) await spill.add(d % 5, 0, numbers, d % 1000, `doc/${d}`);
    let seen = 0;
    for await (const doc of spill.documents()) {
      expect([doc.label, doc.numbers.length, doc.numbers[doc.numbers.length - 1] ?? -1, doc.key]).toEqual([seen % 5, seen % 1000, seen % 1000 === 0 ? -1 : ((seen % 1000) - 1) * 7, `doc/${seen}`]);
      seen += 1;
    }
    expect(seen).toBe(documents);
    await spill.remove();
  });
});

describe('a disk that fills up halfway', () => {
  // Room for every byte a run writes lets it finish; room for fewer stops it with exit 1, a message
  // naming the output and the reason, and every output as it was: no half file, no temporary file.
  it.each(COMMANDS)('%s: all or nothing, at every amount of room', { timeout: 90_000 }, async (_what, args) => {
    await corpus();
    const before = await snapshot(tmp.dir);
    const saved = new Map<string, Buffer>();
    for (const name of before.keys()) if (!name.endsWith('/')) saved.set(name, await readFile(join(tmp.dir, name)));
    const counting = diskWithRoom(Number.MAX_SAFE_INTEGER);
    expect((await cli(...args())).code).toBe(0);
    const total = counting.used();
    restore?.();
    const after = await snapshot(tmp.dir);
    // Back to the old outputs.
    for (const [name, bytes] of saved) await writeFile(join(tmp.dir, name), bytes);
    expect(await snapshot(tmp.dir)).toEqual(before);
    const budgets = [0, 1, Math.floor(total / 4), Math.floor(total / 2), Math.floor((total * 3) / 4), total - 1, total];
    for (const budget of budgets) {
      diskWithRoom(budget);
      const r = await cli(...args());
      restore?.();
      restore = null;
      const got = await snapshot(tmp.dir);
      if (budget === total) {
        expect([budget, r.code, r.stderr]).toEqual([budget, 0, '']);
        expect(got).toEqual(after);
        continue;
      }
      expect([budget, r.code]).toEqual([budget, 1]);
      expect(r.stderr).toMatch(new RegExp(`^lexlock ${args()[0]}: ${tmp.dir}/[^:]+: not written: the disk is full \\(ENOSPC while [a-z ,.-]+\\); free some space there, or name an output on another disk`));
      expect(r.stderr).not.toContain('bug');
      expect(got, `room for ${budget} of ${total} bytes`).toEqual(before);
    }
  });
});

describe('a write the system takes nothing of', () => {
  it('is an error, not a loop', async () => {
    let calls = 0;
    restore = replaceFileSystem({
      write: async () => {
        calls += 1;
        // On the old code this loops for ever: give up loudly instead of hanging the suite.
        if (calls > 1000) throw new Error('still writing after 1000 calls that took nothing');
        return 0;
      },
    });
    const { writeWhole } = await import('../../src/files/writeWhole.js');
    const error = await caughtError(() => writeWhole(tmp.path('lex.json'), 'ferry'));
    expect(error.message).toBe(`${tmp.path('lex.json')}: not written: the system took none of 5 bytes (while writing); check that the disk has room and works`);
    expect(calls).toBe(1);
    expect(await readdir(tmp.dir)).toEqual([]);
  });
});
