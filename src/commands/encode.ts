import { resolve } from 'node:path';
import { describeShape } from '../lexicon/Shape.js';
import { isLexlockError, LexlockError } from '../LexlockError.js';
import { readCorpus } from '../corpus/readCorpus.js';
import { loadLexicon } from '../files/loadLexicon.js';
import type { EncodedSource } from '../output/EncodedOutput.js';
import { isJsonl, outputDestinations } from '../output/EncodedOutput.js';
import { writeEncoded } from '../pipeline/writeEncoded.js';
import { parseSplits } from '../split/parseSplits.js';
import { DEFAULT_SEED, type SplitPlan } from '../split/Split.js';
import { assertOutputName, encodedJson, encodedSummary } from './encodedOutput.js';
import { pairs } from './format.js';
import type { Io } from './Io.js';
import { assertFolderLabelled, assertLabelsRead, NO_LABELS_FLAG, noLabelsFlag, withoutLabels } from './labelsFlag.js';
import { parseArgs, positionals, valueOf, type ParsedArgs } from './parseArgs.js';
import { corpusBytes } from './corpusBytes.js';
import { createProgress } from './progress.js';
import { CORPUS_FLAGS, SHAPE_FLAGS, corpusOptions, shapeFromFlags, lexiconFieldDefaults, threadsFlag } from './sharedFlags.js';

/** `lexlock encode --help`. */
export const ENCODE_HELP = `lexlock encode <corpus> --lexicon <lexicon.json> -o <out> [options]

Turns every document into ids with a lexicon, in corpus order; every row keeps its document's key.

  --lexicon FILE        the lexicon to encode with (checked: schema, fingerprint, canaries)
  -o, --output OUT      OUT ending in .jsonl: one line a document {"ids", "length", "label", "key"};
                        anything else (but not a name ending in .json or .npy): a folder with ids.npy,
                        lengths.npy, labels.npy, keys.jsonl and manifest.json
  --split NAME=SHARE,...  one output a split, each document in the split a hash of its key and --seed
                        picks (such as train=0.8,valid=0.1,test=0.1; shares add up to 1): folders
                        OUT/train/ ..., or files train.jsonl ... in the folder of OUT.jsonl
  --seed N              the seed of --split (default ${DEFAULT_SEED}); a key stays in its split while seed and splits stay
  --key FIELD           key column or member (.csv/.tsv/.jsonl; unique, not empty); default: the
                        data-row number (.txt: the line number; a folder: the path below it)
  --length L            fixed length when the lexicon has no shape (with --pad/--cut start|end, default end)
  --text FIELD          text column or member (default: as the lexicon was built, else text)
  --label FIELD         label column or member (default: as the lexicon was built)
  --no-labels           write rows without labels (a lexicon with labels otherwise needs them read)
  --bad-text fail|replace|skip   what to do with invalid UTF-8 (default fail)
  --record-limit MiB    refuse any one line, CSV record or folder file larger than this (default 64, at most 256)
  --json                print the summary as one JSON object (rows per split and label)
  --force               overwrite existing output
  --threads N           worker threads (default: the machine's cores from 8 MiB of corpus); the output is the same for any N
  -q, --quiet           no progress on stderr
`;

