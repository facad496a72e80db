// `npm run bench`: generates seeded corpora in a temporary folder, runs every phase in a child process
// against the built lexlock (dist/, as users run it), prints one table and removes the corpora.
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { cpus, tmpdir, totalmem } from 'node:os';
import { join } from 'node:path';
import { benchOptions } from './benchOptions.js';
import { BENCH_MEMORY_LIMIT_MIB, boundedLines, checkSameFingerprint, fingerprintOf, LARGE_CAP, type MeasuredBuild } from './boundedBuild.js';
import { formatTable } from './formatTable.js';
import { writeMailCorpus, type WrittenCorpus } from './mailCorpus.js';
import type { PhaseName, PhaseResult, PhaseSpec } from './PhaseSpec.js';
import { writeReviewCsv } from './reviewCsv.js';
import { cliLexiconOf, spawnPhase } from './spawnPhase.js';
import { SCALED_PHASES, threadScaling, type ThreadScaling } from './threadScaling.js';
import { WINDOW_LENGTH, WINDOW_TEXT_BYTES } from './windowSizes.js';
import { writeZipfText } from './zipfText.js';

interface Corpus {
  name: string;
  path: string;
  written: WrittenCorpus;
  label?: string;
  length: number;
  /** The builds' `--cap`. */
  cap: number;
  distinct?: number;
}

const PHASES: readonly PhaseName[] = ['plain', 'tokenize', 'count', 'build', 'build-cli', 'baseline-build', 'encode-noop', 'encode-npy', 'baseline-encode', 'build-encode-cli', 'baseline-one-script', 'audit'];
/** Which hand-written step each lexlock phase is compared with. */
const BASELINE_OF: Partial<Record<PhaseName, PhaseName>> = {
  tokenize: 'plain',
  count: 'plain',
  build: 'baseline-build',
  'build-cli': 'baseline-build',
  'encode-noop': 'baseline-encode',
  'encode-npy': 'baseline-encode',
  audit: 'baseline-encode',
};
const TITLE: Record<PhaseName, string> = {
  plain: '(a) plain tokenizer',
  tokenize: 'tokenize',
  count: 'tokenize + count',
  build: 'build (1 thread)',
  'build-cli': 'build (CLI, all cores)',
  'build-cli-one-thread': 'build (CLI, --threads 1)',
  'build-cli-bounded': 'build (CLI, --memory-limit)',
  'baseline-build': '(b) baseline count+sort',
  'encode-noop': 'encode (no-op sink)',
  'encode-npy': 'encode (.npy, CLI)',
  'baseline-encode': '(b) baseline encode',
  'build-encode-cli': 'build --encode (CLI)',
  'baseline-one-script': '(c) one-script fit+encode',
  audit: 'audit',
  latency: 'serving',
  idle: 'idle',
};

const mb = (bytes: number) => bytes / 1e6;
const fixed = (n: number, digits = 1) => n.toFixed(digits);
const say = (text: string) => process.stderr.write(`${text}\n`);

async function measureCorpus(corpus: Corpus, scratch: string): Promise<Map<PhaseName, PhaseResult>> {
  const results = new Map<PhaseName, PhaseResult>();
  for (const phase of PHASES) {
    say(`  ${corpus.name}: ${phase}`);
    results.set(phase, await spawnPhase(specOf(corpus, phase, scratch)));
  }
  return results;
}

/** Spec of one phase on a corpus. */
function specOf(corpus: Corpus, phase: PhaseName, scratch: string): PhaseSpec {
  return {
    phase,
    corpus: corpus.path,
    lexicon: join(scratch, `${corpus.name}.lexicon.json`),
    out: join(scratch, `${corpus.name}-encoded`),
    cap: corpus.cap,
    length: corpus.length,
    ...(corpus.label === undefined ? {} : { label: corpus.label }),
  };
}

/**
 * The bounded build against the unbounded ones on a corpus (`--large`): `lexlock build --memory-limit`,
 * then `--threads 1`, each in its own process, beside the all-cores build measureCorpus ran; fails
 * the bench when the bounded lexicon's fingerprint is not the unbounded one's.
 */
