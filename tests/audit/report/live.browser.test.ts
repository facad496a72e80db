// The report page's cap and length controls (issue 16), in Debian's headless Chromium: the page is
// made by `lexlock audit --report` from the demo corpus, the controls are set through the UI (typing
// into the number box, arrow keys on the slider), and every figure the controls move must then read
// as the page `lexlock audit --cap X --length Y --json` gives for that pair: the JSON report of that
// run is rendered as a static page and its `data-live` figures compared, text for text, and the
// headline figures are checked against the JSON's own numbers too. A screenshot of the charts must
// show the chosen marker's ink at its new place.
import { existsSync } from 'node:fs';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CoverageReport } from '../../../src/audit/CoverageReport.js';
import { formatCount } from '../../../src/audit/report/formatCount.js';
import { formatPercent } from '../../../src/audit/report/formatPercent.js';
import { renderReport } from '../../../src/audit/report/renderReport.js';
import { shareOf } from '../../../src/audit/report/shareOf.js';
import { CHROMIUM, CHROMIUM_ARGS, chromiumMissing, serveFiles } from '../../helpers/chromium.js';
import { cli } from '../../helpers/cli.js';
import { plainCsv } from '../../helpers/plainCsv.js';
import { resolveRules } from '../../../src/rules/TextRules.js';
import { tokenize } from '../../../src/rules/tokenize.js';

const MISSING = chromiumMissing("the report controls' browser test");
const DEMO = join(import.meta.dirname, '../../../corpora-demo/ferry-messages.csv');
const CAP = 800;
const LENGTH = 40;

let dir = '';
let browser: Browser | undefined;
let close: (() => Promise<void>) | undefined;
let origin = '';
const consoleErrors: string[] = [];
const requests: string[] = [];

async function audited(...flags: string[]): Promise<CoverageReport> {
  const r = await cli('audit', DEMO, '--label', 'topic', '--json', '-q', ...flags);
  expect(r.stderr).toBe('');
  return JSON.parse(r.stdout) as CoverageReport;
}

async function openPage(name: string): Promise<Page> {
  if (browser === undefined) throw new Error(existsSync(CHROMIUM) ? 'the browser did not start; see the error of beforeAll' : MISSING);
  const page = await browser.newPage({ viewport: { width: 900, height: 1200 } });
  page.on('request', (request) => requests.push(request.url()));
  page.on('console', (message) => {
    if (message.type() === 'error') consoleErrors.push(message.text());
  });
  page.on('pageerror', (error) => consoleErrors.push(error.message));
  await page.goto(`${origin}/${name}`, { waitUntil: 'load' });
  return page;
}

/** Every `data-live` figure of a page, keyed by its name (and row, for the label table). */
async function liveFigures(page: Page): Promise<Record<string, string>> {
  return page.locator('[data-live]').evaluateAll((nodes) =>
    Object.fromEntries(nodes.map((n) => [`${n.getAttribute('data-live') ?? ''}${n.hasAttribute('data-row') ? `:${n.getAttribute('data-row') ?? ''}` : ''}`, n.textContent ?? ''])),
  );
}

/** The figures a static page of this report shows (no page data, so no script): the reference. */
async function staticFigures(report: CoverageReport): Promise<Record<string, string>> {
  if (browser === undefined) throw new Error(MISSING);
  const page = await browser.newPage();
  await page.setContent(renderReport(report, { corpus: 'ferry-messages.csv', lexiconFile: null, settings: {}, generatedAt: '2031-06-01T00:00:00Z', lexlockVersion: 'test' }));
  const figures = await liveFigures(page);
  await page.close();
  return figures;
}

/** Where a marker's line stands (SVG units), and where the chart's scale puts a data value (worked out here from the scale's ends). */
async function markerX(page: Page, name: string): Promise<{ at: number; scale: string }> {
  return page.locator(`[data-live-line="${name}"]`).evaluate((line) => ({ at: Number(line.getAttribute('x1')), scale: line.parentElement?.getAttribute('data-x-scale') ?? '' }));
}
function place(scale: string, value: number): number {
  const [kind, d0, d1, r0, r1] = scale.split(' ');
  const [a, b, c, d] = [Number(d0), Number(d1), Number(r0), Number(r1)];
  const t = kind === 'log' ? (Math.log10(value) - Math.log10(a)) / (Math.log10(b) - Math.log10(a)) : (value - a) / (b - a);
  return c + t * (d - c);
}

