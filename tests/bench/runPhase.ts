import { readFile } from 'node:fs/promises';
import {
  auditCorpus,
  auditOnThreads,
  encodeCorpus,
  freeze,
  loadLexicon,
  parseLexicon,
  readCorpus,
  resolveRules,
  saveLexicon,
  Tally,
  tallyCorpus,
  tokenize,
  type CorpusOptions,
  type Lexicon,
} from 'lexlock/node';
import { allocatedBytes } from '../helpers/allocatedBytes.js';
import { baselineTexts } from './baselineTexts.js';
import type { PhaseResult, PhaseSpec } from './PhaseSpec.js';
import { percentile } from './percentile.js';
import { plainTokens } from './plainTokens.js';
import { longServiceText, serviceText } from './serviceText.js';
import { WINDOW_LENGTH, WINDOW_TEXT_BYTES } from './windowSizes.js';

function corpusOptions(spec: PhaseSpec): CorpusOptions {
  return spec.label === undefined ? {} : { label: spec.label };
}

async function texts(spec: PhaseSpec): Promise<string[]> {
  const out: string[] = [];
  for await (const doc of readCorpus(spec.corpus, corpusOptions(spec))) out.push(doc.text);
  return out;
}

function seconds(since: bigint): number {
  return Number(process.hrtime.bigint() - since) / 1e9;
}

function median(values: number[]): number {
  return percentile([...values].sort((a, b) => a - b), 50);
}

type Measured = Omit<PhaseResult, 'phase' | 'maxRssKiB'>;

async function measureTokenize(spec: PhaseSpec, tokens: (text: string) => string[]): Promise<Measured> {
  const docs = await texts(spec);
  let count = 0;
  const start = process.hrtime.bigint();
  for (const text of docs) count += tokens(text).length;
  return { seconds: seconds(start), figures: { documents: docs.length, tokens: count } };
}

/** Tokenizing and counting texts loaded first, as a build counts them (Tally.add: spans looked up in place). */
async function measureCount(spec: PhaseSpec): Promise<Measured> {
  const docs = await texts(spec);
  const start = process.hrtime.bigint();
  const tally = new Tally(resolveRules());
  for (const text of docs) tally.add(text);
  return { seconds: seconds(start), figures: { documents: docs.length, tokens: tally.tokens, distinctTokens: tally.types } };
}

async function measureBuild(spec: PhaseSpec): Promise<Measured> {
  const start = process.hrtime.bigint();
  const { tally, snippets } = await tallyCorpus(readCorpus(spec.corpus, corpusOptions(spec)), resolveRules(), { threads: spec.threads ?? 1 });
  const lexicon = freeze(tally, { cap: spec.cap, snippets, shape: { length: spec.length, pad: 'start', cut: 'end' } });
  const time = seconds(start);
  await saveLexicon(spec.lexicon, lexicon, { force: true });
  return { seconds: time, figures: { distinctTokens: tally.types, size: lexicon.size } };
}

/** Most frequent first, ties in code-unit order, the cap's tokens kept. */
function ranked(counts: Map<string, number>, cap: number): Array<[string, number]> {
  return [...counts].sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0)).slice(0, cap);
}

async function measureBaselineBuild(spec: PhaseSpec): Promise<Measured> {
  const start = process.hrtime.bigint();
  const counts = new Map<string, number>();
  for await (const text of baselineTexts(spec.corpus)) for (const t of plainTokens(text)) counts.set(t, (counts.get(t) ?? 0) + 1);
  const kept = ranked(counts, spec.cap);
  return { seconds: seconds(start), figures: { distinctTokens: counts.size, kept: kept.length } };
}

/**
 * Fit and encode in one script, as a careful user writes it: each document read and tokenized once
 * (the same reader and tokenizer as the two-step baseline), every document's tokens kept in memory,
 * counted in a Map, sorted, then each kept token list looked up and padded into a row (ids from 2:
 * 0 pads, 1 is out of vocabulary; the row is filled and dropped, as the baseline encode does).
 */
