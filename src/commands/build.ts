import { DEFAULT_CAP, freeze } from '../lexicon/freeze.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import type { EncodeStats } from '../pipeline/encodeCorpus.js';
import { tallyAndRecord, type RecordedTally } from '../pipeline/tallyAndRecord.js';
import { readCorpus } from '../corpus/readCorpus.js';
import { serializeLexicon } from '../artifact/serializeLexicon.js';
import { commitAll } from '../files/commitAll.js';
import { withLocks } from '../files/outputLock.js';
import { openAtomic, writeWhole, type AtomicFile } from '../files/writeWhole.js';
import { assertWritable } from '../files/refuseOverwrite.js';
import { boundedCorpusTally } from '../pipeline/boundedCorpusTally.js';
import { tallyCorpus } from '../pipeline/tallyCorpus.js';
import { loadTally } from '../files/loadTally.js';
import { resolveRules } from '../rules/TextRules.js';
import type { TallyFile } from '../tally/tallyFile.js';
import { formatWhere, isLexlockError, LexlockError } from '../LexlockError.js';
import type { Shape } from '../lexicon/Shape.js';
import type { TextRules } from '../rules/TextRules.js';
import { resolve, sep } from 'node:path';
import type { MeasuredFit } from '../lexicon/measuredFit.js';
import { formatBytes, LEAST_LIMIT_MIB, memoryPlan, MOST_LIMIT_MIB, recordLimitFor, type MemoryPlan } from '../tally/memoryPlan.js';
import { RECORD_LIMIT_DEFAULT } from '../corpus/recordLimit.js';
import { limitChunkMemo } from '../rules/fast/scanWordTokens.js';
import { describeLexiconText } from './describeLexicon.js';
import type { Io } from './Io.js';
import { assertOutputWritable, isJsonl, openEncodedOutput, type EncodedOutput, type EncodedPart, type EncodedSource } from '../output/EncodedOutput.js';
import type { CorpusKind } from '../corpus/corpusKind.js';
import { assertOutputName, encodedSummary } from './encodedOutput.js';
import { count, pairs } from './format.js';
import { parseArgs, positionals, valueOf, wholeNumberFlag, type ParsedArgs } from './parseArgs.js';
import { corpusBytes } from './corpusBytes.js';
import { createProgress } from './progress.js';
import { CORPUS_FLAGS, RULE_FLAGS, SHAPE_FLAGS, corpusOptions, rulesFromFlags, shapeFromFlags, threadsFlag, badTextNotes, corpusFields } from './sharedFlags.js';
import { spillPathFor } from '../files/tempNames.js';

/** `lexlock build --help`. */
export const BUILD_HELP = `lexlock build <corpus | all.tally> -o <lexicon.json> [options]

Counts the tokens of a corpus and writes a fingerprinted lexicon file. Given a .tally file (from
lexlock tally or merge) it freezes those counts instead; the rule and corpus flags are refused then.

  -o, --output FILE     where to write the lexicon (refused if it exists, unless --force)
  --cap N               keep the N most frequent tokens (default 30000)
  --min-count N         drop tokens seen fewer than N times (default 1)
  --oov first|last      OOV id 1 (default) or the id after the last token
  --reserve TOKEN       a token that takes an id right after the specials (repeatable)
  --level word|char     word tokens (default) or characters
  --spaces keep|drop    --level char: each run of white space is one ' ' token (keep, default) or none
  --case lower|keep     lower-case the text (default) or keep case
  --unicode NFKC|NFC|none   Unicode normalization (default NFKC)
  --drop TYPES          leave out token types, e.g. punctuation,emoji
  --collapse TYPES      one placeholder per type, e.g. number,url -> <number>, <url>
  --length L            store a fixed length: every row has L ids
  --pad start|end       with --length: where the padding zeros go in a short row (default end)
  --cut start|end       with --length: which end of a long document loses tokens (default end)
  --text FIELD          text column or member for .csv/.tsv/.jsonl (default text)
  --label FIELD         label column or member (folders: the first folder is the label)
  --bad-text fail|replace|skip   what to do with invalid UTF-8 (default fail)
  --record-limit MiB    refuse any one line, CSV record or folder file larger than this (default 64, at most 256)
  --force               overwrite an existing lexicon file
  --threads N           worker threads (default: the machine's cores from 8 MiB of corpus); the lexicon is the same for any N
  --memory-limit MiB    count within MiB of memory (at least 32; one or two passes): the exact lexicon,
                        or a refusal that names a limit that will do; one document may then take
                        only a share of it
  --encode OUT          also encode the corpus with the new lexicon, from the same reading: OUT as
                        in lexlock encode -o (.jsonl, or a folder of .npy files, which needs --length);
                        keeps 4 bytes a token in a temporary file beside -o until then
  --key FIELD           with --encode: key column or member of the rows, as in lexlock encode --key
  -q, --quiet           no progress on stderr
`;