/** Chart texts that stick out of their chart or overlap another (as report.browser.test.ts checks the static page). */
async function textProblems(page: Page): Promise<string[]> {
  return page.locator('svg.chart').evaluateAll((svgs) => {
    const found: string[] = [];
    for (const svg of svgs) {
      const frame = svg.getBoundingClientRect();
      const texts = Array.from(svg.querySelectorAll('text'))
        .filter((t) => getComputedStyle(t).visibility !== 'hidden')
        .map((t) => ({ text: t.textContent ?? '', box: t.getBoundingClientRect() }));
      texts.forEach(({ text, box }, i) => {
        if (box.left < frame.left - 0.5 || box.right > frame.right + 0.5 || box.top < frame.top - 0.5 || box.bottom > frame.bottom + 0.5) found.push(`${svg.id}: "${text}" sticks out of the chart`);
        for (const other of texts.slice(i + 1)) {
          const w = Math.min(box.right, other.box.right) - Math.max(box.left, other.box.left);
          const h = Math.min(box.bottom, other.box.bottom) - Math.max(box.top, other.box.top);
          if (w > 1 && h > 1) found.push(`${svg.id}: "${text}" overlaps "${other.text}"`);
        }
      });
    }
    return found;
  });
}

/**
 * Each label's dropped tokens and padding share at a length, which the JSON report does not have:
 * recounted from the demo corpus read by a plain CSV reader and tokenized under the default rules.
 */
async function labelRowsAt(length: number): Promise<Record<string, string>> {
  const [header, ...rows] = plainCsv(await readFile(DEMO, 'utf8'));
  expect(header).toEqual(['id', 'text', 'topic', 'sentiment']);
  const byLabel = new Map<string, number[]>();
  for (const [, text, topic] of rows) byLabel.set(topic as string, [...(byLabel.get(topic as string) ?? []), tokenize(text as string, resolveRules()).length]);
  const out: Record<string, string> = {};
  for (const [label, lengths] of byLabel) {
    out[`label-dropped:${label}`] = formatCount(lengths.reduce((sum, n) => sum + Math.max(0, n - length), 0));
    out[`label-padding:${label}`] = formatPercent(shareOf(lengths.reduce((sum, n) => sum + Math.max(0, length - n), 0), lengths.length * length));
  }
  return out;
}

/** The figures of a page split into those a static page of the JSON report has, and the per-label dropped and padding ones. */
function split(figures: Record<string, string>): [Record<string, string>, Record<string, string>] {
  const extra = Object.entries(figures).filter(([k]) => k.startsWith('label-dropped:') || k.startsWith('label-padding:'));
  const rest = Object.entries(figures).filter(([k]) => !(k.startsWith('label-dropped:') || k.startsWith('label-padding:')));
  return [Object.fromEntries(rest), Object.fromEntries(extra)];
}

/** Sets a control by typing into its number box. */
async function typeInto(page: Page, id: string, value: number): Promise<void> {
  await page.locator(`#${id}-number`).fill(String(value));
}

/** Moves a slider with the arrow keys, one stop a press, from where it is to `value` (a stop). */
async function arrowTo(page: Page, id: string, value: number): Promise<void> {
  const slider = page.locator(`#${id}-range`);
  await slider.focus();
  for (let guard = 0; guard < 400; guard++) {
    const now = Number(await page.locator(`#${id}-number`).inputValue());
    if (now === value) return;
    await slider.press(now < value ? 'ArrowRight' : 'ArrowLeft');
  }
  throw new Error(`${id} never reached ${value}`);
}

/**
 * Whether a screenshot of a chart has the chosen marker's dark ink (#1f2328) in the column of pixels
 * at `x` (SVG units) and not only there: decoded in the browser (createImageBitmap, a canvas).
 */
