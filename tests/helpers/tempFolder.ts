import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** A fresh temporary folder, a path builder inside it, and a function that removes it. */
export async function tempFolder(): Promise<{ dir: string; path: (name: string) => string; remove: () => Promise<void> }> {
  const dir = await mkdtemp(join(tmpdir(), 'lexlock-test-'));
  return { dir, path: (name) => join(dir, name), remove: () => rm(dir, { recursive: true, force: true }) };
}