/** `lexlock build`: corpus -> lexicon file. */
export async function build(argv: readonly string[], io: Io): Promise<number> {
  const args = parseArgs('build', argv, {
    output: { kind: 'value', short: 'o' },
    cap: { kind: 'value' },
    'min-count': { kind: 'value' },
    oov: { kind: 'value' },
    reserve: { kind: 'value', repeat: true },
    force: { kind: 'switch' },
    'memory-limit': { kind: 'value' },
    encode: { kind: 'value' },
    key: { kind: 'value' },
    ...CORPUS_FLAGS,
    ...RULE_FLAGS,
    ...SHAPE_FLAGS,
  });
  const [corpus] = positionals('build', args, ['corpus']) as [string];
  const output = valueOf(args, 'output');
  if (output === undefined) throw new LexlockError('USAGE_MISSING', '-o/--output is required: where should the lexicon go?', { field: '--output' });
  const cap = wholeNumberFlag(args, 'cap', 1) ?? DEFAULT_CAP;
  const minCount = wholeNumberFlag(args, 'min-count', 1) ?? 1;
  const oovFlag = valueOf(args, 'oov');
  if (oovFlag !== undefined && oovFlag !== 'first' && oovFlag !== 'last') {
    throw new LexlockError('USAGE_BAD_VALUE', `--oov: "${oovFlag}" is not one of first, last`, { field: '--oov' });
  }
  const oov: 'first' | 'last' = oovFlag ?? 'first';
  const shape = shapeFromFlags(args);
  const force = args.switches.has('force');
  const fromTally = isTallyPath(corpus);
  if (fromTally) refuseCorpusFlags(args.values);
  const rules = fromTally ? null : rulesFromFlags(args);
  const options = corpusOptions(args);
  const encodeTo = valueOf(args, 'encode');
  if (encodeTo !== undefined) refuseWithEncode(args, fromTally, encodeTo, shape !== null);
  else if (args.values.has('key') && !fromTally) {
    throw new LexlockError('USAGE_BAD_VALUE', '--key goes with --encode: it names the field that keys the encoded rows; add --encode OUT, or leave out --key', { field: '--key' });
  }
  if (encodeTo !== undefined && resolve(encodeTo) === resolve(output)) {
    throw new LexlockError('USAGE_BAD_VALUE', `--encode ${encodeTo}: that is where -o puts the lexicon; name another output`, { field: '--encode' });
  }
  // The outputs' locks are held from here on: a second run writing either fails at once.
  const outputs = encodeTo === undefined ? [output] : [output, encodeTo];
  const context = { args, io, corpus, output, cap, minCount, oov, shape, force, fromTally, rules, options, encodeTo };
  return withLocks(outputs, () => buildHolding(context)).catch((e: unknown) => {
    throw encodeTo === undefined ? e : alsoNotWritten(e, output, encodeTo);
  });
}

