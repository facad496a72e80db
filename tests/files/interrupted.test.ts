import { spawn, type ChildProcess } from 'node:child_process';
import { watch } from 'node:fs';
import { mkdir, readdir, readFile, readlink, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse as parseNpy } from 'npyjs';
import { describe, expect, it } from 'vitest';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import { freshFolderEachTest } from '../helpers/cli.js';

// Interrupted writes, end to end through the built executable (npm test builds dist/ first).
// "Atomic" is POSIX rename(2): "If newpath already exists, it will be atomically replaced, so that
// there is no point at which another process attempting to access newpath will find it missing"
// (Linux man-pages). SIGKILL cannot be caught or ignored (signal(7)), so whatever a killed run left
// is what a crash leaves. Exit status 128 + the signal number for a program stopped by a signal
// (SIGINT 2 -> 130, SIGTERM 15 -> 143) is common practice of shells and command-line tools.
// The NPY layout checked below is NumPy's NPY format 1.0 (numpy.lib.format; NEP 1), and npyjs, a
// general-purpose reader, must read every file too.

const root = join(fileURLToPath(import.meta.url), '../../..');
const bin = join(root, 'dist', 'bin.js');
const tmp = freshFolderEachTest();

/** Documents of the big corpus: about 1-2 s of build on one core of this 2-core machine. */
const DOCUMENTS = 80_000;

/** A seeded invented corpus (Glimmerholt Ferries messages): common words and many rarer made-up ones. */
async function writeCorpus(path: string, documents: number, seed: number): Promise<void> {
  let state = seed >>> 0;
  const next = () => (state = (Math.imul(state, 1103515245) + 12345) >>> 0) / 2 ** 32;
  const words = 'ferry harbour ticket late crossing deck cabin ramp tide pier glimmerholt north south island car foot passenger refund delay storm timetable'.split(' ');
  const lines: string[] = [];
  for (let i = 0; i < documents; i++) {
    const length = 8 + Math.floor(next() * 12);
    const line: string[] = [];
    for (let j = 0; j < length; j++) line.push(next() < 0.7 ? (words[Math.floor(next() * words.length)] as string) : `route${Math.floor(next() * 60000).toString(36)}`);
    lines.push(line.join(' '));
  }
  await writeFile(path, `${lines.join('\n')}\n`);
}

interface Ended {
  code: number | null;
  signal: NodeJS.Signals | null;
  stderr: string;
}

/** Starts `lexlock ...args`; `ended` settles when it has exited and its streams are closed. */
function start(args: string[], options: { detached?: boolean } = {}): { child: ChildProcess; ended: Promise<Ended> } {
  const child = spawn(process.execPath, [bin, ...args], { stdio: ['ignore', 'pipe', 'pipe'], detached: options.detached ?? false });
  let stderr = '';
  child.stderr?.setEncoding('utf8').on('data', (t: string) => (stderr += t));
  child.stdout?.resume();
  const ended = new Promise<Ended>((resolve) => child.on('close', (code, signal) => resolve({ code, signal, stderr })));
  return { child, ended };
}