async function measureBounded(corpus: Corpus, scratch: string, results: Map<PhaseName, PhaseResult>): Promise<string[]> {
  const measured = async (phase: PhaseName, result?: PhaseResult): Promise<MeasuredBuild> => {
    const spec = { ...specOf(corpus, phase, scratch), memoryLimitMiB: BENCH_MEMORY_LIMIT_MIB };
    if (result === undefined) say(`  ${corpus.name}: ${phase}`);
    const r = result ?? (await spawnPhase(spec));
    const path = cliLexiconOf(spec) as string;
    return { seconds: r.seconds, maxRssKiB: r.maxRssKiB, fingerprint: fingerprintOf(await readFile(path, 'utf8'), path) };
  };
  const allCores = await measured('build-cli', results.get('build-cli'));
  const bounded = await measured('build-cli-bounded');
  const oneThread = await measured('build-cli-one-thread');
  checkSameFingerprint(allCores, bounded, BENCH_MEMORY_LIMIT_MIB);
  checkSameFingerprint(oneThread, bounded, BENCH_MEMORY_LIMIT_MIB);
  return boundedLines(allCores, oneThread, bounded, BENCH_MEMORY_LIMIT_MIB);
}

function corpusRows(corpus: Corpus, results: Map<PhaseName, PhaseResult>): string[][] {
  const speed = (phase: PhaseName) => {
    const r = results.get(phase);
    return r === undefined || r.seconds === 0 ? 0 : mb(corpus.written.bytes) / r.seconds;
  };
  return PHASES.map((phase) => {
    const r = results.get(phase);
    const base = BASELINE_OF[phase];
    const own = speed(phase);
    return [
      corpus.name,
      TITLE[phase],
      fixed(own, 2),
      phase === 'plain' || phase.startsWith('baseline') ? '' : `${fixed(own / speed('plain'), 2)}x`,
      base === undefined || base === 'plain' ? '' : `${fixed(own / speed(base), 2)}x`,
      r === undefined ? '' : fixed(r.maxRssKiB / 1024, 0),
      r === undefined ? '' : fixed(r.seconds, 1),
    ];
  });
}

/** Fit + encode through the CLI against the baseline's count+sort plus encode, with the fit's peak memory. */
function endToEndLine(corpus: Corpus, results: Map<PhaseName, PhaseResult>): string {
  const s = (phase: PhaseName) => results.get(phase)?.seconds ?? 0;
  const ours = s('build-cli') + s('encode-npy');
  const theirs = s('baseline-build') + s('baseline-encode');
  const fitRss = (results.get('build-cli')?.maxRssKiB ?? 0) / 1024;
  const onePass = s('build-encode-cli');
  const onePassRss = (results.get('build-encode-cli')?.maxRssKiB ?? 0) / 1024;
  const oneScript = s('baseline-one-script');
  const oneScriptRss = (results.get('baseline-one-script')?.maxRssKiB ?? 0) / 1024;
  const ratio = (x: number, over = theirs) => (x > 0 ? `${fixed(over / x, 2)}x` : 'n/a');
  return (
    `${corpus.name}: build then encode ${fixed(ours, 2)} s vs ${fixed(theirs, 2)} s, ${ratio(ours)}; fit peak RSS ${fixed(fitRss, 0)} MiB\n` +
    `  ${corpus.name}: build --encode (one reading) ${fixed(onePass, 2)} s vs ${fixed(theirs, 2)} s, ${ratio(onePass)}; peak RSS ${fixed(onePassRss, 0)} MiB\n` +
    `  ${corpus.name}: build --encode vs the one-script baseline (c) ${fixed(oneScript, 2)} s at ${fixed(oneScriptRss, 0)} MiB peak RSS: ${ratio(onePass, oneScript)}`
  );
}

