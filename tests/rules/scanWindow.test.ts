// scanWindow (issue 14, point 7): a shaped encode tokenizes only the part of a long text its row keeps.
// The kept tokens must be exactly those of the whole text (scanTokens, itself proven equal to the
// contract's definition by tests/lexicon/encodeExact.test.ts), for both cut ends, at the word and
// character levels, under every rule variant, wherever a window happens to end or start: the windows
// here are made as small as one code unit so that every place in a text gets to be a window's edge.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { prepareTokens } from '../../src/rules/prepareTokens.js';
import { scanTokens } from '../../src/rules/scanTokens.js';
import { firstWindow, scanWindow, windowWork, type CutEnd } from '../../src/rules/scanWindow.js';
import { resolveRules, TOKEN_TYPES, type TextRules } from '../../src/rules/TextRules.js';
import { TokenSpans } from '../../src/rules/TokenSpans.js';
import { adversarialText, GLUE } from './fast/adversarialText.js';
import { HOSTILE_FAMILIES, hostileFamily, hostileText } from './fast/hostileText.js';

const RULE_SETS: readonly [string, TextRules][] = [
  ['default rules', resolveRules()],
  ['case keep, unicode none', resolveRules({ case: 'keep', unicode: 'none' })],
  ['NFC, number/time/url collapsed, punctuation and emoji dropped', resolveRules({ unicode: 'NFC', collapse: ['number', 'time', 'url'], drop: ['punctuation', 'emoji'] })],
  ['every type but word dropped', resolveRules({ drop: TOKEN_TYPES.filter((t) => t !== 'word') })],
  ['character level', resolveRules({ level: 'char' })],
  ['character level, case keep, unicode none', resolveRules({ level: 'char', case: 'keep', unicode: 'none' })],
  ['character level, spaces dropped', resolveRules({ level: 'char', spaces: 'drop' })],
];
const CUTS: readonly CutEnd[] = ['start', 'end'];

/** The tokens a row of `want` keeps, from the whole text's tokens (the definition). */
function keptOfWhole(text: string, rules: TextRules, want: number, cut: CutEnd): string[] {
  const all = scanTokens(text, rules, new TokenSpans(), true).toArray();
  return cut === 'end' ? all.slice(0, want) : all.slice(Math.max(0, all.length - want));
}

/** The tokens a row of `want` keeps, picked from a window as Lexicon.encode picks them (keptOf, firstKept). */
function keptOfWindow(text: string, rules: TextRules, want: number, cut: CutEnd, first?: number): string[] {
  const out = scanWindow(text, rules, new TokenSpans(), want, cut, first);
  const kept = Math.min(out.count, want);
  const from = out.count > want && cut === 'start' ? out.count - want : 0;
  const tokens: string[] = [];
  for (let i = 0; i < kept; i++) tokens.push(out.tokenAt(from + i));
  return tokens;
}

/** Long adversarial text: many adversarial texts and short hostile runs, glued by odd white space or none. */
const longText = fc
  .array(fc.tuple(fc.oneof({ weight: 5, arbitrary: adversarialText }, { weight: 1, arbitrary: hostileFamily.map((f) => hostileText(f, 40)) }), fc.constantFrom(...GLUE)), { minLength: 1, maxLength: 10 })
  .map((parts) => parts.map(([text, glue]) => text + glue).join(''));

