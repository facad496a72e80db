import { readFile } from 'node:fs/promises';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

// The architecture rule of DEVELOPERS.md, checked on the sources: nothing reachable from the
// browser-safe entry imports node: modules or the Node-only folders; the core never reaches upward.
const src = join(dirname(fileURLToPath(import.meta.url)), '..', 'src');
const IMPORT = /^\s*(?:import|export)\s[^'"]*?from\s+['"]([^'"]+)['"]|^\s*import\s+['"]([^'"]+)['"]/gm;

async function graph(entry: string): Promise<Map<string, string[]>> {
  const seen = new Map<string, string[]>();
  const todo = [entry];
  while (todo.length > 0) {
    const file = todo.pop()!;
    if (seen.has(file)) continue;
    const text = await readFile(file, 'utf8');
    const specifiers = [...text.matchAll(IMPORT)].map((m) => (m[1] ?? m[2]) as string);
    seen.set(file, specifiers);
    for (const s of specifiers) if (s.startsWith('.')) todo.push(join(dirname(file), s.replace(/\.js$/, '.ts')));
  }
  return seen;
}

describe('layering', () => {
  it.each(['index.ts', 'browser.ts'])('the browser-safe entry %s reaches no node: module and no Node-only folder', async (entry) => {
    const files = await graph(join(src, entry));
    expect(files.size).toBeGreaterThan(20);
    for (const [file, specifiers] of files) {
      const where = relative(src, file);
      expect(where, `${where} is Node-only`).not.toMatch(/^(corpus|files|pipeline|commands|output)\/|^(cli|bin|node)\.ts$/);
      for (const s of specifiers) expect(s, `${where} imports ${s}`).not.toMatch(/^node:|^(fs|path|os|stream|crypto|worker_threads)$/);
    }
  });
});
