import { describeShape, type Shape } from '../lexicon/Shape.js';
import type { AuditCounts } from '../audit/AuditCounts.js';
import type { CoverageReport } from '../audit/CoverageReport.js';
import { renderReport } from '../audit/report/renderReport.js';
import { readCorpus } from '../corpus/readCorpus.js';
import { withLocks } from '../files/outputLock.js';
import { writeWhole } from '../files/writeWhole.js';
import { loadLexicon } from '../files/loadLexicon.js';
import { assertWritable } from '../files/refuseOverwrite.js';
import { freeze } from '../lexicon/freeze.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { LexlockError } from '../LexlockError.js';
import { auditCountsOnThreads, type PageRequest } from '../pipeline/auditOnThreads.js';
import { auditReport } from '../audit/auditCorpus.js';
import { capGrid } from '../audit/explore/pageBudget.js';
import { pageDataOf } from '../audit/explore/pageDataOf.js';
import { rankingLexicon } from '../audit/explore/rankingLexicon.js';
import { buildWords } from './buildWords.js';
import { tallyCorpus } from '../pipeline/tallyCorpus.js';
import { VERSION } from '../version.js';
import { auditSummary, crossedGates, type Gates } from './auditSummary.js';
import { paintFor } from './colour.js';
import { corpusBytes } from './corpusBytes.js';
import type { Io } from './Io.js';
import { parseArgs, positionals, valueOf, wholeNumberFlag, type ParsedArgs } from './parseArgs.js';
import { createProgress } from './progress.js';
import { assertFolderLabelled, assertLabelsRead, NO_LABELS_FLAG, noLabelsFlag, withoutLabels } from './labelsFlag.js';
import { CORPUS_FLAGS, RULE_FLAGS, SHAPE_FLAGS, corpusOptions, rulesFromFlags, shapeFromFlags, lexiconFieldDefaults, threadsFlag } from './sharedFlags.js';

/** `lexlock audit --help`. */
export const AUDIT_HELP = `lexlock audit <corpus> (--lexicon <lexicon.json> | --cap N) [options]

What a vocabulary cap and a sequence length cost on a corpus: OOV, truncation and padding, overall and
per label, the caps and lengths that would cover 90/95/99 %, the most frequent OOV tokens, and with
--lexicon the drift from the corpus the lexicon was built on.

  --lexicon FILE        audit held-out or live data against the lexicon a model was trained with
  --cap N               or: count the corpus, keep N tokens, and audit it against itself
  --min-count N         with --cap: drop tokens seen fewer than N times (default 1)
  --level, --case, --unicode, --spaces, --drop, --collapse   with --cap: text rules as in lexlock build
  --length L            count truncation and padding at length L (default: the lexicon's shape)
  --pad start|end, --cut start|end   with --length: where the zeros go, which end a long document loses (default end, end)
  --text FIELD, --label FIELD, --bad-text fail|replace|skip, --record-limit MiB   as in lexlock build
  --no-labels           audit without labels (a lexicon with labels otherwise needs them read)
  --json                print the report as one JSON object
  --report FILE.html    also write a self-contained HTML page: the charts, and a cap and a length control that
                        recompute the figures in the page (--force to overwrite)
  --max-oov R           exit 3 when the OOV rate is above R (a share such as 0.05, or 5%)
  --max-truncated R     exit 3 when the share of truncated documents is above R
  --threads N           worker threads (default: the machine's cores from 8 MiB of corpus); the report is the same for any N
  -q, --quiet           no progress on stderr
`;

function shareFlag(args: ParsedArgs, name: string): number | null {
  const raw = valueOf(args, name);
  if (raw === undefined) return null;
  const percentForm = raw.endsWith('%');
  const digits = percentForm ? raw.slice(0, -1).trim() : raw;
  // A percentage is read as the decimal it spells, `5.6%` as 5.6e-2: 0.056, the share 7 of 125 is.
  // (5.6 / 100 is 0.055999999999999994 in binary, which a rate of exactly 5.6 % would be above.)
  const share = percentForm ? (/^[+-]?(\d+\.?\d*|\.\d+)$/.test(digits) ? Number(`${digits}e-2`) : Number.NaN) : Number(raw);
  if (raw.trim() === '' || !Number.isFinite(share) || share < 0 || share > 1) {
    throw new LexlockError('USAGE_BAD_VALUE', `--${name}: "${raw}" is not a share from 0 to 1 (such as 0.05) or a percentage (such as 5%)`, { field: `--${name}` });
  }
  return share;
}

