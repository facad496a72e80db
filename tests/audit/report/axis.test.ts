import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { extent, linearScale, logScale, logTicks, niceStep, niceTicks, zeroAxis } from '../../../src/audit/report/svg/axis.js';

// Outside source for the linear ticks: P. S. Heckbert, "Nice numbers for graph labels" (1990): the
// step is the raw step (range / ticks) rounded to 1, 2, 5 or 10 × 10^k, rounding at 1.5, 3 and 7.
// The expected values below are worked out by hand with that rule.
describe('niceStep', () => {
  it.each([
    [100, 5, 20], // raw 20 = 2 × 10
    [1, 5, 0.2], // raw 0.2
    [0.37, 5, 0.1], // raw 0.074: 7.4 ≥ 7 rounds to 10 × 0.01
    [35_000, 5, 10_000], // raw 7,000: 7 rounds to 10
    [30_800, 5, 5_000], // raw 6,160: 6.16 < 7 rounds to 5
    [3_000, 8, 500], // raw 375: 3.75 rounds to 5
    [7, 5, 1], // raw 1.4 < 1.5 rounds to 1
    [14, 5, 2], // raw 2.8 < 3 rounds to 2
  ])('niceStep(%d, %d) is %d', (span, target, step) => {
    expect(niceStep(span, target)).toBe(step);
  });
});

describe('niceTicks', () => {
  it.each<[number, number, number, number[]]>([
    [0, 100, 5, [0, 20, 40, 60, 80, 100]],
    [0, 1, 5, [0, 0.2, 0.4, 0.6, 0.8, 1]],
    [0.1, 0.7, 5, [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7]],
    [-0.5, 2999.5, 8, [0, 500, 1000, 1500, 2000, 2500]],
    [3, 3, 5, [3]],
  ])('niceTicks(%d, %d, %d)', (min, max, target, ticks) => {
    expect(niceTicks(min, max, target)).toEqual(ticks);
  });

  it('gives ascending, equally spaced ticks on the 1-2-5 series inside the range', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: 1e-3, max: 1e6, noNaN: true }), (min, span) => {
        fc.pre(span >= Math.abs(min) * 1e-6); // a chart axis resolves at most about six significant digits
        const max = min + span;
        const ticks = niceTicks(min, max, 5);
        const step = niceStep(span, 5);
        const mantissa = step / 10 ** Math.floor(Math.log10(step) + 1e-9);
        expect([1, 2, 5].some((m) => Math.abs(mantissa - m) < 1e-6)).toBe(true);
        expect(ticks.length).toBeGreaterThanOrEqual(2);
        expect(ticks.length).toBeLessThanOrEqual(12);
        for (const t of ticks) {
          expect(t).toBeGreaterThanOrEqual(min - step * 1e-6);
          expect(t).toBeLessThanOrEqual(max + step * 1e-6);
        }
        for (let i = 1; i < ticks.length; i++) expect((ticks[i] ?? 0) - (ticks[i - 1] ?? 0)).toBeCloseTo(step, 6);
      }),
    );
  });
});

describe('zeroAxis', () => {
  it.each<[number, number, number[]]>([
    [37, 40, [0, 10, 20, 30, 40]],
    [30_800, 35_000, [0, 5_000, 10_000, 15_000, 20_000, 25_000, 30_000, 35_000]],
    [21, 25, [0, 5, 10, 15, 20, 25]],
    [100, 100, [0, 20, 40, 60, 80, 100]],
    [0, 1, [0, 1]],
  ])('zeroAxis(%d) ends at %d', (max, top, ticks) => {
    expect(zeroAxis(max)).toEqual({ top, ticks });
  });
});

// Log ticks follow logarithmic graph paper: a major line at every power of ten (a decade) and minor
// lines at its 2…9 multiples.
describe('logTicks', () => {
  it('puts major ticks on the decades and minor ones on their multiples', () => {
    const { major, minor } = logTicks(1, 48_000);
    expect(major).toEqual([1, 10, 100, 1_000, 10_000]);
    expect(minor.slice(0, 9)).toEqual([2, 3, 4, 5, 6, 7, 8, 9, 20]);
    expect(minor.slice(-3)).toEqual([20_000, 30_000, 40_000]);
    expect(minor).toHaveLength(4 * 8 + 3);
  });

  it('promotes the 2 and 5 multiples when fewer than two decades are in range', () => {
    expect(logTicks(3, 80)).toEqual({ major: [5, 10, 20, 50], minor: [3, 4, 6, 7, 8, 9, 30, 40, 60, 70, 80] });
  });

  it('keeps decimal decades exact', () => {
    expect(logTicks(0.01, 1).major).toEqual([0.01, 0.1, 1]);
  });

  it('gives nothing for a range that is not positive', () => {
    expect(logTicks(0, 10)).toEqual({ major: [], minor: [] });
  });
});

describe('scales', () => {
  it('maps linearly, and decades evenly on a log scale', () => {
    const lin = linearScale(0, 100, 50, 250);
    expect([lin(0), lin(25), lin(100)]).toEqual([50, 100, 250]);
    const log = logScale(1, 1_000, 0, 300);
    expect(log(1)).toBeCloseTo(0, 9);
    expect(log(10)).toBeCloseTo(100, 9);
    expect(log(100)).toBeCloseTo(200, 9);
    expect(log(1_000)).toBeCloseTo(300, 9);
    const flipped = linearScale(0, 100, 300, 20); // y axes grow upwards
    expect(flipped(100)).toBe(20);
  });

  it('finds the extent of a long array without spreading it', () => {
    // 0, -1, 2, -3, …, 299,998, -299,999: too long to spread into Math.min in some engines.
    const values = Array.from({ length: 300_000 }, (_, i) => (i % 2 === 0 ? i : -i));
    expect(extent(values)).toEqual([-299_999, 299_998]);
    expect(extent([4])).toEqual([4, 4]);
    expect(extent([])).toBeNull();
  });
});
