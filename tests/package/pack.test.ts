import { execFile, spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAIN_HELP } from '../../src/cli.js';

// The package as users get it: `npm pack` of the built project, installed into a fresh project (from
// npm's cache where it can), then used from `import`, from `require` and through `npx lexlock`.
// `npm test` builds dist/ first.
const run = promisify(execFile);
const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const demo = join(root, 'corpora-demo', 'ferry-messages.csv');
const NPM = process.platform === 'win32' ? 'npm.cmd' : 'npm';
const NPX = process.platform === 'win32' ? 'npx.cmd' : 'npx';

let dir = '';
let consumer = '';
let tarball = '';
let installed = '';
let files: string[] = [];

/** Runs `command` with `input` on its standard input; its exit code and output. */
function piped(command: string, args: string[], input: string, cwd: string): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((done, fail) => {
    const child = spawn(command, args, { cwd });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (c: Buffer) => (stdout += c.toString()));
    child.stderr.on('data', (c: Buffer) => (stderr += c.toString()));
    child.on('error', fail);
    child.on('close', (code) => done({ code, stdout, stderr }));
    child.stdin.end(input);
  });
}

beforeAll(async () => {
  if (!existsSync(join(root, 'dist', 'index.js'))) throw new Error('dist/ is missing: npm test builds it first');
  dir = await mkdtemp(join(tmpdir(), 'lexlock-pack-'));
  const packed = await run(NPM, ['pack', '--ignore-scripts', '--json', '--pack-destination', dir], { cwd: root, maxBuffer: 16 << 20 });
  const [info] = JSON.parse(packed.stdout) as Array<{ filename: string; files: Array<{ path: string }> }>;
  if (info === undefined) throw new Error(`npm pack said nothing usable: ${packed.stdout}`);
  files = info.files.map((f) => f.path);
  consumer = join(dir, 'consumer');
  await run('mkdir', ['-p', consumer]);
  await writeFile(join(consumer, 'package.json'), JSON.stringify({ name: 'consumer', version: '1.0.0', private: true }));
  tarball = join(dir, info.filename);
  const install = await run(NPM, ['install', '--no-audit', '--no-fund', '--prefer-offline', tarball], { cwd: consumer, maxBuffer: 16 << 20 });
  installed = `${install.stdout}${install.stderr}`;
}, 240_000);

afterAll(async () => {
  if (dir !== '') await rm(dir, { recursive: true, force: true });
});