const RULE_FLAG_NAMES = ['level', 'case', 'unicode', 'spaces', 'drop', 'collapse', 'min-count'];

/** `lexlock audit`: exit 0, 1 for bad input, 2 for bad usage, 3 when a threshold is crossed. */
export async function audit(argv: readonly string[], io: Io): Promise<number> {
  const args = parseArgs('audit', argv, {
    lexicon: { kind: 'value' },
    cap: { kind: 'value' },
    'min-count': { kind: 'value' },
    json: { kind: 'switch' },
    report: { kind: 'value' },
    force: { kind: 'switch' },
    'max-oov': { kind: 'value' },
    'max-truncated': { kind: 'value' },
    ...NO_LABELS_FLAG,
    ...CORPUS_FLAGS,
    ...RULE_FLAGS,
    ...SHAPE_FLAGS,
  });
  const [corpus] = positionals('audit', args, ['corpus']) as [string];
  const lexiconPath = valueOf(args, 'lexicon');
  const cap = wholeNumberFlag(args, 'cap', 1);
  if ((lexiconPath === undefined) === (cap === undefined)) {
    throw new LexlockError(
      'USAGE_MISSING',
      lexiconPath === undefined
        ? 'pass --lexicon FILE to audit against a lexicon, or --cap N to audit the corpus against itself'
        : '--lexicon and --cap exclude each other: the lexicon already fixes its vocabulary',
      { field: lexiconPath === undefined ? '--lexicon' : '--cap' },
    );
  }
  if (lexiconPath !== undefined) {
    const given = RULE_FLAG_NAMES.find((f) => args.values.has(f));
    if (given !== undefined) {
      throw new LexlockError('USAGE_BAD_VALUE', `--${given} goes with --cap; with --lexicon the lexicon fixes the text rules`, { field: `--${given}` });
    }
  }
  const noLabels = noLabelsFlag(args);
  const gates: Gates = { maxOov: shareFlag(args, 'max-oov'), maxTruncated: shareFlag(args, 'max-truncated') };
  const flagShape = shapeFromFlags(args);
  const reportPath = valueOf(args, 'report');
  // The report's lock is held from here on: a second run writing the same page fails at once.
  return withLocks(reportPath === undefined ? [] : [reportPath], () => auditHolding({ args, io, corpus, lexiconPath, cap, gates, flagShape, reportPath, noLabels }));
}