async function measureBaselineOneScript(spec: PhaseSpec): Promise<Measured> {
  const start = process.hrtime.bigint();
  const documents: string[][] = [];
  const counts = new Map<string, number>();
  for await (const text of baselineTexts(spec.corpus)) {
    const tokens = plainTokens(text);
    documents.push(tokens);
    for (const t of tokens) counts.set(t, (counts.get(t) ?? 0) + 1);
  }
  const ids = new Map(ranked(counts, spec.cap).map(([t], i) => [t, i + 2]));
  const row = new Int32Array(spec.length);
  let checksum = 0;
  for (const tokens of documents) {
    row.fill(0);
    const kept = Math.min(tokens.length, spec.length);
    for (let i = 0; i < kept; i++) row[spec.length - kept + i] = ids.get(tokens[i] ?? '') ?? 1;
    checksum += row[spec.length - 1] ?? 0;
  }
  return { seconds: seconds(start), figures: { documents: documents.length, distinctTokens: counts.size, checksum } };
}

async function measureEncodeNoop(spec: PhaseSpec): Promise<Measured> {
  const lexicon = await loadLexicon(spec.lexicon);
  const start = process.hrtime.bigint();
  const stats = await encodeCorpus(readCorpus(spec.corpus, corpusOptions(spec)), lexicon, lexicon.shape, { row() {} }, { threads: spec.threads ?? 1 });
  return { seconds: seconds(start), figures: { documents: stats.documents, tokens: stats.tokens } };
}

async function measureBaselineEncode(spec: PhaseSpec): Promise<Measured> {
  const file = JSON.parse(await readFile(spec.lexicon, 'utf8')) as { encoding: { tokens: string[] } };
  const ids = new Map(file.encoding.tokens.map((t, i) => [t, i + 2]));
  const row = new Int32Array(spec.length);
  let documents = 0;
  const start = process.hrtime.bigint();
  for await (const text of baselineTexts(spec.corpus)) {
    const tokens = plainTokens(text);
    row.fill(0);
    const kept = Math.min(tokens.length, spec.length);
    for (let i = 0; i < kept; i++) row[spec.length - kept + i] = ids.get(tokens[i] ?? '') ?? 1;
    documents += 1;
  }
  return { seconds: seconds(start), figures: { documents } };
}

async function measureAudit(spec: PhaseSpec): Promise<Measured> {
  const lexicon = await loadLexicon(spec.lexicon);
  const start = process.hrtime.bigint();
  const documents = readCorpus(spec.corpus, corpusOptions(spec));
  // The table's audit is `auditCorpus` itself; the thread-scaling runs (threads given) use auditOnThreads, 1 and 2 alike.
  const report = spec.threads === undefined ? await auditCorpus(documents, lexicon) : await auditOnThreads(documents, lexicon, { threads: spec.threads });
  return { seconds: seconds(start), figures: { oovRate: report.oovRate } };
}

/** Serving: load times of the lexicon file, then p50/p99 of encoding one 50-word text (after warm-up). */
async function measureLatency(spec: PhaseSpec): Promise<Measured> {
  const json = await readFile(spec.lexicon, 'utf8');
  const parseMs: number[] = [];
  const loadMs: number[] = [];
  for (let i = 0; i < 12; i++) {
    let t = process.hrtime.bigint();
    parseLexicon(json);
    parseMs.push(seconds(t) * 1e3);
    t = process.hrtime.bigint();
    await loadLexicon(spec.lexicon);
    loadMs.push(seconds(t) * 1e3);
  }
  const lexicon = await loadLexicon(spec.lexicon);
  const text = serviceText(lexicon, 50, 1);
  for (let i = 0; i < 5_000; i++) lexicon.encode(text);
  const calls = 20_000;
  const micros = new Float64Array(calls);
  let sum = 0;
  for (let i = 0; i < calls; i++) {
    const t = process.hrtime.bigint();
    const ids = lexicon.encode(text);
    micros[i] = Number(process.hrtime.bigint() - t) / 1e3;
    sum += ids[ids.length - 1] ?? 0;
  }
  const sorted = micros.sort();
  const length = lexicon.shape?.length ?? lexicon.encode(text).length;
  const figures: Record<string, number> = {};
  measureWindows(lexicon, figures);
  return {
    seconds: 0,
    figures: {
      ...figures,
      tokens: lexicon.size - 2,
      parseMs: median(parseMs),
      loadMs: median(loadMs),
      p50Micros: percentile(sorted, 50),
      p99Micros: percentile(sorted, 99),
      checksum: sum,
      // V8 heap one encode allocates, next to what allocating its output alone does (tests/helpers/allocatedBytes.ts).
      encodeHeapBytes: allocatedBytes(() => lexicon.encode(text)),
      outputHeapBytes: allocatedBytes(() => new Int32Array(length)),
    },
  };
}

