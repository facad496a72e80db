import { formatCount } from '../audit/report/formatCount.js';

/** A whole number with thousands separators: 12,345 (the same grouping as the HTML report). */
export function count(n: number): string {
  return formatCount(n);
}

/** A share as a percentage with two decimals: 3.25 %. */
export function percent(share: number): string {
  return `${(share * 100).toFixed(2)} %`;
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
