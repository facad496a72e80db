import { mkdir, mkdtemp, rm, symlink, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LexlockError } from '../../src/LexlockError.js';
import { assertWritable } from '../../src/files/refuseOverwrite.js';

// Refusing to replace an existing output unless asked is common practice for command-line tools
// (e.g. the shell's noclobber option, POSIX sh `set -C`).

let root: string;
beforeAll(async () => {
  root = await mkdtemp(join(tmpdir(), 'lexlock-refuse-'));
  await writeFile(join(root, 'lex.json'), '{}');
  await mkdir(join(root, 'out'));
  await symlink(join(root, 'nowhere'), join(root, 'dangling'));
});
afterAll(async () => {
  await rm(root, { recursive: true, force: true });
});

describe('assertWritable', () => {
  it.each([
    ['a missing file', 'new.json', false],
    ['a missing file, forced', 'new.json', true],
    ['an existing file, forced', 'lex.json', true],
    ['a file in a missing folder (left to the write)', join('missing', 'x.json'), false],
  ])('allows %s', async (_what, name, force) => {
    await expect(assertWritable(join(root, name), force)).resolves.toBeUndefined();
  });

  it.each([
    ['an existing file', 'lex.json', false, 'already exists; pass --force to overwrite it'],
    ['a folder', 'out', false, 'is a folder; name a file to write instead'],
    ['a folder, even forced', 'out', true, 'is a folder; name a file to write instead'],
  ])('refuses %s with OUTPUT_EXISTS', async (_what, name, force, tail) => {
    const path = join(root, name);
    const error = await assertWritable(path, force).then(
      () => null,
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(LexlockError);
    expect(error).toMatchObject({ code: 'OUTPUT_EXISTS', message: `${path} ${tail}`, where: { file: path } });
  });

  // A link is refused before the overwrite question: --force would not help (refuseSymlink.test.ts says why).
  it.each([false, true])('refuses a dangling symbolic link with OUTPUT_SYMLINK (force %s)', async (force) => {
    const path = join(root, 'dangling');
    const error = await assertWritable(path, force).then(
      () => null,
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(LexlockError);
    const target = join(root, 'nowhere');
    expect(error).toMatchObject({
      code: 'OUTPUT_SYMLINK',
      message: `${path} is a symbolic link to ${target}; lexlock does not write through symbolic links: remove the link, or name ${target} itself as the output`,
      where: { file: path },
    });
  });
});
