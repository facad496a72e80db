import type { Lexicon } from '../lexicon/Lexicon.js';
import { shapeInto, type Shape } from '../lexicon/Shape.js';
import type { LabelledText } from '../tally/Tally.js';

/** Receives encoded rows in corpus order. */
export interface RowSink {
  /**
   * One document: `ids` (shaped when a shape was given, else variable length), how many of them are
   * tokens, and its label id (-1 for a label the lexicon lacks, null for an unlabelled document).
   * `ids` is reused for the next row: copy it to keep it.
   */
  row(ids: Int32Array, kept: number, labelId: number | null): Promise<void> | void;
}

/** What an encode run saw. */
export interface EncodeStats {
  documents: number;
  /** Tokens of all documents before any cut. */
  tokens: number;
  oovTokens: number;
  truncatedDocuments: number;
  droppedTokens: number;
  /** Documents whose label the lexicon does not know (label id -1). */
  unknownLabels: number;
  labelled: number;
}

/**
 * Encodes a stream of documents with a lexicon, row by row, into a sink: the same tokenize and id
 * path as `Lexicon.encode`, holding one row at a time.
 */
export async function encodeCorpus(
  documents: AsyncIterable<string | LabelledText> | Iterable<string | LabelledText>,
  lexicon: Lexicon,
  shape: Shape | null,
  sink: RowSink,
): Promise<EncodeStats> {
  const stats: EncodeStats = { documents: 0, tokens: 0, oovTokens: 0, truncatedDocuments: 0, droppedTokens: 0, unknownLabels: 0, labelled: 0 };
  const shaped = shape === null ? null : new Int32Array(shape.length);
  const labels = new Map(lexicon.labels.map((l, i) => [l, i]));
  for await (const doc of documents) {
    const text = typeof doc === 'string' ? doc : doc.text;
    const label = typeof doc === 'string' ? undefined : doc.label;
    const ids = lexicon.idsOf(lexicon.tokenize(text));
    stats.documents += 1;
    stats.tokens += ids.length;
    for (let i = 0; i < ids.length; i++) if (ids[i] === lexicon.oovId) stats.oovTokens += 1;
    let labelId: number | null = null;
    if (label !== undefined) {
      stats.labelled += 1;
      labelId = labels.get(label) ?? -1;
      if (labelId === -1) stats.unknownLabels += 1;
    }
    if (shape === null || shaped === null) {
      await sink.row(ids, ids.length, labelId);
      continue;
    }
    if (ids.length > shape.length) {
      stats.truncatedDocuments += 1;
      stats.droppedTokens += ids.length - shape.length;
    }
    shaped.fill(0);
    const kept = shapeInto(ids, shape, shaped, 0);
    await sink.row(shaped, kept, labelId);
  }
  return stats;
}
