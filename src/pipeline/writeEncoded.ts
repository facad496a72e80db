import { LexlockError } from '../LexlockError.js';
import type { CorpusReader } from '../corpus/readCorpus.js';
import { commitAll } from '../files/commitAll.js';
import { withLocks } from '../files/outputLock.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import type { Shape } from '../lexicon/Shape.js';
import { assertOutputWritable, isJsonl, openEncodedOutput, outputDestinations, outputNameProblem, rowsError, type EncodedPart, type EncodedSource } from '../output/EncodedOutput.js';
import { checkSeed, checkSplits } from '../split/checkSplits.js';
import { DEFAULT_SEED, type Split, type SplitPlan } from '../split/Split.js';
import { encodeCorpus, type EncodableDocument, type EncodeStats } from './encodeCorpus.js';

/** Options of {@link writeEncodedFolder}. */
export interface WriteEncodedFolderOptions {
  /**
   * The lexicon's file, which the manifest names relative to its own folder (so the folder and the
   * lexicon can move together); null or absent: the manifest's `lexicon.file` is null.
   */
  lexiconPath?: string | null;
  /** The shape of every row; default the lexicon's own (one of them is needed). */
  shape?: Shape | null;
  /** One folder a split (`folder/train/…`), each document going to the split of its key (splitOf); seed default 0. */
  split?: { splits: readonly Split[]; seed?: number } | null;
  /** Replace an existing folder that holds only what an encode writes (default false: refused). */
  force?: boolean;
  /** Worker threads to tokenize on (default 1); the files are the same for any count. */
  threads?: number;
}

/** What {@link writeEncodedFolder} wrote: the run's figures and each folder's (one, or one a split). */
export interface EncodedFolderResult {
  stats: EncodeStats;
  parts: EncodedPart[];
}

/**
 * What the CLI adds: where the documents came from, how many documents its reader read (each must
 * be a row), and a check of the run before anything is put in place.
 */
export interface WriteEncodedInternals {
  source: EncodedSource;
  documentsRead?: () => number;
  check?: (stats: EncodeStats) => void;
}

/**
 * Encodes documents into an encoded folder, exactly as `lexlock encode -o folder` writes it (it is
 * the same code): ids.npy (rows × length, int32), lengths.npy, labels.npy when documents have
 * labels, keys.jsonl (each row's key, a JSON string a line) and manifest.json; with `split`, such a
 * folder for every split inside `folder`. All or nothing: written under a hidden name beside the
 * folder and put in place whole once every document is a row, while holding the folder's lock
 * (`OUTPUT_BUSY` for a second writer). From a `readCorpus` reader the manifest also takes the corpus
 * name, bad-text policy, key field and the counts of documents replaced or left out.
 * @example
 * const lexicon = await loadLexicon('lexicon.json');
 * const corpus = readCorpus('reviews.csv', { label: 'topic', key: 'id' });
 * const { parts } = await writeEncodedFolder(corpus, lexicon, 'encoded', {
 *   lexiconPath: 'lexicon.json',
 *   split: { splits: [{ name: 'train', share: 0.9 }, { name: 'test', share: 0.1 }], seed: 7 },
 * });
 * parts.map((p) => [p.output, p.stats.documents]); // [['encoded/train', …], ['encoded/test', …]]
 */
export async function writeEncodedFolder(
  documents: AsyncIterable<EncodableDocument> | Iterable<EncodableDocument>,
  lexicon: Lexicon,
  folder: string,
  options: WriteEncodedFolderOptions = {},
): Promise<EncodedFolderResult> {
  const problem = isJsonl(folder) ? `"${folder}" ends in .jsonl, but this writes a folder; name a folder` : outputNameProblem(folder);
  if (problem !== null) throw new LexlockError('BAD_OPTION', problem, { file: folder });
  const reader = corpusReaderOf(documents);
  const source: EncodedSource = {
    lexicon,
    lexiconPath: options.lexiconPath ?? null,
    corpus: reader?.path ?? null,
    badText: reader?.badText ?? null,
    keyField: reader?.keyField ?? null,
    readStats: reader?.stats ?? { replaced: 0, skipped: 0 },
  };
  return writeEncoded(documents, lexicon, folder, options, { source });
}

/**
 * The one path from documents to an encoded output (`.jsonl` or folder), for `lexlock encode` and
 * writeEncodedFolder: locks, checks what is there, encodes, checks every document became one row,
 * then puts every file in place as one (commitAll).
 */
export async function writeEncoded(
  documents: AsyncIterable<EncodableDocument> | Iterable<EncodableDocument>,
  lexicon: Lexicon,
  output: string,
  options: WriteEncodedFolderOptions,
  internals: WriteEncodedInternals,
): Promise<EncodedFolderResult> {
  const shape = options.shape ?? lexicon.shape;
  if (!isJsonl(output) && shape === null) {
    throw new LexlockError('BAD_OPTION', `${output}: .npy output needs a fixed length, and the lexicon has no shape; pass a shape, or write .jsonl for variable-length rows`, { file: output });
  }
  const split = splitPlanOf(options.split);
  const reader = corpusReaderOf(documents);
  const documentsRead = internals.documentsRead ?? (reader === null ? null : () => reader.stats.documents);
  return withLocks(outputDestinations(output, split), async () => {
    await assertOutputWritable(output, options.force ?? false, split);
    const sink = await openEncodedOutput(output, shape, internals.source, split);
    try {
      const stats = await encodeCorpus(documents, lexicon, shape, sink, { threads: options.threads ?? 1 });
      // Every document read must have become one row before anything is committed.
      if (documentsRead !== null && stats.documents !== documentsRead()) throw rowsError(output, stats.documents, documentsRead());
      internals.check?.(stats);
      const parts = await sink.finish(stats);
      await commitAll(await sink.commitSteps());
      return { stats, parts };
    } catch (e) {
      await sink.abort();
      throw e;
    }
  });
}

/** A split option checked and with its seed, or null. */
export function splitPlanOf(split: { splits: readonly Split[]; seed?: number } | null | undefined): SplitPlan | null {
  if (split === null || split === undefined) return null;
  const seed = split.seed ?? DEFAULT_SEED;
  checkSplits(split.splits);
  checkSeed(seed);
  return { splits: split.splits, seed };
}

/** The documents as a corpus reader (readCorpus's), or null for any other iterable. */
function corpusReaderOf(documents: unknown): CorpusReader | null {
  if (typeof documents !== 'object' || documents === null) return null;
  const d = documents as Partial<CorpusReader>;
  return typeof d.path === 'string' && typeof d.kind === 'string' && typeof d.stats === 'object' && d.stats !== null ? (d as CorpusReader) : null;
}
