import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatCount } from '../../../src/audit/report/formatCount.js';
import { formatPercent } from '../../../src/audit/report/formatPercent.js';
import { formatTick } from '../../../src/audit/report/formatTick.js';
import { formatChange } from '../../../src/audit/report/sections/formatChange.js';

const NBSP = '\u00a0';

describe('formatCount', () => {
  // Outside source: ECMA-402 Intl.NumberFormat with the en-US locale (comma grouping, point decimals).
  // Values are whole or quarter numbers, exact in binary, so both round the same way (for inexact
  // decimals such as 1.005, toFixed rounds the binary value and Intl its shortest decimal form).
  it('agrees with Intl.NumberFormat en-US for non-negative numbers', () => {
    const value = fc.tuple(fc.integer({ min: 0, max: 2 ** 40 }), fc.constantFrom(0, 0.25, 0.5, 0.75)).map(([whole, quarter]) => whole + quarter);
    fc.assert(
      fc.property(value, fc.integer({ min: 0, max: 4 }), (n, decimals) => {
        const reference = new Intl.NumberFormat('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals }).format(n);
        expect(formatCount(n, decimals)).toBe(reference);
      }),
    );
  });

  it.each([
    [0, 0, '0'],
    [999, 0, '999'],
    [1_000, 0, '1,000'],
    [11_605_781, 0, '11,605,781'],
    [-1_234, 0, '−1,234'],
    [-0.001, 2, '0.00'],
    [Infinity, 0, 'Infinity'],
  ])('formatCount(%d, %d) is %s', (n, decimals, text) => {
    expect(formatCount(n, decimals)).toBe(text);
  });
});

describe('formatPercent', () => {
  it.each([
    [0, `0${NBSP}%`],
    [1, `100${NBSP}%`],
    [0.0325, `3.25${NBSP}%`],
    [0.0586, `5.86${NBSP}%`],
    [0.941, `94.1${NBSP}%`],
    [0.12345, `12.3${NBSP}%`],
    [0.9937, `99.37${NBSP}%`],
    [0.99996, `>${NBSP}99.99${NBSP}%`],
    [0.0001, `0.010${NBSP}%`],
    [0.0037, `0.37${NBSP}%`],
    [0.000207, `0.021${NBSP}%`],
    [0.00999, `1.00${NBSP}%`],
    [0.000034, `0.0034${NBSP}%`],
    [1e-7, `<${NBSP}0.0001${NBSP}%`],
    [-0.03, `−3.00${NBSP}%`],
    [Number.NaN, `–${NBSP}%`],
  ])('formatPercent(%d) is %s', (share, text) => {
    expect(formatPercent(share)).toBe(text);
  });
});

describe('formatTick', () => {
  it.each([
    [0, '0'],
    [2.5, '2.5'],
    [5, '5'],
    [0.30000000000000004, '0.3'],
    [10_000, '10,000'],
    [12.25, '12.25'],
  ])('formatTick(%d) is %s', (value, text) => {
    expect(formatTick(value)).toBe(text);
  });
});

describe('formatChange', () => {
  it.each<[number, number, string, number, number, string]>([
    [0.05, 0.0625, 'points', 100, 2, '+1.25 points'],
    [0.27, 0.24, 'points', 100, 2, '−3.00 points'],
    [0.22, 0.22, 'points', 100, 2, 'no change'],
    [190, 248, 'tokens', 1, 0, '+58 tokens'],
    [2_100, 2_999, 'tokens', 1, 0, '+899 tokens'],
  ])('from %d to %d', (then, now, unit, factor, decimals, text) => {
    expect(formatChange(then, now, unit, factor, decimals)).toBe(text);
  });
});
