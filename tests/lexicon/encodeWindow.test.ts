// A shaped encode tokenizes only the window its row keeps (issue 14, point 7): the rows of long texts
// must be exactly the rows the whole text's ids give (shapeInto of the variable-length ids), for both
// cut ends and pad ends, at the word and character levels and under every rule variant; keptIds and
// encodeMany must agree with them.
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { freeze } from '../../src/lexicon/freeze.js';
import type { Lexicon } from '../../src/lexicon/Lexicon.js';
import { shapeInto, type Shape, type ShapeEnd } from '../../src/lexicon/Shape.js';
import { resolveRules, TOKEN_TYPES, type TextRulesInput } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { adversarialText, GLUE } from '../rules/fast/adversarialText.js';
import { hostileFamily, hostileText } from '../rules/fast/hostileText.js';

const demo: string[] = [];
for await (const doc of readCorpus(join(import.meta.dirname, '../../corpora-demo/ferry-messages.csv'))) demo.push(doc.text);

const RULES: readonly [string, TextRulesInput][] = [
  ['default rules', {}],
  ['case keep, unicode none', { case: 'keep', unicode: 'none' }],
  ['NFC, number/time/url collapsed, punctuation and emoji dropped', { unicode: 'NFC', collapse: ['number', 'time', 'url'], drop: ['punctuation', 'emoji'] }],
  ['every type but word dropped', { drop: TOKEN_TYPES.filter((t) => t !== 'word') }],
  ['character level', { level: 'char' }],
  ['character level, spaces dropped, case keep', { level: 'char', spaces: 'drop', case: 'keep' }],
];
const ENDS: readonly ShapeEnd[] = ['start', 'end'];

function lexiconOf(rules: TextRulesInput): Lexicon {
  return freeze(Tally.fromTexts(demo.slice(0, 400), resolveRules(rules)), { cap: 300 });
}

/** Long texts: demo messages, adversarial texts and hostile runs, glued by odd white space, some kilobytes to tens of kilobytes. */
const longText = fc
  .array(
    fc.tuple(
      fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...demo) }, { weight: 2, arbitrary: adversarialText }, { weight: 1, arbitrary: hostileFamily.map((f) => hostileText(f, 60)) }),
      fc.constantFrom(...GLUE),
    ),
    { minLength: 1, maxLength: 80 },
  )
  .map((parts) => parts.map(([text, glue]) => text + glue).join(''));

const shape = fc.record({ length: fc.integer({ min: 1, max: 120 }), pad: fc.constantFrom(...ENDS), cut: fc.constantFrom(...ENDS) });

/** The row the whole text's ids give: the definition a window must meet. */
function wholeRow(lexicon: Lexicon, text: string, s: Shape): Int32Array {
  const row = new Int32Array(s.length);
  shapeInto(lexicon.encode(text, { shape: null }), s, row, 0);
  return row;
}

describe('a shaped encode of a long text gives the whole text\'s row', () => {
  it.each(RULES)('encode, keptIds and encodeMany; %s', (_name, rules) => {
    const lexicon = lexiconOf(rules);
    fc.assert(
      fc.property(fc.array(longText, { minLength: 1, maxLength: 3 }), shape, (texts, s) => {
        const rows = texts.map((text) => wholeRow(lexicon, text, s));
        texts.forEach((text, r) => {
          const row = rows[r] as Int32Array;
          expect(lexicon.encode(text, { shape: s })).toEqual(row);
          const all = lexicon.encode(text, { shape: null });
          const kept = Math.min(all.length, s.length);
          expect(lexicon.keptIds(text, { shape: s })).toEqual(s.cut === 'end' ? all.slice(0, kept) : all.slice(all.length - kept));
        });
        const batch = lexicon.encodeMany(texts, { shape: s });
        expect(batch.ids).toEqual(Int32Array.from(rows.flatMap((row) => [...row])));
        expect([...batch.lengths]).toEqual(texts.map((text) => Math.min(lexicon.encode(text, { shape: null }).length, s.length)));
      }),
      { numRuns: 60 },
    );
  });

  it('keptIds without a shape gives every id, as encode does', () => {
    const lexicon = lexiconOf({});
    const text = demo.slice(0, 30).join(' ');
    expect(lexicon.keptIds(text)).toEqual(lexicon.encode(text));
    expect(lexicon.keptIds(text).length).toBeGreaterThan(200);
  });
});
