import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, rmdirSync } from 'node:fs';
import { chmod, mkdir, readdir, readFile, statfs, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { cli, freshFolderEachTest, tempFolder } from '../helpers/cli.js';

// Ordinary file-system failures on real folders: an output under a file (ENOTDIR/EEXIST), a folder
// the user may not write to (EACCES), a read-only file system (EROFS) and a full one (ENOSPC), with
// their meanings as in Linux man-pages open(2), mkdir(2), write(2). Runs are in-process, except
// those made as another user, which run the built executable (npm test builds dist/ first). Every command must exit 1 with one line naming the output and the
// reason in plain words, never "unexpected error", and leave every output as it was.
// The real mounts need root (mount(8) of tmpfs); where mounting is not permitted those tests are
// skipped, and the title says why.

const root = join(fileURLToPath(import.meta.url), '../../..');
/** The built CLI module (`run`): code-split by tsup under a hashed name. */
const cliModule = (() => {
  const name = readdirSync(join(root, 'dist')).find((n) => /^cli-[A-Z0-9]+\.js$/.test(n));
  if (name === undefined) throw new Error('dist/ has no cli-*.js: run npm run build first');
  return pathToFileURL(join(root, 'dist', name)).href;
})();
const tmp = freshFolderEachTest();
const isRoot = process.getuid?.() === 0;

interface Ran {
  code: number | null;
  stdout: string;
  stderr: string;
}

/**
 * Runs lexlock on `args` in this process; `nobody` runs the built CLI as user 65534 instead (for
 * permissions, which root bypasses): a child process loads it as root and then drops to nobody, since
 * the checkout may sit in a folder only root may enter (mktemp -d makes mode 700).
 */
async function lexlock(args: string[], nobody = false): Promise<Ran> {
  if (!nobody) return cli(...args);
  const script = [
    `const { run } = await import(${JSON.stringify(cliModule)});`,
    'process.setgroups([]); process.setgid(65534); process.setuid(65534);',
    `process.exitCode = await run(${JSON.stringify(args)}, { stdout: process.stdout, stderr: process.stderr, env: process.env });`,
  ].join('\n');
  const r = spawnSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8', cwd: tmpdir() });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Every entry under `dir` with its bytes, as a sorted list of lines. */
async function listing(dir: string): Promise<string[]> {
  const out: string[] = [];
  const walk = async (at: string, prefix: string): Promise<void> => {
    for (const entry of await readdir(at, { withFileTypes: true })) {
      if (entry.isDirectory()) {
        out.push(`${prefix}${entry.name}/`);
        await walk(join(at, entry.name), `${prefix}${entry.name}/`);
      } else out.push(`${prefix}${entry.name} ${(await readFile(join(at, entry.name))).toString('base64')}`);
    }
  };
  await walk(dir, '');
  return out.sort();
}

/** The inputs every test reads: a labelled corpus of the invented ferry operator, with many rare tokens so every output is tens of KiB, a lexicon and a tally of it. */
let shared: Awaited<ReturnType<typeof tempFolder>>;
const input = (name: string) => shared.path(name);
beforeAll(async () => {
  shared = await tempFolder();
  await chmod(shared.dir, 0o755); // user 65534 reads them too
  const topics = ['delays', 'praise', 'refunds'];
  const words = 'ferry harbour ticket late crossing deck cabin ramp tide pier north south island refund storm'.split(' ');
  const lines = ['topic,text'];
  for (let i = 0; i < 3000; i++) lines.push(`${topics[i % 3]},${words[i % words.length]} ${words[(i * 7) % words.length]} route${i} berth${i % 997}`);
  await writeFile(input('m.csv'), `${lines.join('\n')}\n`);
  expect((await cli('build', input('m.csv'), '-o', input('lex.json'), '--label', 'topic', '--length', '4')).code).toBe(0);
  expect((await cli('tally', input('m.csv'), '-o', input('part.tally'))).code).toBe(0);
});
afterAll(async () => {
  await shared.remove();
});

/** Each writing command with its outputs in `into`; `names` are what it writes there. */
const COMMANDS: Array<[string, string, (into: string) => string[], string[]]> = [
  ['encode', ' to a folder', (into) => ['encode', input('m.csv'), '--lexicon', input('lex.json'), '-o', join(into, 'out'), '--force'], ['out']],
  ['encode', ' to a .jsonl file', (into) => ['encode', input('m.csv'), '--lexicon', input('lex.json'), '-o', join(into, 'rows.jsonl'), '--force'], ['rows.jsonl']],
  ['build', '', (into) => ['build', input('m.csv'), '-o', join(into, 'lex.json'), '--force'], ['lex.json']],
  ['build', ' --encode', (into) => ['build', input('m.csv'), '-o', join(into, 'lex.json'), '--length', '4', '--force', '--encode', join(into, 'out')], ['lex.json', 'out']],
  ['tally', '', (into) => ['tally', input('m.csv'), '-o', join(into, 'a.tally'), '--force'], ['a.tally']],
  ['merge', '', (into) => ['merge', input('part.tally'), '-o', join(into, 'a.tally'), '--force'], ['a.tally']],
  ['audit', ' --report', (into) => ['audit', input('m.csv'), '--cap', '5', '--report', join(into, 'r.html'), '--force'], ['r.html']],
];

/** Old outputs in `into` for every command to write over (with --force). */
async function oldOutputs(into: string): Promise<void> {
  await mkdir(join(into, 'out'), { recursive: true });
  await writeFile(join(into, 'out', 'ids.npy'), 'old ids');
  await writeFile(join(into, 'out', 'manifest.json'), 'old manifest');
  for (const name of ['rows.jsonl', 'lex.json', 'a.tally', 'r.html']) await writeFile(join(into, name), `old ${name}`);
}

/** The line a failed command prints: the first output named, the reason, and (build --encode) the other output. */
function failure(command: string, into: string, names: string[], reason: RegExp): RegExp {
  const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  // A folder output's message may name the file inside it that failed.
  const first = `(${names.map((n) => escape(join(into, n))).join('|')})(/[a-z]+\\.[a-z]+)?`;
  const other = names.length === 1 ? '' : `; (${names.map((n) => escape(join(into, n))).join('|')}) was not written either`;
  return new RegExp(`^lexlock ${command}: ${first}: not written: ${reason.source}${other}\n$`);
}

describe('an output whose folder is a file', () => {
  it.each(COMMANDS)('%s%s: exit 1, the file named, nothing made', async (command, _what, args, names) => {
    await writeFile(tmp.path('file.txt'), 'a file');
    const before = await listing(tmp.dir);
    const r = await lexlock(args(tmp.path('file.txt/sub')));
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(failure(command, tmp.path('file.txt/sub'), names, new RegExp(`${tmp.path('file.txt').replace(/[.*+?^${}()|[\]\\]/g, '\\$&')} is a file, not a folder; fix the path, or move that file away`)));
    expect(await listing(tmp.dir)).toEqual(before);
  });

  it('encode -o naming an existing file as the folder: refused, the file kept', async () => {
    await writeFile(tmp.path('file.txt'), 'a file');
    const r = await lexlock(['encode', input('m.csv'), '--lexicon', input('lex.json'), '-o', tmp.path('file.txt'), '--force']);
    expect([r.code, r.stderr]).toEqual([1, `lexlock encode: ${tmp.path('file.txt')} is a file, and .npy output is a folder; name a folder (or a .jsonl file)\n`]);
    expect(await readFile(tmp.path('file.txt'), 'utf8')).toBe('a file');
  });
});

describe('a folder the user may not write to', () => {
  it.each(COMMANDS)('%s%s: exit 1, permission denied, the old outputs kept', async (command, _what, args, names) => {
    const into = tmp.path('locked');
    await oldOutputs(into);
    // Root writes anywhere: then the run is made by user 65534 ("nobody").
    if (isRoot) await chmod(tmp.dir, 0o755);
    await chmod(into, 0o555);
    await chmod(join(into, 'out'), 0o555);
    try {
      const before = await listing(into);
      const r = await lexlock(args(into), isRoot);
      expect(r.code).toBe(1);
      expect(r.stderr).toMatch(failure(command, into, names, /permission denied \(EACCES while creating its lock file\); name a folder you may write to, or change its permissions/));
      expect(await listing(into)).toEqual(before);
    } finally {
      await chmod(join(into, 'out'), 0o755);
      await chmod(into, 0o755);
    }
  });
});

/** Why a tmpfs cannot be mounted here, or null when it can (tried once, on a scratch folder). */
const cannotMount: string | null = (() => {
  if (!isRoot) return 'mounting a tmpfs needs root';
  const dir = mkdtempSync(join(tmpdir(), 'lexlock-mount-probe-'));
  try {
    const r = spawnSync('mount', ['-t', 'tmpfs', '-o', 'size=64k', 'tmpfs', dir], { encoding: 'utf8' });
    if (r.error !== undefined) return `mount(8) cannot be run: ${r.error.message}`;
    if (r.status !== 0) return `mount(8) refused: ${r.stderr.trim()}`;
    spawnSync('umount', [dir]);
    return null;
  } finally {
    rmdirSync(dir);
  }
})();

describe.skipIf(cannotMount !== null)(`on a real tmpfs${cannotMount === null ? '' : ` (skipped: ${cannotMount})`}`, () => {
  const mounted: string[] = [];
  afterEach(() => {
    for (const dir of mounted.splice(0)) spawnSync('umount', [dir]);
  });

  /** A fresh tmpfs of `size` at tmp/disk holding old outputs. */
  async function disk(size: string): Promise<string> {
    const into = tmp.path('disk');
    await mkdir(into);
    const r = spawnSync('mount', ['-t', 'tmpfs', '-o', `size=${size}`, 'tmpfs', into], { encoding: 'utf8' });
    expect([r.status, r.stderr]).toEqual([0, '']);
    mounted.push(into);
    await oldOutputs(into);
    return into;
  }

  it.each(COMMANDS)('read-only: %s%s exits 1, read-only named, the old outputs kept', async (command, _what, args, names) => {
    const into = await disk('4m');
    expect(spawnSync('mount', ['-o', 'remount,ro', into]).status).toBe(0);
    const before = await listing(into);
    const r = await lexlock(args(into));
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(failure(command, into, names, /the file system is read-only \(EROFS while creating its lock file\); name an output on a writable file system/));
    expect(await listing(into)).toEqual(before);
  });

  it.each(COMMANDS)('full: %s%s exits 1, a full disk named, the old outputs kept, nothing left behind', async (command, _what, args, names) => {
    const into = await disk('1m');
    // Leave 12 KiB free: room for the lock and a little of the output, never all of it.
    const { bavail, bsize } = await statfs(into);
    await writeFile(join(into, 'filler'), Buffer.alloc(Number(bavail) * Number(bsize) - 12 * 1024));
    const before = await listing(into);
    const r = await lexlock(args(into));
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(failure(command, into, names, /the disk is full \(ENOSPC while [a-z ,]+\); free some space there, or name an output on another disk/));
    expect(await listing(into)).toEqual(before);
  });
});