/** The rest of `lexlock build`, once the flags are checked and the outputs' locks are held. */
async function buildHolding(context: {
  args: ParsedArgs;
  io: Io;
  corpus: string;
  output: string;
  cap: number;
  minCount: number;
  oov: 'first' | 'last';
  shape: Shape | null;
  force: boolean;
  fromTally: boolean;
  rules: TextRules | null;
  options: ReturnType<typeof corpusOptions>;
  encodeTo: string | undefined;
}): Promise<number> {
  const { args, io, corpus, output, cap, minCount, oov, shape, force, fromTally, rules, options, encodeTo } = context;
  await assertWritable(output, force);
  if (encodeTo !== undefined) await assertOutputWritable(encodeTo, force, null);

  let counted: TallyFile;
  let stats = { replaced: 0, skipped: 0 };
  let kind: CorpusKind = 'txt';
  let recorded: RecordedTally | null = null;
  let measured: MeasuredFit | undefined;
  if (fromTally) {
    counted = await loadTally(corpus);
    const r = counted.tally.rules;
    const current = resolveRules({ level: r.level }).tokenizer;
    if (r.tokenizer !== current) {
      throw new LexlockError('BAD_TALLY', `${corpus}: counted with ${r.tokenizer}, but this lexlock tokenizes with ${current}; count the parts again with this lexlock`, { file: corpus, field: 'rules.tokenizer' });
    }
  } else {
    const progress = createProgress(io, 'build', { quiet: args.switches.has('quiet'), totalBytes: await corpusBytes(corpus) });
    const memoryLimit = memoryLimitFlag(args);
    const reserved = args.values.get('reserve') ?? [];
    const plan = memoryLimit === undefined ? null : memoryPlan(memoryLimit, cap + new Set(reserved).size);
    const recordLimit = options.maxRecordBytes ?? RECORD_LIMIT_DEFAULT;
    let reader = readCorpus(corpus, { ...options, onProgress: (p) => progress.update(p) });
    // Under a memory limit one document may take only the plan's share: the reader refuses a longer one.
    const readerLimit = plan === null ? recordLimit : Math.min(recordLimit, recordLimitFor(plan, reader.kind));
    if (readerLimit !== recordLimit) reader = readCorpus(corpus, { ...options, maxRecordBytes: readerLimit, onProgress: (p) => progress.update(p) });
    let result;
    try {
      if (encodeTo !== undefined) result = recorded = await tallyAndRecord(reader, rules ?? resolveRules(), spillPathFor(output), { threads: threadsFlag(args, await corpusBytes(corpus)) });
      else if (plan === null) result = await tallyCorpus(reader, rules ?? resolveRules(), { threads: threadsFlag(args, await corpusBytes(corpus)) });
      else {
        limitChunkMemo(plan.memoBytes);
        result = await boundedCorpusTally(() => reader, rules ?? resolveRules(), { cap, minCount, reserved, memoryLimitMiB: plan.limitMiB }).catch((e: unknown) => {
          throw isLexlockError(e) && e.code === 'RECORD_TOO_LARGE' && readerLimit < recordLimit ? documentTooLarge(e, plan, reader.kind, recordLimit, cap + new Set(reserved).size) : e;
        });
        measured = result.measured;
      }
    } finally {
      progress.done();
    }
    stats = reader.stats;
    kind = reader.kind;
    counted = {
      tally: result.tally,
      snippets: result.snippets,
      fields: {
        ...corpusFields(reader.kind, options),
      },
    };
  }
  let lexicon: Lexicon;
  try {
    lexicon = freeze(counted.tally, {
      cap,
      minCount,
      oov,
      reserved: args.values.get('reserve') ?? [],
      shape,
      // No corpus text as canaries: a lexicon ships to every service and browser that loads it, and a
      // short document may hold personal data (the fixed probe texts are the canaries).
      source: corpus,
      fields: counted.fields,
      // What encode, audit and serving do with invalid UTF-8 by default (a tally, read when counted, gives fail).
      badText: options.badText,
      ...(measured === undefined ? {} : { measured }),
    });
  } catch (e) {
    await recorded?.discard();
    throw e;
  }
  let out = `wrote ${output}\n${describeLexiconText(lexicon)}`;
  out += badTextNotes(stats);
  if (recorded === null || encodeTo === undefined) {
    await writeWhole(output, serializeLexicon(lexicon));
  } else {
    const source: EncodedSource = { lexicon, lexiconPath: output, corpus, badText: options.badText, keyField: options.key ?? null, readStats: stats };
    const { stats: encoded, parts } = await writeBoth(output, lexicon, recorded, encodeTo, source);
    out += `wrote ${encodeTo}\n${pairs(encodedSummary(encoded, parts, shape, source, kind, null))}`;
  }
  io.stdout.write(out);
  return 0;
}