// Characters where normalization or tokenizing looks across a place (see TokenScan.test.ts for the
// normalization traps, common practice): Hangul jamo, final sigma, marks, surrogates, U+FDFA; and
// what the time rule joins over one white space (digits, ':', a/p/h), also as full-width or other
// compatibility forms that NFKC makes a, p or h; white space of every kind, and U+00A8, which NFKC
// makes a space and a mark.
const TRICKY = [
  'a', 'A', 'p', 'h', 'm', 'r', 's', 'Σ', 'σ', ' ', '  ', '\t', '\u00A0', '\u3000', '\uFEFF', '\u2028', '.', "'", ':', '1', '10', '0:',
  '\u0301', '\u0327', '\uAC00', '\u1100', '\u1161', '\u11A8', '\u3131', '\u3133', '\uD800', '\uDC00', '😀', '\uFDFA', 'ﬁ', 'İ',
  'ａ', 'Ｐ', 'ℎ', 'ª', 'ₐ', '\u00A8', '①', '東', 'ا', '@', 'x.io', 'http://', '#',
];
const trickyText = fc.array(fc.oneof(fc.constantFrom(...TRICKY), fc.string({ unit: 'binary', maxLength: 2 })), { maxLength: 60 }).map((p) => p.join(''));
/** Mostly ASCII (read in place, unnormalized) with now and then a character that composes with the one before it or becomes ASCII. */
const mostlyAscii = fc
  .array(fc.oneof({ weight: 8, arbitrary: fc.constantFrom('a', 'e', 'p', 'h', 'm', '1', '0', ':', ' ', ' ', '  ', '.', 'am', 'x') }, { weight: 1, arbitrary: fc.constantFrom('\u0301', '\u0327', '\u0308', 'ａ', '\u00A0', 'Σ') }), { maxLength: 40 })
  .map((p) => p.join(''));

describe('scanWindow keeps exactly the whole text\'s tokens', () => {
  it.each(RULE_SETS)('long adversarial text, windows from 1 code unit, both cut ends; %s', (_name, rules) => {
    fc.assert(
      fc.property(longText, fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 120 }), fc.constantFrom(...CUTS), (text, want, first, cut) => {
        expect(keptOfWindow(text, rules, want, cut, first)).toEqual(keptOfWhole(text, rules, want, cut));
      }),
      { numRuns: 250 },
    );
  });

  it.each(RULE_SETS)('normalization and time-rule traps at every window edge; %s', (_name, rules) => {
    fc.assert(
      fc.property(fc.oneof(trickyText, mostlyAscii), fc.integer({ min: 1, max: 6 }), fc.integer({ min: 1, max: 12 }), fc.constantFrom(...CUTS), (text, want, first, cut) => {
        expect(keptOfWindow(text, rules, want, cut, first)).toEqual(keptOfWhole(text, rules, want, cut));
      }),
      { numRuns: 1500 },
    );
  });

  // Each text here breaks a window that ignores one of the reasons above (checked by hand): every
  // window size and kept count up to the text's tokens is tried.
  it.each([
    ['a time over one white space at the tail\'s start', 'ferry 10 am', resolveRules()],
    ['a full-width time suffix NFKC makes "am"', 'ferry 10 ａｍ x', resolveRules()],
    ['a time split over the head\'s limit', 'x 10 am y 7 pm z 3:45 hrs', resolveRules()],
    ['a mention, e-mail and URL at the edges', 'see @deck or a@b.co at https://x.io/p?q=1 now', resolveRules()],
    ['final sigma before white space', 'ΟΔΟΣ ΑΣ a ΑΣa', resolveRules()],
    ['Hangul jamo NFKC joins with the syllable before', '\uAC00\u3133 \uAC00\u3133\u3131', resolveRules()],
    ['U+00A8 becomes a space and a mark', 'a \u00A8b\u00A8 \u00A8', resolveRules({ level: 'char' })],
    ['runs of white space of several kinds', 'a  \t\u3000b \u00A0 c\n\nd', resolveRules({ level: 'char' })],
    ['surrogate pairs and lone surrogates', '😀 😀\uD800x\uDC00 😀', resolveRules({ level: 'char' })],
    ['a byte order mark, white space that may not be cut before', 'a\uFEFFb \uFEFF c', resolveRules()],
    ['a final sigma after a byte order mark: lower-casing looks back through it', 'ΑΣ a\uFEFFΣ b\uFEFFΣ', resolveRules()],
    ['ASCII, then a mark that composes with the letter before it', 'ae\u0301c e\u0301 10 a\u0301m x', resolveRules()],
    ['ASCII, then a mark that composes with the letter before it; character level', 'ae\u0301c e\u0301 x', resolveRules({ level: 'char' })],
  ])('%s', (_name, text, rules) => {
    const total = scanTokens(text, rules, new TokenSpans(), true).count;
    for (let first = 1; first <= text.length; first++) {
      for (let want = 1; want <= total; want++) {
        for (const cut of CUTS) expect(keptOfWindow(text, rules, want, cut, first), `first ${first}, want ${want}, cut ${cut}`).toEqual(keptOfWhole(text, rules, want, cut));
      }
    }
  });

  it('a text at most the first window long, or one whose tokens were found ahead, is scanned whole', () => {
    const rules = resolveRules();
    expect(scanWindow('the ferry was late again', rules, new TokenSpans(), 2, 'end').count).toBe(5);
    const long = 'the ferry was late again '.repeat(1000);
    expect(scanWindow(long, rules, new TokenSpans(), 2, 'end').count).toBeLessThan(100);
    const prepared = prepareTokens(long, rules, false);
    while (!prepared.step(1 << 12));
    // Taken as they were found: all 5,000 tokens, where a window holds a few.
    expect(scanWindow(long, rules, new TokenSpans(), 2, 'end').count).toBe(5000);
  });
});

