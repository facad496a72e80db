import { mkdir } from 'node:fs/promises';
import { join } from 'node:path';
import { openInPlace } from '../files/AtomicFile.js';
import type { CommitStep } from '../files/commitAll.js';
import { ioError } from '../files/ioError.js';
import { StagedFolder } from '../files/StagedFolder.js';
import type { Shape } from '../lexicon/Shape.js';
import { countRow, emptyEncodeStats, type EncodeStats, type RowFacts } from '../pipeline/EncodeStats.js';
import type { SplitPlan } from '../split/Split.js';
import { splitChooser } from '../split/splitOf.js';
import type { EncodedOutput, EncodedPart } from './EncodedOutput.js';
import { rowsError } from './EncodedOutput.js';
import { ENCODED_FILES, encodedManifest, type EncodedSource } from './encodedManifest.js';
import { JsonlWriter } from './JsonlWriter.js';
import { NpyWriter } from './NpyWriter.js';

/** Label ids written at a time when a labels file opened late is filled in for the rows before it. */
const FILL_CHUNK = 1 << 16;

/**
 * An encoded folder written whole under a hidden name beside `folder` (StagedFolder): ids.npy
 * (rows × length), lengths.npy, labels.npy (once a row has a label), keys.jsonl and manifest.json;
 * with a split plan, one such folder a split inside it (`folder/train/…`), each row going to the
 * split its key belongs to (splitChooser).
 */
export async function openEncodedFolder(folder: string, shape: Shape, source: EncodedSource, split: SplitPlan | null): Promise<EncodedOutput> {
  const choose = split === null ? null : splitChooser(split.splits, split.seed);
  const staged = await StagedFolder.create(folder);
  const parts: FolderPart[] = [];
  try {
    if (split === null) parts.push(await FolderPart.open(staged, null, shape, source));
    else for (const { name } of split.splits) parts.push(await FolderPart.open(staged, name, shape, source));
  } catch (e) {
    for (const part of parts) await part.abort();
    await staged.abort();
    throw e;
  }
  return {
    destinations: [folder],
    async row(ids, kept, labelId, key, facts) {
      const part = parts[choose === null ? 0 : choose(key)] as FolderPart;
      await part.row(ids, kept, labelId, key, facts);
    },
    async finish(stats) {
      const rows = parts.reduce((sum, p) => sum + p.stats.documents, 0);
      if (rows !== stats.documents) throw rowsError(folder, rows, stats.documents);
      // One folder's rows have labels: every folder gets a labels file, so all splits look alike.
      const labelled = parts.some((p) => p.labelled);
      for (const part of parts) await part.finish(labelled, split);
      await staged.seal();
      return parts.map((p) => ({ name: p.name, output: p.output, stats: p.stats }) satisfies EncodedPart);
    },
    commitSteps: async (): Promise<CommitStep[]> => [staged.commitStep()],
    async abort() {
      for (const part of parts) await part.abort();
      await staged.abort();
    },
  };
}

/** The files of one encoded folder inside a staged folder: the whole output, or one split's folder. */
class FolderPart {
  readonly name: string | null;
  /** Where the folder will be once committed (for messages and summaries). */
  readonly output: string;
  readonly stats: EncodeStats;
  private readonly staged: StagedFolder;
  private readonly shape: Shape;
  private readonly source: EncodedSource;
  private readonly ids: NpyWriter;
  private readonly lengths: NpyWriter;
  private readonly keys: JsonlWriter;
  private labels: NpyWriter | null = null;
  private readonly one = new Int32Array(1);

  private constructor(staged: StagedFolder, name: string | null, shape: Shape, source: EncodedSource, writers: { ids: NpyWriter; lengths: NpyWriter; keys: JsonlWriter }) {
    this.staged = staged;
    this.name = name;
    this.output = name === null ? staged.destination : staged.reportOf(name);
    this.shape = shape;
    this.source = source;
    this.stats = emptyEncodeStats(source.lexicon.labels.length);
    this.ids = writers.ids;
    this.lengths = writers.lengths;
    this.keys = writers.keys;
  }

