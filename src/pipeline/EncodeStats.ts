import type { Shape } from '../lexicon/Shape.js';

/** What an encode run saw (or one split of it). */
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
  /** Documents of each label the lexicon knows, in label id order. */
  labelRows: number[];
}

/** What a row's document had before it was shaped: its tokens and how many of them are OOV. */
export interface RowFacts {
  tokens: number;
  oovTokens: number;
}

/** Stats with nothing counted yet, for a lexicon of `labels` labels. */
export function emptyEncodeStats(labels: number): EncodeStats {
  return { documents: 0, tokens: 0, oovTokens: 0, truncatedDocuments: 0, droppedTokens: 0, unknownLabels: 0, labelled: 0, labelRows: new Array<number>(labels).fill(0) };
}

/** Counts one row: its document's facts, its label id (null: unlabelled, -1: unknown) under a shape (null: no cut). */
export function countRow(stats: EncodeStats, facts: RowFacts, shape: Shape | null, labelId: number | null): void {
  stats.documents += 1;
  stats.tokens += facts.tokens;
  stats.oovTokens += facts.oovTokens;
  if (labelId !== null) {
    stats.labelled += 1;
    if (labelId === -1) stats.unknownLabels += 1;
    else stats.labelRows[labelId] = (stats.labelRows[labelId] ?? 0) + 1;
  }
  if (shape !== null && facts.tokens > shape.length) {
    stats.truncatedDocuments += 1;
    stats.droppedTokens += facts.tokens - shape.length;
  }
}
