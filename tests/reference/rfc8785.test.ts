// canonicalJson checked against RFC 8785 (JSON Canonicalization Scheme, JCS) and against the
// general-purpose `canonicalize` library (an independent RFC 8785 implementation).
//
// Source of the expected values: RFC 8785, section 3.2.2 (sample input and its canonical output),
// section 3.2.3 (the property sorting example) and Appendix B (number serialization samples, given in
// the RFC as IEEE 754 bit patterns). All of them are written here from memory of the RFC text.
import canonicalizeModule from 'canonicalize';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { canonicalJson } from '../../src/artifact/canonicalJson.js';
import { LexlockError } from '../../src/LexlockError.js';

// `canonicalize` is CommonJS (`module.exports = serialize`) while its .d.ts declares an ES default
// export; under NodeNext the default import is module.exports itself, so it is the function.
const canonicalize = canonicalizeModule as unknown as (input: unknown) => string | undefined;

/** The IEEE 754 double with these 64 bits (hex, as RFC 8785 Appendix B lists its inputs). */
function fromBits(hex: string): number {
  const view = new DataView(new ArrayBuffer(8));
  view.setBigUint64(0, BigInt(`0x${hex}`));
  return view.getFloat64(0);
}

describe('RFC 8785 section 3.2.2: the sample object', () => {
  // RFC 8785 section 3.2.2 (from memory): the input is JSON text (with white space, upper-case
  // exponents and escapes), its canonical form has no white space, sorted members, ES6 numbers and
  // minimal string escapes.
  const input = String.raw`{
    "numbers": [333333333.33333329, 1E30, 4.50,
                2e-3, 0.000000000000000000000000001],
    "string": "\u20ac$\u000F\u000aA'\u0042\u0022\u005c\\\"\/",
    "literals": [null, true, false]
  }`;
  const expected = String.raw`{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],"string":"€$\u000f\nA'B\"\\\\\"/"}`;

  it('gives the canonical output printed in the RFC', () => {
    expect(canonicalJson(JSON.parse(input))).toBe(expected);
  });
});

describe('RFC 8785 section 3.2.3: sorting of properties by UTF-16 code units', () => {
  // RFC 8785 section 3.2.3 (from memory): the example object and the order its values come out in.
  const input = String.raw`{
    "\u20ac": "Euro Sign",
    "\r": "Carriage Return",
    "\ufb33": "Hebrew Letter Dalet With Dagesh",
    "1": "One",
    "\ud83d\ude00": "Emoji: Grinning Face",
    "\u0080": "Control",
    "\u00f6": "Latin Small Letter O With Diaeresis"
  }`;
  const expectedOrder = [
    'Carriage Return',
    'One',
    'Control',
    'Latin Small Letter O With Diaeresis',
    'Euro Sign',
    'Emoji: Grinning Face',
    'Hebrew Letter Dalet With Dagesh',
  ];

  it('orders the values as the RFC lists them', () => {
    const out = canonicalJson(JSON.parse(input));
    // Read the order from the text: Object.values would move the integer-like key "1" to the front.
    const positions = expectedOrder.map((v) => out.indexOf(`:"${v}"`));
    expect(positions.every((p) => p > 0)).toBe(true);
    expect([...positions].sort((a, b) => a - b)).toEqual(positions);
  });

  it('writes the whole object as the RFC does (\\r escaped, the others raw)', () => {
    const expected =
      '{"\\r":"Carriage Return","1":"One","\u0080":"Control","\u00f6":"Latin Small Letter O With Diaeresis",' +
      '"\u20ac":"Euro Sign","\ud83d\ude00":"Emoji: Grinning Face","\ufb33":"Hebrew Letter Dalet With Dagesh"}';
    expect(canonicalJson(JSON.parse(input))).toBe(expected);
  });
});

describe('RFC 8785 Appendix B: number serialization samples', () => {
  // RFC 8785 Appendix B (from memory): IEEE 754 bit pattern -> canonical text.
  it.each([
    ['0000000000000000', '0', 'zero'],
    ['8000000000000000', '0', 'minus zero'],
    ['0000000000000001', '5e-324', 'min pos number'],
    ['8000000000000001', '-5e-324', 'min neg number'],
    ['7fefffffffffffff', '1.7976931348623157e+308', 'max pos number'],
    ['ffefffffffffffff', '-1.7976931348623157e+308', 'max neg number'],
    ['4340000000000000', '9007199254740992', 'max pos int'],
    ['c340000000000000', '-9007199254740992', 'max neg int'],
    ['4430000000000000', '295147905179352830000', '~2**68'],
    ['44b52d02c7e14af5', '9.999999999999997e+22', ''],
    ['44b52d02c7e14af6', '1e+23', ''],
    ['44b52d02c7e14af7', '1.0000000000000001e+23', ''],
    ['444b1ae4d6e2ef4e', '999999999999999700000', ''],
    ['444b1ae4d6e2ef4f', '999999999999999900000', ''],
    ['444b1ae4d6e2ef50', '1e+21', ''],
    ['3eb0c6f7a0b5ed8c', '9.999999999999997e-7', ''],
    ['3eb0c6f7a0b5ed8d', '0.000001', ''],
    ['41b3de4355555553', '333333333.3333332', ''],
    ['41b3de4355555554', '333333333.33333325', ''],
    ['41b3de4355555555', '333333333.3333333', ''],
    ['41b3de4355555556', '333333333.3333334', ''],
    ['41b3de4355555557', '333333333.33333343', ''],
    ['becbf647612f3696', '-0.0000033333333333333333', ''],
    ['43143ff3c1cb0959', '1424953923781206.2', 'round to even'],
  ])('%s -> %s %s', (bits, text) => {
    expect(canonicalJson(fromBits(bits))).toBe(text);
    expect(canonicalJson([fromBits(bits)])).toBe(`[${text}]`);
  });

  // ECMA-262 Number::toString, which RFC 8785 section 3.2.2.3 makes normative: exponent notation for
  // magnitudes below 1e-6 and from 1e21 up (from memory of the algorithm's thresholds).
  it.each([
    [1e21, '1e+21'],
    [1e20, '100000000000000000000'],
    [1e-7, '1e-7'],
    [1e-6, '0.000001'],
    [-1.5e-7, '-1.5e-7'],
    [100, '100'],
  ])('ECMA-262 Number::toString of %d is %s', (n, text) => {
    expect(canonicalJson(n)).toBe(text);
  });
});