/**
 * Shaped encode of long texts (issue 14, point 7): p50 and p99 of one encode at length 200, for each
 * size, cut end and text (ASCII, or with accents to normalize). The calls of all of them take turns
 * (one of each, round after round, after warm-up), so a busy moment of the machine falls on all alike.
 * Also the time of encoding the 300 KiB ASCII text whole (variable length), the work a window saves.
 */
function measureWindows(lexicon: Lexicon, figures: Record<string, number>): void {
  const series: Array<{ key: string; text: string; options: { shape: { length: number; pad: 'start'; cut: 'start' | 'end' } } }> = [];
  for (const accented of [false, true]) {
    for (const [name, bytes] of WINDOW_TEXT_BYTES) {
      const text = longServiceText(lexicon, bytes, 7, accented);
      for (const cut of ['start', 'end'] as const) {
        series.push({ key: `window${name}${accented ? 'Accented' : 'Ascii'}Cut${cut}`, text, options: { shape: { length: WINDOW_LENGTH, pad: 'start', cut } } });
      }
    }
  }
  for (let round = 0; round < 300; round++) for (const s of series) lexicon.encode(s.text, s.options);
  const rounds = 3_000;
  const micros = series.map(() => new Float64Array(rounds));
  for (let round = 0; round < rounds; round++) {
    series.forEach((s, i) => {
      const t = process.hrtime.bigint();
      lexicon.encode(s.text, s.options);
      (micros[i] as Float64Array)[round] = Number(process.hrtime.bigint() - t) / 1e3;
    });
  }
  series.forEach((s, i) => {
    const sorted = (micros[i] as Float64Array).sort();
    figures[`${s.key}P50Micros`] = percentile(sorted, 50);
    figures[`${s.key}P99Micros`] = percentile(sorted, 99);
  });
  const whole = longServiceText(lexicon, 300 * 1024, 7, false);
  const ms: number[] = [];
  for (let i = 0; i < 25; i++) {
    const t = process.hrtime.bigint();
    lexicon.encode(whole, { shape: null });
    ms.push(seconds(t) * 1e3);
  }
  figures.whole300KiBMs = median(ms);
}

/** The phases run in this process (the command-line phases run dist/bin.js: see spawnPhase). */
type CliPhase = 'build-cli' | 'build-cli-one-thread' | 'build-cli-bounded' | 'build-encode-cli' | 'encode-npy';
const CLI_PHASES: readonly PhaseSpec['phase'][] = ['build-cli', 'build-cli-one-thread', 'build-cli-bounded', 'build-encode-cli', 'encode-npy'] satisfies CliPhase[];
const PHASES: Record<Exclude<PhaseSpec['phase'], CliPhase>, (spec: PhaseSpec) => Promise<Measured>> = {
  tokenize: (spec) => {
    const rules = resolveRules();
    return measureTokenize(spec, (text) => tokenize(text, rules));
  },
  count: measureCount,
  plain: (spec) => measureTokenize(spec, plainTokens),
  build: measureBuild,
  'baseline-build': measureBaselineBuild,
  'encode-noop': measureEncodeNoop,
  'baseline-encode': measureBaselineEncode,
  'baseline-one-script': measureBaselineOneScript,
  audit: measureAudit,
  latency: measureLatency,
  idle: () => Promise.resolve({ seconds: 0, figures: {} }),
};

/** Runs one phase in this process and reports its time, figures and this process's peak memory. */
export async function runPhase(spec: PhaseSpec): Promise<PhaseResult> {
  const phase = spec.phase;
  if (CLI_PHASES.includes(phase)) throw new Error(`${phase} runs the built executable: use spawnPhase`);
  const measured = await PHASES[phase as Exclude<PhaseSpec['phase'], CliPhase>](spec);
  return { phase: spec.phase, ...measured, maxRssKiB: process.resourceUsage().maxRSS };
}
