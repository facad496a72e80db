import { spawn, spawnSync } from 'node:child_process';
import { readdir, readFile, readlink, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import { writeFlatCorpus, writeZipfCorpus } from '../helpers/generatedCorpora.js';
import { freshFolderEachTest, tempFolder } from '../helpers/cli.js';

// `build --memory-limit` end to end through the built executable (npm test builds dist/ first): the
// heap cap and the process around the count only exist there. Peak RSS is each process's own
// getrusage(2) maxRSS, written when it exits by tests/helpers/reportPeakRss.mjs (preloaded).

const root = join(fileURLToPath(import.meta.url), '../../..');
const bin = join(root, 'dist', 'bin.js');
const preload = join(root, 'tests', 'helpers', 'reportPeakRss.mjs');

interface Run {
  code: number | null;
  stderr: string;
  /** The sum of the peak RSS of every process of the run, in MiB (a run of two processes holds both). */
  peakMiB: number;
}

let shared: Awaited<ReturnType<typeof tempFolder>>;
let runs = 0;

async function lexlock(...args: string[]): Promise<Run> {
  runs += 1;
  const rssFile = shared.path(`rss-${runs}.txt`);
  const r = spawnSync(process.execPath, ['--import', preload, bin, ...args], { encoding: 'utf8', env: { ...process.env, LEXLOCK_TEST_PEAK_RSS: rssFile } });
  const lines = (await readFile(rssFile, 'utf8').catch(() => '')).trim().split('\n').filter((l) => l !== '');
  const peakKiB = lines.reduce((sum, l) => sum + Number(l.split(' ')[1]), 0);
  return { code: r.status, stderr: r.stderr, peakMiB: peakKiB / 1024 };
}

/** What V8 prints when it runs out of heap: never acceptable from lexlock. */
const CRASH = /FATAL ERROR|Native stack trace|heap out of memory|Aborted/;

beforeAll(async () => {
  shared = await tempFolder();
  // 100,000 distinct tokens, each once (650 KB): the flat corpus that crashed V8 at 16 to 32 MiB.
  await writeFlatCorpus(shared.path('flat.txt'), 10_000);
  await writeFile(shared.path('tiny.txt'), 'the ferry was late\nlovely crossing\n');
}, 60_000);

afterAll(async () => {
  await shared.remove();
});

describe('build --memory-limit on a flat corpus', () => {
  let exact: string;
  beforeAll(async () => {
    const r = await lexlock('build', shared.path('flat.txt'), '-o', shared.path('exact.json'), '--quiet');
    expect([r.code, r.stderr]).toEqual([0, '']);
    exact = parseLexicon(await readFile(shared.path('exact.json'), 'utf8')).fingerprint;
  }, 60_000);

  /** Builds at `limit`; checks no crash and the peak RSS against a two-line build's at the same limit. */
  async function within(limit: number): Promise<Run> {
    const out = shared.path(`lex-${limit}.json`);
    const r = await lexlock('build', shared.path('flat.txt'), '-o', out, '--force', '--quiet', '--memory-limit', String(limit));
    expect(r.stderr).not.toMatch(CRASH);
    if (r.code === 2) return r; // refused as a usage error before anything was read
    const base = await lexlock('build', shared.path('tiny.txt'), '-o', shared.path(`tiny-${limit}.json`), '--force', '--quiet', '--memory-limit', String(limit));
    expect(base.code, base.stderr).toBe(0);
    // The promise: peak RSS within the limit plus what lexlock itself takes at that limit (Node, the code).
    expect(r.peakMiB, `peak ${r.peakMiB.toFixed(1)} MiB at --memory-limit ${limit}, a two-line build ${base.peakMiB.toFixed(1)} MiB`).toBeLessThanOrEqual(limit + base.peakMiB);
    if (r.code === 0) expect(parseLexicon(await readFile(out, 'utf8')).fingerprint).toBe(exact);
    return r;
  }

  const named = (r: Run) => Number(/try --memory-limit (\d+)\n$/.exec(r.stderr)?.[1] ?? NaN);

  it.each([16, 32, 64])('at %i MiB builds the exact lexicon, or refuses naming a limit that then builds it', { timeout: 60_000 }, async (limit) => {
    let r = await within(limit);
    if (r.code === 2) {
      // Below the least limit a bounded build can keep to: a usage error that names that least limit.
      expect(r.stderr).toMatch(/^lexlock build: --memory-limit: /);
      const least = named(r);
      expect(least).toBeGreaterThan(limit);
      r = await within(least);
    }
    if (r.code === 1) {
      expect(r.stderr).toMatch(/^lexlock build: .*try --memory-limit \d+\n$/);
      const enough = named(r);
      r = await within(enough);
    }
    expect([r.code, r.stderr]).toEqual([0, '']);
  });
});

describe('build --memory-limit when the process is killed', () => {
  const tmp = freshFolderEachTest();

  /** Every process below `pid` now (Linux /proc, proc(5)). */
  async function descendants(pid: number): Promise<number[]> {
    const tasks = await readdir(`/proc/${pid}/task`).catch(() => [] as string[]);
    const children: number[] = [];
    for (const task of tasks) {
      const text = await readFile(`/proc/${pid}/task/${task}/children`, 'utf8').catch(() => '');
      for (const c of text.trim().split(/\s+/)) if (c !== '') children.push(Number(c));
    }
    const below = await Promise.all(children.map(descendants));
    return [...children, ...below.flat()];
  }

  /** Whether `pid` runs (a zombie, dead but not yet waited for, does not). */
  async function alive(pid: number): Promise<boolean> {
    const stat = await readFile(`/proc/${pid}/stat`, 'utf8').catch(() => null);
    return stat !== null && !/^\d+ \(.*\) Z /.test(stat);
  }
  const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

  it('leaves nothing running that could replace the output after a SIGKILL', { timeout: 60_000 }, async () => {
    await writeZipfCorpus(tmp.path('big.txt'), 60_000, 200_000, 3);
    await writeFile(tmp.path('lex.json'), 'old lexicon');
    const child = spawn(process.execPath, [bin, 'build', tmp.path('big.txt'), '-o', tmp.path('lex.json'), '--force', '--quiet', '--memory-limit', '256'], { stdio: 'ignore' });
    const closed = new Promise((r) => child.on('close', r));
    const pid = child.pid as number;
    // Wait until the corpus is being read, by this process or one it started.
    let reading = false;
    for (let i = 0; i < 2000 && !reading; i++) {
      for (const p of [pid, ...(await descendants(pid))]) {
        for (const fd of await readdir(`/proc/${p}/fd`).catch(() => [] as string[])) {
          if ((await readlink(`/proc/${p}/fd/${fd}`).catch(() => '')) === tmp.path('big.txt')) reading = true;
        }
      }
      if (!reading) await sleep(5);
    }
    expect(reading).toBe(true);
    const below = await descendants(pid);
    child.kill('SIGKILL');
    await closed;
    // Whatever it started must end too, and soon: nothing may go on to write the lexicon.
    for (let i = 0; i < 400; i++) {
      const left = (await Promise.all(below.map(alive))).some(Boolean);
      if (!left) break;
      await sleep(50);
    }
    expect((await Promise.all(below.map(alive))).some(Boolean)).toBe(false);
    expect((await readFile(tmp.path('lex.json'), 'utf8')).slice(0, 60)).toBe('old lexicon');
  });
});