async function inkColumn(page: Page, chart: string, x: number): Promise<{ inkAtMarker: number; width: number }> {
  const png = await page.locator(`#${chart}`).screenshot();
  const viewBoxWidth = await page.locator(`#${chart}`).evaluate((svg) => (svg as SVGSVGElement).viewBox.baseVal.width);
  const blank = await (browser as Browser).newPage();
  const result = await blank.evaluate(
    async ([data, atX, boxWidth]) => {
      const bytes = Uint8Array.from(atob(data as string), (c) => c.charCodeAt(0));
      const image = await createImageBitmap(new Blob([bytes], { type: 'image/png' }));
      const canvas = new OffscreenCanvas(image.width, image.height);
      const context = canvas.getContext('2d') as OffscreenCanvasRenderingContext2D;
      context.drawImage(image, 0, 0);
      const column = Math.round(((atX as number) * image.width) / (boxWidth as number));
      let ink = 0;
      for (let dx = -1; dx <= 1; dx++) {
        const pixels = context.getImageData(column + dx, 0, 1, image.height).data;
        for (let i = 0; i < pixels.length; i += 4) if ((pixels[i] as number) < 60 && (pixels[i + 1] as number) < 60 && (pixels[i + 2] as number) < 60) ink += 1;
      }
      return { inkAtMarker: ink, width: image.width };
    },
    [png.toString('base64'), x, viewBoxWidth],
  );
  await blank.close();
  return result;
}

beforeAll(async () => {
  if (!existsSync(CHROMIUM)) return;
  dir = await mkdtemp(join(tmpdir(), 'lexlock-live-'));
  const made = await cli('audit', DEMO, '--label', 'topic', '--cap', String(CAP), '--length', String(LENGTH), '--report', join(dir, 'corpus.html'), '-q');
  expect(made.code, made.stderr).toBe(0);
  // Audited far from every suggestion, so the chosen labels sit in the first row, beside the suggestions'.
  const far = await cli('audit', DEMO, '--label', 'topic', '--cap', '5', '--length', '2', '--report', join(dir, 'far.html'), '-q');
  expect(far.code, far.stderr).toBe(0);
  const free = await cli('audit', DEMO, '--label', 'topic', '--cap', '800', '--report', join(dir, 'nolength.html'), '-q');
  expect(free.code, free.stderr).toBe(0);
  const built = await cli('build', DEMO, '--label', 'topic', '--cap', '1500', '--length', '48', '-o', join(dir, 'lexicon.json'), '-q');
  expect(built.code, built.stderr).toBe(0);
  const againstLexicon = await cli('audit', DEMO, '--lexicon', join(dir, 'lexicon.json'), '--report', join(dir, 'lexicon.html'), '-q');
  expect(againstLexicon.code, againstLexicon.stderr).toBe(0);
  const served = await serveFiles({
    '/corpus.html': ['text/html; charset=utf-8', await readFile(join(dir, 'corpus.html'))],
    '/lexicon.html': ['text/html; charset=utf-8', await readFile(join(dir, 'lexicon.html'))],
    '/far.html': ['text/html; charset=utf-8', await readFile(join(dir, 'far.html'))],
    '/nolength.html': ['text/html; charset=utf-8', await readFile(join(dir, 'nolength.html'))],
  });
  origin = served.origin;
  close = served.close;
  browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS, timeout: 60_000 });
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await close?.();
  if (dir !== '') await rm(dir, { recursive: true, force: true });
});

