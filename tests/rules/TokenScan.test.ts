// TokenScan, the step-by-step form of scanTokens (so that a long document can be tokenized with pauses:
// issue 13): any budget must give the tokens scanTokens gives at once, normalization in pieces must
// give the whole text's normalization, and tokens prepared ahead must be taken, not found again.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { scanWork } from '../../src/rules/fast/scanWork.js';
import { normalize } from '../../src/rules/normalize.js';
import { prepareTokens } from '../../src/rules/prepareTokens.js';
import { dropPrepared, scanTokens } from '../../src/rules/scanTokens.js';
import { resolveRules, type TextRules } from '../../src/rules/TextRules.js';
import { mayCutBefore, pieceEnd, TokenScan } from '../../src/rules/TokenScan.js';
import { TokenSpans } from '../../src/rules/TokenSpans.js';
import { tokenize } from '../../src/rules/tokenize.js';
import { adversarialText } from './fast/adversarialText.js';
import { HOSTILE_FAMILIES, hostileFamily, hostileText } from './fast/hostileText.js';

const RULE_SETS: readonly [string, TextRules][] = [
  ['default rules', resolveRules()],
  ['case keep, unicode none', resolveRules({ case: 'keep', unicode: 'none' })],
  ['NFC, number/url collapsed, punctuation dropped', resolveRules({ unicode: 'NFC', collapse: ['number', 'url'], drop: ['punctuation'] })],
  ['character level', resolveRules({ level: 'char' })],
  ['character level, spaces dropped, case keep', resolveRules({ level: 'char', spaces: 'drop', case: 'keep' })],
];

/** The tokens of `text` found by a TokenScan in steps of `budget`, as strings. */
function stepped(text: string, rules: TextRules, budget: number, mayFold: boolean, strings = false): string[] {
  const out = new TokenSpans(strings);
  const scan = new TokenScan();
  scan.begin(text, rules, out, mayFold);
  let steps = 0;
  while (!scan.step(budget)) if (++steps > 10 * text.length + 100) throw new Error('no end in sight');
  return out.toArray();
}

describe('TokenScan in steps gives scanTokens\' tokens', () => {
  it.each(RULE_SETS)('fast-check adversarial and hostile text, any budget, folded or not; %s', (_name, rules) => {
    fc.assert(
      fc.property(fc.oneof(adversarialText, hostileFamily.map((f) => hostileText(f, 300))), fc.integer({ min: 1, max: 400 }), fc.boolean(), (text, budget, mayFold) => {
        expect(stepped(text, rules, budget, mayFold)).toEqual(tokenize(text, rules));
      }),
      { numRuns: 400 },
    );
  });

  it('hostile chunks longer than 64 KiB, which go to the cascade when the work comes in steps', () => {
    const rules = resolveRules();
    for (const family of HOSTILE_FAMILIES) {
      const text = `ok ${hostileText(family, 80 * 1024)} go`;
      expect(stepped(text, rules, 1 << 12, true), family.name).toEqual(tokenize(text, rules));
    }
    const plain = `x ${'ferry-'.repeat(20_000)} y`;
    expect(stepped(plain, rules, 1 << 12, false, true)).toEqual(tokenize(plain, rules));
  });
});

describe('normalization in pieces', () => {
  // Traps, common practice: Hangul compatibility jamo (U+3131 and on), whose NFKC forms join a syllable
  // before them; the final sigma, which looks at letters on both sides; marks that compose with what
  // precedes; lone surrogates; U+FDFA, which NFKC makes 18 characters.
  it.each([
    ['\uAC00\u3133', 0x3133, false],
    ['ΑΣ a', 0x20, true],
    ['ΑΣa', 0x61, false],
    ['ΑΣ.', 0x2e, false],
    ['e\u0301', 0x301, false],
    ['\uD800\uDC00', 0xdc00, false],
    ['\uFDFA\uFDFA', 0xfdfa, true],
    ['東京', 0x4eac, true],
    ['12', 0x32, true],
  ] as const)('%j: may cut before U+%s: %s', (text, code, may) => {
    expect(mayCutBefore(code)).toBe(may);
    const at = text.lastIndexOf(String.fromCharCode(code));
    if (may) for (const rules of RULE_SETS) expect(normalize(text.slice(0, at), rules[1]) + normalize(text.slice(at), rules[1])).toBe(normalize(text, rules[1]));
  });

  const TRICKY = ['a', 'A', 'Σ', 'σ', 'ς', ' ', '.', "'", ':', '1', '\u0301', '\u0327', '\u0338', '<', '\uAC00', '\u1100', '\u1161', '\u11A8', '\u3131', '\u3133', '\u314F', '\uD800', '\uDC00', '😀', '\uFDFA', 'ﬁ', 'ǅ', 'İ', '\u0B47', '\u0B3E', '\u3099', '\u304B', '①', '\u200D', '東', 'ا'];
  const tricky = fc.array(fc.oneof(fc.constantFrom(...TRICKY), fc.string({ unit: 'binary', maxLength: 2 })), { maxLength: 40 }).map((p) => p.join(''));

  it.each(RULE_SETS.slice(0, 3))('pieces cut wherever allowed give the whole text\'s normalization; %s', (_name, rules) => {
    fc.assert(
      fc.property(tricky, fc.integer({ min: 1, max: 5 }), (text, length) => {
        let pieces = '';
        for (let at = 0; at < text.length; ) {
          const end = pieceEnd(text, at, length);
          pieces += normalize(text.slice(at, end), rules);
          at = end;
        }
        expect(pieces).toBe(normalize(text, rules));
      }),
      { numRuns: 3000 },
    );
  });
});

describe('tokens prepared ahead', () => {
  const rules = resolveRules();
  const text = `Depart ${hostileText(HOSTILE_FAMILIES[0] as (typeof HOSTILE_FAMILIES)[number], 5000)} 10 am Ärø`;

  it.each([true, false])('are taken by the next scanTokens of the same text under the same rules (prepared as strings: %s)', (strings) => {
    const prepared = prepareTokens(text, rules, strings);
    while (!prepared.step(64));
    const before = scanWork.units;
    const taken = scanTokens(text, resolveRules(), new TokenSpans(true), false).toArray();
    expect(scanWork.units).toBe(before);
    expect(taken).toEqual(tokenize(text, rules));
    // Taken once: the next scan finds them again.
    expect(scanTokens(text, rules, new TokenSpans(false), true).toArray()).toEqual(taken);
    expect(scanWork.units).toBeGreaterThan(before);
  });

  it('are not taken for another text or other rules, and can be let go', () => {
    const prepared = prepareTokens(text, rules, false);
    while (!prepared.step(1 << 20));
    const keep = resolveRules({ case: 'keep' });
    expect(scanTokens(text, keep, new TokenSpans(true), false).toArray()).toEqual(tokenize(text, keep));
    expect(scanTokens(`${text} `, rules, new TokenSpans(true), false).toArray()).toEqual(tokenize(text, rules));
    dropPrepared();
    const before = scanWork.units;
    scanTokens(text, rules, new TokenSpans(false), true);
    expect(scanWork.units).toBeGreaterThan(before);
  });
});