describe('scanWindow reads only the window (work counted, never timed)', () => {
  const prose = 'The 10 am ferry from Ærø was late again, said the crew; refunds at https://ferry.example.org/help. ';
  const ascii = prose.replace('Ærø', 'Aero');
  const texts: readonly [string, string, TextRules][] = [
    ['ASCII prose, word level', ascii, resolveRules()],
    ['prose with non-ASCII words, word level', prose, resolveRules()],
    ['ASCII prose, character level', ascii, resolveRules({ level: 'char' })],
    ['prose with non-ASCII words, character level, spaces dropped', prose, resolveRules({ level: 'char', spaces: 'drop' })],
  ];

  /** The windowWork units (code units looked at) of one scanWindow. */
  function workOf(text: string, rules: TextRules, want: number, cut: CutEnd): { work: number; count: number } {
    const before = windowWork.units;
    const out = scanWindow(text, rules, new TokenSpans(), want, cut);
    return { work: windowWork.units - before, count: out.count };
  }

  it.each(texts)('%s: a 300 KiB text at length 200 reads about what 200 tokens take, from either end', (_name, unit, rules) => {
    const text = unit.repeat(Math.ceil((300 * 1024) / unit.length));
    const whole = scanTokens(text, rules, new TokenSpans(), true).count;
    const window = firstWindow(200, rules);
    for (const cut of CUTS) {
      const { work, count } = workOf(text, rules, 200, cut);
      expect(count, cut).toBeGreaterThanOrEqual(200);
      // The tokens found: a window's worth, against tens of thousands in the whole text.
      expect(count, cut).toBeLessThanOrEqual(2 * window);
      expect(whole).toBeGreaterThan(100 * count);
      // Each code unit of the window looked at a few times (checked, normalized, scanned), the rest never.
      expect(work, cut).toBeLessThanOrEqual(4 * window);
      expect(work, cut).toBeGreaterThanOrEqual(window / 4);
    }
  });

  it('a tail that cannot start where it looks for one reads the text a few times over, never once a candidate', () => {
    // Every white space is followed by a full-width a, which NFKC makes "a": no tail may start after a
    // digit there. A search that normalized the whole tail for each candidate would read it n²/2 times.
    const rules = resolveRules();
    for (const unit of ['ａ ', '1 ａ ', 'ｐ\u3000']) {
      const text = unit.repeat(40_000);
      const { work } = workOf(text, rules, 5, 'start');
      expect(work, JSON.stringify(unit)).toBeLessThanOrEqual(6 * text.length);
      expect(keptOfWindow(text, rules, 5, 'start')).toEqual(keptOfWhole(text, rules, 5, 'start'));
    }
  });

  it('a text without white space to start a tail at is read whole, and still right', () => {
    const rules = resolveRules();
    const text = hostileText(HOSTILE_FAMILIES[0] as (typeof HOSTILE_FAMILIES)[number], 20_000);
    const out = scanWindow(text, rules, new TokenSpans(), 5, 'start');
    expect(out.count).toBe(scanTokens(text, rules, new TokenSpans(), true).count);
    expect(keptOfWindow(text, rules, 5, 'start')).toEqual(keptOfWhole(text, rules, 5, 'start'));
  });
});