describe('RFC 8785: values canonical JSON cannot carry are refused', () => {
  // RFC 8785 section 3.2.2.3 / Appendix B (from memory): NaN and Infinity must cause an error.
  // RFC 8785 section 3.2.2.2 builds on I-JSON (RFC 7493 section 2.1), whose strings must not hold
  // lone surrogates.
  it.each([
    ['NaN', Number.NaN, '$: NaN is not a JSON number'],
    ['Infinity', Number.POSITIVE_INFINITY, '$: Infinity is not a JSON number'],
    ['-Infinity', Number.NEGATIVE_INFINITY, '$: -Infinity is not a JSON number'],
    ['NaN from bits 7fffffffffffffff', fromBits('7fffffffffffffff'), '$: NaN is not a JSON number'],
    ['Infinity from bits 7ff0000000000000', fromBits('7ff0000000000000'), '$: Infinity is not a JSON number'],
    ['nested NaN', { a: [1, Number.NaN] }, '$.a[1]: NaN is not a JSON number'],
    ['lone high surrogate', '\ud800', '$: a string holds a lone surrogate, which canonical JSON cannot carry'],
    ['lone low surrogate', 'x\udc00', '$: a string holds a lone surrogate, which canonical JSON cannot carry'],
    ['reversed pair', '\ude00\ud83d', '$: a string holds a lone surrogate, which canonical JSON cannot carry'],
    ['lone surrogate in a member', { k: ['\udbff'] }, '$.k[0]: a string holds a lone surrogate, which canonical JSON cannot carry'],
    ['lone surrogate in a key', { '\ud83d': 1 }, '$: a string holds a lone surrogate, which canonical JSON cannot carry'],
  ])('%s', (_name, value, message) => {
    expect(() => canonicalJson(value)).toThrow(LexlockError);
    expect(() => canonicalJson(value)).toThrow(message);
    try {
      canonicalJson(value);
    } catch (e) {
      expect((e as LexlockError).message).toBe(message);
      expect((e as LexlockError).code).toBe('BAD_OPTION');
    }
  });

  it('accepts a well-formed surrogate pair', () => {
    // U+1F600 as a UTF-16 pair is well-formed (The Unicode Standard, section 3.9, D91).
    expect(canonicalJson('\ud83d\ude00')).toBe('"\ud83d\ude00"');
  });
});

describe('agreement with the canonicalize library on random JSON', () => {
  // `canonicalize` (npm) is the second reference: an RFC 8785 implementation whose package.json lists
  // Samuel Erdtman and Anders Rundgren as contributors (two of the RFC's authors, from memory). `stringUnit: 'binary'` draws any code point except lone surrogates, so keys and
  // strings exercise control characters, the BMP above the surrogates and astral characters.
  const json = fc.jsonValue({ stringUnit: 'binary', maxDepth: 4 });

  it('gives the same text', () => {
    fc.assert(
      fc.property(json, (value) => {
        expect(canonicalJson(value)).toBe(canonicalize(value));
      }),
      { numRuns: 500 },
    );
  });

  it('is stable: parsing the canonical form and canonicalizing again gives it back (follows from the rules of RFC 8785 section 3.2)', () => {
    fc.assert(
      fc.property(json, (value) => {
        const once = canonicalJson(value);
        expect(canonicalJson(JSON.parse(once))).toBe(once);
      }),
      { numRuns: 500 },
    );
  });

  it('does not depend on the order members were inserted in (RFC 8785 section 3.2.3)', () => {
    const entries = fc.uniqueArray(fc.tuple(fc.string({ unit: 'binary' }), fc.jsonValue({ maxDepth: 2 })), {
      selector: ([k]) => k,
      size: 'small',
    });
    fc.assert(
      fc.property(entries, (pairs) => {
        const forward = Object.fromEntries(pairs);
        const backward = Object.fromEntries([...pairs].reverse());
        expect(canonicalJson(backward)).toBe(canonicalJson(forward));
        expect(canonicalJson(forward)).toBe(canonicalize(forward));
      }),
      { numRuns: 300 },
    );
  });

  it('writes -0 as 0, as canonicalize does (RFC 8785 Appendix B, minus zero)', () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom(-0, 0, -1, 1)), (xs) => {
        expect(canonicalJson(xs)).toBe(canonicalize(xs));
      }),
      { numRuns: 100 },
    );
  });
});
