import { describe, expect, it } from 'vitest';
import { nearestRank, summarizeLengths } from '../../src/tally/nearestRank.js';

const histogramOf = (values: number[]) => {
  const h = new Map<number, number>();
  for (const v of values) h.set(v, (h.get(v) ?? 0) + 1);
  return h;
};

describe('nearestRank', () => {
  // The nearest-rank worked examples of the "Percentile" article of Wikipedia (section "The nearest-rank
  // method"), values from memory: list 15, 20, 35, 40, 50 gives P5=15, P30=20, P40=20, P50=35, P100=50;
  // list 3, 6, 7, 8, 8, 10, 13, 15, 16, 20 gives P25=7, P50=8, P75=15, P100=20.
  it.each([
    [[15, 20, 35, 40, 50], 5, 15],
    [[15, 20, 35, 40, 50], 30, 20],
    [[15, 20, 35, 40, 50], 40, 20],
    [[15, 20, 35, 40, 50], 50, 35],
    [[15, 20, 35, 40, 50], 100, 50],
    [[3, 6, 7, 8, 8, 10, 13, 15, 16, 20], 25, 7],
    [[3, 6, 7, 8, 8, 10, 13, 15, 16, 20], 50, 8],
    [[3, 6, 7, 8, 8, 10, 13, 15, 16, 20], 75, 15],
    [[3, 6, 7, 8, 8, 10, 13, 15, 16, 20], 100, 20],
  ])('%j at p%d is %d', (values, p, expected) => {
    expect(nearestRank(histogramOf(values), p)).toBe(expected);
  });

  it('gives the minimum at p0 and 0 on an empty histogram', () => {
    expect(nearestRank(histogramOf([9, 4, 7]), 0)).toBe(4);
    expect(nearestRank(new Map(), 50)).toBe(0);
  });

  it('summarizes a length histogram', () => {
    const values = Array.from({ length: 100 }, (_, i) => i + 1);
    expect(summarizeLengths(histogramOf(values))).toEqual({ min: 1, p50: 50, p90: 90, p95: 95, p99: 99, max: 100 });
  });
});
