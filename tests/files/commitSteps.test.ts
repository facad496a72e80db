import { spawn, type ChildProcess } from 'node:child_process';
import { cp, mkdir, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import { cli, freshFolderEachTest } from '../helpers/cli.js';

// A run stopped at every step of putting its outputs in place, through the built executable (npm
// test builds dist/ first; the runs that must simply succeed are made in this process) and the test hook LEXLOCK_TEST_STEPS (src/files/testSteps.ts), which makes
// a run announce each step on stderr and stop at a chosen one, so the kill lands exactly there
// without any timing. SIGKILL cannot be caught or ignored (signal(7)): what a killed run leaves is
// what a crash leaves. rename(2) replaces a file atomically but refuses to replace a folder that has
// entries (ENOTEMPTY) (Linux man-pages): a folder output is swapped with two renames, and the
// instant between them is one of the steps below. Exit status 128 + the signal number (SIGINT 130,
// SIGTERM 143) is common practice of shells.

const root = join(fileURLToPath(import.meta.url), '../../..');
const bin = join(root, 'dist', 'bin.js');
const tmp = freshFolderEachTest();

interface Ended {
  code: number | null;
  signal: NodeJS.Signals | null;
  stderr: string;
}

interface Run {
  child: ChildProcess;
  /** Settles with the step's name once the run says it has stopped there, or null if it ended first. */
  paused: Promise<string | null>;
  ended: Promise<Ended>;
}

/** Starts `lexlock ...args`, stopping at step `pauseAt` (0: only announcing the steps). */
function start(args: string[], pauseAt: number | null = null): Run {
  const env = { ...process.env };
  if (pauseAt === null) delete env.LEXLOCK_TEST_STEPS;
  else env.LEXLOCK_TEST_STEPS = pauseAt === 0 ? 'announce' : `pause:${pauseAt}`;
  const child = spawn(process.execPath, [bin, ...args], { stdio: ['ignore', 'ignore', 'pipe'], env });
  let stderr = '';
  let announce: (name: string | null) => void = () => undefined;
  const paused = new Promise<string | null>((resolve) => (announce = resolve));
  child.stderr?.setEncoding('utf8').on('data', (t: string) => {
    stderr += t;
    const match = /^lexlock paused at step \d+ \((?:async|sync)\): (.*)$/m.exec(stderr);
    if (match !== null) announce(match[1] as string);
  });
  const ended = new Promise<Ended>((resolve) =>
    child.on('close', (code, signal) => {
      announce(null);
      resolve({ code, signal, stderr });
    }),
  );
  return { child, paused, ended };
}

/** A run that must succeed, in this process (quicker than starting one); what killed runs left is stale to it. */
async function lexlock(...args: string[]): Promise<void> {
  const done = await cli(...args);
  expect([done.code, done.stderr]).toEqual([0, '']);
}

/** The steps a run goes through, as it announces them: `[kind, name]` with the folder's path left out. */
async function stepsOf(args: string[], folder: string): Promise<Array<[string, string]>> {
  const done = await start(args, 0).ended;
  expect(done.code).toBe(0);
  return [...done.stderr.matchAll(/^lexlock step \d+ \((async|sync)\): (.*)$/gm)].map((m) => [m[1] as string, (m[2] as string).replaceAll(`${folder}/`, '')]);
}

/** A seeded invented corpus of the ferry operator, `documents` lines. */
async function corpus(path: string, documents: number, seed: number): Promise<void> {
  let state = seed;
  const next = () => (state = (Math.imul(state, 1103515245) + 12345) >>> 0) / 2 ** 32;
  const words = 'ferry harbour ticket late crossing deck cabin ramp tide pier north south island refund storm'.split(' ');
  const lines = Array.from({ length: documents }, () => Array.from({ length: 4 + Math.floor(next() * 9) }, () => (next() < 0.8 ? words[Math.floor(next() * words.length)] : `quay${Math.floor(next() * 900)}`)).join(' '));
  await writeFile(path, `${lines.join('\n')}\n`);
}

/** Every file of a folder with its bytes, or null when the folder is missing. */
async function filesOf(dir: string): Promise<Map<string, string> | null> {
  const names = await readdir(dir).catch(() => null);
  if (names === null) return null;
  const out = new Map<string, string>();
  for (const name of names.sort()) out.set(name, (await readFile(join(dir, name))).toString('base64'));
  return out;
}

describe('encode to a folder, killed (SIGKILL) at every step of putting it in place', () => {
  it('leaves the old set or the new set, never a mix; between the two renames no folder, which the next run puts back', { timeout: 120_000 }, async () => {
    await corpus(tmp.path('old.txt'), 60, 1);
    await corpus(tmp.path('new.txt'), 300, 2);
    await lexlock('build', tmp.path('old.txt'), '-o', tmp.path('old.json'), '--length', '8');
    await lexlock('build', tmp.path('new.txt'), '-o', tmp.path('new.json'), '--length', '16');
    const work = tmp.path('work');
    const out = join(work, 'out');
    const encode = ['encode', tmp.path('new.txt'), '--lexicon', tmp.path('new.json'), '-o', out, '--force'];
    // The old state, made once and copied back before each run.
    await mkdir(tmp.path('template'));
    await lexlock('encode', tmp.path('old.txt'), '--lexicon', tmp.path('old.json'), '-o', tmp.path('template/out'));
    const fresh = async () => {
      await rm(work, { recursive: true, force: true });
      await cp(tmp.path('template'), work, { recursive: true });
    };
    await fresh();
    const oldSet = await filesOf(out);
    const steps = await stepsOf(encode, work);
    const newSet = await filesOf(out);
    expect(newSet).not.toEqual(oldSet);
    expect(steps).toEqual([
      ['async', 'locked out'],
      ['async', 'commit out'],
      ['sync', 'put out in place'],
      ['sync', 'old out set aside'],
      ['sync', 'flush the folder of out'],
      ['async', 'committed; removing what was set aside'],
      ['async', 'done; unlocking'],
    ]);
    const states: string[] = [];
    for (let k = 1; k <= steps.length; k++) {
      await fresh();
      const run = start(encode, k);
      expect((await run.paused)?.replaceAll(`${work}/`, '')).toBe(steps[k - 1]?.[1]);
      run.child.kill('SIGKILL');
      await run.ended;
      const now = await filesOf(out);
      const state = now === null ? 'none' : JSON.stringify([...now]) === JSON.stringify([...(oldSet ?? [])]) ? 'old' : JSON.stringify([...now]) === JSON.stringify([...(newSet ?? [])]) ? 'new' : 'mixed';
      states.push(state);
      if (state === 'none') {
        // The old folder is set aside and the new one staged beside it, both named for the dead run.
        expect((await readdir(work)).map((n) => n.replace(`.${run.child.pid}.`, '.<pid>.').replace(/\.[0-9a-f]{12}\./, '.<random>.')).sort()).toEqual([
          '.out.<pid>.<random>.new',
          '.out.<pid>.<random>.old',
          '.out.lock',
        ]);
        // The next run puts the old folder back before anything else; without --force it then refuses.
        const refused = await cli('encode', tmp.path('new.txt'), '--lexicon', tmp.path('new.json'), '-o', out);
        expect([refused.code, refused.stderr]).toEqual([1, `lexlock encode: ${out} already exists and is not empty; pass --force to write into it\n`]);
        expect(await filesOf(out)).toEqual(oldSet);
      }
      // Whatever the kill left, the next run writes the new set and leaves nothing else.
      await lexlock(...encode);
      expect(await filesOf(out)).toEqual(newSet);
      expect(await readdir(work)).toEqual(['out']);
    }
    expect(states).toEqual(['old', 'old', 'old', 'none', 'new', 'new', 'new']);
  });
});

describe('build --encode, killed (SIGKILL) at every step of putting its two outputs in place', () => {
  it.each([
    ['a folder', 'out'],
    ['a .jsonl file', 'rows.jsonl'],
  ] as const)('to %s: both old or both new, but for the one instant between the two', { timeout: 120_000 }, async (_what, name) => {
    await corpus(tmp.path('old.txt'), 60, 3);
    await corpus(tmp.path('new.txt'), 300, 4);
    const work = tmp.path('work');
    const lexicon = join(work, 'lex.json');
    const encoded = join(work, name);
    const build = (text: string, force: boolean) => ['build', tmp.path(text), '-o', lexicon, '--length', '8', '--encode', encoded, ...(force ? ['--force'] : [])];
    await mkdir(work);
    await lexlock(...build('old.txt', false));
    await cp(work, tmp.path('template'), { recursive: true });
    const fresh = async () => {
      await rm(work, { recursive: true, force: true });
      await cp(tmp.path('template'), work, { recursive: true });
    };
    const fingerprintOf = async () => parseLexicon(await readFile(lexicon, 'utf8')).fingerprint;
    const oldFingerprint = await fingerprintOf();
    const read = async (): Promise<string | null> => (name === 'out' ? JSON.stringify([...((await filesOf(encoded)) ?? [])]) : await readFile(encoded, 'base64').catch(() => null));
    const oldEncoded = await read();
    const steps = await stepsOf(build('new.txt', true), work);
    const newFingerprint = await fingerprintOf();
    const newEncoded = await read();
    const aside = name === 'out' ? [['sync', 'old out set aside']] : [['sync', `old ${name} kept aside`]];
    expect(steps).toEqual([
      ['async', `locked lex.json, ${name}`],
      ['async', `commit ${name}, lex.json`],
      ['sync', `put ${name} in place`],
      ...aside,
      ['sync', `flush the folder of ${name}`],
      ['sync', 'put lex.json in place'],
      ['sync', 'old lex.json kept aside'],
      ['sync', 'flush the folder of lex.json'],
      ['async', 'committed; removing what was set aside'],
      ['async', 'done; unlocking'],
    ]);
    const states: string[] = [];
    for (let k = 1; k <= steps.length; k++) {
      await fresh();
      const run = start(build('new.txt', true), k);
      expect(await run.paused).not.toBeNull();
      run.child.kill('SIGKILL');
      await run.ended;
      const fingerprint = await fingerprintOf();
      const lexiconState = fingerprint === oldFingerprint ? 'old' : fingerprint === newFingerprint ? 'new' : 'neither';
      const now = await read();
      const encodedState = now === oldEncoded ? 'old' : now === newEncoded ? 'new' : now === null || now === '[]' ? 'none' : 'neither';
      states.push(`${lexiconState} ${encodedState}`);
      await lexlock(...build('new.txt', true));
      expect(await read()).toBe(newEncoded);
      expect((await readdir(work)).sort()).toEqual([name, 'lex.json'].sort());
    }
    // The lexicon goes in right after the encoded output, in the same synchronous stretch that no
    // signal handler can enter: only a SIGKILL (or a crash) between those renames can leave the new
    // rows beside the old lexicon (a folder's manifest names the fingerprint of its lexicon: README).
    const swap = name === 'out' ? ['old none'] : ['old old'];
    expect(states).toEqual(['old old', 'old old', 'old old', ...swap, 'old new', 'old new', 'old new', 'new new', 'new new', 'new new']);
  });
});

describe('build --encode, stopped by SIGINT or SIGTERM at each step a signal can reach', () => {
  // Step numbers as the test above lists them for build --encode to a folder.
  it.each([
    ['locked', 1, 'SIGINT', 130, 'no file was being written', 'old'],
    ['commit', 2, 'SIGTERM', 143, 'nothing was written to <lex>, <out>', 'old'],
    ['committed', 9, 'SIGINT', 130, '<out>, <lex> were written in full before it', 'new'],
    ['done', 10, 'SIGTERM', 143, '<out>, <lex> were written in full before it', 'new'],
  ] as const)('at %s (step %d): %s exits %d saying "%s"; both outputs %s, nothing else left', { timeout: 60_000 }, async (at, k, signal, code, said, state) => {
    await corpus(tmp.path('old.txt'), 60, 5);
    await corpus(tmp.path('new.txt'), 300, 6);
    const work = tmp.path('work');
    await mkdir(work);
    const lexicon = join(work, 'lex.json');
    const out = join(work, 'out');
    await lexlock('build', tmp.path('old.txt'), '-o', lexicon, '--length', '8', '--encode', out);
    const oldLexicon = await readFile(lexicon);
    const oldOut = await filesOf(out);
    const args = ['build', tmp.path('new.txt'), '-o', lexicon, '--length', '8', '--encode', out, '--force'];
    const run = start(args, k);
    expect((await run.paused)?.startsWith(at)).toBe(true);
    run.child.kill(signal);
    const done = await run.ended;
    expect([done.code, done.signal]).toEqual([code, null]);
    const line = `lexlock: interrupted (${signal}); ${said.replace('<lex>', lexicon).replace('<out>', out)}\n`;
    expect(done.stderr.replace(/^lexlock (paused at )?step .*\n/gm, '')).toBe(line);
    expect(await readdir(work)).toEqual(['lex.json', 'out']);
    if (state === 'old') expect([(await readFile(lexicon)).equals(oldLexicon), await filesOf(out)]).toEqual([true, oldOut]);
    else {
      // The new rows are those of the new lexicon: the same as encode gives with it.
      await lexlock('encode', tmp.path('new.txt'), '--lexicon', lexicon, '-o', tmp.path('expected'));
      const [now, expected] = [await filesOf(out), await filesOf(tmp.path('expected'))];
      for (const files of [now, expected]) files?.delete('manifest.json');
      expect([(await readFile(lexicon)).equals(oldLexicon), now]).toEqual([false, expected]);
    }
  });
});

describe('two runs writing the same output', () => {
  it('the second fails at once, naming the first; after the first ends it goes through', { timeout: 60_000 }, async () => {
    await corpus(tmp.path('c.txt'), 300, 7);
    const lexicon = tmp.path('lex.json');
    const out = tmp.path('out');
    const args = ['build', tmp.path('c.txt'), '-o', lexicon, '--length', '8', '--encode', out];
    await lexlock(...args);
    const first = start([...args, '--force'], 2); // paused at "commit": everything written, nothing in place
    expect((await first.paused)?.startsWith('commit')).toBe(true);
    const pid = first.child.pid as number;
    const busy = (path: string) => `${path} is being written by another lexlock run (process ${pid}); wait until it ends, or name another output (if no lexlock is running, remove ${join(tmp.dir, `.${path.slice(tmp.dir.length + 1)}.lock`)})`;
    const before = await readdir(tmp.dir);
    for (const [second, message] of [
      [['build', tmp.path('c.txt'), '-o', lexicon, '--force'], `lexlock build: ${busy(lexicon)}\n`],
      [['encode', tmp.path('c.txt'), '--lexicon', lexicon, '-o', out, '--force'], `lexlock encode: ${busy(out)}\n`],
      [['build', tmp.path('c.txt'), '-o', tmp.path('other.json'), '--length', '8', '--encode', out, '--force'], `lexlock build: ${busy(out)}\n`],
    ] as const) {
      const done = await start([...second]).ended;
      expect([done.code, done.stderr]).toEqual([1, message]);
    }
    expect(await readdir(tmp.dir)).toEqual(before); // other.json's lock was given back, nothing made
    first.child.kill('SIGTERM');
    expect((await first.ended).code).toBe(143);
    await lexlock('build', tmp.path('c.txt'), '-o', lexicon, '--length', '8', '--encode', out, '--force');
    expect((await readdir(tmp.dir)).sort()).toEqual(['c.txt', 'lex.json', 'out']);
  });

  it('a lock left by a killed run is taken over, and its leftovers removed', { timeout: 60_000 }, async () => {
    await corpus(tmp.path('c.txt'), 300, 8);
    const args = ['build', tmp.path('c.txt'), '-o', tmp.path('lex.json'), '--length', '8', '--encode', tmp.path('out')];
    const killed = start([...args, '--force'], 2); // at "commit"
    expect((await killed.paused)?.startsWith('commit')).toBe(true);
    killed.child.kill('SIGKILL');
    await killed.ended;
    expect((await readdir(tmp.dir)).filter((n) => n.startsWith('.')).length).toBeGreaterThanOrEqual(4); // two locks, the lexicon's temporary file, the hidden folder
    await lexlock(...args, '--force');
    expect((await readdir(tmp.dir)).sort()).toEqual(['c.txt', 'lex.json', 'out']);
  });

  it('started together, each finishes or is refused at once, and the folder holds one whole set', { timeout: 60_000 }, async () => {
    await corpus(tmp.path('c.txt'), 900, 9);
    await lexlock('build', tmp.path('c.txt'), '-o', tmp.path('a.json'), '--length', '8');
    await lexlock('build', tmp.path('c.txt'), '-o', tmp.path('b.json'), '--length', '16');
    const sets = new Map<string, string>();
    for (const which of ['a', 'b']) {
      await lexlock('encode', tmp.path('c.txt'), '--lexicon', tmp.path(`${which}.json`), '-o', tmp.path(`ref-${which}`));
      sets.set(JSON.stringify([...((await filesOf(tmp.path(`ref-${which}`))) ?? [])].map(([n, b]) => (n === 'manifest.json' ? [n, ''] : [n, b]))), which);
    }
    for (let round = 0; round < 2; round++) {
      const runs = ['a', 'b'].map((which) => ({ which, run: start(['encode', tmp.path('c.txt'), '--lexicon', tmp.path(`${which}.json`), '-o', tmp.path('out'), '--force']) }));
      const results = await Promise.all(runs.map(async ({ which, run }) => ({ which, done: await run.ended })));
      for (const { done } of results) {
        if (done.code !== 0) expect([done.code, done.stderr]).toEqual([1, expect.stringMatching(/^lexlock encode: .*\/out is being written by another lexlock run \(process \d+\); wait until it ends/)]);
      }
      const finished = results.filter(({ done }) => done.code === 0).map(({ which }) => which);
      expect(finished.length).toBeGreaterThan(0);
      const now = JSON.stringify([...((await filesOf(tmp.path('out'))) ?? [])].map(([n, b]) => (n === 'manifest.json' ? [n, ''] : [n, b])));
      const holds = sets.get(now);
      expect(holds).toBeDefined();
      expect(finished).toContain(holds);
      expect((await readdir(tmp.dir)).filter((n) => n.startsWith('.'))).toEqual([]);
    }
  });
});
