import { readCorpus } from '../corpus/readCorpus.js';
import { withLocks } from '../files/outputLock.js';
import { writeTallyFile } from '../files/saveTally.js';
import { assertWritable } from '../files/refuseOverwrite.js';
import { tallyCorpus } from '../pipeline/tallyCorpus.js';
import type { TallyFile } from '../tally/tallyFile.js';
import { LexlockError } from '../LexlockError.js';
import { count, pairs } from './format.js';
import type { Io } from './Io.js';
import { parseArgs, positionals, valueOf } from './parseArgs.js';
import { corpusBytes } from './corpusBytes.js';
import { createProgress } from './progress.js';
import { CORPUS_FLAGS, RULE_FLAGS, corpusOptions, rulesFromFlags, badTextNotes, corpusFields } from './sharedFlags.js';

/** `lexlock tally --help`. */
export const TALLY_HELP = `lexlock tally <corpus part> -o <part.tally> [options]

Counts one part of a corpus and writes a tally file that lexlock merge adds up and lexlock build freezes.

  -o, --output FILE     where to write the tally; must end in .tally (refused if it exists, unless --force)
  --level word|char     word tokens (default) or characters
  --spaces keep|drop    --level char: each run of white space is one ' ' token (keep, default) or none
  --case lower|keep     lower-case the text (default) or keep case
  --unicode NFKC|NFC|none   Unicode normalization (default NFKC)
  --drop TYPES          leave out token types, e.g. punctuation,emoji
  --collapse TYPES      one placeholder per type, e.g. number,url -> <number>, <url>
  --text FIELD          text column or member for .csv/.tsv/.jsonl (default text)
  --label FIELD         label column or member (folders: the first folder is the label)
  --bad-text fail|replace|skip   what to do with invalid UTF-8 (default fail)
  --record-limit MiB    refuse any one line, CSV record or folder file larger than this (default 64, at most 256)
  --force               overwrite an existing tally file
  -q, --quiet           no progress on stderr
Every part must be counted with the same rule flags, or merge refuses them.
`;

/** Refuses (usage error) an output that does not end in `.tally`, which build and merge recognise. */
export function assertTallyName(output: string): void {
  if (!output.toLowerCase().endsWith('.tally')) {
    throw new LexlockError('USAGE_BAD_VALUE', `--output: "${output}" must end in .tally, so lexlock build knows it for a tally`, { field: '--output' });
  }
}

/** The summary lines tally and merge print about a tally file of `types` distinct tokens. */
export function describeTallyFile(path: string, file: TallyFile, types: number = file.tally.types): string {
  const { tally } = file;
  const r = tally.rules;
  return `wrote ${path}\n${pairs([
    ['rules', `${r.level} level, ${r.unicode}, case ${r.case}, ${r.tokenizer}` + (r.drop.length > 0 ? `, drop ${r.drop.join(',')}` : '') + (r.collapse.length > 0 ? `, collapse ${r.collapse.join(',')}` : '')],
    ['corpus', `${count(tally.documents)} documents, ${count(tally.tokens)} tokens, ${count(types)} distinct`],
    ['labels', tally.labels.size === 0 ? 'none' : `${tally.labels.size}`],
  ])}`;
}

/** `lexlock tally`: corpus part -> tally file. */
export async function tally(argv: readonly string[], io: Io): Promise<number> {
  const args = parseArgs('tally', argv, {
    output: { kind: 'value', short: 'o' },
    force: { kind: 'switch' },
    ...CORPUS_FLAGS,
    ...RULE_FLAGS,
  });
  const [corpus] = positionals('tally', args, ['corpus part']) as [string];
  const output = valueOf(args, 'output');
  if (output === undefined) throw new LexlockError('USAGE_MISSING', '-o/--output is required: where should the tally go?', { field: '--output' });
  assertTallyName(output);
  const rules = rulesFromFlags(args);
  const force = args.switches.has('force');
  const options = corpusOptions(args);
  return withLocks([output], async () => {
    await assertWritable(output, force);
    const progress = createProgress(io, 'tally', { quiet: args.switches.has('quiet'), totalBytes: await corpusBytes(corpus) });
    const reader = readCorpus(corpus, { ...options, onProgress: (p) => progress.update(p) });
    let result;
    try {
      result = await tallyCorpus(reader, rules);
    } finally {
      progress.done();
    }
    const file: TallyFile = {
      tally: result.tally,
      snippets: [], // no corpus text: a lexicon built from tallies keeps none either (see build)
      fields: {
        ...corpusFields(reader.kind, options),
      },
    };
    await writeTallyFile(output, file);
    const { stats } = reader;
    let out = describeTallyFile(output, file);
    out += badTextNotes(stats);
    io.stdout.write(out);
    return 0;
  });
}
