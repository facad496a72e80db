import { freeze } from '../lexicon/freeze.js';
import { readCorpus } from '../corpus/readCorpus.js';
import { saveLexicon } from '../files/saveLexicon.js';
import { assertWritable } from '../files/refuseOverwrite.js';
import { tallyCorpus } from '../pipeline/tallyCorpus.js';
import { LexlockError } from '../LexlockError.js';
import { describeLexiconText } from './describeLexicon.js';
import type { Io } from './Io.js';
import { parseArgs, positionals, valueOf, wholeNumberFlag } from './parseArgs.js';
import { corpusBytes } from './corpusBytes.js';
import { createProgress } from './progress.js';
import { CORPUS_FLAGS, RULE_FLAGS, SHAPE_FLAGS, corpusOptions, rulesFromFlags, shapeFromFlags, threadsFlag } from './sharedFlags.js';

/** `lexlock build --help`. */
export const BUILD_HELP = `lexlock build <corpus> -o <lexicon.json> [options]

Counts the tokens of a corpus and writes a fingerprinted lexicon file.

  -o, --output FILE     where to write the lexicon (refused if it exists, unless --force)
  --cap N               keep the N most frequent tokens (default 20000)
  --min-count N         drop tokens seen fewer than N times (default 1)
  --oov first|last      OOV id 1 (default) or the id after the last token
  --reserve TOKEN       a token that takes an id right after the specials (repeatable)
  --level word|char     word tokens (default) or characters
  --case lower|keep     lower-case the text (default) or keep case
  --unicode NFKC|NFC|none   Unicode normalization (default NFKC)
  --drop TYPES          leave out token types, e.g. punctuation,emoji
  --collapse TYPES      one placeholder per type, e.g. number,url -> <number>, <url>
  --length L            store a fixed length; with --pad pre|post and --cut pre|post (default post)
  --text FIELD          text column or member for .csv/.tsv/.jsonl (default text)
  --label FIELD         label column or member (folders: the first folder is the label)
  --bad-text fail|replace|skip   what to do with invalid UTF-8 (default fail)
  --force               overwrite an existing lexicon file
  --threads N           worker threads (default: the machine's cores from 8 MiB of corpus); the lexicon is the same for any N
  -q, --quiet           no progress on stderr
`;

/** Default vocabulary cap of `lexlock build`. */
export const DEFAULT_CAP = 20000;

/** `lexlock build`: corpus -> lexicon file. */
export async function build(argv: readonly string[], io: Io): Promise<number> {
  const args = parseArgs('build', argv, {
    output: { kind: 'value', short: 'o' },
    cap: { kind: 'value' },
    'min-count': { kind: 'value' },
    oov: { kind: 'value' },
    reserve: { kind: 'value', repeat: true },
    force: { kind: 'switch' },
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
  const oov = oovFlag ?? 'first';
  const rules = rulesFromFlags(args);
  const shape = shapeFromFlags(args);
  const force = args.switches.has('force');
  const options = corpusOptions(args);
  await assertWritable(output, force);

  const progress = createProgress(io, 'build', { quiet: args.switches.has('quiet'), totalBytes: await corpusBytes(corpus) });
  const reader = readCorpus(corpus, { ...options, onProgress: (p) => progress.update(p) });
  let result;
  try {
    result = await tallyCorpus(reader, rules, { threads: threadsFlag(args, await corpusBytes(corpus)) });
  } finally {
    progress.done();
  }
  const lexicon = freeze(result.tally, {
    cap,
    minCount,
    oov,
    reserved: args.values.get('reserve') ?? [],
    shape,
    snippets: result.snippets,
    source: corpus,
    fields: {
      text: reader.kind === 'csv' || reader.kind === 'tsv' || reader.kind === 'jsonl' ? (options.text ?? 'text') : null,
      label: options.label ?? null,
    },
  });
  await saveLexicon(output, lexicon, { force });
  const { stats } = reader;
  let out = `wrote ${output}\n${describeLexiconText(lexicon)}`;
  if (stats.replaced > 0) out += `note: ${stats.replaced} documents had invalid UTF-8 replaced\n`;
  if (stats.skipped > 0) out += `note: ${stats.skipped} documents with invalid UTF-8 were skipped\n`;
  io.stdout.write(out);
  return 0;
}
