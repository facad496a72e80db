import { mkdir, readdir, rm } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { LexlockError } from '../LexlockError.js';
import type { CorpusStats } from '../corpus/CorpusStats.js';
import { writeWhole } from '../files/writeWhole.js';
import { assertWritable } from '../files/refuseOverwrite.js';
import { assertNotSymlink } from '../files/refuseSymlink.js';
import { removeStaleTemps } from '../files/removeStaleTemps.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { describeShape, type Shape } from '../lexicon/Shape.js';
import { JsonlWriter } from '../output/JsonlWriter.js';
import { NpyWriter } from '../output/NpyWriter.js';
import type { EncodeStats, RowSink } from '../pipeline/encodeCorpus.js';
import { VERSION } from '../version.js';
import { corpusName } from '../lexicon/corpusName.js';
import { count, percent } from './format.js';
import { pathFrom } from './pathFrom.js';

/** Where encoded rows go (`lexlock encode -o`, `lexlock build --encode`): a sink that is finished or aborted. */
export interface EncodedOutput extends RowSink {
  finish(stats: EncodeStats): Promise<void>;
  abort(): Promise<void>;
}

/** What an encoded folder's manifest records besides the figures of the run. */
export interface EncodedSource {
  lexicon: Lexicon;
  lexiconPath: string;
  corpus: string;
  readStats: Pick<CorpusStats, 'replaced' | 'skipped'>;
}

/** True when `output` names a JSON Lines file; anything else is a folder of .npy files. */
export function isJsonl(output: string): boolean {
  return output.toLowerCase().endsWith('.jsonl');
}

/** Refuses an existing output (a .jsonl file, or a folder that is not empty) unless `force`. */
export async function assertOutputWritable(output: string, force: boolean): Promise<void> {
  if (isJsonl(output)) {
    await assertWritable(output, force);
    return;
  }
  // The folder's own files: none may be a link, and a killed run's temporary files go first, so a
  // folder holding nothing else counts as empty.
  for (const name of ['ids.npy', 'lengths.npy', 'labels.npy', 'manifest.json']) {
    await assertNotSymlink(join(output, name));
    await removeStaleTemps(join(output, name));
  }
  let entries: string[];
  try {
    entries = await readdir(output);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') return;
    if (code === 'ENOTDIR') await assertWritable(output, force);
    return;
  }
  if (entries.length > 0 && !force) {
    throw new LexlockError('OUTPUT_EXISTS', `${output} already exists and is not empty; pass --force to write into it`, { file: output });
  }
}

/** Opens `output`: one JSON line a document, or (shape required) ids/lengths/labels .npy files and a manifest. */
export async function openEncodedOutput(output: string, shape: Shape | null, source: EncodedSource): Promise<EncodedOutput> {
  if (isJsonl(output)) return jsonlOutput(output);
  return npyOutput(output, shape as Shape, (stats, labelled) => manifest(stats, labelled, shape, source, output));
}

/** The summary lines of an encode run, as `lexlock encode` prints them. */
export function encodedSummary(stats: EncodeStats, shape: Shape | null, source: EncodedSource): Array<[string, string]> {
  const { lexicon, lexiconPath, readStats } = source;
  const rows: Array<[string, string]> = [
    ['lexicon', `${lexiconPath} (${lexicon.fingerprint})`],
    ['rows', `${count(stats.documents)}${shape === null ? ', variable length' : ` x ${shape.length} (${describeShape(shape)})`}`],
    ['OOV', `${percent(stats.tokens === 0 ? 0 : stats.oovTokens / stats.tokens)} of ${count(stats.tokens)} tokens`],
  ];
  if (shape !== null) {
    rows.push(['cut', `${count(stats.truncatedDocuments)} documents (${percent(stats.documents === 0 ? 0 : stats.truncatedDocuments / stats.documents)}), ${count(stats.droppedTokens)} tokens dropped`]);
  }
  if (stats.labelled > 0) rows.push(['labels', `${count(stats.labelled)} labelled documents, ${count(stats.unknownLabels)} with a label the lexicon lacks (id -1)`]);
  if (readStats.replaced > 0) rows.push(['replaced', `${count(readStats.replaced)} documents had invalid UTF-8 replaced`]);
  if (readStats.skipped > 0) rows.push(['skipped', `${count(readStats.skipped)} documents with invalid UTF-8 left out`]);
  return rows;
}

async function jsonlOutput(path: string): Promise<EncodedOutput> {
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

async function npyOutput(folder: string, shape: Shape, manifest: (stats: EncodeStats, labelled: boolean) => object): Promise<EncodedOutput> {
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
      // The manifest goes first and comes back last, so a folder with a manifest always holds one
      // run's files: a run stopped between the renames below leaves no manifest, never a mixed folder.
      await rm(join(folder, 'manifest.json'), { force: true });
      await ids.finish();
      await lengths.finish();
      if (labels !== null) await (labels as NpyWriter).finish();
      // An unlabelled run over a labelled one's folder (--force) must not leave the old labels beside it.
      else await rm(join(folder, 'labels.npy'), { force: true });
      await writeWhole(join(folder, 'manifest.json'), `${JSON.stringify(manifest(stats, labels !== null), null, 2)}\n`);
    },
    async abort() {
      await ids.abort();
      await lengths.abort();
      if (labels !== null) await (labels as NpyWriter).abort();
    },
  };
}

/**
 * The version of an encoded folder's manifest.json. Version 2: the shape's ends are `start`/`end`
 * (the manifest of lexlock 0.1 carried no version and other names for them).
 */
export const MANIFEST_FORMAT_VERSION = 2;

/** The manifest of the folder `folder`; it names the corpus by its last segment and the lexicon relative to the folder. */
function manifest(stats: EncodeStats, labelled: boolean, shape: Shape | null, source: EncodedSource, folder: string): object {
  const { lexicon, lexiconPath, corpus, readStats } = source;
  return {
    format: 'lexlock.encoded',
    formatVersion: MANIFEST_FORMAT_VERSION,
    lexlockVersion: VERSION,
    lexicon: { fingerprint: lexicon.fingerprint, file: pathFrom(folder, lexiconPath), size: lexicon.size, oovId: lexicon.oovId },
    source: corpusName(corpus),
    rows: stats.documents,
    shape,
    files: { ids: 'ids.npy', lengths: 'lengths.npy', labels: labelled ? 'labels.npy' : null },
    labels: labelled ? lexicon.labels : null,
    replacedDocuments: readStats.replaced,
    skippedDocuments: readStats.skipped,
    unknownLabels: stats.unknownLabels,
    tokens: stats.tokens,
    oovTokens: stats.oovTokens,
    truncatedDocuments: stats.truncatedDocuments,
    droppedTokens: stats.droppedTokens,
  };
}
