import { copyFile, existsSync } from 'node:fs';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderReport } from '../../../src/audit/report/renderReport.js';
import { CHROMIUM, CHROMIUM_ARGS, chromiumMissing } from '../../helpers/chromium.js';
import { ferryContext, ferryReport, SCRIPT_TOKEN } from './reportFixture.js';

// The page is checked against a real browser: Debian's Chromium parses, lays out, prints and
// screenshots it. These tests never skip: without the browser every one fails, saying how to install it.
const MISSING = chromiumMissing("the report's browser test");
/** A4 is 210 mm wide; less the page's 14 mm margins on each side, at 96 CSS px per inch. */
const A4_PRINTABLE_PX = Math.floor(((210 - 2 * 14) / 25.4) * 96);
/** Set this to a file path to keep the full-page screenshot for a look. */
const KEEP_SCREENSHOT = process.env['LEXLOCK_REPORT_SCREENSHOT'];

let dir = '';
let server: Server | undefined;
let browser: Browser | undefined;
let page: Page | undefined;
let origin = '';
const requests: string[] = [];
const served: string[] = [];
const consoleErrors: string[] = [];

/** The page, once beforeAll has opened it. */
function opened(): Page {
  if (page === undefined) throw new Error(existsSync(CHROMIUM) ? 'the report page did not open; see the error of beforeAll' : MISSING);
  return page;
}

beforeAll(async () => {
  if (!existsSync(CHROMIUM)) return; // every test then fails with MISSING
  dir = await mkdtemp(join(tmpdir(), 'lexlock-report-'));
  const html = renderReport(ferryReport(), ferryContext());
  const file = join(dir, 'report.html');
  await writeFile(file, html);
  server = createServer((req, res) => {
    served.push(req.url ?? '');
    if (req.url === '/report.html') {
      void readFile(file).then((body) => {
        res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
        res.end(body);
      });
    } else {
      res.writeHead(404, { 'content-type': 'text/plain' });
      res.end('not here');
    }
  });
  server.requestTimeout = 10_000;
  server.headersTimeout = 5_000;
  server.maxConnections = 16;
  const listening = server;
  await new Promise<void>((resolve, reject) => {
    listening.once('error', reject);
    listening.listen(0, '127.0.0.1', () => resolve());
  });
  origin = `http://127.0.0.1:${String((listening.address() as AddressInfo).port)}`;

  browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS, timeout: 60_000 });
  page = await browser.newPage({ viewport: { width: 900, height: 1200 } });
  page.on('request', (request) => requests.push(request.url()));
  page.on('console', (message) => {
    if (message.type() === 'error') consoleErrors.push(message.text());
  });
  page.on('pageerror', (error) => consoleErrors.push(error.message));
  const response = await page.goto(`${origin}/report.html`, { waitUntil: 'load', timeout: 30_000 });
  expect(response?.status()).toBe(200);
});

afterAll(async () => {
  await browser?.close();
  if (server !== undefined) {
    server.closeAllConnections();
    await promisify(server.close.bind(server))();
  }
  if (dir !== '') await rm(dir, { recursive: true, force: true });
});

