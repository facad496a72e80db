import type { Random } from './seededRandom.js';

/**
 * Draws a rank from 1 to `ranks` with probability close to 1 / rank^exponent (Zipf's law), by inverting
 * the continuous distribution: no table, so the rank space can be in the tens of millions.
 * @example const rank = zipfRank(random, 1_000_000, 1.05); // 1 most often, then 2, ...
 */
export function zipfRank(random: Random, ranks: number, exponent: number): number {
  const u = random();
  let x: number;
  if (Math.abs(exponent - 1) < 1e-9) x = Math.pow(ranks + 1, u);
  else {
    const a = 1 - exponent;
    x = Math.pow((Math.pow(ranks + 1, a) - 1) * u + 1, 1 / a);
  }
  return Math.min(ranks, Math.max(1, Math.floor(x)));
}