describe('the packed package', () => {
  it('holds only what users need: the built files, the licence, the README and package.json', () => {
    expect(files.filter((f) => !f.startsWith('dist/'))).toEqual(['LICENSE', 'README.md', 'package.json']);
    for (const f of ['dist/index.js', 'dist/index.cjs', 'dist/index.d.ts', 'dist/index.d.cts', 'dist/node.js', 'dist/node.cjs', 'dist/browser.js', 'dist/browser.d.ts', 'dist/bin.js', 'dist/worker.js']) {
      expect(files).toContain(f);
    }
  });

  it('carries no source maps (they would point at sources it does not ship)', () => {
    expect(files.filter((f) => f.endsWith('.map'))).toEqual([]);
  });

  // npm runs preinstall, install, postinstall and the prepare scripts of a package it installs (npm
  // docs, "Life Cycle Scripts"; npm 11 warns about each package that has one). A build belongs to prepack.
  it('carries no script npm would run when a user installs it, and npm warns about none', async () => {
    const manifest = JSON.parse(await readFile(join(consumer, 'node_modules', 'lexlock', 'package.json'), 'utf8')) as { scripts?: Record<string, string> };
    const scripts = Object.keys(manifest.scripts ?? {});
    expect(scripts.filter((name) => ['preinstall', 'install', 'postinstall', 'preprepare', 'prepare', 'postprepare'].includes(name))).toEqual([]);
    expect(scripts).toContain('prepack');
    expect(installed).not.toMatch(/install-scripts|lexlock@[^ ]* \(/);
  });

  it('gives a new user the lexlock command: npx lexlock, the project\'s bin, and a global install', async () => {
    const viaNpx = await run(NPX, ['--no-install', 'lexlock', '--help'], { cwd: consumer });
    expect(viaNpx.stdout).toBe(MAIN_HELP);
    const viaBin = await run(join(consumer, 'node_modules', '.bin', 'lexlock'), ['--version'], { cwd: consumer });
    expect(viaBin.stdout.trim()).toBe((JSON.parse(await readFile(join(root, 'package.json'), 'utf8')) as { version: string }).version);
    // npm install -g of the tarball, into a prefix of its own instead of the machine's.
    const prefix = join(dir, 'global');
    await run(NPM, ['install', '--global', '--prefix', prefix, '--no-audit', '--no-fund', '--prefer-offline', tarball], { cwd: dir, maxBuffer: 16 << 20 });
    const global = await run(join(prefix, 'bin', 'lexlock'), ['--help'], { cwd: dir });
    expect(global.stdout).toBe(MAIN_HELP);
  }, 120_000);

  it('reads standard input through npx lexlock peek', async () => {
    const lexicon = join(consumer, 'peek-lexicon.json');
    await run(NPX, ['--no-install', 'lexlock', 'build', demo, '-o', lexicon, '--cap', '500', '--length', '4', '--pad', 'start', '--quiet'], { cwd: consumer });
    const peeked = await piped(NPX, ['--no-install', 'lexlock', 'peek', lexicon, '--json'], 'the ferry\nthe ferry was late again today\n', consumer);
    expect([peeked.code, peeked.stderr]).toEqual([0, '']);
    const rows = peeked.stdout.trim().split('\n').map((l) => JSON.parse(l) as { line: number; tokens: unknown[]; cutTokens: number; zeros: number; row: number[] });
    expect(rows.map((r) => [r.line, r.tokens.length, r.cutTokens, r.zeros, r.row.length])).toEqual([
      [1, 2, 0, 2, 4],
      [2, 6, 2, 0, 4],
    ]);
  });

  it('works from import: the main entry, lexlock/node on worker threads and lexlock/browser', async () => {
    const script = `
      import { Tally, freeze, resolveRules, serializeLexicon, VERSION } from 'lexlock';
      import { tallyCorpus, readCorpus } from 'lexlock/node';
      import { parseLexicon } from 'lexlock/browser';
      const { tally } = await tallyCorpus(readCorpus(${JSON.stringify(demo)}), resolveRules(), { threads: 2 });
      const one = freeze(Tally.fromTexts(['late ferry', 'late again'], resolveRules()), {});
      const back = parseLexicon(serializeLexicon(one));
      console.log(JSON.stringify({ version: VERSION, types: tally.types, ids: Array.from(back.encode('late ferry')) }));
    `;
    await writeFile(join(consumer, 'esm.mjs'), script);
    const { stdout } = await run(process.execPath, ['esm.mjs'], { cwd: consumer });
    const said = JSON.parse(stdout) as { version: string; types: number; ids: number[] };
    expect(said.version).toBe((JSON.parse(await readFile(join(root, 'package.json'), 'utf8')) as { version: string }).version);
    expect(said.types).toBe(4033); // the demo corpus's distinct tokens, as the demo prints them
    // Worked out by hand: late (2) takes id 2, then again and ferry (1 each) in string order, 3 and 4.
    expect(said.ids).toEqual([2, 4]);
  });

  it('works from require: the main entry and lexlock/node on worker threads', async () => {
    const script = `
      const { Tally, freeze, resolveRules } = require('lexlock');
      const { tallyCorpus, readCorpus } = require('lexlock/node');
      tallyCorpus(readCorpus(${JSON.stringify(demo)}), resolveRules(), { threads: 2 }).then(({ tally }) => {
        const one = freeze(Tally.fromTexts(['late ferry', 'late again'], resolveRules()), {});
        console.log(JSON.stringify({ types: tally.types, tokens: one.encoding.tokens }));
      });
    `;
    await writeFile(join(consumer, 'cjs.cjs'), script);
    const { stdout } = await run(process.execPath, ['cjs.cjs'], { cwd: consumer });
    expect(JSON.parse(stdout)).toEqual({ types: 4033, tokens: ['late', 'again', 'ferry'] });
  });

  it('works through npx lexlock: build, then verify the lexicon', async () => {
    const lexicon = join(consumer, 'lexicon.json');
    await run(NPX, ['--no-install', 'lexlock', 'build', demo, '-o', lexicon, '--label', 'topic', '--cap', '500', '--quiet'], { cwd: consumer });
    const { stdout } = await run(NPX, ['--no-install', 'lexlock', 'verify', lexicon], { cwd: consumer });
    expect(stdout).toContain('vocabulary       500 tokens; padding 0, OOV 1; ids 0 to 501 (502 rows for an embedding)');
  });
});