/**
 * build --encode's two outputs, all or nothing: the lexicon is written and flushed under a temporary
 * name, the corpus encoded from the spill, every document checked to have become one row, and only
 * then are both put in place together (commitAll: the encoded output first, so a failure of the
 * lexicon's rename can still put the old encoded output back).
 */
async function writeBoth(output: string, lexicon: Lexicon, recorded: RecordedTally, encodeTo: string, source: EncodedSource): Promise<{ stats: EncodeStats; parts: EncodedPart[] }> {
  let lexiconFile: AtomicFile | null = null;
  let sink: EncodedOutput | null = null;
  try {
    lexiconFile = await openAtomic(output);
    await lexiconFile.write(new TextEncoder().encode(serializeLexicon(lexicon)));
    await lexiconFile.seal();
    sink = await openEncodedOutput(encodeTo, lexicon.shape, source, null);
    const encoded = await recorded.encode(lexicon, lexicon.shape, sink);
    const documents = lexicon.fit?.documents ?? recorded.tally.documents;
    if (encoded.documents !== recorded.tally.documents || documents !== recorded.tally.documents) {
      throw new LexlockError(
        'IO',
        `${encodeTo}: not written: ${count(encoded.documents)} rows came back from the temporary file of token numbers for ${count(recorded.tally.documents)} documents read; is the disk failing? (otherwise this is a lexlock bug: please report it)`,
        { file: encodeTo },
      );
    }
    const parts = await sink.finish(encoded);
    await commitAll([...(await sink.commitSteps()), lexiconFile.commitStep()]);
    return { stats: encoded, parts };
  } catch (e) {
    await sink?.abort();
    await lexiconFile?.abort();
    await recorded.discard();
    throw e;
  }
}

/** Adds to a failed build --encode's error that the other output was not written either. */
function alsoNotWritten(e: unknown, output: string, encodeTo: string): unknown {
  if (!isLexlockError(e) || e.isUsage || e.code === 'OUTPUT_BUSY' || e.code === 'OUTPUT_EXISTS' || e.code === 'OUTPUT_SYMLINK') return e;
  const folder = encodeTo.replace(/[/\\]+$/, '');
  if (e.where.file === output || e.where.file === encodeTo || e.where.file?.startsWith(`${folder}${sep}`)) {
    const other = e.where.file === output ? encodeTo : output;
    e.message += `; ${other} was not written either`;
  }
  return e;
}

/** Refuses what `--encode` cannot go with: a tally input, bounded memory, .npy without a length. */
function refuseWithEncode(args: ParsedArgs, fromTally: boolean, encodeTo: string, hasShape: boolean): void {
  if (fromTally) {
    throw new LexlockError('USAGE_BAD_VALUE', '--encode needs a corpus: a tally holds counts, not documents; build from the tally, then run lexlock encode on the corpus', { field: '--encode' });
  }
  if (args.values.has('memory-limit')) {
    throw new LexlockError('USAGE_BAD_VALUE', '--encode cannot be combined with --memory-limit: a bounded build reads the corpus twice anyway; build with --memory-limit, then run lexlock encode', { field: '--encode' });
  }
  assertOutputName(encodeTo, '--encode');
  if (!isJsonl(encodeTo) && !hasShape) {
    throw new LexlockError('USAGE_MISSING', `--encode ${encodeTo}: .npy output needs a fixed length; pass --length L (or encode to a .jsonl file for variable-length rows)`, { field: '--length' });
  }
}