describe('the report page in Chromium', () => {
  it("runs on Debian's chromium", () => {
    expect(existsSync(CHROMIUM), MISSING).toBe(true);
  });

  it('loads with no console errors and requests nothing but itself from 127.0.0.1', () => {
    opened();
    expect(requests.length).toBeGreaterThan(0);
    for (const url of requests) expect(url.startsWith(`${origin}/`), url).toBe(true);
    expect(requests[0]).toBe(`${origin}/report.html`);
    expect(served.filter((url) => url !== '/favicon.ico')).toEqual(['/report.html']);
    expect(consoleErrors).toEqual([]);
  });

  it('takes a full-page screenshot that is a real PNG', async () => {
    const path = join(dir, 'report.png');
    await opened().screenshot({ path, fullPage: true });
    const png = await readFile(path);
    // PNG signature and the IHDR chunk (RFC 2083 / ISO/IEC 15948): width and height at bytes 16 and 20.
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(png.subarray(12, 16).toString('latin1')).toBe('IHDR');
    expect(png.readUInt32BE(16)).toBe(900);
    expect(png.readUInt32BE(20)).toBeGreaterThan(2_000);
    if (KEEP_SCREENSHOT !== undefined && KEEP_SCREENSHOT !== '') await promisify(copyFile)(path, KEEP_SCREENSHOT);
  });

  it('lays out at least four accessible charts, each with a non-empty box', async () => {
    const charts = await opened()
      .locator('svg')
      .evaluateAll((svgs) =>
        svgs.map((svg) => {
          const box = svg.getBoundingClientRect();
          return { id: svg.id, role: svg.getAttribute('role'), title: svg.querySelector(':scope > title')?.textContent ?? '', width: box.width, height: box.height };
        }),
      );
    expect(charts.length).toBeGreaterThanOrEqual(4);
    expect(charts.map((c) => c.id)).toEqual(['chart-coverage', 'chart-lengths', 'chart-labels', 'chart-drift-lengths', 'chart-drift-labels']);
    for (const chart of charts) {
      expect(chart.role, chart.id).toBe('img');
      expect(chart.title.length, chart.id).toBeGreaterThan(10);
      expect(chart.width, chart.id).toBeGreaterThan(100);
      expect(chart.height, chart.id).toBeGreaterThan(100);
    }
  });

  it('keeps every text of a chart inside the chart and clear of the others', async () => {
    const problems = await opened()
      .locator('svg')
      .evaluateAll((svgs) => {
        const found: string[] = [];
        for (const svg of svgs) {
          const frame = svg.getBoundingClientRect();
          const texts = Array.from(svg.querySelectorAll('text')).map((t) => ({ text: t.textContent ?? '', box: t.getBoundingClientRect() }));
          for (const { text, box } of texts) {
            if (box.width === 0 || box.height === 0) found.push(`${svg.id}: "${text}" has an empty box`);
            if (box.left < frame.left - 0.5 || box.right > frame.right + 0.5 || box.top < frame.top - 0.5 || box.bottom > frame.bottom + 0.5) {
              found.push(`${svg.id}: "${text}" sticks out of the chart`);
            }
          }
          for (let i = 0; i < texts.length; i++) {
            for (let j = i + 1; j < texts.length; j++) {
              const a = texts[i];
              const b = texts[j];
              if (a === undefined || b === undefined) continue;
              const w = Math.min(a.box.right, b.box.right) - Math.max(a.box.left, b.box.left);
              const h = Math.min(a.box.bottom, b.box.bottom) - Math.max(a.box.top, b.box.top);
              if (w > 1 && h > 1) found.push(`${svg.id}: "${a.text}" overlaps "${b.text}"`);
            }
          }
        }
        return found;
      });
    expect(problems).toEqual([]);
  });

  it('shows corpus-derived text as text, never as markup', async () => {
    const p = opened();
    expect(await p.locator('script').count()).toBe(0);
    const codes = await p.locator('code').allTextContents();
    for (const token of [SCRIPT_TOKEN, 'a&b', '"quoted"', "o'clock"]) expect(codes).toContain(token);
    expect(await p.title()).toBe('Vocabulary audit: harbourline-support-2031-q2.jsonl');
    const text = await p.locator('body').innerText();
    expect(text).toContain(`sha256:${'3f9a0c1d'.repeat(8)}`);
    expect(text).toContain('cap (tokens kept, log scale)');
  });

  it('fits every chart within an A4 page width when printed', async () => {
    const p = opened();
    await p.emulateMedia({ media: 'print' });
    await p.setViewportSize({ width: A4_PRINTABLE_PX, height: 1000 });
    const boxes = await p.locator('svg').evaluateAll((svgs) => svgs.map((s) => ({ id: s.id, left: s.getBoundingClientRect().left, right: s.getBoundingClientRect().right, height: s.getBoundingClientRect().height })));
    for (const box of boxes) {
      expect(box.left, box.id).toBeGreaterThanOrEqual(0);
      expect(box.right, box.id).toBeLessThanOrEqual(A4_PRINTABLE_PX + 0.5);
      expect(box.height, box.id).toBeGreaterThan(100);
    }
    const pdf = await p.pdf({ format: 'A4' });
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    await p.emulateMedia({ media: 'screen' });
  });
});
