import { formatCount } from '../formatCount.js';

/**
 * A signed difference `now - then` with a unit: "+1.25 points", "−30 tokens", "no change".
 * @example formatChange(0.05, 0.0625, 'points', 100) // '+1.25 points'
 */
export function formatChange(then: number, now: number, unit: string, factor = 1, decimals = 2): string {
  const delta = (now - then) * factor;
  const text = formatCount(Math.abs(delta), decimals);
  if (Number(Math.abs(delta).toFixed(decimals)) === 0) return 'no change';
  return `${delta > 0 ? '+' : '−'}${text} ${unit}`;
}