/** `--memory-limit MiB`: undefined when absent; a usage error naming the least limit when below it. */
function memoryLimitFlag(args: ParsedArgs): number | undefined {
  const raw = valueOf(args, 'memory-limit');
  if (raw === undefined) return undefined;
  const mib = /^[0-9]+$/.test(raw) ? Number(raw) : Number.NaN;
  if (!Number.isSafeInteger(mib)) {
    throw new LexlockError('USAGE_BAD_VALUE', `--memory-limit: "${raw}" is not a whole number of MiB; try --memory-limit ${LEAST_LIMIT_MIB}`, { field: '--memory-limit' });
  }
  if (mib < LEAST_LIMIT_MIB) {
    throw new LexlockError(
      'USAGE_BAD_VALUE',
      `--memory-limit: ${mib} MiB is below the ${LEAST_LIMIT_MIB} MiB a bounded build needs at least (one document in flight, the tokenizer, the lexicon and some counters); try --memory-limit ${LEAST_LIMIT_MIB}`,
      { field: '--memory-limit' },
    );
  }
  if (mib > MOST_LIMIT_MIB) {
    throw new LexlockError('USAGE_BAD_VALUE', `--memory-limit: ${mib} MiB is more than the ${MOST_LIMIT_MIB} MiB (1 TiB) it takes; try --memory-limit ${MOST_LIMIT_MIB}`, { field: '--memory-limit' });
  }
  return mib;
}

/**
 * The reader's refusal of a document longer than a memory limit allows one (`RECORD_TOO_LARGE`), as
 * `MEMORY_LIMIT` naming the least limit that allows documents up to the record limit itself.
 */
function documentTooLarge(e: LexlockError, plan: MemoryPlan, kind: string, recordLimit: number, kept: number): LexlockError {
  const allows = (limit: number) => recordLimitFor(memoryPlan(limit, kept), kind) >= recordLimit;
  let low = plan.limitMiB;
  let high = low;
  while (high < MOST_LIMIT_MIB && !allows(high)) high = Math.min(MOST_LIMIT_MIB, high * 2);
  while (low + 1 < high) {
    const mid = Math.floor((low + high) / 2);
    if (allows(mid)) high = mid;
    else low = mid;
  }
  const place = formatWhere(e.where);
  return new LexlockError(
    'MEMORY_LIMIT',
    `${place === '' ? '' : `${place}: `}a document is longer than the ${formatBytes(recordLimitFor(plan, kind))} --memory-limit ${plan.limitMiB} allows for one in this corpus; ` +
      `split it into smaller documents, or try --memory-limit ${high} (documents up to ${formatBytes(recordLimit)}; a smaller --record-limit asks less)`,
    e.where,
  );
}

/** True for a build input that is a tally file rather than a corpus. */
function isTallyPath(path: string): boolean {
  return path.toLowerCase().endsWith('.tally');
}

/** Refuses the flags a tally already fixed: the rules it was counted under and how its corpus was read. */
function refuseCorpusFlags(values: ReadonlyMap<string, string[]>): void {
  for (const name of Object.keys(RULE_FLAGS)) {
    if (values.has(name)) {
      throw new LexlockError('USAGE_BAD_VALUE', `--${name} cannot be used with a tally: the tally fixes the rules it was counted under; leave it out, or count the parts again with lexlock tally --${name}`, { field: `--${name}` });
    }
  }
  for (const name of ['text', 'label', 'key', 'bad-text', 'record-limit']) {
    if (values.has(name)) {
      throw new LexlockError('USAGE_BAD_VALUE', `--${name} cannot be used with a tally: its corpus was read when it was counted; leave it out, or pass it to lexlock tally`, { field: `--${name}` });
    }
  }
  if (values.has('memory-limit')) {
    throw new LexlockError(
      'USAGE_BAD_VALUE',
      '--memory-limit cannot be used with a tally: it bounds counting a corpus, and a tally is counted already (its counts are read whole); leave it out',
      { field: '--memory-limit' },
    );
  }
}
