import { spawn, spawnSync } from 'node:child_process';
import { readFile, readdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import { freshFolderEachTest } from '../helpers/cli.js';

// End-to-end through the built executable (npm test runs tsup first), as a user would call it.
const root = join(fileURLToPath(import.meta.url), '../../..');
const bin = join(root, 'dist', 'bin.js');
const demo = join(root, 'corpora-demo', 'ferry-messages.csv');

const tmp = freshFolderEachTest();

function lexlock(...args: string[]) {
  return spawnSync(process.execPath, [bin, ...args], { encoding: 'utf8' });
}

describe('the lexlock executable', () => {
  it('builds, encodes and verifies the demo corpus', async () => {
    const built = lexlock('build', demo, '-o', tmp.path('lex.json'), '--label', 'topic', '--cap', '2000', '--length', '48');
    expect(built.stderr).toBe('');
    expect(built.status).toBe(0);
    const encoded = lexlock('encode', demo, '--lexicon', tmp.path('lex.json'), '-o', tmp.path('enc'));
    expect(encoded.status).toBe(0);
    expect((await readdir(tmp.path('enc'))).sort()).toEqual(['ids.npy', 'keys.jsonl', 'labels.npy', 'lengths.npy', 'manifest.json']);
    const verified = lexlock('verify', tmp.path('lex.json'));
    expect(verified.status).toBe(0);
    const lex = parseLexicon(await readFile(tmp.path('lex.json'), 'utf8'));
    expect(verified.stdout).toContain(lex.fingerprint);
    const manifest = JSON.parse(await readFile(tmp.path('enc/manifest.json'), 'utf8'));
    expect(manifest.rows).toBe(lex.fit?.documents);
  });

  it('prints a one-line error without a stack trace and exits 1 on bad input, 2 on bad usage', async () => {
    await writeFile(tmp.path('bad.jsonl'), '{"text": "fine"}\n{"text": oops}\n');
    const bad = lexlock('build', tmp.path('bad.jsonl'), '-o', tmp.path('lex.json'));
    expect(bad.status).toBe(1);
    expect(bad.stderr.trim().split('\n')).toHaveLength(1);
    expect(bad.stderr).toContain(`${tmp.path('bad.jsonl')} line 2: not JSON`);
    expect(bad.stderr).not.toMatch(/\n\s+at /);
    const usage = lexlock('build', demo, '-o', tmp.path('lex.json'), '--cap', '-3');
    expect(usage.status).toBe(2);
    expect(usage.stderr).toBe('lexlock build: --cap: "-3" is not a whole number of at least 1\n');
  });

  // The built package starts dist/worker.js (the sources start worker.ts through tsx): check that path too.
  it('builds the same lexicon bytes on 1 and 2 worker threads from the built package', async () => {
    for (const threads of ['1', '2']) {
      const r = lexlock('build', demo, '-o', tmp.path(`t${threads}.json`), '--label', 'topic', '--threads', threads, '--quiet');
      expect([r.status, r.stderr]).toEqual([0, '']);
    }
    const [one, two] = await Promise.all(['t1.json', 't2.json'].map(async (f) => JSON.parse(await readFile(tmp.path(f), 'utf8'))));
    two.fit.createdAt = one.fit.createdAt;
    expect(JSON.stringify(two)).toBe(JSON.stringify(one));
    const encoded = lexlock('encode', demo, '--lexicon', tmp.path('t1.json'), '-o', tmp.path('e2.jsonl'), '--threads', '2');
    const single = lexlock('encode', demo, '--lexicon', tmp.path('t1.json'), '-o', tmp.path('e1.jsonl'), '--threads', '1');
    expect([encoded.status, single.status]).toEqual([0, 0]);
    expect(await readFile(tmp.path('e2.jsonl'), 'utf8')).toBe(await readFile(tmp.path('e1.jsonl'), 'utf8'));
  });

  // --memory-limit runs the command on a worker thread with the V8 heap capped (src/runCapped.ts): same lexicon, same exit codes.
  it('builds the same lexicon with --memory-limit, on a thread whose heap is capped, and passes its exit code on', async () => {
    const plain = lexlock('build', demo, '-o', tmp.path('plain.json'), '--label', 'topic', '--cap', '500', '--quiet');
    const bounded = lexlock('build', demo, '-o', tmp.path('bounded.json'), '--label', 'topic', '--cap', '500', '--quiet', '--memory-limit', '64');
    expect([plain.status, plain.stderr, bounded.status, bounded.stderr]).toEqual([0, '', 0, '']);
    const unbounded = parseLexicon(await readFile(tmp.path('plain.json'), 'utf8'));
    expect(parseLexicon(await readFile(tmp.path('bounded.json'), 'utf8')).fingerprint).toBe(unbounded.fingerprint);
    const refused = lexlock('build', demo, '-o', tmp.path('x.json'), '--memory-limit', '64', '--cap', '0');
    expect(refused.status).toBe(2);
    expect(refused.stderr).toContain('--cap');
  });

  // Atomic save: killed at any moment, build leaves either no lexicon or a complete, valid one.
  it('never leaves a half-written lexicon when killed', async () => {
    const big = tmp.path('big.txt');
    const line = 'the ferry to north harbour left at 10 am and was late again, sadly\n';
    await writeFile(big, line.repeat(60000));
    for (const delay of [50, 150, 300, 600]) {
      const out = tmp.path(`lex-${delay}.json`);
      const child = spawn(process.execPath, [bin, 'build', big, '-o', out, '--quiet']);
      // Listened for at once: a fast build may finish before the kill.
      const closed = new Promise((r) => child.on('close', r));
      await new Promise((r) => setTimeout(r, delay));
      child.kill('SIGKILL');
      await closed;
      const text = await readFile(out, 'utf8').catch(() => null);
      if (text !== null) expect(parseLexicon(text).fit?.documents).toBe(60000);
    }
  });
});
