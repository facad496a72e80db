import type { BadTextPolicy } from '../corpus/decodeText.js';
import { corpusName } from '../lexicon/corpusName.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import type { Shape } from '../lexicon/Shape.js';
import type { EncodeStats } from '../pipeline/EncodeStats.js';
import type { SplitPlan } from '../split/Split.js';
import { labelWeights } from '../training/labelWeights.js';
import { VERSION } from '../version.js';
import { pathFrom } from './pathFrom.js';

/**
 * The version of an encoded folder's manifest.json. Version 3: keys (`files.keys`, `keyField`),
 * splits (`split`), rows per label (`labelRows`), label weights (`labelWeights`) and the bad-text
 * policy (`badText`). Version 2: the
 * shape's ends are `start`/`end` (the manifest of lexlock 0.1 carried no version and other names).
 */
export const MANIFEST_FORMAT_VERSION = 3;

/** The file names of an encoded folder (or of each split's folder inside it). */
export const ENCODED_FILES = { ids: 'ids.npy', lengths: 'lengths.npy', labels: 'labels.npy', keys: 'keys.jsonl', manifest: 'manifest.json' } as const;

/** What an encoded output records about where its rows came from. */
export interface EncodedSource {
  lexicon: Lexicon;
  /** The lexicon's file, which a manifest names relative to its own folder; null when it has none. */
  lexiconPath: string | null;
  /** The corpus path (a manifest keeps only its last segment), or null. */
  corpus: string | null;
  /** The bad-text policy the corpus was read under; null for texts that were never bytes. */
  badText: BadTextPolicy | null;
  /** The key field the corpus was read with, or null for keys numbered by the reader. */
  keyField: string | null;
  /** The reader's counts of documents replaced or left out for invalid UTF-8, read once all rows are in. */
  readStats: { readonly replaced: number; readonly skipped: number };
}

/**
 * The manifest of the encoded folder `folder`: one split's (`part`, with the plan) or the whole
 * corpus's. README ("The encoded folder") documents every member.
 */
export function encodedManifest(
  folder: string,
  stats: EncodeStats,
  labelled: boolean,
  shape: Shape,
  source: EncodedSource,
  split: { plan: SplitPlan; part: string } | null,
): object {
  const { lexicon, lexiconPath, corpus, readStats } = source;
  return {
    format: 'lexlock.encoded',
    formatVersion: MANIFEST_FORMAT_VERSION,
    lexlockVersion: VERSION,
    lexicon: { fingerprint: lexicon.fingerprint, file: lexiconPath === null ? null : pathFrom(folder, lexiconPath), size: lexicon.size, oovId: lexicon.oovId },
    source: corpus === null ? null : corpusName(corpus),
    badText: source.badText,
    keyField: source.keyField,
    split:
      split === null
        ? null
        : { name: split.part, seed: split.plan.seed, hash: 'sha256', splits: split.plan.splits.map(({ name, share }) => ({ name, share })) },
    rows: stats.documents,
    shape,
    files: { ids: ENCODED_FILES.ids, lengths: ENCODED_FILES.lengths, labels: labelled ? ENCODED_FILES.labels : null, keys: ENCODED_FILES.keys },
    labels: labelled ? lexicon.labels : null,
    labelRows: labelled ? stats.labelRows : null,
    labelWeights: labelled ? weightsOf(lexicon) : null,
    unknownLabels: stats.unknownLabels,
    replacedDocuments: readStats.replaced,
    skippedDocuments: readStats.skipped,
    tokens: stats.tokens,
    oovTokens: stats.oovTokens,
    truncatedDocuments: stats.truncatedDocuments,
    droppedTokens: stats.droppedTokens,
  };
}

/**
 * Label weights for a loss, `n / (C · n_c)` by label id from the documents of each label in the
 * lexicon's corpus (see labelWeights), or null when the lexicon has no fit or a label had no documents.
 */
function weightsOf(lexicon: Lexicon): number[] | null {
  const fit = lexicon.fit;
  if (fit === null || lexicon.labels.length === 0) return null;
  const byLabel = new Map(fit.labels.map((l) => [l.label, l.documents]));
  if (lexicon.labels.some((label) => (byLabel.get(label) ?? 0) === 0)) return null;
  return labelWeights(lexicon);
}
