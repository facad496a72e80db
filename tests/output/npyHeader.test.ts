import fc from 'fast-check';
import { parse } from 'npyjs';
import { describe, expect, it } from 'vitest';
import { NPY_ALIGNMENT, npyHeader, npyShapeLiteral } from '../../src/output/npyHeader.js';

// The NPY format version 1.0, as the NumPy docs (numpy.lib.format) and NEP 1 describe it, from memory:
//   bytes 0-5  magic "\x93NUMPY"; byte 6 major version (1); byte 7 minor version (0);
//   bytes 8-9  HEADER_LEN, little-endian unsigned short;
//   then HEADER_LEN bytes of ASCII: a Python dict literal with keys 'descr', 'fortran_order', 'shape',
//   "terminated by a newline (\n) and padded with spaces (\x20) to make the total of
//   len(magic string) + 2 + len(length) + HEADER_LEN be evenly divisible by 64".
// NumPy writes the dict with sorted keys, each as "'key': repr(value), ", then "}", and a shape as
// repr() of a Python tuple: "()", "(5,)", "(3, 4)". The expected headers below are written out by hand
// from those rules; the arithmetic is in the comment beside each.
const PREFIX = '\x93NUMPY\x01\x00';
const latin1 = (bytes: Uint8Array): string => Buffer.from(bytes).toString('latin1');
const le16 = (n: number): string => String.fromCharCode(n & 0xff, n >> 8);

describe('npyHeader', () => {
  it.each([
    // dict "{'descr': '<i4', 'fortran_order': False, 'shape': (3, 4), }" is 59 chars;
    // 10 + 59 + 1 newline = 70, next multiple of 64 is 128: 58 spaces, HEADER_LEN 118 (0x76, 'v').
    // From memory, hex dumps of small arrays saved by NumPy show the same "\x93NUMPY\x01\x00v\x00" start.
    [[3, 4], "{'descr': '<i4', 'fortran_order': False, 'shape': (3, 4), }", 58, 118],
    // "(5,)": dict 57 chars; 10 + 57 + 1 = 68 -> 128: 60 spaces, HEADER_LEN 118.
    [[5], "{'descr': '<i4', 'fortran_order': False, 'shape': (5,), }", 60, 118],
    // "(0, 200)": dict 61 chars; 10 + 61 + 1 = 72 -> 128: 56 spaces.
    [[0, 200], "{'descr': '<i4', 'fortran_order': False, 'shape': (0, 200), }", 56, 118],
    // 0-d "()": dict 55 chars; 10 + 55 + 1 = 66 -> 128: 62 spaces.
    [[], "{'descr': '<i4', 'fortran_order': False, 'shape': (), }", 62, 118],
    // four dims, three of 16 digits: shape literal 16*3 + 1 + 3*2 = 55 chars, dict 51 + 55 + 4 = 110;
    // 10 + 110 + 1 = 121 -> 128: 7 spaces.
    [
      [9007199254740991, 9007199254740991, 9007199254740991, 7],
      "{'descr': '<i4', 'fortran_order': False, 'shape': (9007199254740991, 9007199254740991, 9007199254740991, 7), }",
      7,
      118,
    ],
    // four dims of 16 digits: literal 70 chars, dict 125; 10 + 125 + 1 = 136 -> 192: 56 spaces, HEADER_LEN 182.
    [
      [9007199254740991, 9007199254740991, 9007199254740991, 9007199254740991],
      "{'descr': '<i4', 'fortran_order': False, 'shape': (9007199254740991, 9007199254740991, 9007199254740991, 9007199254740991), }",
      56,
      182,
    ],
  ])('shape %j: header byte for byte', (shape, dict, spaces, headerLen) => {
    const expected = PREFIX + le16(headerLen) + dict + ' '.repeat(spaces) + '\n';
    const header = npyHeader(shape);
    expect(latin1(header)).toBe(expected);
    expect(header.byteLength % 64).toBe(0);
  });

  it('pads to a reserved size so a header can be patched in place', () => {
    // Same dict as (3, 4) above, padded to 192 instead of 128: 122 spaces, HEADER_LEN 182.
    const dict = "{'descr': '<i4', 'fortran_order': False, 'shape': (3, 4), }";
    expect(latin1(npyHeader([3, 4], 192))).toBe(PREFIX + le16(182) + dict + ' '.repeat(122) + '\n');
  });

  it('gives a header that is 64-aligned, ends in a newline and reads back in npyjs (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.maxSafeNat(), { maxLength: 6 }), (shape) => {
        const header = npyHeader(shape);
        expect(header.byteLength % NPY_ALIGNMENT).toBe(0);
        expect(header[header.byteLength - 1]).toBe(0x0a);
        expect((header[8] ?? 0) | ((header[9] ?? 0) << 8)).toBe(header.byteLength - 10);
        // npyjs (a general-purpose NPY reader) reads the dtype and shape back; the data part is empty.
        const parsed = parse(header.slice().buffer);
        expect(parsed.dtype).toBe('i4');
        expect(parsed.fortranOrder).toBe(false);
        expect(parsed.shape).toEqual(shape);
      }),
    );
  });

  it.each([
    [[3, -1], 'NPY shape [3, -1]: -1 is not a valid dimension; every dimension must be a whole number from 0 to 9007199254740991'],
    [[1.5], 'NPY shape [1.5]: 1.5 is not a valid dimension; every dimension must be a whole number from 0 to 9007199254740991'],
    [[2 ** 53], 'NPY shape [9007199254740992]: 9007199254740992 is not a valid dimension; every dimension must be a whole number from 0 to 9007199254740991'],
    [[Number.NaN], 'NPY shape [NaN]: NaN is not a valid dimension; every dimension must be a whole number from 0 to 9007199254740991'],
  ])('refuses shape %j with NPY_SHAPE', (shape, message) => {
    expect(() => npyHeader(shape)).toThrow(expect.objectContaining({ code: 'NPY_SHAPE', message }));
  });

  it.each([
    [64, 'NPY shape (3, 4): the header needs 128 bytes but 64 were reserved; reserve a multiple of 64 of at least 128'],
    [130, 'NPY shape (3, 4): the header needs 128 bytes but 130 were reserved; reserve a multiple of 64 of at least 128'],
  ])('refuses a reserved size of %d', (total, message) => {
    expect(() => npyHeader([3, 4], total)).toThrow(expect.objectContaining({ code: 'NPY_SHAPE', message }));
  });

  it('refuses a header longer than format 1.0 can describe', () => {
    // HEADER_LEN is an unsigned short in version 1.0, so at most 65535 bytes (NumPy docs, from memory).
    expect(() => npyHeader([3, 4], 65536 + 64)).toThrow(
      expect.objectContaining({
        code: 'NPY_SHAPE',
        message: 'NPY shape (3, 4): a 65590-byte header does not fit NPY format 1.0 (at most 65535); use fewer dimensions',
      }),
    );
  });
});

describe('npyShapeLiteral', () => {
  // Python's tuple repr (Python language reference: a one-element tuple needs a trailing comma).
  it.each([
    [[], '()'],
    [[7], '(7,)'],
    [[0, 3], '(0, 3)'],
    [[2, 3, 4], '(2, 3, 4)'],
  ])('%j -> %s', (shape, literal) => {
    expect(npyShapeLiteral(shape)).toBe(literal);
  });
});
