import { lstat, mkdir, readdir, readFile, readlink, symlink, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { isLexlockError, type LexlockError } from '../../src/LexlockError.js';
import { writeWhole } from '../../src/files/writeWhole.js';
import { assertWritable } from '../../src/files/refuseOverwrite.js';
import { assertNotSymlink } from '../../src/files/refuseSymlink.js';
import { saveTally } from '../../src/files/saveTally.js';
import { NpyWriter } from '../../src/output/NpyWriter.js';
import { JsonlWriter } from '../../src/output/JsonlWriter.js';
import { Tally } from '../../src/tally/Tally.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { caseFolders } from '../helpers/caseFolders.js';
import { caughtError } from '../helpers/caughtError.js';

const folder = caseFolders('symlink');

// Why a link is refused rather than written "through": rename(2) replaces a link at the new path
// with the file, "If newpath refers to a symbolic link, the link will be overwritten" (Linux
// man-pages), so an atomic write can never update the file a link points to; it would silently turn
// the link into a plain file. lexlock refuses every link, inside the folder or outside it.


function message(link: string, target: string): string {
  return `${link} is a symbolic link to ${target}; lexlock does not write through symbolic links: remove the link, or name ${target} itself as the output`;
}

/** A folder `out` with a link `out/<name>` to `target` (made relative to `out` when `relative`), and a file `elsewhere/secret.txt`. */
async function linkCase(name: string, target: 'outside' | 'inside' | 'dangling', relative = false) {
  const dir = await folder();
  await mkdir(join(dir, 'out'));
  await mkdir(join(dir, 'elsewhere'));
  await writeFile(join(dir, 'elsewhere', 'secret.txt'), 'not yours');
  await writeFile(join(dir, 'out', 'real.txt'), 'a file beside it');
  const absolute = { outside: join(dir, 'elsewhere', 'secret.txt'), inside: join(dir, 'out', 'real.txt'), dangling: join(dir, 'nowhere') }[target];
  const written = relative ? { outside: '../elsewhere/secret.txt', inside: 'real.txt', dangling: '../nowhere' }[target] : absolute;
  const link = join(dir, 'out', name);
  await symlink(written, link);
  return { dir, link, target: absolute, written };
}

describe('assertNotSymlink', () => {
  it.each([
    ['outside the folder', 'outside', false],
    ['outside the folder, written relative', 'outside', true],
    ['inside the same folder', 'inside', false],
    ['inside the same folder, written relative', 'inside', true],
    ['nowhere (dangling)', 'dangling', false],
  ] as const)('refuses a link pointing %s with OUTPUT_SYMLINK, naming both paths', async (_what, kind, relative) => {
    const { link, target } = await linkCase('lex.json', kind, relative);
    const error = await caughtError(() => assertNotSymlink(link));
    expect(error).toMatchObject({ code: 'OUTPUT_SYMLINK', message: message(link, target), where: { file: link } });
    expect(error.isUsage).toBe(false); // bad input: the CLI exits 1
  });

  it.each([
    ['a missing path', 'new.json'],
    ['a file', 'real.txt'],
    ['a folder', '.'],
  ])('lets %s through', async (_what, name) => {
    const { dir } = await linkCase('lex.json', 'outside');
    await expect(assertNotSymlink(join(dir, 'out', name))).resolves.toBeUndefined();
  });
});

describe('writers refuse a symbolic link and leave the link and its target as they were', () => {
  it.each([
    ['assertWritable without --force', 'lex.json', (p: string) => assertWritable(p, false)],
    ['assertWritable with --force', 'lex.json', (p: string) => assertWritable(p, true)],
    ['writeWhole (manifest.json of an encoded folder)', 'manifest.json', (p: string) => writeWhole(p, '{}')],
    ['NpyWriter.open', 'ids.npy', (p: string) => NpyWriter.open(p, 8)],
    ['JsonlWriter.open', 'rows.jsonl', (p: string) => JsonlWriter.open(p)],
    ['saveTally with force', 'part.tally', (p: string) => saveTally(p, { tally: new Tally(resolveRules()), snippets: [], fields: { text: 'text', label: null } }, { force: true })],
  ])('%s', async (_what, name, write) => {
    for (const kind of ['outside', 'inside'] as const) {
      const { dir, link, target, written } = await linkCase(name, kind);
      const error = await caughtError(() => write(link));
      expect([error.code, error.message]).toEqual(['OUTPUT_SYMLINK', message(link, target)]);
      expect((await lstat(link)).isSymbolicLink()).toBe(true);
      expect(await readlink(link)).toBe(written);
      expect(await readFile(join(dir, 'elsewhere', 'secret.txt'), 'utf8')).toBe('not yours');
      expect(await readFile(join(dir, 'out', 'real.txt'), 'utf8')).toBe('a file beside it');
      expect((await readdir(join(dir, 'out'))).sort()).toEqual([name, 'real.txt'].sort()); // no temporary file left
    }
  });
});
