// normalize and tokenize checked against Unicode Standard Annex #15 (Unicode Normalization Forms),
// the Unicode Character Database (UnicodeData.txt decompositions) and SpecialCasing.txt.
//
// Source of the expected code points: UAX #15's figures of singletons, canonical composites, multiple
// combining marks and compatibility composites, and its table of the four forms applied to
// U+1E9B U+0323; UnicodeData.txt for <circle> and <wide> decompositions; SpecialCasing.txt for
// U+0130 and the Final_Sigma condition. All written here from memory of those documents.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { normalize } from '../../src/rules/normalize.js';
import { resolveRules, type TextRules } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';

/** A string from code points given as hex, e.g. cp('1E9B 0323'). */
function cp(hex: string): string {
  return String.fromCodePoint(...hex.split(' ').map((h) => Number.parseInt(h, 16)));
}

/** The code points of a string as upper-case hex, for readable failures. */
function hexOf(s: string): string {
  return [...s].map((c) => (c.codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')).join(' ');
}

const keep = (unicode: TextRules['unicode']): Pick<TextRules, 'unicode' | 'case'> => ({ unicode, case: 'keep' });

describe('UAX #15: the four forms of U+1E9B U+0323 (table in UAX #15 section 1.2, from memory)', () => {
  // Source: 1E9B 0323. NFD: 017F 0323 0307. NFC: 1E9B 0323. NFKD: 0073 0323 0307. NFKC: 1E69.
  // lexlock offers NFC and NFKC; the decomposed forms are canonically or compatibly equivalent inputs
  // and must normalize to the same NFC / NFKC results.
  it.each([
    ['1E9B 0323', 'NFC', '1E9B 0323'],
    ['1E9B 0323', 'NFKC', '1E69'],
    ['017F 0323 0307', 'NFC', '1E9B 0323'],
    ['017F 0323 0307', 'NFKC', '1E69'],
    ['0073 0323 0307', 'NFKC', '1E69'],
    ['0073 0323 0307', 'NFC', '1E69'],
    ['1E9B 0323', 'none', '1E9B 0323'],
    ['017F 0323 0307', 'none', '017F 0323 0307'],
  ] as const)('%s under %s is %s', (source, form, result) => {
    expect(hexOf(normalize(cp(source), keep(form)))).toBe(result);
  });
});

describe('UAX #15 figures: canonical and compatibility equivalence (from memory)', () => {
  it.each([
    // Singletons: replaced under both NFC and NFKC.
    ['ANGSTROM SIGN', '212B', '00C5', '00C5'],
    ['OHM SIGN', '2126', '03A9', '03A9'],
    // Canonical composites: combining sequences compose.
    ['A + COMBINING RING ABOVE', '0041 030A', '00C5', '00C5'],
    ['o + COMBINING CIRCUMFLEX', '006F 0302', '00F4', '00F4'],
    ['e + COMBINING ACUTE', '0065 0301', '00E9', '00E9'],
    // Multiple combining marks: canonical reordering, then composition.
    ['s + dot below + dot above', '0073 0323 0307', '1E69', '1E69'],
    ['d with dot above + dot below', '1E0B 0323', '1E0D 0307', '1E0D 0307'],
    ['q + dot above + dot below', '0071 0307 0323', '0071 0323 0307', '0071 0323 0307'],
    // Compatibility composites: unchanged under NFC, decomposed under NFKC.
    ['LATIN SMALL LIGATURE FI', 'FB01', 'FB01', '0066 0069'],
    ['2 + SUPERSCRIPT FIVE', '0032 2075', '0032 2075', '0032 0035'],
    ['LONG S WITH DOT ABOVE', '1E9B', '1E9B', '1E61'],
    // UnicodeData.txt: U+2460 CIRCLED DIGIT ONE has decomposition <circle> 0031.
    ['CIRCLED DIGIT ONE', '2460', '2460', '0031'],
    // UnicodeData.txt: fullwidth forms have <wide> decompositions to ASCII; U+3000 is <wide> 0020.
    ['FULLWIDTH "Full"', 'FF26 FF55 FF4C FF4C', 'FF26 FF55 FF4C FF4C', '0046 0075 006C 006C'],
    ['IDEOGRAPHIC SPACE', '3000', '3000', '0020'],
    ['FULLWIDTH DIGIT SEVEN', 'FF17', 'FF17', '0037'],
  ])('%s (%s): NFC %s, NFKC %s', (_name, source, nfc, nfkc) => {
    expect(hexOf(normalize(cp(source), keep('NFC')))).toBe(nfc);
    expect(hexOf(normalize(cp(source), keep('NFKC')))).toBe(nfkc);
    expect(hexOf(normalize(cp(source), keep('none')))).toBe(source);
  });
});

describe('normalization seen through tokenize', () => {
  const keepCase = (unicode: TextRules['unicode']): TextRules => resolveRules({ unicode, case: 'keep' });

  it.each([
    // Each pair is equivalent under the form (figures above), so the tokens must be the same.
    ['NFKC', '\ufb01ne', 'fine'],
    ['NFKC', '\uff26\uff55\uff4c\uff4c\uff57\uff49\uff44\uff54\uff48', 'Fullwidth'],
    ['NFKC', '\u2460', '1'],
    ['NFKC', 'caf\u0065\u0301', 'caf\u00e9'],
    ['NFC', 'caf\u0065\u0301', 'caf\u00e9'],
    ['NFC', '\u212b', '\u00c5'],
    ['NFC', '\u017f\u0323\u0307', '\u1e9b\u0323'],
  ] as const)('under %s, %j gives the tokens of %j', (form, a, b) => {
    expect(tokenize(a, keepCase(form))).toEqual(tokenize(b, keepCase(form)));
  });

  it('the default rules (NFKC, lower-case) make the fullwidth word and the ligature plain ASCII words', () => {
    // UnicodeData.txt <wide> and <compat> decompositions, then lower-casing (UnicodeData simple mappings).
    expect(tokenize('\uff26\uff55\uff4c\uff4c\uff57\uff49\uff44\uff54\uff48 \ufb01ne \u2460', resolveRules())).toEqual(['fullwidth', 'fine', '1']);
  });

  it('NFC keeps the ligature: its tokens differ from those of "fine"', () => {
    // UAX #15: U+FB01 has only a compatibility decomposition, which NFC does not apply.
    expect(tokenize('\ufb01ne', keepCase('NFC'))).not.toEqual(tokenize('fine', keepCase('NFC')));
    expect(tokenize('\ufb01ne', keepCase('NFC')).join('')).toBe('\ufb01ne');
  });

  it('canonically equivalent texts give the same tokens under NFC and NFKC (UAX #15: NFC(NFD(x)) = NFC(x))', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme', size: 'medium' }), (s) => {
        for (const unicode of ['NFC', 'NFKC'] as const) {
          for (const letterCase of ['keep', 'lower'] as const) {
            const rules = resolveRules({ unicode, case: letterCase });
            expect(tokenize(s.normalize('NFD'), rules)).toEqual(tokenize(s, rules));
          }
        }
      }),
      { numRuns: 300 },
    );
  });

  it('compatibly equivalent texts give the same tokens under NFKC (UAX #15: NFKC(NFKD(x)) = NFKC(x))', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme', size: 'medium' }), (s) => {
        expect(tokenize(s.normalize('NFKD'), resolveRules())).toEqual(tokenize(s, resolveRules()));
      }),
      { numRuns: 300 },
    );
  });
});

