import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { LineSplitter, readLines, stripCr } from '../../src/corpus/lines.js';

/** Splits `bytes` into chunks at the given cut points and runs them through a splitter. */
function split(bytes: Buffer, cuts: number[]) {
  const splitter = new LineSplitter();
  const points = [...new Set(cuts.map((c) => c % (bytes.length + 1)))].sort((a, b) => a - b);
  const lines = [];
  let from = 0;
  for (const p of [...points, bytes.length]) {
    lines.push(...splitter.push(bytes.subarray(from, p)));
    from = p;
  }
  lines.push(...splitter.end());
  return lines.map((l) => ({ text: l.bytes.toString('latin1'), line: l.line, byteOffset: l.byteOffset }));
}

describe('LineSplitter', () => {
  it.each([
    ['', []],
    ['a', [{ text: 'a', line: 1, byteOffset: 0 }]],
    ['a\n', [{ text: 'a', line: 1, byteOffset: 0 }]],
    ['\n', [{ text: '', line: 1, byteOffset: 0 }]],
    ['a\r\n\nbc', [{ text: 'a\r', line: 1, byteOffset: 0 }, { text: '', line: 2, byteOffset: 3 }, { text: 'bc', line: 3, byteOffset: 4 }]],
    ['\xef\xbb\xbfhi\nyo', [{ text: 'hi', line: 1, byteOffset: 3 }, { text: 'yo', line: 2, byteOffset: 6 }]],
    ['x\n\xef\xbb\xbfhi', [{ text: 'x', line: 1, byteOffset: 0 }, { text: '\xef\xbb\xbfhi', line: 2, byteOffset: 2 }]],
  ])('%j', (input, expected) => {
    expect(split(Buffer.from(input, 'latin1'), [])).toEqual(expected);
  });

  it('drops a BOM split across chunks', () => {
    expect(split(Buffer.from('\xef\xbb\xbfhi', 'latin1'), [1, 2])).toEqual([{ text: 'hi', line: 1, byteOffset: 3 }]);
  });

  // Invariant: however the bytes are cut into chunks, the lines are those of splitting the whole on 0x0A.
  it('gives the same lines for any chunking', () => {
    const bytes = fc.array(fc.constantFrom(0x0a, 0x0d, 0x61, 0xc3, 0xa9, 0xef, 0xbb, 0xbf), { maxLength: 60 }).map((a) => Buffer.from(a));
    fc.assert(
      fc.property(bytes, fc.array(fc.nat(), { maxLength: 10 }), (b, cuts) => {
        const whole = split(b, []);
        expect(split(b, cuts)).toEqual(whole);
        // and whole splitting is String.split on LF, without the empty piece after a final LF
        const pieces = b.toString('latin1').split('\n');
        if (pieces[pieces.length - 1] === '') pieces.pop();
        if (pieces.length > 0 && pieces[0]!.startsWith('\xef\xbb\xbf')) pieces[0] = pieces[0]!.slice(3);
        expect(whole.map((l) => l.text)).toEqual(pieces);
      }),
    );
  });

  it('stripCr drops one trailing CR only', () => {
    expect(stripCr(Buffer.from('a\r\r')).toString()).toBe('a\r');
    expect(stripCr(Buffer.from('a')).toString()).toBe('a');
    expect(stripCr(Buffer.from('')).toString()).toBe('');
  });

  it('readLines hands out the lines of a stream in groups of about 64 KiB', async () => {
    const line = `${'x'.repeat(99)}\n`; // 100 bytes a line
    const bytes = Buffer.from(line.repeat(3000));
    async function* chunks() {
      for (let i = 0; i < bytes.length; i += 100_000) yield bytes.subarray(i, i + 100_000);
    }
    const groups: number[] = [];
    const numbers: number[] = [];
    for await (const group of readLines(chunks())) {
      groups.push(group.length);
      numbers.push(...group.map((l) => l.line));
    }
    expect(numbers).toEqual(Array.from({ length: 3000 }, (_, i) => i + 1));
    // 656 lines reach 65,600 bytes >= 64 KiB; each 100,000-byte chunk completes 1000 lines
    expect(groups).toEqual([656, 344, 656, 344, 656, 344]);
  });
});
