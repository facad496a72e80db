import { formatCount } from './formatCount.js';

/**
 * An axis tick value with thousands separators and no trailing zeros (at most 4 decimals).
 * @example formatTick(2.5) // '2.5'; formatTick(10000) // '10,000'
 */
export function formatTick(value: number): string {
  const rounded = Number(value.toFixed(4));
  const text = formatCount(rounded, 4);
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}