async function main(): Promise<void> {
  const options = benchOptions(process.argv.slice(2));
  const scratch = await mkdtemp(join(tmpdir(), 'lexlock-bench-'));
  const cpu = cpus();
  const machine = `${cpu.length} cores, ${cpu[0]?.model.trim() ?? 'unknown CPU'}, ${fixed(totalmem() / 2 ** 30, 1)} GiB, Node ${process.version}, ${process.platform}-${process.arch}`;
  try {
    say(`lexlock benchmark on ${machine}; corpora in ${scratch}`);
    const corpora: Corpus[] = [];
    say('generating the mail-like folder corpus');
    corpora.push({ name: 'mail', path: join(scratch, 'mail'), written: await writeMailCorpus(join(scratch, 'mail'), { files: options.mailFiles, seed: options.seed }), length: 400, cap: 24_000 });
    say('generating the review-like CSV');
    corpora.push({ name: 'reviews', path: join(scratch, 'reviews.csv'), written: await writeReviewCsv(join(scratch, 'reviews.csv'), { rows: options.reviewRows, seed: options.seed }), label: 'stars', length: 120, cap: 24_000 });
    if (options.largeMegabytes > 0) {
      say(`generating the large-vocabulary text (${options.largeMegabytes} MB)`);
      const written = await writeZipfText(join(scratch, 'large.txt'), { bytes: options.largeMegabytes * 1e6, seed: options.seed });
      corpora.push({ name: 'large-vocab', path: join(scratch, 'large.txt'), written, length: 64, cap: LARGE_CAP, distinct: written.distinctTokens });
    }
    const rows: string[][] = [];
    const endToEnd: string[] = [];
    const scaling: Array<[string, ThreadScaling]> = [];
    let bounded: string[] = [];
    for (const corpus of corpora) {
      const results = await measureCorpus(corpus, scratch);
      if (corpus.name === 'large-vocab') bounded = await measureBounded(corpus, scratch, results);
      rows.push(...corpusRows(corpus, results));
      endToEnd.push(endToEndLine(corpus, results));
      if (corpus.name !== 'large-vocab') {
        say(`  ${corpus.name}: thread scaling (two one-thread builds at once; build, encode, audit on 1 and 2 threads)`);
        const label = corpus.label === undefined ? {} : { label: corpus.label };
        scaling.push([corpus.name, await threadScaling({ corpus: corpus.path, lexicon: join(scratch, `${corpus.name}.lexicon.json`), out: scratch, cap: corpus.cap, length: corpus.length, ...label }, join(scratch, `${corpus.name}.scaling.json`))]);
      }
      const built = results.get('build');
      if (built !== undefined) corpus.distinct = built.figures['distinctTokens'] ?? 0;
    }

    say('serving: building a 50,000-token lexicon, then timing loads and single encodes');
    const serving = join(scratch, 'serving.txt');
    await writeZipfText(serving, { bytes: 6e6, seed: options.seed + 1 });
    const servingLexicon = join(scratch, 'serving.lexicon.json');
    const servingSpec: PhaseSpec = { phase: 'build', corpus: serving, lexicon: servingLexicon, out: scratch, cap: 50_000, length: 64 };
    await spawnPhase(servingSpec);
    const latency = await spawnPhase({ ...servingSpec, phase: 'latency' });
    const f = (name: string) => latency.figures[name] ?? 0;
    const idle = await spawnPhase({ ...servingSpec, phase: 'idle' });

    const out: string[] = [];
    out.push(`lexlock benchmark — ${machine}`);
    out.push('');
    out.push('Corpora (generated, seeded):');
    for (const c of corpora) {
      out.push(`  ${c.name.padEnd(12)} ${fixed(mb(c.written.bytes), 1).padStart(6)} MB  ${String(c.written.documents).padStart(8)} documents  ${String(c.distinct ?? 0).padStart(8)} distinct tokens  cap ${c.cap}`);
    }
    out.push('');
    out.push(formatTable(['corpus', 'phase', 'MB/s', 'vs (a)', 'vs (b)', 'peak RSS MiB', 'seconds'], rows));
    out.push('');
    out.push('vs (a): MB/s over the plain per-document tokenizer (NFKC, lower-case, wink-tokenizer, alien split; texts in memory).');
    out.push('vs (b): MB/s over the hand-written baseline (read files, same tokenizer, count in a Map and sort / look up ids and pad).');
    out.push('tokenize, tokenize + count and (a) exclude reading (texts loaded first); every other phase includes reading the corpus. Peak RSS is');
    out.push(`each phase's own child process (process.resourceUsage().maxRSS); an idle library child (Node, tsx loader, lexlock) peaks at`);
    out.push(`${fixed(idle.maxRssKiB / 1024, 0)} MiB. The CLI phases run dist/bin.js itself, as users do, with no loader; their seconds include loading it.`);
    out.push('');
    out.push('End to end, fit + encode vs the baseline (b) count+sort then encode: `lexlock build` then `lexlock encode` (all cores),');
    out.push('and `lexlock build --encode` (one reading of the corpus, all cores); (c) is a leaner baseline in one script: each document');
    out.push('read and tokenized once, every document\'s tokens kept in memory, counted, sorted, then encoded from the kept tokens:');
    for (const line of endToEnd) out.push(`  ${line}`);
    if (bounded.length > 0) {
      out.push(`Bounded memory, large-vocab (cap ${LARGE_CAP.toLocaleString('en-US')}; peak RSS of each build's own process; one run each):`);
      for (const line of bounded) out.push(`  ${line}`);
    }
    out.push('Thread scaling, 1 -> 2 threads (library steps): ceiling = two one-thread builds started at once, their combined speed over');
    out.push('one alone; efficiency = (2-thread speed-up) / ceiling; each time the median of 3 rounds taken in turn, each run a new process:');
    const x = (n: number | null) => (n === null ? 'n/a' : `${fixed(n, 2)}x`);
    for (const [name, t] of scaling) {
      const cells = SCALED_PHASES.map((phase) => {
        const up = t.speedUp[phase];
        const efficiency = up === null || t.ceiling === null ? 'n/a' : fixed(up / t.ceiling, 2);
        return `${TITLE[phase].replace(/ \(.*\)$/, '')} ${x(up)} (efficiency ${efficiency})`;
      });
      out.push(`  ${name}: ceiling ${x(t.ceiling)}; ${cells.join(', ')}`);
    }
    out.push(`Serving, lexicon of ${f('tokens')} tokens (${fixed(latency.maxRssKiB / 1024, 0)} MiB peak RSS):`);
    out.push(`  load: parseLexicon ${fixed(f('parseMs'))} ms, loadLexicon ${fixed(f('loadMs'))} ms (median of 12)`);
    out.push(`  encode one 50-word text: p50 ${fixed(f('p50Micros'))} µs, p99 ${fixed(f('p99Micros'))} µs (20,000 calls after 5,000 warm-up)`);
    out.push(`  heap allocated by one encode: ${fixed(f('encodeHeapBytes'), 0)} bytes (its Int32Array alone: ${fixed(f('outputHeapBytes'), 0)} bytes)`);
    out.push(`  encode of long texts at length ${WINDOW_LENGTH}, p50 / p99 µs (3,000 rounds of one call each, after 300; only the window a row keeps is tokenized):`);
    for (const kind of ['Ascii', 'Accented']) {
      for (const cut of ['end', 'start']) {
        const cells = WINDOW_TEXT_BYTES.map(([name]) => `${name} ${fixed(f(`window${name}${kind}Cut${cut}P50Micros`))} / ${fixed(f(`window${name}${kind}Cut${cut}P99Micros`))}`);
        const p99s = WINDOW_TEXT_BYTES.map(([name]) => f(`window${name}${kind}Cut${cut}P99Micros`));
        const spread = Math.max(...p99s) / Math.max(1e-9, Math.min(...p99s));
        out.push(`    ${kind === 'Ascii' ? 'ASCII   ' : 'accented'} cut ${cut.padEnd(5)} ${cells.join(', ')}; p99 spread ${fixed(spread, 2)}x`);
      }
    }
    out.push(`  the 300 KiB ASCII text encoded whole (variable length): ${fixed(f('whole300KiBMs'))} ms (median of 25)`);
    process.stdout.write(`${out.join('\n')}\n`);
  } finally {
    await rm(scratch, { recursive: true, force: true });
  }
}

await main();