describe('the report page controls in Chromium', () => {
  it('run the page script allowed by its hash: controls shown, no console error, nothing fetched', async () => {
    const page = await openPage('corpus.html');
    expect(await page.locator('#controls').isVisible()).toBe(true);
    expect(await page.locator('#controls-off').isVisible()).toBe(false);
    expect(await page.locator('#cap-number').inputValue()).toBe(String(CAP));
    expect(await page.locator('#length-number').inputValue()).toBe(String(LENGTH));
    expect(await page.locator('#cap-range').getAttribute('aria-valuetext')).toBe(`cap ${formatCount(CAP)}`);
    expect(consoleErrors).toEqual([]);
    for (const url of requests) expect(url.startsWith(`${origin}/`), url).toBe(true);
    await page.close();
  });

  it('show, for three caps and lengths set through the controls, the figures of lexlock audit --cap X --length Y --json', async () => {
    const page = await openPage('corpus.html');
    const before = await markerX(page, 'cap-marker');
    const pairs: Array<[number, number, 'type' | 'keys']> = [
      [250, 24, 'type'],
      [256, 21, 'keys'],
      [3000, 120, 'type'],
    ];
    for (const [cap, length, how] of pairs) {
      if (how === 'type') {
        await typeInto(page, 'cap', cap);
        await typeInto(page, 'length', length);
      } else {
        await arrowTo(page, 'cap', cap);
        await arrowTo(page, 'length', length);
      }
      const json = await audited('--cap', String(cap), '--length', String(length));
      const [shown, labelRows] = split(await liveFigures(page));
      expect(shown, `cap ${cap}, length ${length}`).toEqual(await staticFigures(json));
      expect(labelRows, `length ${length}`).toEqual(await labelRowsAt(length));
      // And straight from the JSON's numbers:
      expect(shown['oov-figure']).toBe(formatPercent(json.oovRate));
      expect(shown['truncated-detail']).toBe(`${formatCount(json.truncatedDocuments)} longer than ${formatCount(length)} tokens`);
      expect(shown['dropped-figure']).toBe(formatCount(json.droppedTokens));
      expect(shown['padding-figure']).toBe(formatCount(json.paddingTokens));
      for (const [label, a] of Object.entries(json.labels)) {
        expect(shown[`label-oov:${label}`]).toBe(formatPercent(shareOf(a.oovTokens, a.tokens)));
        expect(shown[`label-truncated:${label}`]).toBe(formatPercent(shareOf(a.truncatedDocuments, a.documents)));
      }
      expect(await page.locator('#build-line').textContent()).toBe(`lexlock build ${DEMO} -o ferry-messages.lexicon.json --cap ${cap} --length ${length} --pad end --cut end --label topic`);
      const marker = await markerX(page, 'cap-marker');
      expect(marker.at).toBeCloseTo(place(marker.scale, cap), 1);
      const lengthMarker = await markerX(page, 'length-marker');
      expect(lengthMarker.at).toBeCloseTo(place(lengthMarker.scale, length + 0.5), 1);
      expect(await textProblems(page), `cap ${cap}, length ${length}`).toEqual([]);
    }
    const after = await markerX(page, 'cap-marker');
    expect(Math.abs(after.at - before.at)).toBeGreaterThan(20);
    // The screenshot: each chart non-empty, the chosen cap's ink where the marker now stands, none where it stood.
    for (const svg of await page.locator('svg.chart').all()) {
      const box = await svg.boundingBox();
      expect((box?.width ?? 0) * (box?.height ?? 0)).toBeGreaterThan(10_000);
    }
    const now = await inkColumn(page, 'chart-coverage', after.at);
    const then = await inkColumn(page, 'chart-coverage', before.at);
    expect(now.inkAtMarker).toBeGreaterThan(100);
    expect(then.inkAtMarker).toBeLessThan(now.inkAtMarker / 4);
    expect(consoleErrors).toEqual([]);
    await page.close();
  }, 120_000);

  it.each(['corpus.html', 'far.html'])('%s: keep chart texts apart wherever the markers go (caps and lengths around every suggestion)', async (name) => {
    const page = await openPage(name);
    const json = await audited('--cap', String(CAP), '--length', String(LENGTH));
    const s = json.suggest;
    const caps = [1, 2, 5, 40, s.capFor90, s.capFor95, s.capFor99, json.types].flatMap((c) => [c - 20, c, c + 20]).filter((c) => c >= 1 && c <= json.types);
    const lengths = [1, 3, s.lengthFor90, s.lengthFor95, s.lengthFor99, json.length.max].flatMap((l) => [l - 2, l, l + 2]).filter((l) => l >= 1 && l <= json.length.max);
    for (let i = 0; i < Math.max(caps.length, lengths.length); i++) {
      await typeInto(page, 'cap', caps[i % caps.length] as number);
      await typeInto(page, 'length', lengths[i % lengths.length] as number);
      expect(await textProblems(page), `cap ${caps[i % caps.length]}, length ${lengths[i % lengths.length]}`).toEqual([]);
    }
    expect(consoleErrors).toEqual([]);
    await page.close();
  }, 60_000);

  it('with --lexicon, start at the lexicon cap and length and show what a smaller lexicon of the same ranking would give', async () => {
    const page = await openPage('lexicon.html');
    expect(await page.locator('#cap-number').inputValue()).toBe('1500');
    expect(await page.locator('#length-number').inputValue()).toBe('48');
    await typeInto(page, 'cap', 600);
    await typeInto(page, 'length', 30);
    const smaller = join(dir, 'smaller.json');
    const built = await cli('build', DEMO, '--label', 'topic', '--cap', '600', '-o', smaller, '-q');
    expect(built.code, built.stderr).toBe(0);
    const json = await audited('--lexicon', smaller, '--length', '30');
    const [shown, labelRows] = split(await liveFigures(page));
    expect(labelRows).toEqual(await labelRowsAt(30));
    // The build line names the corpus the lexicon was built from, as its fit record does (the last segment).
    expect(await page.locator('#build-line').textContent()).toBe('lexlock build ferry-messages.csv -o ferry-messages.lexicon.json --cap 600 --length 30 --pad end --cut end --label topic');
    const reference = await staticFigures(json);
    // The coverage marker says what the lexicon's own first tokens cover (the curve is this corpus's best).
    expect(shown['cap-marker']).toBe(`chosen cap 600: ${formatPercent(shareOf(json.tokens - json.oovTokens, json.tokens))} covered by the lexicon`);
    delete shown['cap-marker'];
    delete reference['cap-marker'];
    expect(shown).toEqual(reference);
    expect(consoleErrors).toEqual([]);
    await page.close();
  }, 60_000);

  it('without --length, start the length control at the corpus p95 and count from there once moved', async () => {
    const page = await openPage('nolength.html');
    const json = await audited('--cap', '800');
    expect(await page.locator('#length-number').inputValue()).toBe(String(json.suggest.lengthFor95));
    expect(await page.locator('[data-live="truncated-figure"]').textContent()).toBe('–');
    await typeInto(page, 'cap', 300);
    const [shown] = split(await liveFigures(page));
    const reference = await staticFigures(await audited('--cap', '300', '--length', String(json.suggest.lengthFor95)));
    // The histogram of an audit without a length has no chosen length to move: every other figure follows.
    expect(shown['length-marker']).toBeUndefined();
    delete reference['length-marker'];
    expect(shown).toEqual(reference);
    expect(consoleErrors).toEqual([]);
    await page.close();
  });

  // A browser may break a line after any hyphen, so a flag could wrap as "-" and "-cut"; each word of
  // the build line keeps to one line, and wraps only at the spaces between words (its text unchanged).
  it('wraps the build line only between words, before and after the controls move', async () => {
    const page = await openPage('corpus.html');
    await page.setViewportSize({ width: 420, height: 1200 });
    const words = async () =>
      page.locator('#build-line span').evaluateAll((spans) => spans.map((s) => ({ text: s.textContent ?? '', lines: new Set(Array.from(s.getClientRects()).map((r) => Math.round(r.top))).size })));
    const check = async () => {
      const found = await words();
      const text = (await page.locator('#build-line').textContent()) ?? '';
      expect(found.map((w) => w.text)).toEqual(text.split(' '));
      expect(found.filter((w) => w.lines !== 1)).toEqual([]);
      // At this width the line does wrap, so the check above is about something.
      const box = await page.locator('#build-line').boundingBox();
      expect(box?.height ?? 0).toBeGreaterThan(40);
    };
    await check();
    await page.locator('#cap-number').fill('350');
    await page.locator('#length-number').fill('33');
    expect(await page.locator('#build-line').textContent()).toContain('--cap 350 --length 33 ');
    await check();
    await page.close();
  });

  it('prints on A4 without the controls, every chart within the printable width', async () => {
    const page = await openPage('corpus.html');
    const printable = Math.floor(((210 - 2 * 14) / 25.4) * 96); // A4 less the page's 14 mm margins, at 96 px an inch
    await page.emulateMedia({ media: 'print' });
    await page.setViewportSize({ width: printable, height: 1000 });
    expect(await page.locator('#controls').isVisible()).toBe(false);
    expect(await page.locator('#build-line').isVisible()).toBe(true);
    for (const box of await page.locator('svg.chart').evaluateAll((svgs) => svgs.map((s) => s.getBoundingClientRect().toJSON() as DOMRect))) {
      expect(box.left).toBeGreaterThanOrEqual(0);
      expect(box.right).toBeLessThanOrEqual(printable + 0.5);
    }
    expect((await page.pdf({ format: 'A4' })).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    await page.close();
  });

  it('keeps the audited figures and its build line when the script is blocked', async () => {
    if (browser === undefined) throw new Error(MISSING);
    const context = await browser.newContext({ javaScriptEnabled: false });
    const page = await context.newPage();
    await page.goto(`${origin}/corpus.html`);
    expect(await page.locator('#controls').isVisible()).toBe(false);
    expect(await page.locator('#controls-off').isVisible()).toBe(true);
    expect(await page.locator('#build-line').textContent()).toContain(`--cap ${CAP} --length ${LENGTH} `);
    // The static page: its figures are those of the audited pair, the per-label dropped and padding ones too.
    const [shown, labelRows] = split(await liveFigures(page));
    expect(shown).toEqual(await staticFigures(await audited('--cap', String(CAP), '--length', String(LENGTH))));
    expect(labelRows).toEqual(await labelRowsAt(LENGTH));
    await context.close();
  });
});
