import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { folderFiles } from '../../src/corpus/folderFiles.js';
import { isLexlockError } from '../../src/LexlockError.js';
import { fixture } from './corpusFixtures.js';

async function read(root: string, paths: string[], slowReadMs?: number): Promise<Array<[string, string, string]>> {
  const out: Array<[string, string, string]> = [];
  for await (const f of folderFiles(root, paths, slowReadMs)) out.push([f.relative, f.file, f.bytes.toString('latin1')]);
  return out;
}

// Common practice: the way a file is read must not change its bytes or their order.
describe('folderFiles', () => {
  const files: Record<string, string> = {};
  for (let i = 0; i < 30; i++) files[`d${i % 3}/f${String(i).padStart(2, '0')}.txt`] = `file ${i} ${'x'.repeat(i * 37)}`;
  const paths = Object.keys(files).sort();

  it.each([
    ['synchronously while reads are quick', Infinity],
    ['ahead in the background once a read was slow (after the first file)', -1],
  ])('hands out every file in the order given, the same bytes, read %s', async (_how, slowReadMs) => {
    const root = await fixture(files);
    expect(await read(root, paths, slowReadMs)).toEqual(paths.map((p) => [p, join(root, p), files[p]]));
  });

  it.each([
    ['synchronously', Infinity],
    ['in the background', -1],
  ])('fails at the turn of a missing file, read %s, with an IO error naming it', async (_how, slowReadMs) => {
    const root = await fixture(files);
    const withGap = [...paths.slice(0, 5), 'd9/missing.txt', ...paths.slice(5)];
    const seen: string[] = [];
    let error: unknown;
    try {
      for await (const f of folderFiles(root, withGap, slowReadMs)) seen.push(f.relative);
    } catch (e) {
      error = e;
    }
    expect(seen).toEqual(paths.slice(0, 5));
    expect(isLexlockError(error) && error.code).toBe('IO');
    expect((error as Error).message).toBe(`${join(root, 'd9/missing.txt')}: could not read it (ENOENT: no such file or directory); check that it exists and that you may read it`);
  });
});
