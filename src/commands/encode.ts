import { mkdir, readdir } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { LexlockError } from '../LexlockError.js';
import { readCorpus } from '../corpus/readCorpus.js';
import { writeFileAtomic } from '../files/atomicWrite.js';
import { loadLexicon } from '../files/loadLexicon.js';
import { assertWritable } from '../files/refuseOverwrite.js';
import type { Shape } from '../lexicon/Shape.js';
import { JsonlWriter } from '../output/JsonlWriter.js';
import { NpyWriter } from '../output/NpyWriter.js';
import { encodeCorpus, type EncodeStats, type RowSink } from '../pipeline/encodeCorpus.js';
import { VERSION } from '../version.js';
import { count, pairs, percent } from './format.js';
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
  --length L            fixed length when the lexicon has no shape (with --pad/--cut, default post)
  --text FIELD          text column or member (default: as the lexicon was built, else text)
  --label FIELD         label column or member (default: as the lexicon was built)
  --bad-text fail|replace|skip   what to do with invalid UTF-8 (default fail)
  --force               overwrite existing output
  --threads N           worker threads (default: the machine's cores from 8 MiB of corpus); the output is the same for any N
  -q, --quiet           no progress on stderr
`;

interface Output extends RowSink {
  finish(stats: EncodeStats): Promise<void>;
  abort(): Promise<void>;
}

async function jsonlOutput(path: string): Promise<Output> {
  await mkdir(dirname(path), { recursive: true });
  const writer = await JsonlWriter.open(path);
  return {
    async row(ids, kept, labelId) {
      const line: { ids: number[]; length: number; label?: number } = { ids: Array.from(ids), length: kept };
      if (labelId !== null) line.label = labelId;
      await writer.writeLine(line);
    },
    finish: () => writer.finish(),
    abort: () => writer.abort(),
  };
}

async function npyOutput(folder: string, shape: Shape, manifest: (stats: EncodeStats, labelled: boolean) => object): Promise<Output> {
  await mkdir(folder, { recursive: true });
  const ids = await NpyWriter.open(join(folder, 'ids.npy'), shape.length);
  const lengths = await NpyWriter.open(join(folder, 'lengths.npy'), null);
  let labels: NpyWriter | null = null;
  let rows = 0;
  const one = new Int32Array(1);
  return {
    async row(row, kept, labelId) {
      await ids.appendRows(row);
      one[0] = kept;
      await lengths.appendRows(one);
      if (labelId !== null && labels === null) {
        labels = await NpyWriter.open(join(folder, 'labels.npy'), null);
        if (rows > 0) await labels.appendRows(new Int32Array(rows).fill(-1));
      }
      if (labels !== null) {
        one[0] = labelId ?? -1;
        await labels.appendRows(one);
      }
      rows += 1;
    },
    async finish(stats) {
      await ids.finish();
      await lengths.finish();
      if (labels !== null) await (labels as NpyWriter).finish();
      await writeFileAtomic(join(folder, 'manifest.json'), `${JSON.stringify(manifest(stats, labels !== null), null, 2)}\n`);
    },
    async abort() {
      await ids.abort();
      await lengths.abort();
      if (labels !== null) await (labels as NpyWriter).abort();
    },
  };
}

async function assertFolderWritable(folder: string, force: boolean): Promise<void> {
  let entries: string[];
  try {
    entries = await readdir(folder);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') return;
    if (code === 'ENOTDIR') await assertWritable(folder, force);
    return;
  }
  if (entries.length > 0 && !force) {
    throw new LexlockError('OUTPUT_EXISTS', `${folder} already exists and is not empty; pass --force to write into it`, { file: folder });
  }
}

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
      `--length: ${lexiconPath} already fixes the shape (length ${s.length}, pad ${s.pad}, cut ${s.cut}) as part of its fingerprint; drop --length, or build a lexicon without --length`,
      { field: '--length' },
    );
  }
  const shape = flagShape ?? lexicon.shape;
  const jsonl = output.toLowerCase().endsWith('.jsonl');
  if (!jsonl && shape === null) {
    throw new LexlockError(
      'USAGE_MISSING',
      `.npy output needs a fixed length and ${lexiconPath} has no shape; pass --length L (or write .jsonl for variable-length rows)`,
      { field: '--length' },
    );
  }
  const options = corpusOptions(args, lexiconFieldDefaults(corpus, lexicon));
  if (jsonl) await assertWritable(output, force);
  else await assertFolderWritable(output, force);

  const progress = createProgress(io, 'encode', { quiet: args.switches.has('quiet'), totalBytes: await corpusBytes(corpus) });
  const reader = readCorpus(corpus, { ...options, onProgress: (p) => progress.update(p) });
  const manifest = (stats: EncodeStats, labelled: boolean) => ({
    format: 'lexlock.encoded',
    lexlockVersion: VERSION,
    lexicon: { fingerprint: lexicon.fingerprint, file: lexiconPath, size: lexicon.size, oovId: lexicon.oovId },
    source: corpus,
    rows: stats.documents,
    shape,
    files: { ids: 'ids.npy', lengths: 'lengths.npy', labels: labelled ? 'labels.npy' : null },
    labels: labelled ? lexicon.labels : null,
    replacedDocuments: reader.stats.replaced,
    skippedDocuments: reader.stats.skipped,
    unknownLabels: stats.unknownLabels,
    tokens: stats.tokens,
    oovTokens: stats.oovTokens,
    truncatedDocuments: stats.truncatedDocuments,
    droppedTokens: stats.droppedTokens,
  });
  const sink = jsonl ? await jsonlOutput(output) : await npyOutput(output, shape as Shape, manifest);
  let stats: EncodeStats;
  try {
    stats = await encodeCorpus(reader, lexicon, shape, sink, { threads: threadsFlag(args, await corpusBytes(corpus)) });
    await sink.finish(stats);
  } catch (e) {
    await sink.abort();
    throw e;
  } finally {
    progress.done();
  }
  const rows: Array<[string, string]> = [
    ['lexicon', `${lexiconPath} (${lexicon.fingerprint})`],
    ['rows', `${count(stats.documents)}${shape === null ? ', variable length' : ` x ${shape.length} (pad ${shape.pad}, cut ${shape.cut})`}`],
    ['OOV', `${percent(stats.tokens === 0 ? 0 : stats.oovTokens / stats.tokens)} of ${count(stats.tokens)} tokens`],
  ];
  if (shape !== null) {
    rows.push(['cut', `${count(stats.truncatedDocuments)} documents (${percent(stats.documents === 0 ? 0 : stats.truncatedDocuments / stats.documents)}), ${count(stats.droppedTokens)} tokens dropped`]);
  }
  if (stats.labelled > 0) rows.push(['labels', `${count(stats.labelled)} labelled documents, ${count(stats.unknownLabels)} with a label the lexicon lacks (id -1)`]);
  if (reader.stats.replaced > 0) rows.push(['replaced', `${count(reader.stats.replaced)} documents had invalid UTF-8 replaced`]);
  if (reader.stats.skipped > 0) rows.push(['skipped', `${count(reader.stats.skipped)} documents with invalid UTF-8 left out`]);
  io.stdout.write(`wrote ${output}\n${pairs(rows)}`);
  return 0;
}
