// Label weights w_c = n / (C · n_c) (common practice for class weights), worked out by hand.
import { describe, expect, it } from 'vitest';
import { Lexicon } from '../../src/lexicon/Lexicon.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { labelWeights, labelWeightsOf } from '../../src/training/labelWeights.js';

const rules = resolveRules();

describe('labelWeights', () => {
  it('weighs the labels of a lexicon by its corpus, worked by hand', () => {
    // 6 documents: delays 3, praise 1, refunds 2; C = 3 labels, ids in string order.
    const lexicon = freeze(
      Tally.fromTexts(
        [
          { text: 'late again', label: 'delays' },
          { text: 'late', label: 'delays' },
          { text: 'so late', label: 'delays' },
          { text: 'lovely crew', label: 'praise' },
          { text: 'refund please', label: 'refunds' },
          { text: 'my refund', label: 'refunds' },
        ],
        rules,
      ),
    );
    expect(lexicon.labels).toEqual(['delays', 'praise', 'refunds']);
    // delays 6 / (3 · 3) = 2/3; praise 6 / (3 · 1) = 2; refunds 6 / (3 · 2) = 1.
    const weights = labelWeights(lexicon);
    expect(weights).toHaveLength(3);
    expect(weights[0]).toBeCloseTo(2 / 3, 15);
    expect(weights.slice(1)).toEqual([2, 1]);
    // Each label weighs n / C = 2 in all: 3 · 2/3, 1 · 2, 2 · 1.
    expect([3, 1, 2].map((n, c) => n * weights[c]!)).toEqual([2, 2, 2]);
  });

  it.each<[number[], number[]]>([
    [[30, 10], [40 / 60, 2]],
    [[5, 5, 5, 5], [1, 1, 1, 1]],
    [[1, 99], [50, 100 / 198]],
  ])('documents %j give %j', (counts, expected) => {
    expect(labelWeightsOf(counts)).toEqual(expected);
  });

  it.each<[string, () => unknown, string]>([
    ['a lexicon without labels', () => labelWeights(freeze(Tally.fromTexts(['late'], rules))), 'the lexicon has no labels: label weights need one built from a labelled corpus (--label FIELD, or a folder corpus)'],
    [
      'a lexicon without its fit',
      () => {
        const made = freeze(Tally.fromTexts([{ text: 'late', label: 'delays' }], rules));
        return labelWeights(new Lexicon(made.encoding, null));
      },
      'the lexicon has no fit, so no label counts to weigh by: use one made by lexlock build or freeze, or call labelWeightsOf(counts)',
    ],
    ['a label with no documents', () => labelWeightsOf([4, 0], ['delays', 'praise']), 'label 1 ("praise") has no documents, so its weight n / (C · 0) has no value: count its documents, or leave it out of the labels'],
    ['a count that is no whole number', () => labelWeightsOf([4, 1.5]), 'documents of label 1: 1.5 is not a whole number from 0'],
    ['no counts', () => labelWeightsOf([]), 'no labels to weigh: give the documents of each label'],
  ])('refuses %s', (_name, call, message) => {
    expect(call).toThrow(message);
  });
});
