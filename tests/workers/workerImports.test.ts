import { readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

// A worker thread starts inside the time a build, encode or audit takes, so what it loads is paid on
// every run with threads: the schema's zod alone took about 45 ms of a worker's start on the bench
// machine. This follows the source import graph from the worker's entry (imports of types only are
// erased, so they are skipped) and lists the packages it reaches.
const src = resolve(import.meta.dirname, '../../src');

function packagesReached(entry: string): Map<string, string> {
  const packages = new Map<string, string>(); // package -> first module importing it
  const seen = new Set<string>();
  const todo = [entry];
  while (todo.length > 0) {
    const file = todo.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    const text = readFileSync(file, 'utf8');
    for (const m of text.matchAll(/^(?:import|export)\s+(?!type\b)[^;]*?from\s+'([^']+)';/gms)) {
      const target = m[1]!;
      if (target.startsWith('.')) todo.push(join(dirname(file), target.replace(/\.js$/, '.ts')));
      else if (!target.startsWith('node:') && !packages.has(target)) packages.set(target, file.slice(src.length + 1));
    }
  }
  return packages;
}

describe('what a worker thread loads', () => {
  it('reaches no schema code (zod) and only the tokenizer\'s and hashing packages', () => {
    const reached = [...packagesReached(join(src, 'workers/worker.ts')).keys()].sort();
    expect(reached).not.toContain('zod/mini');
    expect(reached).toEqual(['@noble/hashes/sha2', '@noble/hashes/utils', 'emoji-regex', 'wink-tokenizer/src/eng-contractions.js']);
  });
});