  static async open(staged: StagedFolder, name: string | null, shape: Shape, source: EncodedSource): Promise<FolderPart> {
    if (name !== null) {
      try {
        await mkdir(staged.pathOf(name));
      } catch (e) {
        throw ioError(staged.reportOf(name), 'creating it', e);
      }
    }
    const opened: Array<NpyWriter | JsonlWriter> = [];
    try {
      const ids = await NpyWriter.open(pathIn(staged, name, ENCODED_FILES.ids), shape.length, inPlace(staged, name, ENCODED_FILES.ids));
      opened.push(ids);
      const lengths = await NpyWriter.open(pathIn(staged, name, ENCODED_FILES.lengths), null, inPlace(staged, name, ENCODED_FILES.lengths));
      opened.push(lengths);
      const keys = await JsonlWriter.open(pathIn(staged, name, ENCODED_FILES.keys), inPlace(staged, name, ENCODED_FILES.keys));
      return new FolderPart(staged, name, shape, source, { ids, lengths, keys });
    } catch (e) {
      for (const w of opened) await w.abort();
      throw e;
    }
  }

  get labelled(): boolean {
    return this.labels !== null;
  }

  async row(ids: Int32Array, kept: number, labelId: number | null, key: string, facts: RowFacts): Promise<void> {
    await this.ids.appendRows(ids);
    this.one[0] = kept;
    await this.lengths.appendRows(this.one);
    if (labelId !== null && this.labels === null) await this.openLabels(this.stats.documents);
    if (this.labels !== null) {
      this.one[0] = labelId ?? -1;
      await this.labels.appendRows(this.one);
    }
    await this.keys.writeLine(key);
    countRow(this.stats, facts, this.shape, labelId);
  }

  async finish(labelled: boolean, split: SplitPlan | null): Promise<void> {
    if (labelled && this.labels === null) await this.openLabels(this.stats.documents);
    const rows = this.stats.documents;
    for (const [name, count] of [
      [ENCODED_FILES.ids, this.ids.rows],
      [ENCODED_FILES.lengths, this.lengths.rows],
      [ENCODED_FILES.keys, this.keys.lines],
      [ENCODED_FILES.labels, this.labels?.rows ?? rows],
    ] as const) {
      if (count !== rows) throw rowsError(this.reportOf(name), count, rows);
    }
    await this.ids.finish();
    await this.lengths.finish();
    await this.keys.finish();
    if (this.labels !== null) await this.labels.finish();
    const manifest = encodedManifest(this.output, this.stats, labelled, this.shape, this.source, split === null || this.name === null ? null : { plan: split, part: this.name });
    const file = await openInPlace(pathIn(this.staged, this.name, ENCODED_FILES.manifest), this.reportOf(ENCODED_FILES.manifest));
    try {
      await file.write(new TextEncoder().encode(`${JSON.stringify(manifest, null, 2)}\n`));
      await file.commit();
    } catch (e) {
      await file.abort();
      throw e;
    }
  }

  async abort(): Promise<void> {
    await this.ids.abort();
    await this.lengths.abort();
    await this.keys.abort();
    if (this.labels !== null) await this.labels.abort();
  }

  /** Opens labels.npy and gives the `before` rows already written label id -1. */
  private async openLabels(before: number): Promise<void> {
    const labels = await NpyWriter.open(pathIn(this.staged, this.name, ENCODED_FILES.labels), null, inPlace(this.staged, this.name, ENCODED_FILES.labels));
    this.labels = labels;
    const fill = new Int32Array(Math.min(FILL_CHUNK, before)).fill(-1);
    for (let left = before; left > 0; left -= fill.length) await labels.appendRows(left >= fill.length ? fill : fill.subarray(0, left));
  }

  private reportOf(file: string): string {
    return join(this.output, file);
  }
}

/** Where a part's file is written now (inside the hidden folder). */
function pathIn(staged: StagedFolder, part: string | null, file: string): string {
  return part === null ? staged.pathOf(file) : join(staged.pathOf(part), file);
}

/** Makes a part's file in place inside the hidden folder, named in messages where it will be. */
function inPlace(staged: StagedFolder, part: string | null, file: string) {
  const report = part === null ? staged.reportOf(file) : join(staged.reportOf(part), file);
  return { open: (path: string) => openInPlace(path, report) };
}
