import { execFile } from 'node:child_process';
import { existsSync } from 'node:fs';
import { copyFile, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { createRequire } from 'node:module';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { promisify } from 'node:util';
import { chromium } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CHROMIUM, CHROMIUM_ARGS, chromiumMissing, serveFiles } from '../helpers/chromium.js';
import { CHECK_FUNCTION, readmeBlocks, withChecks } from './readmeBlocks.js';

// Every TypeScript block of the README runs, in order, in one scratch folder, against the built
// package (dist/, which `npm test` builds first), so the README cannot drift from the API. A line
// `expression; // [..]` must give what its comment says. The placeholder fingerprint 'sha256:…' is
// the fingerprint of the lexicon.json an earlier block wrote. Browser blocks run in Chromium.
const run = promisify(execFile);
const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const dist = join(root, 'dist');
const SPECIFIERS: Record<string, string> = {
  lexlock: pathToFileURL(join(dist, 'index.js')).href,
  'lexlock/node': pathToFileURL(join(dist, 'node.js')).href,
  'lexlock/browser': pathToFileURL(join(dist, 'browser.js')).href,
  // The Training block's tensor library, a devDependency, from the repository's node_modules.
  '@tensorflow/tfjs': pathToFileURL(createRequire(import.meta.url).resolve('@tensorflow/tfjs')).href,
};
const PLACEHOLDER = "'sha256:…'";

let dir = '';
const blocks = readmeBlocks(await readFile(join(root, 'README.md'), 'utf8'));
const isBrowserBlock = (code: string) => code.includes("from 'lexlock/browser'");

async function fingerprintHere(): Promise<string> {
  return (JSON.parse(await readFile(join(dir, 'lexicon.json'), 'utf8')) as { fingerprint: string }).fingerprint;
}

beforeAll(async () => {
  if (!existsSync(join(dist, 'index.js'))) throw new Error('dist/ is missing: npm test builds it first');
  dir = await mkdtemp(join(tmpdir(), 'lexlock-readme-'));
  // The README's corpus name; the demo corpus has its `topic` column.
  await copyFile(join(root, 'corpora-demo', 'ferry-messages.csv'), join(dir, 'reviews.csv'));
  // The Training block's held-out messages: the demo's other 300, with their `topic`.
  await copyFile(join(root, 'corpora-demo', 'ferry-messages.jsonl'), join(dir, 'held-out.jsonl'));
});

afterAll(async () => {
  if (dir !== '') await rm(dir, { recursive: true, force: true });
});

describe('README code blocks', () => {
  it('has the Library, Serving and training blocks', () => {
    expect(blocks.length).toBeGreaterThanOrEqual(5);
    expect(blocks.filter((b) => isBrowserBlock(b.code))).toHaveLength(1);
  });

  it.each(blocks.filter((b) => !isBrowserBlock(b.code)).map((b) => [b.line, b] as const))('the block at README line %i runs in Node and gives what it says', async (_line, block) => {
    let code = withChecks(block.code);
    for (const [name, url] of Object.entries(SPECIFIERS)) code = code.replaceAll(`from '${name}'`, `from '${url}'`);
    if (code.includes(PLACEHOLDER)) code = code.replaceAll(PLACEHOLDER, JSON.stringify(await fingerprintHere()));
    const file = join(dir, `block-${block.line}.mjs`);
    await writeFile(file, `${CHECK_FUNCTION}\n${code}\n`);
    await expect(run(process.execPath, [file], { cwd: dir })).resolves.toBeDefined();
  });

  it('the browser block runs in Chromium, with lexlock/browser mapped to dist/browser.js', async () => {
    if (!existsSync(CHROMIUM)) throw new Error(chromiumMissing('the README browser example'));
    const block = blocks.find((b) => isBrowserBlock(b.code));
    if (block === undefined) throw new Error('the README has no browser block');
    const fingerprint = await fingerprintHere();
    const server = await serveFiles({
      '/index.html': ['text/html; charset=utf-8', '<!doctype html><meta charset="utf-8"><script type="importmap">{"imports":{"lexlock/browser":"/browser.js"}}</script><textarea>Is the 10 am ferry running today?</textarea>'],
      '/browser.js': ['text/javascript; charset=utf-8', await readFile(join(dist, 'browser.js'))],
      '/models/ferry/lexicon.json': ['application/json; charset=utf-8', await readFile(join(dir, 'lexicon.json'))],
    });
    const browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS, timeout: 60_000 });
    try {
      const page = await browser.newPage();
      const errors: string[] = [];
      page.on('pageerror', (e) => errors.push(e.message));
      await page.goto(`${server.origin}/index.html`, { waitUntil: 'load' });
      const code = `${block.code.replaceAll(PLACEHOLDER, JSON.stringify(fingerprint))}\nwindow.__readme = Array.from(ids);`;
      await page.addScriptTag({ type: 'module', content: code });
      const ids = await page.waitForFunction(() => (window as unknown as { __readme?: number[] }).__readme, undefined, { timeout: 30_000 });
      const node = (await import(SPECIFIERS['lexlock/node'] as string)) as typeof import('../../src/node.js');
      const lexicon = await node.loadLexicon(join(dir, 'lexicon.json'));
      expect(await ids.jsonValue()).toEqual(Array.from(lexicon.encode('Is the 10 am ferry running today?')));
      expect(errors).toEqual([]);
    } finally {
      await browser.close();
      await server.close();
    }
  });
});
