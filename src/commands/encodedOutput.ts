import { lstat, readdir } from 'node:fs/promises';
import { basename, join, resolve } from 'node:path';
import { LexlockError } from '../LexlockError.js';
import type { CorpusStats } from '../corpus/CorpusStats.js';
import { openInPlace } from '../files/AtomicFile.js';
import type { CommitStep } from '../files/commitAll.js';
import { ioError } from '../files/ioError.js';
import { assertWritable } from '../files/refuseOverwrite.js';
import { assertNotSymlink } from '../files/refuseSymlink.js';
import { removeStaleTemps } from '../files/removeStaleTemps.js';
import { StagedFolder } from '../files/StagedFolder.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { describeShape, type Shape } from '../lexicon/Shape.js';
import { JsonlWriter } from '../output/JsonlWriter.js';
import { NpyWriter } from '../output/NpyWriter.js';
import type { EncodeStats, RowSink } from '../pipeline/encodeCorpus.js';
import { VERSION } from '../version.js';
import { corpusName } from '../lexicon/corpusName.js';
import { count, percent } from './format.js';
import { pathFrom } from './pathFrom.js';

/**
 * Where encoded rows go (`lexlock encode -o`, `lexlock build --encode`). Nothing appears at the
 * output until the step from {@link EncodedOutput.commitStep} is committed (commitAll): a `.jsonl`
 * file is written under a temporary name, a folder under a hidden name beside it (StagedFolder).
 */
export interface EncodedOutput extends RowSink {
  /**
   * Checks that every document became one row in every file, writes what is left (the `.npy`
   * headers, the manifest) and flushes it all to disk: ready to commit.
   */
  finish(stats: EncodeStats): Promise<void>;
  /** The step that puts the finished output in place. */
  commitStep(): Promise<CommitStep>;
  /** Removes everything written; the output is left as it was. Never throws. */
  abort(): Promise<void>;
}

/** What an encoded folder's manifest records besides the figures of the run. */
export interface EncodedSource {
  lexicon: Lexicon;
  lexiconPath: string;
  corpus: string;
  readStats: Pick<CorpusStats, 'replaced' | 'skipped'>;
}

/** The files of an encoded folder. */
const FOLDER_FILES = ['ids.npy', 'lengths.npy', 'labels.npy', 'manifest.json'];

/** True when `output` names a JSON Lines file; anything else is a folder of .npy files. */
export function isJsonl(output: string): boolean {
  return output.toLowerCase().endsWith('.jsonl');
}

/**
 * Refuses (usage error) a folder output named `.`, `..` or a root: it is replaced whole by renames
 * beside it, so it needs a name of its own in a parent folder. `flag` is the flag that named it.
 */
export function assertOutputName(output: string, flag: string): void {
  const last = basename(output.replace(/[/\\]+$/, ''));
  if (isJsonl(output) || (last !== '' && last !== '.' && last !== '..')) return;
  const name = basename(resolve(output)) || 'encoded';
  throw new LexlockError('USAGE_BAD_VALUE', `${flag}: name the output folder by its own name (such as ../${name}), not "${output}": the folder is replaced whole`, { field: flag });
}

/**
 * Refuses an existing output (a .jsonl file, or a folder that is not empty) unless `force`; a folder
 * is replaced whole, so one holding anything but an encoded folder's files is refused even with
 * `force`. First removes what dead runs left there (and puts back a folder a killed run had set aside).
 */
export async function assertOutputWritable(output: string, force: boolean): Promise<void> {
  if (isJsonl(output)) {
    await assertWritable(output, force);
    return;
  }
  await removeStaleTemps(output);
  await assertNotSymlink(output);
  const stat = await lstat(output).catch((e: NodeJS.ErrnoException) => {
    if (e.code === 'ENOENT') return null;
    throw ioError(output, 'looking at what is there', e);
  });
  if (stat === null) return;
  if (!stat.isDirectory()) {
    throw new LexlockError('OUTPUT_EXISTS', `${output} is a file, and .npy output is a folder; name a folder (or a .jsonl file)`, { file: output });
  }
  // The folder's own files: none may be a link, and temporary files a killed run of an older lexlock
  // left inside go first, so a folder holding nothing else counts as empty.
  for (const name of FOLDER_FILES) {
    await assertNotSymlink(join(output, name));
    await removeStaleTemps(join(output, name));
  }
  let entries: string[];
  try {
    entries = await readdir(output);
  } catch (e) {
    throw ioError(output, 'looking into it', e);
  }
  if (entries.length === 0) return;
  if (!force) {
    throw new LexlockError('OUTPUT_EXISTS', `${output} already exists and is not empty; pass --force to write into it`, { file: output });
  }
  const others = entries.filter((name) => !FOLDER_FILES.includes(name)).sort();
  if (others.length > 0) {
    const named = others.length <= 3 ? others.join(', ') : `${others.slice(0, 3).join(', ')} and ${others.length - 3} more`;
    throw new LexlockError(
      'OUTPUT_EXISTS',
      `${output} holds files an encode does not write (${named}); the folder is replaced whole, so move them elsewhere or name another folder`,
      { file: output },
    );
  }
}