describe('normalize: properties from UAX #15', () => {
  const text = fc.string({ unit: 'binary', size: 'medium' });

  it('NFC and NFKC are idempotent (UAX #15: normalizing normalized text changes nothing)', () => {
    fc.assert(
      fc.property(text, (s) => {
        for (const form of ['NFC', 'NFKC'] as const) {
          const once = normalize(s, keep(form));
          expect(normalize(once, keep(form))).toBe(once);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('`none` leaves text exactly alone, and `none` + lower is plain toLowerCase', () => {
    // Encoding contract rule 1; unnormalized input (decomposed, singletons, ligatures) is kept as given.
    fc.assert(
      fc.property(fc.oneof(text, fc.constantFrom(cp('212B'), cp('0065 0301'), cp('017F 0323 0307'), cp('FB01'))), (s) => {
        expect(normalize(s, { unicode: 'none', case: 'keep' })).toBe(s);
        expect(normalize(s, { unicode: 'none', case: 'lower' })).toBe(s.toLowerCase());
      }),
      { numRuns: 300 },
    );
  });
});

describe('lower-casing is locale-free (SpecialCasing.txt, language-independent mappings only; from memory)', () => {
  it.each([
    // SpecialCasing.txt: 0130; 0069 0307; 0130; 0130; — the unconditional mapping (not Turkish/Azeri).
    ['LATIN CAPITAL LETTER I WITH DOT ABOVE', '0130', '0069 0307'],
    // UnicodeData.txt simple mapping I -> i; the Turkish I -> dotless ı rule is language-conditioned.
    ['LATIN CAPITAL LETTER I', '0049', '0069'],
    // SpecialCasing.txt Final_Sigma (a context condition, not a language one): Σ at a word end is ς.
    ['ΟΔΟΣ', '039F 0394 039F 03A3', '03BF 03B4 03BF 03C2'],
    ['ΣΑΣ ΣΑ', '03A3 0391 03A3 0020 03A3 0391', '03C3 03B1 03C2 0020 03C3 03B1'],
    // UnicodeData.txt: U+01C5 (title case Dž) lower-cases to U+01C6.
    ['LATIN CAPITAL LETTER D WITH SMALL LETTER Z WITH CARON', '01C5', '01C6'],
  ])('%s (%s) lower-cases to %s', (_name, source, lower) => {
    expect(hexOf(normalize(cp(source), { unicode: 'none', case: 'lower' }))).toBe(lower);
    expect(hexOf(normalize(cp(source), { unicode: 'NFC', case: 'lower' }))).toBe(lower);
  });

  it('İ survives NFKC unchanged (U+0130 is its own NFC/NFKC form) and then lower-cases to i + U+0307', () => {
    // UnicodeData.txt: U+0130 decomposes canonically to 0049 0307, which NFC recomposes.
    expect(hexOf(normalize(cp('0130'), keep('NFKC')))).toBe('0130');
    expect(hexOf(normalize(cp('0130'), { unicode: 'NFKC', case: 'lower' }))).toBe('0069 0307');
    // Through tokenize the characters are all still there, in order.
    expect(tokenize('\u0130', resolveRules()).join('')).toBe('i\u0307');
  });

  it('lower-casing comes after normalization (encoding contract rule 1): U+212B becomes U+00E5', () => {
    // UAX #15 singleton 212B -> 00C5, then UnicodeData.txt lower-case mapping 00C5 -> 00E5.
    expect(hexOf(normalize(cp('212B'), { unicode: 'NFKC', case: 'lower' }))).toBe('00E5');
  });
});
