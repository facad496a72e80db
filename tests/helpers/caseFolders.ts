import { mkdir, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll } from 'vitest';

/**
 * One temporary root for a test file (made before all tests, removed after) and a function giving a
 * fresh empty folder inside it for each case.
 */
export function caseFolders(prefix: string): () => Promise<string> {
  let root = '';
  let n = 0;
  beforeAll(async () => {
    root = await mkdtemp(join(tmpdir(), `lexlock-${prefix}-`));
  });
  afterAll(async () => {
    await rm(root, { recursive: true, force: true });
  });
  return async () => {
    n += 1;
    const dir = join(root, `case-${n}`);
    await mkdir(dir);
    return dir;
  };
}
