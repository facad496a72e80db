import { formatCount } from '../audit/report/formatCount.js';

/** A whole number with thousands separators: 12,345 (the same grouping as the HTML report). */
export function count(n: number): string {
  return formatCount(n);
}

/**
 * A share (0…1) as percent digits with `decimals` decimals, rounded from the share's exact binary
 * value: `toFixed` is exact (ECMA-262), whereas share × 100 would round once more and could make two
 * different shares look alike. `percentDigits(0.0205, 2)` is `'2.05'`.
 */
function percentDigits(share: number, decimals: number): string {
  const fixed = Math.abs(share).toFixed(decimals + 2);
  const point = fixed.indexOf('.');
  const whole = `${fixed.slice(0, point)}${fixed.slice(point + 1, point + 3)}`.replace(/^0+(?=\d)/, '');
  const fraction = fixed.slice(point + 3);
  return `${share < 0 ? '-' : ''}${whole}${fraction === '' ? '' : `.${fraction}`}`;
}

/** A share as a percentage with two decimals: 3.25 %. */
export function percent(share: number): string {
  return `${percentDigits(share, 2)} %`;
}

/** The most decimals `percentsApart` shows: `toFixed` takes at most 100 digits, 2 go before the point. */
const MOST_DECIMALS = 98;

/**
 * Two shares as percentages with the same, fewest decimals (at least 2) that tell them apart, so a
 * threshold message never reads `2.05 % is above 2.05 %`: (0.020501, 0.0205) gives `2.0501 %` and
 * `2.0500 %`. Equal shares show 2 decimals. Rounding keeps order: the larger share never shows smaller.
 */
export function percentsApart(a: number, b: number): [string, string] {
  let decimals = 2;
  let x = percentDigits(a, decimals);
  let y = percentDigits(b, decimals);
  while (x === y && a !== b && decimals < MOST_DECIMALS) {
    decimals += 1;
    x = percentDigits(a, decimals);
    y = percentDigits(b, decimals);
  }
  return [`${x} %`, `${y} %`];
}

/** Lines of label/value pairs with the values aligned. */
export function pairs(rows: ReadonlyArray<readonly [string, string]>): string {
  const width = Math.max(...rows.map(([k]) => k.length));
  return rows.map(([k, v]) => `${k.padEnd(width)}  ${v}\n`).join('');
}

/** A count with its noun, singular for 1: `1 document`, `12,345 documents`. */
export function counted(n: number, noun: string): string {
  return `${count(n)} ${n === 1 ? noun : `${noun}s`}`;
}
