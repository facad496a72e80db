import { lstat, readdir } from 'node:fs/promises';
import { basename, dirname, join, resolve } from 'node:path';
import { LexlockError } from '../LexlockError.js';
import { formatCount } from '../audit/report/formatCount.js';
import type { CommitStep } from '../files/commitAll.js';
import { ioError } from '../files/ioError.js';
import { assertWritable } from '../files/refuseOverwrite.js';
import { assertNotSymlink } from '../files/refuseSymlink.js';
import { removeStaleTemps } from '../files/removeStaleTemps.js';
import type { Shape } from '../lexicon/Shape.js';
import type { RowSink } from '../pipeline/encodeCorpus.js';
import type { EncodeStats } from '../pipeline/EncodeStats.js';
import type { SplitPlan } from '../split/Split.js';
import { openEncodedFolder } from './EncodedFolder.js';
import { openEncodedJsonl } from './EncodedJsonl.js';
import { ENCODED_FILES, type EncodedSource } from './encodedManifest.js';

export { ENCODED_FILES, MANIFEST_FORMAT_VERSION, type EncodedSource } from './encodedManifest.js';

/** One output of an encode: the whole corpus (`name` null) or one split, where it goes, and what it got. */
export interface EncodedPart {
  name: string | null;
  /** The `.jsonl` file or the folder the part's rows go to. */
  output: string;
  stats: EncodeStats;
}

/**
 * Where encoded rows go (`lexlock encode -o`, `lexlock build --encode`, `writeEncodedFolder`). Nothing
 * appears at the output until the steps from {@link EncodedOutput.commitSteps} are committed together
 * (commitAll): a `.jsonl` file is written under a temporary name, a folder under a hidden name beside
 * it (StagedFolder), with a folder for each split inside it.
 */
export interface EncodedOutput extends RowSink {
  /** What is put in place: the folder, or the `.jsonl` file (one a split). */
  readonly destinations: readonly string[];
  /**
   * Checks that every document became one row in every file, writes what is left (the `.npy`
   * headers, the manifests) and flushes it all to disk: ready to commit. Gives each part's figures.
   */
  finish(stats: EncodeStats): Promise<EncodedPart[]>;
  /** The steps that put the finished output in place, for commitAll (with other outputs, if any). */
  commitSteps(): Promise<CommitStep[]>;
  /** Removes everything written; the output is left as it was. Never throws. */
  abort(): Promise<void>;
}

/**
 * Why `output` cannot name an encoded output, or null when it can: a name ending in `.json` or
 * `.npy` (it would become a folder of that name), or a folder named `.`, `..` or a root (a folder
 * output is replaced whole by renames beside it, so it needs a name of its own in a parent folder).
 */
export function outputNameProblem(output: string): string | null {
  if (isJsonl(output)) return null;
  const last = basename(output.replace(/[/\\]+$/, ''));
  const ending = /\.(json|npy)$/i.exec(last);
  if (ending !== null) {
    return `"${output}" ends in ${ending[0]}, but encoded outputs are a .jsonl file or a folder (of .npy files, a manifest and keys); name a .jsonl file, or a folder without that ending`;
  }
  if (last !== '' && last !== '.' && last !== '..') return null;
  const name = basename(resolve(output)) || 'encoded';
  return `name the output folder by its own name (such as ../${name}), not "${output}": the folder is replaced whole`;
}

/** True when `output` names a JSON Lines file; anything else is a folder of .npy files. */
export function isJsonl(output: string): boolean {
  return output.toLowerCase().endsWith('.jsonl');
}

/**
 * Where a split's rows go: for a `.jsonl` output, `<split>.jsonl` in the same folder (`data/rows.jsonl`
 * with split `train`: `data/train.jsonl`); for a folder output, the folder `<split>` inside it.
 */
export function splitOutputPath(output: string, name: string): string {
  return isJsonl(output) ? join(dirname(output), `${name}.jsonl`) : join(output, name);
}

/** What an output puts in place: the folder (splits inside it), or each `.jsonl` file. */
export function outputDestinations(output: string, split: SplitPlan | null): string[] {
  if (split === null || !isJsonl(output)) return [output];
  return split.splits.map((s) => splitOutputPath(output, s.name));
}

/**
 * Opens `output`: one JSON line a document, or (shape required) a folder of ids/lengths/labels .npy
 * files, keys and a manifest; with a split plan, one such output a split. The output's folder must
 * exist (lockOutput makes it).
 */
export async function openEncodedOutput(output: string, shape: Shape | null, source: EncodedSource, split: SplitPlan | null): Promise<EncodedOutput> {
  if (isJsonl(output)) return openEncodedJsonl(output, shape, source, split);
  if (shape === null) {
    throw new LexlockError('BAD_OPTION', `${output}: .npy output needs a fixed length, and neither the lexicon nor the call gives a shape; give a shape, or write .jsonl for variable-length rows`, { file: output });
  }
  return openEncodedFolder(output, shape, source, split);
}

/**
 * Refuses an existing output (a .jsonl file, or a folder that is not empty) unless `force`; a folder
 * is replaced whole, so one holding anything but what an encode writes (its files, and folders of
 * split outputs holding only those) is refused even with `force`. First removes what dead runs left
 * there (and puts back a folder a killed run had set aside).
 */
export async function assertOutputWritable(output: string, force: boolean, split: SplitPlan | null): Promise<void> {
  if (isJsonl(output)) {
    for (const file of outputDestinations(output, split)) await assertWritable(file, force);
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
  const entries = await entriesOf(output);
  if (entries.length === 0) return;
  if (!force) {
    throw new LexlockError('OUTPUT_EXISTS', `${output} already exists and is not empty; pass --force to write into it`, { file: output });
  }
  const others: string[] = [];
  for (const name of entries) if (!FOLDER_FILES.includes(name) && !(await isEncodedPart(join(output, name)))) others.push(name);
  if (others.length > 0) {
    others.sort();
    const named = others.length <= 3 ? others.join(', ') : `${others.slice(0, 3).join(', ')} and ${others.length - 3} more`;
    throw new LexlockError(
      'OUTPUT_EXISTS',
      `${output} holds files an encode does not write (${named}); the folder is replaced whole, so move them elsewhere or name another folder`,
      { file: output },
    );
  }
}

/** A file that does not hold one row a document: nothing is committed. */
export function rowsError(path: string, rows: number, documents: number): LexlockError {
  return new LexlockError(
    'IO',
    `${path}: not written: it got ${formatCount(rows)} rows for ${formatCount(documents)} documents; this is a lexlock bug, please report it with the command you ran`,
    { file: path },
  );
}

/** The files of an encoded folder. */
const FOLDER_FILES: readonly string[] = Object.values(ENCODED_FILES);

/** True for a folder (not a link) holding only an encoded folder's files: a split of an earlier encode. */
async function isEncodedPart(path: string): Promise<boolean> {
  const stat = await lstat(path).catch(() => null);
  if (stat === null || !stat.isDirectory()) return false;
  const entries = await entriesOf(path);
  return entries.every((name) => FOLDER_FILES.includes(name));
}

async function entriesOf(folder: string): Promise<string[]> {
  try {
    return await readdir(folder);
  } catch (e) {
    throw ioError(folder, 'looking into it', e);
  }
}