/**
 * Opens `output`: one JSON line a document, or (shape required) ids/lengths/labels .npy files and a
 * manifest. The output's folder must exist (lockOutput makes it).
 */
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
  const writer = await JsonlWriter.open(path);
  return {
    async row(ids, kept, labelId) {
      const line: { ids: number[]; length: number; label?: number } = { ids: Array.from(ids), length: kept };
      if (labelId !== null) line.label = labelId;
      await writer.writeLine(line);
    },
    async finish(stats) {
      if (writer.lines !== stats.documents) throw rowsError(path, writer.lines, stats.documents);
      await writer.seal();
    },
    commitStep: () => writer.commitStep(),
    abort: () => writer.abort(),
  };
}

async function npyOutput(folder: string, shape: Shape, manifest: (stats: EncodeStats, labelled: boolean) => object): Promise<EncodedOutput> {
  const staged = await StagedFolder.create(folder);
  const inPlace = (name: string) => ({ open: (path: string) => openInPlace(path, staged.reportOf(name)) });
  const writers: NpyWriter[] = [];
  try {
    writers.push(await NpyWriter.open(staged.pathOf('ids.npy'), shape.length, inPlace('ids.npy')));
    writers.push(await NpyWriter.open(staged.pathOf('lengths.npy'), null, inPlace('lengths.npy')));
  } catch (e) {
    for (const w of writers) await w.abort();
    await staged.abort();
    throw e;
  }
  const [ids, lengths] = writers as [NpyWriter, NpyWriter];
  let labels: NpyWriter | null = null;
  let rows = 0;
  const one = new Int32Array(1);
  return {
    async row(row, kept, labelId) {
      await ids.appendRows(row);
      one[0] = kept;
      await lengths.appendRows(one);
      if (labelId !== null && labels === null) {
        labels = await NpyWriter.open(staged.pathOf('labels.npy'), null, inPlace('labels.npy'));
        if (rows > 0) await labels.appendRows(new Int32Array(rows).fill(-1));
      }
      if (labels !== null) {
        one[0] = labelId ?? -1;
        await labels.appendRows(one);
      }
      rows += 1;
    },
    async finish(stats) {
      const labelled = labels as NpyWriter | null;
      for (const [name, writer] of [['ids.npy', ids], ['lengths.npy', lengths], ['labels.npy', labelled]] as const) {
        if (writer !== null && writer.rows !== stats.documents) throw rowsError(staged.reportOf(name), writer.rows, stats.documents);
      }
      await ids.finish();
      await lengths.finish();
      if (labelled !== null) await labelled.finish();
      const file = await openInPlace(staged.pathOf('manifest.json'), staged.reportOf('manifest.json'));
      try {
        await file.write(new TextEncoder().encode(`${JSON.stringify(manifest(stats, labelled !== null), null, 2)}\n`));
        await file.commit();
      } catch (e) {
        await file.abort();
        throw e;
      }
      await staged.seal();
    },
    commitStep: async () => staged.commitStep(),
    async abort() {
      await ids.abort();
      await lengths.abort();
      if (labels !== null) await (labels as NpyWriter).abort();
      await staged.abort();
    },
  };
}

/** A file that does not hold one row a document: nothing is committed. */
export function rowsError(path: string, rows: number, documents: number): LexlockError {
  return new LexlockError(
    'IO',
    `${path}: not written: it got ${count(rows)} rows for ${count(documents)} documents; this is a lexlock bug, please report it with the command you ran`,
    { file: path },
  );
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
