import { spawn } from 'node:child_process';
import { readdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { freshFolderEachTest } from '../helpers/cli.js';

// SIGINT during a long tokenize of one hostile line (issue 13): JavaScript signal handlers run only when
// the event loop turns, and one document of 60 MiB takes seconds to tokenize, so the pipeline
// tokenizes it in steps with turns between them. Shown by order, not by a clock: a line 16 times as
// long as a small one is built after the small one was built whole; SIGINT comes when the big build has
// had twice the small build's whole time, so at most about an eighth of its line can be tokenized; it
// must then stop within one more small build's time, long before it could have finished. Exit status
// 128 + the signal's number (SIGINT 2 -> 130) is common practice of shells and command-line tools.
// Through the built executable (npm test builds dist/ first).

const root = join(fileURLToPath(import.meta.url), '../../..');
const bin = join(root, 'dist', 'bin.js');
const tmp = freshFolderEachTest();

/** A run of digits then a currency sign: one group wink-tokenizer, run as it is, takes quadratic time on. */
const hostileLine = (mebibytes: number) => `${'1'.repeat(mebibytes * 1024 * 1024)}€\n`;

interface Run {
  code: number | null;
  stderr: string;
  /** When it ended, on the clock of `performance.now()`. */
  endedAt: number;
}

function build(corpus: string, out: string): { kill: (signal: NodeJS.Signals) => void; ended: Promise<Run> } {
  const child = spawn(process.execPath, [bin, 'build', corpus, '-o', out, '--quiet', '--threads', '1'], { stdio: ['ignore', 'ignore', 'pipe'] });
  let stderr = '';
  child.stderr.setEncoding('utf8').on('data', (t: string) => (stderr += t));
  const ended = new Promise<Run>((resolve) => child.on('close', (code) => resolve({ code, stderr, endedAt: performance.now() })));
  return { kill: (signal) => child.kill(signal), ended };
}

describe('Ctrl-C during a long tokenize of one hostile line', () => {
  it('exits 130 soon after SIGINT, long before the build could have finished', { timeout: 120_000 }, async () => {
    await writeFile(tmp.path('small.txt'), hostileLine(60 / 16));
    await writeFile(tmp.path('big.txt'), hostileLine(60));
    let small = 0;
    for (const out of ['small-1.json', 'small-2.json']) {
      const started = performance.now();
      const run = await build(tmp.path('small.txt'), tmp.path(out)).ended;
      expect([run.code, run.stderr]).toEqual([0, '']);
      small = Math.max(small, run.endedAt - started);
    }
    const started = performance.now();
    const big = build(tmp.path('big.txt'), tmp.path('big.json'));
    const tooLate = new Promise<'still running'>((resolve) => setTimeout(() => resolve('still running'), 4 * small));
    await new Promise((resolve) => setTimeout(resolve, 2 * small));
    const signalledAt = performance.now();
    big.kill('SIGINT');
    const first = await Promise.race([big.ended, tooLate]);
    if (first === 'still running') big.kill('SIGKILL');
    const run = await big.ended;
    expect(first).not.toBe('still running');
    expect([run.code, run.stderr]).toEqual([130, 'lexlock: interrupted (SIGINT); no file was being written\n']);
    // Stopped within one small build's time of the signal (the order the test is about), and the
    // build had not finished by then: no lexicon was written.
    expect(run.endedAt - signalledAt).toBeLessThan(small);
    expect(signalledAt - started).toBeGreaterThanOrEqual(2 * small - 1);
    expect((await readdir(tmp.dir)).sort()).toEqual(['big.txt', 'small-1.json', 'small-2.json', 'small.txt']);
  });
});
