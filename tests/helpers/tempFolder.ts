import { afterEach, beforeEach } from 'vitest';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** A fresh temporary folder, a path builder inside it, and a function that removes it. */
export async function tempFolder(): Promise<{ dir: string; path: (name: string) => string; remove: () => Promise<void> }> {
  const dir = await mkdtemp(join(tmpdir(), 'lexlock-test-'));
  return { dir, path: (name) => join(dir, name), remove: () => rm(dir, { recursive: true, force: true }) };
}

/**
 * A fresh temporary folder for every test of the calling file (made before each test, removed after),
 * reached through the returned object.
 */
export function freshFolderEachTest(): { readonly dir: string; path: (name: string) => string } {
  let current: Awaited<ReturnType<typeof tempFolder>> | null = null;
  beforeEach(async () => {
    current = await tempFolder();
  });
  afterEach(async () => {
    await current?.remove();
    current = null;
  });
  const now = () => {
    if (current === null) throw new Error('the temporary folder exists only while a test runs');
    return current;
  };
  return {
    get dir() {
      return now().dir;
    },
    path: (name) => now().path(name),
  };
}
