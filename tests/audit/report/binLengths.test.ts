import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { binLengths, binWidthFor } from '../../../src/audit/report/binLengths.js';

describe('binWidthFor', () => {
  it.each([
    [1, 1],
    [80, 1], // up to 80 distinct lengths: one bar each
    [81, 2],
    [120, 2],
    [121, 3],
    [2_998, 50],
    [3_001, 60],
    [100_000, 2_000],
  ])('a span of %d lengths gets bins of %d', (span, width) => {
    expect(binWidthFor(span)).toBe(width);
  });
});

describe('binLengths', () => {
  it('gives one bar per length for few lengths, splitting kept and truncated documents', () => {
    expect(binLengths([{ length: 3, documents: 2 }, { length: 5, documents: 1 }], 4)).toEqual({
      width: 1,
      bins: [
        { from: 3, to: 3, base: 2, over: 0 },
        { from: 4, to: 4, base: 0, over: 0 },
        { from: 5, to: 5, base: 0, over: 1 },
      ],
    });
  });

  it('bins a long tail into equal widths aligned on multiples of the width', () => {
    const { width, bins } = binLengths([{ length: 4, documents: 10 }, { length: 260, documents: 3 }, { length: 2_999, documents: 1 }], 256);
    expect(width).toBe(50);
    expect(bins[0]).toEqual({ from: 0, to: 49, base: 10, over: 0 });
    expect(bins[5]).toEqual({ from: 250, to: 299, base: 0, over: 3 });
    expect(bins.at(-1)).toEqual({ from: 2_950, to: 2_999, base: 0, over: 1 });
    expect(bins).toHaveLength(60);
  });

  it('gives nothing for an empty histogram', () => {
    expect(binLengths([], 10)).toEqual({ width: 1, bins: [] });
  });

  it('keeps every document, in the bin that holds its length, on the right side of the cut', () => {
    const histogram = fc.uniqueArray(fc.record({ length: fc.integer({ min: 0, max: 20_000 }), documents: fc.integer({ min: 1, max: 1_000 }) }), {
      minLength: 1,
      maxLength: 60,
      selector: (h) => h.length,
    });
    fc.assert(
      fc.property(histogram, fc.option(fc.integer({ min: 0, max: 20_000 })), (h, cut) => {
        const { width, bins } = binLengths(h, cut);
        const lengths = h.map((x) => x.length);
        const span = Math.max(...lengths) - Math.min(...lengths) + 1;
        if (span > 80) {
          expect(bins.length).toBeGreaterThanOrEqual(40);
          expect(bins.length).toBeLessThanOrEqual(61);
        } else expect(width).toBe(1);
        bins.forEach((bin, i) => {
          expect(bin.to - bin.from + 1).toBe(width);
          expect(bin.from % width).toBe(0);
          if (i > 0) expect(bin.from).toBe((bins[i - 1]?.to ?? 0) + 1);
          const inside = h.filter((x) => x.length >= bin.from && x.length <= bin.to);
          const over = inside.filter((x) => cut !== null && x.length > cut).reduce((s, x) => s + x.documents, 0);
          const all = inside.reduce((s, x) => s + x.documents, 0);
          expect(bin.over).toBe(over);
          expect(bin.base).toBe(all - over);
        });
        expect(bins.reduce((s, b) => s + b.base + b.over, 0)).toBe(h.reduce((s, x) => s + x.documents, 0));
      }),
    );
  });
});
