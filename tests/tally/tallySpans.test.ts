// A Tally counts a text by looking its tokens up where they lie in the text (issue 15, goal 1): no
// string is made for a token already counted. The counts must be exactly those the definition gives
// (encoding contract, rule 3): the text's tokens as strings (`tokenize`, itself proven equal to
// wink-tokenizer's reading by tests/reference), counted in plain Maps in the order first met. Checked
// under every rule variant on adversarial texts, ASCII with capitals (spans read lower-cased in place),
// text that normalization changes, long tokens (13 code units and more) and tokens made as strings
// (collapsed placeholders, alien pieces).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { resolveRules, TOKEN_TYPES, type TextRules } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';
import { Tally } from '../../src/tally/Tally.js';
import { adversarialText } from '../rules/fast/adversarialText.js';

const RULE_SETS: readonly [string, TextRules][] = [
  ['default rules', resolveRules()],
  ['case keep, unicode none', resolveRules({ case: 'keep', unicode: 'none' })],
  ['NFC, number/time/url collapsed, punctuation and emoji dropped', resolveRules({ unicode: 'NFC', collapse: ['number', 'time', 'url'], drop: ['punctuation', 'emoji'] })],
  ['email and mention collapsed', resolveRules({ collapse: ['email', 'mention', 'hashtag'] })],
  ['every type but word dropped', resolveRules({ drop: TOKEN_TYPES.filter((t) => t !== 'word') })],
  ['character level', resolveRules({ level: 'char' })],
  ['character level, spaces dropped', resolveRules({ level: 'char', spaces: 'drop' })],
];

const WORDS = [
  'Ferry', 'FERRY', 'ferry', 'Late', 'late', 'CROSSINGS', 'Overbooked-Departures', 'DISEMBARKATIONPOINT', 'disembarkationpoint',
  'É', 'été', 'ÉTÉ', 'İstanbul', 'straße', 'STRASSE', 'ﬁne', '東京', '😀', '__proto__', 'constructor', "Couldn't", '42ND',
  'crew@pier.example', 'https://pier.example/a', '@harbour', '#delay', '10:30am', '3/10', '12.50', 'ab…', '\u0301a',
];
const word = fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...WORDS) }, { weight: 1, arbitrary: adversarialText });
const text = fc.array(fc.tuple(word, fc.constantFrom(' ', '  ', ', ', '\n', '\t', '', '. ')), { maxLength: 14 }).map((parts) => parts.map(([w, g]) => w + g).join(''));
const doc = fc.record({ text, label: fc.option(fc.constantFrom('delays', 'praise', 'constructor'), { nil: undefined }) });

/** The definition: each text's tokens as strings, counted in Maps in the order first met. */
function reference(docs: ReadonlyArray<{ text: string; label: string | undefined }>, rules: TextRules) {
  const numbers = new Map<string, number>();
  const counts: number[] = [];
  const documents: number[] = [];
  const lengths = new Map<number, number>();
  const labels = new Map<string, { documents: number; tokens: number }>();
  const numbered: number[][] = [];
  let tokensInAll = 0;
  for (const d of docs) {
    const tokens = tokenize(d.text, rules);
    tokensInAll += tokens.length;
    lengths.set(tokens.length, (lengths.get(tokens.length) ?? 0) + 1);
    const seen = new Set<number>();
    const row: number[] = [];
    for (const t of tokens) {
      let n = numbers.get(t);
      if (n === undefined) {
        n = numbers.size;
        numbers.set(t, n);
        counts.push(0);
        documents.push(0);
      }
      counts[n] = (counts[n] as number) + 1;
      if (!seen.has(n)) documents[n] = (documents[n] as number) + 1;
      seen.add(n);
      row.push(n);
    }
    numbered.push(row);
    if (d.label !== undefined) {
      const l = labels.get(d.label) ?? { documents: 0, tokens: 0 };
      labels.set(d.label, { documents: l.documents + 1, tokens: l.tokens + tokens.length });
    }
  }
  return {
    entries: [...numbers.keys()].map((t, n) => [t, counts[n], documents[n]]),
    documents: docs.length,
    tokens: tokensInAll,
    lengths: [...lengths],
    labels: [...labels],
    numbered,
  };
}

function told(tally: Tally, numbered: number[][]) {
  return {
    entries: [...tally.entries()],
    documents: tally.documents,
    tokens: tally.tokens,
    lengths: [...tally.lengths],
    labels: [...tally.labels],
    numbered,
  };
}

describe('Tally counts spans as the definition counts strings (property)', () => {
  it.each(RULE_SETS)('add and addNumberedText, %s', (_name, rules) => {
    fc.assert(
      fc.property(fc.array(doc, { maxLength: 12 }), (docs) => {
        const byAdd = new Tally(rules);
        const numbered = new Tally(rules);
        const rows: number[][] = [];
        for (const d of docs) {
          byAdd.add(d);
          rows.push([...numbered.addNumberedText(d.text, d.label)]);
        }
        const want = reference(docs, rules);
        expect(told(numbered, rows)).toEqual(want);
        expect(told(byAdd, rows)).toEqual(want);
        // Lookups by string find what the spans counted.
        for (const [token, count, documents] of want.entries as Array<[string, number, number]>) {
          expect([byAdd.countOf(token), byAdd.documentsOf(token)]).toEqual([count, documents]);
        }
      }),
      { numRuns: 150 },
    );
  });

  it('mixes counting by strings, by spans and by merging under one numbering', () => {
    const rules = resolveRules();
    fc.assert(
      fc.property(fc.array(doc, { maxLength: 8 }), fc.array(doc, { maxLength: 8 }), fc.array(doc, { maxLength: 8 }), (a, b, c) => {
        const mixed = new Tally(rules);
        for (const d of a) mixed.addTokens(tokenize(d.text, rules), d.label);
        for (const d of b) mixed.add(d);
        const other = new Tally(rules);
        for (const d of c) other.add(d);
        mixed.mergeCounts(other.toCounts());
        const plain = new Tally(rules);
        for (const d of [...a, ...b]) plain.addTokens(tokenize(d.text, rules), d.label);
        const third = new Tally(rules);
        for (const d of c) third.addTokens(tokenize(d.text, rules), d.label);
        plain.mergeCounts(third.toCounts());
        expect(told(mixed, [])).toEqual(told(plain, []));
      }),
      { numRuns: 150 },
    );
  });

  it('counts a hand-checked example', () => {
    const tally = new Tally(resolveRules());
    tally.add({ text: 'The FERRY, the ferry: Disembarkationpoint!', label: 'delays' });
    tally.add('ferry');
    expect([...tally.entries()]).toEqual([['the', 2, 1], ['ferry', 3, 2], [',', 1, 1], [':', 1, 1], ['disembarkationpoint', 1, 1], ['!', 1, 1]]);
    expect([tally.documents, tally.tokens, [...tally.lengths], [...tally.labels]]).toEqual([2, 9, [[8, 1], [1, 1]], [['delays', { documents: 1, tokens: 8 }]]]);
  });
});