/** `lexlock encode`: corpus + lexicon -> ids (.jsonl or a folder of .npy files; one of them a split). */
export async function encode(argv: readonly string[], io: Io): Promise<number> {
  const args = parseArgs('encode', argv, {
    lexicon: { kind: 'value' },
    output: { kind: 'value', short: 'o' },
    force: { kind: 'switch' },
    json: { kind: 'switch' },
    split: { kind: 'value' },
    seed: { kind: 'value' },
    key: { kind: 'value' },
    ...NO_LABELS_FLAG,
    ...CORPUS_FLAGS,
    ...SHAPE_FLAGS,
  });
  const [corpus] = positionals('encode', args, ['corpus']) as [string];
  const lexiconPath = valueOf(args, 'lexicon');
  if (lexiconPath === undefined) throw new LexlockError('USAGE_MISSING', '--lexicon is required: which lexicon should encode the corpus?', { field: '--lexicon' });
  const output = valueOf(args, 'output');
  if (output === undefined) throw new LexlockError('USAGE_MISSING', '-o/--output is required: a .jsonl file or a folder for .npy files', { field: '--output' });
  assertOutputName(output, '--output');
  const split = splitFlags(args);
  for (const destination of outputDestinations(output, split)) {
    for (const [input, what] of [[corpus, 'the corpus being read'], [lexiconPath, 'the lexicon']] as const) {
      if (resolve(destination) === resolve(input)) {
        throw new LexlockError('USAGE_BAD_VALUE', `--output: ${destination} is ${what}; name another output`, { field: '--output' });
      }
    }
  }
  const noLabels = noLabelsFlag(args);
  const flagShape = shapeFromFlags(args);
  const force = args.switches.has('force');
  const lexicon = await loadLexicon(lexiconPath);
  if (flagShape !== null && lexicon.shape !== null) {
    const s = lexicon.shape;
    throw new LexlockError(
      'USAGE_BAD_VALUE',
      `--length: ${lexiconPath} already fixes the shape (${describeShape(s)}) as part of its fingerprint; drop --length, or build a lexicon without --length`,
      { field: '--length' },
    );
  }
  const shape = flagShape ?? lexicon.shape;
  if (!isJsonl(output) && shape === null) {
    throw new LexlockError(
      'USAGE_MISSING',
      `.npy output needs a fixed length and ${lexiconPath} has no shape; pass --length L (or write .jsonl for variable-length rows)`,
      { field: '--length' },
    );
  }
  const defaults = lexiconFieldDefaults(corpus, lexicon);
  const options = corpusOptions(args, noLabels ? { text: defaults.text } : defaults);
  const kind = readCorpus(corpus, options).kind;
  assertLabelsRead(corpus, kind, options.label, lexicon, lexiconPath, noLabels, 'write rows without labels');
  const progress = createProgress(io, 'encode', { quiet: args.switches.has('quiet'), totalBytes: await corpusBytes(corpus) });
  const reader = readCorpus(corpus, { ...options, onProgress: (p) => progress.update(p) });
  const source: EncodedSource = { lexicon, lexiconPath, corpus, badText: reader.badText, keyField: reader.keyField, readStats: reader.stats };
  let result;
  try {
    result = await writeEncoded(
      noLabels && kind === 'folder' ? withoutLabels(reader) : reader,
      lexicon,
      output,
      { shape, split, force, threads: threadsFlag(args, await corpusBytes(corpus)) },
      {
        source,
        documentsRead: () => reader.stats.documents,
        check: (stats) => assertFolderLabelled(corpus, kind, stats.labelled, lexicon, lexiconPath, noLabels, 'write rows without labels'),
      },
    );
  } finally {
    progress.done();
  }
  const { stats, parts } = result;
  if (args.switches.has('json')) io.stdout.write(`${JSON.stringify(encodedJson(stats, parts, shape, source, split))}\n`);
  else io.stdout.write(`wrote ${parts.map((p) => p.output).join(', ')}\n${pairs(encodedSummary(stats, parts, shape, source, kind, split))}`);
  return 0;
}

/** --split and --seed: the plan, or null without --split (--seed alone is a usage error). */
function splitFlags(args: ParsedArgs): SplitPlan | null {
  const text = valueOf(args, 'split');
  const rawSeed = valueOf(args, 'seed');
  if (text === undefined) {
    if (rawSeed !== undefined) throw new LexlockError('USAGE_BAD_VALUE', '--seed goes with --split: it picks how documents fall into the splits; add --split, or leave out --seed', { field: '--seed' });
    return null;
  }
  let seed = DEFAULT_SEED;
  if (rawSeed !== undefined) {
    seed = /^[0-9]+$/.test(rawSeed) ? Number(rawSeed) : Number.NaN;
    if (!Number.isSafeInteger(seed)) {
      throw new LexlockError('USAGE_BAD_VALUE', `--seed: "${rawSeed}" is not a whole number from 0 to 2^53 - 1 (9007199254740991)`, { field: '--seed' });
    }
  }
  try {
    return { splits: parseSplits(text), seed };
  } catch (e) {
    if (isLexlockError(e) && e.code === 'BAD_OPTION') throw new LexlockError('USAGE_BAD_VALUE', `--split: ${e.message.replace(/^split: /, '')}`, { field: '--split' });
    throw e;
  }
}
