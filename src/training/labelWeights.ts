import { LexlockError } from '../LexlockError.js';
import type { Lexicon } from '../lexicon/Lexicon.js';

/**
 * A weight for each label id that balances the labels in a loss, from the documents the lexicon's
 * corpus had of each (`fit.labels`):
 *
 *     w_c = n / (C · n_c)      n documents with a label, C labels, n_c documents of label c
 *
 * (common practice for class weights). Each label then weighs n / C in all, and the weights of the
 * n documents average 1. Throws `BAD_OPTION` for a lexicon without labels or without its fit.
 * @example labelWeights(lexicon) // [1.25, 0.5, …]: weights[labelId]
 */
export function labelWeights(lexicon: Lexicon): number[] {
  if (lexicon.labels.length === 0) {
    throw new LexlockError('BAD_OPTION', 'the lexicon has no labels: label weights need one built from a labelled corpus (--label FIELD, or a folder corpus)', {
      field: 'encoding.labels',
    });
  }
  const fit = lexicon.fit;
  if (fit === null) {
    throw new LexlockError('BAD_OPTION', 'the lexicon has no fit, so no label counts to weigh by: use one made by lexlock build or freeze, or call labelWeightsOf(counts)', {
      field: 'fit',
    });
  }
  const byLabel = new Map(fit.labels.map((l) => [l.label, l.documents]));
  return labelWeightsOf(lexicon.labels.map((label) => byLabel.get(label) ?? 0), lexicon.labels);
}

/**
 * The same weights from documents per label id: `labelWeightsOf([30, 10])` is `[0.6667, 2]` (40
 * documents, 2 labels: 40 / (2 · 30) and 40 / (2 · 10)). `names` (the labels in id order) only
 * serve the message when a count is 0, whose weight would be infinite.
 */
export function labelWeightsOf(documents: ArrayLike<number>, names?: readonly string[]): number[] {
  const counts = Array.from(documents);
  counts.forEach((n, id) => {
    if (!Number.isSafeInteger(n) || n < 0) {
      throw new LexlockError('BAD_OPTION', `documents of label ${id}: ${String(n)} is not a whole number from 0`, { field: 'labels' });
    }
    if (n === 0) {
      const name = names?.[id] === undefined ? `label ${id}` : `label ${id} ("${names[id]}")`;
      throw new LexlockError('BAD_OPTION', `${name} has no documents, so its weight n / (C · 0) has no value: count its documents, or leave it out of the labels`, { field: 'labels' });
    }
  });
  if (counts.length === 0) throw new LexlockError('BAD_OPTION', 'no labels to weigh: give the documents of each label', { field: 'labels' });
  const total = counts.reduce((a, b) => a + b, 0);
  return counts.map((n) => total / (counts.length * n));
}
