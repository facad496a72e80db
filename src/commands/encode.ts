import { describeShape } from '../lexicon/Shape.js';
import { LexlockError } from '../LexlockError.js';
import { readCorpus } from '../corpus/readCorpus.js';
import { commitAll } from '../files/commitAll.js';
import { loadLexicon } from '../files/loadLexicon.js';
import { withLocks } from '../files/outputLock.js';
import { encodeCorpus, type EncodeStats } from '../pipeline/encodeCorpus.js';
import { assertOutputName, assertOutputWritable, encodedSummary, isJsonl, openEncodedOutput, rowsError } from './encodedOutput.js';
import { pairs } from './format.js';
import type { Io } from './Io.js';
import { parseArgs, positionals, valueOf } from './parseArgs.js';
import { corpusBytes } from './corpusBytes.js';
import { createProgress } from './progress.js';
import { CORPUS_FLAGS, SHAPE_FLAGS, corpusOptions, shapeFromFlags, lexiconFieldDefaults, threadsFlag } from './sharedFlags.js';

/** `lexlock encode --help`. */
export const ENCODE_HELP = `lexlock encode <corpus> --lexicon <lexicon.json> -o <out> [options]

Turns every document into ids with a lexicon, in corpus order.

  --lexicon FILE        the lexicon to encode with (checked: schema, fingerprint, canaries)
  -o, --output OUT      OUT ending in .jsonl: one line a document {"ids", "length", "label"};
                        anything else: a folder with ids.npy, lengths.npy, labels.npy, manifest.json
  --length L            fixed length when the lexicon has no shape (with --pad/--cut start|end, default end)
  --text FIELD          text column or member (default: as the lexicon was built, else text)
  --label FIELD         label column or member (default: as the lexicon was built)
  --bad-text fail|replace|skip   what to do with invalid UTF-8 (default fail)
  --record-limit MiB    refuse any one line, CSV record or folder file larger than this (default 64, at most 256)
  --force               overwrite existing output
  --threads N           worker threads (default: the machine's cores from 8 MiB of corpus); the output is the same for any N
  -q, --quiet           no progress on stderr
`;

/** `lexlock encode`: corpus + lexicon -> ids (.jsonl or a folder of .npy files). */
export async function encode(argv: readonly string[], io: Io): Promise<number> {
  const args = parseArgs('encode', argv, {
    lexicon: { kind: 'value' },
    output: { kind: 'value', short: 'o' },
    force: { kind: 'switch' },
    ...CORPUS_FLAGS,
    ...SHAPE_FLAGS,
  });
  const [corpus] = positionals('encode', args, ['corpus']) as [string];
  const lexiconPath = valueOf(args, 'lexicon');
  if (lexiconPath === undefined) throw new LexlockError('USAGE_MISSING', '--lexicon is required: which lexicon should encode the corpus?', { field: '--lexicon' });
  const output = valueOf(args, 'output');
  if (output === undefined) throw new LexlockError('USAGE_MISSING', '-o/--output is required: a .jsonl file or a folder for .npy files', { field: '--output' });
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
  const options = corpusOptions(args, lexiconFieldDefaults(corpus, lexicon));
  assertOutputName(output, '--output');
  // The output's lock is held from here on: a second run writing the same output fails at once.
  return withLocks([output], async () => {
    await assertOutputWritable(output, force);
    const progress = createProgress(io, 'encode', { quiet: args.switches.has('quiet'), totalBytes: await corpusBytes(corpus) });
    const reader = readCorpus(corpus, { ...options, onProgress: (p) => progress.update(p) });
    const source = { lexicon, lexiconPath, corpus, readStats: reader.stats };
    let stats: EncodeStats;
    try {
      const sink = await openEncodedOutput(output, shape, source);
      try {
        stats = await encodeCorpus(reader, lexicon, shape, sink, { threads: threadsFlag(args, await corpusBytes(corpus)) });
        // Every document read must have become one row before anything is committed.
        if (stats.documents !== reader.stats.documents) throw rowsError(output, stats.documents, reader.stats.documents);
        await sink.finish(stats);
        await commitAll([await sink.commitStep()]);
      } catch (e) {
        await sink.abort();
        throw e;
      }
    } finally {
      progress.done();
    }
    io.stdout.write(`wrote ${output}\n${pairs(encodedSummary(stats, shape, source))}`);
    return 0;
  });
}