/** The rest of `lexlock audit`, once the flags are checked and the report's lock is held. */
async function auditHolding(context: {
  args: ParsedArgs;
  io: Io;
  corpus: string;
  lexiconPath: string | undefined;
  cap: number | undefined;
  gates: Gates;
  flagShape: Shape | null;
  reportPath: string | undefined;
  noLabels: boolean;
}): Promise<number> {
  const { args, io, corpus, lexiconPath, cap, gates, flagShape, reportPath, noLabels } = context;
  if (reportPath !== undefined) await assertWritable(reportPath, args.switches.has('force'));
  const quiet = args.switches.has('quiet');
  const threads = threadsFlag(args, await corpusBytes(corpus));
  const totalBytes = await corpusBytes(corpus);

  let lexicon: Lexicon;
  let options;
  // What the report page's controls need: the cap grid and, with --cap, a lexicon of every token to rank by.
  let page: PageRequest | undefined;
  if (lexiconPath !== undefined) {
    lexicon = await loadLexicon(lexiconPath);
    const defaults = lexiconFieldDefaults(corpus, lexicon);
    options = corpusOptions(args, noLabels ? { text: defaults.text } : defaults);
    assertLabelsRead(corpus, readCorpus(corpus, options).kind, options.label, lexicon, lexiconPath, noLabels, 'audit without labels');
    if (reportPath !== undefined) {
      const ranked = lexicon.encoding.tokens.length - lexicon.encoding.layout.reserved;
      page = { grid: capGrid(ranked, ranked, lexicon.labels.length) };
    }
  } else {
    options = corpusOptions(args);
    const rules = rulesFromFlags(args);
    const counting = createProgress(io, 'audit 1/2 counting', { quiet, totalBytes });
    try {
      const counted = readCorpus(corpus, { ...options, onProgress: (p) => counting.update(p) });
      const { tally } = await tallyCorpus(noLabels && counted.kind === 'folder' ? withoutLabels(counted) : counted, rules, { threads });
      const minCount = wholeNumberFlag(args, 'min-count', 1) ?? 1;
      lexicon = freeze(tally, { cap: cap ?? null, minCount, shape: flagShape });
      if (reportPath !== undefined) {
        const ranking = rankingLexicon(tally, minCount, lexicon);
        page = { grid: capGrid(ranking.encoding.tokens.length, cap ?? 0, tally.labels.size), ranking };
      }
    } finally {
      counting.done();
    }
  }
  const shape = flagShape ?? lexicon.shape;
  const progress = createProgress(io, lexiconPath === undefined ? 'audit 2/2 measuring' : 'audit', { quiet, totalBytes });
  const reader = readCorpus(corpus, { ...options, onProgress: (p) => progress.update(p) });
  let counts: AuditCounts;
  try {
    counts = await auditCountsOnThreads(noLabels && reader.kind === 'folder' ? withoutLabels(reader) : reader, lexicon, { shape, threads, ...(page === undefined ? {} : { page }) });
  } finally {
    progress.done();
  }
  const report: CoverageReport = auditReport(counts, lexicon, { shape, drift: lexiconPath !== undefined });
  if (lexiconPath !== undefined) {
    const labelled = Object.values(report.labels).reduce((sum, l) => sum + l.documents, 0);
    assertFolderLabelled(corpus, reader.kind, labelled, lexicon, lexiconPath, noLabels, 'audit without labels');
  }

  if (reportPath !== undefined) {
    const settings: Record<string, string> = lexiconPath === undefined ? { cap: String(cap) } : { lexicon: lexiconPath };
    if (shape !== null) settings.length = describeShape(shape);
    if (options.label !== undefined) settings.label = options.label;
    if (gates.maxOov !== null) settings['max OOV'] = String(gates.maxOov);
    if (gates.maxTruncated !== null) settings['max truncated'] = String(gates.maxTruncated);
    const build = buildWords({ corpus, lexicon, fromLexicon: lexiconPath !== undefined, args, text: options.text, label: options.label });
    const data = pageDataOf(counts, report, { lexicon, shape, build, ranking: lexiconPath === undefined ? 'corpus' : 'lexicon' });
    const html = renderReport(report, { corpus, lexiconFile: lexiconPath ?? null, settings, generatedAt: new Date().toISOString(), lexlockVersion: VERSION }, data);
    await writeWhole(reportPath, html);
  }
  const crossed = crossedGates(report, gates);
  if (args.switches.has('json')) {
    io.stdout.write(`${JSON.stringify(report)}\n`);
  } else {
    const against = lexiconPath === undefined ? `itself at cap ${cap}` : `${lexiconPath} (${lexicon.fingerprint})`;
    io.stdout.write(auditSummary(report, `audit of ${corpus} against ${against}`, gates, paintFor(io)));
    if (reportPath !== undefined) io.stdout.write(`\nwrote ${reportPath}\n`);
  }
  if (reader.stats.replaced > 0 || reader.stats.skipped > 0) {
    io.stderr.write(`lexlock audit: note: ${reader.stats.replaced} documents had invalid UTF-8 replaced, ${reader.stats.skipped} were skipped\n`);
  }
  if (crossed.length > 0) {
    io.stderr.write(`lexlock audit: ${crossed.join('; ')}\n`);
    return 3;
  }
  return 0;
}