async function lexlock(...args: string[]): Promise<Ended> {
  const done = await start(args).ended;
  expect([done.code, done.stderr]).toEqual([0, '']);
  return done;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Resolves true as soon as a file whose name `matches` is in `dir` (told by the file system's change
 * notification, so the reaction is quick), or false once the run has ended without one appearing.
 */
function appears(dir: string, matches: (name: string) => boolean, ended: Promise<unknown>): Promise<boolean> {
  return new Promise((resolve) => {
    let settled = false;
    const settle = (seen: boolean) => {
      if (settled) return;
      settled = true;
      watcher.close();
      resolve(seen);
    };
    const watcher = watch(dir, (_event, name) => {
      if (name !== null && matches(name)) settle(true);
    });
    void readdir(dir).then((names) => names.some(matches) && settle(true));
    void ended.then(() => settle(false));
  });
}

/** Names lexlock gives its temporary files (src/files/tempNames.ts): hidden, ending in .tmp. */
const isTemp = (name: string) => name.startsWith('.') && name.endsWith('.tmp');

/** What an NPY 1.0 file's header says, checked against the file's size: data bytes = rows x columns x 4. */
function readNpy(bytes: Buffer): { shape: number[]; values: number } {
  expect([...bytes.subarray(0, 8)]).toEqual([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0]); // \x93NUMPY, version 1.0
  const headerEnd = 10 + bytes.readUInt16LE(8);
  expect(headerEnd % 64).toBe(0); // "padded ... so that the total ... is evenly divisible by 64" (NPY 1.0)
  const header = bytes.subarray(10, headerEnd).toString('latin1');
  const match = /^\{'descr': '<i4', 'fortran_order': False, 'shape': \((\d+),(?: (\d+))?\), \} *\n$/.exec(header);
  expect(match, header).not.toBeNull();
  const shape = [Number(match?.[1]), ...(match?.[2] === undefined ? [] : [Number(match[2])])];
  const values = shape.reduce((a, b) => a * b, 1);
  expect(bytes.byteLength - headerEnd).toBe(values * 4);
  const parsed = parseNpy(new Uint8Array(bytes).buffer);
  expect([parsed.shape, parsed.dtype, (parsed.data as Int32Array).length]).toEqual([shape, 'i4', values]);
  return { shape, values };
}

describe('a build killed at any moment (SIGKILL)', () => {
  it('leaves the old lexicon or the whole new one, and the next run leaves no temporary file', { timeout: 120_000 }, async () => {
    await writeCorpus(tmp.path('big.txt'), DOCUMENTS, 1);
    await writeCorpus(tmp.path('small.txt'), 300, 2);
    await mkdir(tmp.path('models'));
    await mkdir(tmp.path('reference'));
    const dest = tmp.path('models/lex.json');
    await lexlock('build', tmp.path('small.txt'), '-o', dest, '--quiet');
    const old = await readFile(dest);
    const began = Date.now();
    await lexlock('build', tmp.path('big.txt'), '-o', tmp.path('reference/lex.json'), '--quiet');
    const runMs = Date.now() - began; // only to spread the kills over a run, never asserted
    const expected = parseLexicon(await readFile(tmp.path('reference/lex.json'), 'utf8')).fingerprint;

    /** The destination parses; it is the old file byte for byte or a complete new lexicon of the big corpus. */
    const check = async (): Promise<'old' | 'new'> => {
      const bytes = await readFile(dest);
      const lexicon = parseLexicon(bytes.toString('utf8'));
      if (bytes.equals(old)) return 'old';
      expect([lexicon.fingerprint, lexicon.fit?.documents]).toEqual([expected, DOCUMENTS]);
      return 'new';
    };
    const build = (...extra: string[]) => start(['build', tmp.path('big.txt'), '-o', dest, '--force', '--quiet', ...extra]);

    const outcomes: string[] = [];
    for (let k = 0; k <= 10; k++) {
      const { child, ended } = build();
      await sleep((runMs * k) / 10);
      child.kill('SIGKILL');
      await ended;
      outcomes.push(await check());
    }
    expect(outcomes[0]).toBe('old'); // killed as it started: nothing can have been written yet

    // Killed as soon as the temporary lexicon appears, i.e. while it is written, flushed or renamed;
    // each time from the old lexicon again (a run above may have finished).
    for (let k = 0; k < 3; k++) {
      await writeFile(dest, old);
      const { child, ended } = build();
      const seen = await appears(tmp.path('models'), (n) => n.startsWith(`.lex.json.${child.pid}.`) && isTemp(n), ended);
      child.kill('SIGKILL');
      await ended;
      const outcome = await check();
      const left = (await readdir(tmp.path('models'))).filter((n) => n.startsWith(`.lex.json.${child.pid}.`));
      // A temporary file still there means the kill came before the rename: the old file must be intact.
      if (seen && left.length > 0) expect(outcome).toBe('old');
    }

    // build --encode killed while it counts: its spill of token numbers stays behind, the lexicon is old.
    {
      const { child, ended } = build('--encode', tmp.path('models/rows.jsonl'));
      expect(await appears(tmp.path('models'), (n) => n === `.lex.json.${child.pid}.numbers.tmp`, ended)).toBe(true);
      child.kill('SIGKILL');
      await ended;
      expect(await check()).toBe('old');
      expect(await readdir(tmp.path('models'))).toContain(`.lex.json.${child.pid}.numbers.tmp`);
    }

    // The next runs remove what the killed ones left for their outputs: temporary files, spills and
    // the locks of dead processes (the build --encode above held one for rows.jsonl too).
    await lexlock('build', tmp.path('big.txt'), '-o', dest, '--force', '--quiet', '--encode', tmp.path('models/rows.jsonl'));
    expect(await check()).toBe('new');
    expect(await readdir(tmp.path('models'))).toEqual(['lex.json', 'rows.jsonl']);
  });
});

describe('an encode to .npy files killed at any moment (SIGKILL)', () => {
  it('leaves the old set of files or the whole new set, readable, and the next run leaves nothing behind', { timeout: 120_000 }, async () => {
    await writeCorpus(tmp.path('big.txt'), DOCUMENTS, 3);
    await writeCorpus(tmp.path('small.txt'), 300, 4);
    await lexlock('build', tmp.path('small.txt'), '-o', tmp.path('old.json'), '--length', '16', '--quiet');
    await lexlock('build', tmp.path('big.txt'), '-o', tmp.path('new.json'), '--length', '32', '--quiet');
    await mkdir(tmp.path('encoded'));
    const dest = tmp.path('encoded/out');
    await lexlock('encode', tmp.path('small.txt'), '--lexicon', tmp.path('old.json'), '-o', dest, '--quiet');
    const encode = (to: string) => start(['encode', tmp.path('big.txt'), '--lexicon', tmp.path('new.json'), '-o', to, '--force', '--quiet']);
    const began = Date.now();
    // At the same depth as dest: the manifest names the lexicon relative to its own folder.
    await mkdir(tmp.path('ref'));
    const reference = await encode(tmp.path('ref/out')).ended;
    const runMs = Date.now() - began; // only to spread the kills over a run, never asserted
    expect([reference.code, reference.stderr]).toEqual([0, '']);
    const names = ['ids.npy', 'keys.jsonl', 'lengths.npy', 'manifest.json'];
    expect((await readdir(dest)).sort()).toEqual(names);
    const before = new Map<string, Buffer>();
    const after = new Map<string, Buffer>();
    for (const name of names) {
      before.set(name, await readFile(join(dest, name)));
      after.set(name, await readFile(tmp.path(`ref/out/${name}`)));
    }
    expect(readNpy(after.get('ids.npy') as Buffer).shape).toEqual([DOCUMENTS, 32]);

    /**
     * The folder holds exactly the old set of files or exactly the new set, each file byte for byte,
     * the .npy files readable; or, killed in the instant between setting the old folder aside and
     * renaming the new one in, no folder, with both beside it (the next run puts the old one back).
     */
    const check = async (): Promise<string> => {
      const present = await readdir(dest).catch(() => null);
      if (present === null) {
        const beside = (await readdir(tmp.path('encoded'))).filter((n) => n.startsWith('.out.'));
        expect(beside.map((n) => n.replace(/\.\d+\.[0-9a-f]{12}\./, '.<pid>.<random>.')).sort()).toEqual(['.out.<pid>.<random>.new', '.out.<pid>.<random>.old']);
        return 'swapping';
      }
      expect(present.sort()).toEqual(names);
      const outcome = new Set<string>();
      for (const name of names) {
        const bytes = await readFile(join(dest, name));
        outcome.add(bytes.equals(before.get(name) as Buffer) ? 'old' : bytes.equals(after.get(name) as Buffer) ? 'new' : `${name} is neither`);
        if (name.endsWith('.npy')) readNpy(bytes);
      }
      expect(outcome.size, [...outcome].join(', ')).toBe(1);
      return [...outcome][0] as string;
    };

    const outcomes: string[] = [];
    for (let k = 0; k <= 10; k++) {
      const { child, ended } = encode(dest);
      await sleep((runMs * k) / 10);
      child.kill('SIGKILL');
      await ended;
      outcomes.push(await check());
    }
    expect(outcomes[0]).toBe('old'); // killed as it started
    // Killed as soon as its hidden folder appears: the old set is untouched (each time from the old
    // set again: a run above may have finished).
    for (let k = 0; k < 2; k++) {
      await rm(dest, { recursive: true, force: true });
      await mkdir(dest);
      for (const [file, bytes] of before) await writeFile(join(dest, file), bytes);
      const { child, ended } = encode(dest);
      const seen = await appears(tmp.path('encoded'), (n) => n.startsWith(`.out.${child.pid}.`) && n.endsWith('.new'), ended);
      child.kill('SIGKILL');
      await ended;
      expect([seen, await check()]).toEqual([true, 'old']);
    }

    // The killed runs left their hidden folders and locks (a SIGKILL lets nothing run); the next run removes them.
    expect((await readdir(tmp.path('encoded'))).filter((n) => n !== 'out')).not.toEqual([]);
    const last = await encode(dest).ended;
    expect([last.code, last.stderr]).toEqual([0, '']);
    expect(await check()).toBe('new');
    expect(await readdir(tmp.path('encoded'))).toEqual(['out']);
  });
});

describe('Ctrl-C (SIGINT) and SIGTERM', () => {
  it('encode: exit 130, one line naming the output, its hidden folder and lock removed, old files untouched', { timeout: 60_000 }, async () => {
    await writeCorpus(tmp.path('big.txt'), DOCUMENTS, 5);
    await lexlock('build', tmp.path('big.txt'), '-o', tmp.path('lex.json'), '--length', '24', '--quiet');
    const dest = tmp.path('out');
    await mkdir(dest);
    await writeFile(join(dest, 'ids.npy'), 'old ids');
    await writeFile(join(dest, 'lengths.npy'), 'old lengths');
    const { child, ended } = start(['encode', tmp.path('big.txt'), '--lexicon', tmp.path('lex.json'), '-o', dest, '--force', '--quiet']);
    // The rows are written into a hidden folder beside the output.
    expect(await appears(tmp.dir, (n) => n.startsWith(`.out.${child.pid}.`) && n.endsWith('.new'), ended)).toBe(true);
    child.kill('SIGINT');
    const done = await ended;
    expect([done.code, done.signal]).toEqual([130, null]);
    expect(done.stderr).toBe(`lexlock: interrupted (SIGINT); nothing was written to ${dest}\n`);
    expect((await readdir(tmp.dir)).sort()).toEqual(['big.txt', 'lex.json', 'out']);
    expect((await readdir(dest)).sort()).toEqual(['ids.npy', 'lengths.npy']);
    expect(await readFile(join(dest, 'ids.npy'), 'utf8')).toBe('old ids');
    expect(await readFile(join(dest, 'lengths.npy'), 'utf8')).toBe('old lengths');
  });

  it('build --encode: SIGTERM while counting exits 143, removes the spill, keeps the old lexicon', { timeout: 60_000 }, async () => {
    await writeCorpus(tmp.path('big.txt'), DOCUMENTS, 6);
    await mkdir(tmp.path('models'));
    await writeFile(tmp.path('models/lex.json'), 'old lexicon');
    const { child, ended } = start(['build', tmp.path('big.txt'), '-o', tmp.path('models/lex.json'), '--force', '--quiet', '--encode', tmp.path('models/rows.jsonl')]);
    expect(await appears(tmp.path('models'), (n) => n === `.lex.json.${child.pid}.numbers.tmp`, ended)).toBe(true);
    child.kill('SIGTERM');
    const done = await ended;
    expect([done.code, done.signal]).toEqual([143, null]);
    expect(done.stderr).toBe(`lexlock: interrupted (SIGTERM); nothing was written to ${tmp.path('models/lex.json')}\n`);
    expect(await readdir(tmp.path('models'))).toEqual(['lex.json']);
    expect(await readFile(tmp.path('models/lex.json'), 'utf8')).toBe('old lexicon');
  });

  // Under --memory-limit the executable runs the command on a worker thread with its heap capped
  // (src/runCapped.ts). A terminal's Ctrl-C goes to the whole process group (termios(3), ISIG); a
  // signal sent to the process alone (kill <pid>) must reach the command all the same: either way it
  // cleans up once and the process exits 130.
  it.each([
    ['to the process group, as a terminal sends it', true],
    ['to the process only', false],
  ])('build --memory-limit: SIGINT %s exits 130', { timeout: 60_000 }, async (_what, group) => {
    await writeCorpus(tmp.path('big.txt'), DOCUMENTS, 7);
    await writeFile(tmp.path('lex.json'), 'old lexicon');
    const { child, ended } = start(['build', tmp.path('big.txt'), '-o', tmp.path('lex.json'), '--force', '--quiet', '--memory-limit', '512'], { detached: true });
    const pid = child.pid as number;
    let exited = false;
    void ended.then(() => (exited = true));
    // The counting thread has its signal message listener before it opens the corpus: wait for that (Linux /proc, proc(5)).
    let reading = false;
    while (!reading && !exited) {
      for (const fd of await readdir(`/proc/${pid}/fd`).catch(() => [])) {
        if ((await readlink(`/proc/${pid}/fd/${fd}`).catch(() => '')) === tmp.path('big.txt')) reading = true;
      }
      if (!reading) await sleep(5);
    }
    expect(reading).toBe(true);
    process.kill(group ? -pid : pid, 'SIGINT');
    const done = await ended;
    expect([done.code, done.signal]).toEqual([130, null]);
    expect(done.stderr).toBe('lexlock: interrupted (SIGINT); no file was being written\n');
    expect(await readdir(tmp.dir)).toEqual(['big.txt', 'lex.json']);
    expect(await readFile(tmp.path('lex.json'), 'utf8')).toBe('old lexicon');
  });
});
