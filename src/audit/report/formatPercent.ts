import { formatCount } from './formatCount.js';

/** The space between a number and its unit: a no-break space, so "12.5 %" never wraps. */
export const UNIT_SPACE = '\u00a0';

/**
 * A share (0…1) as a percentage with decimals that fit its size: 1 decimal from 10 %, 2 from 1 %,
 * two significant digits below that (0.37 %, 0.0034 %), `< 0.0001 %` for tinier non-zero shares,
 * and `> 99.99 %` for shares under 1 that would round up to 100.
 * @example formatPercent(0.0325) // '3.25 %' (with a no-break space)
 */
export function formatPercent(share: number): string {
  if (!Number.isFinite(share)) return `–${UNIT_SPACE}%`;
  const pct = share * 100;
  const magnitude = Math.abs(pct);
  const sign = pct < 0 ? '−' : '';
  if (pct === 0 || pct === 100) return `${formatCount(pct)}${UNIT_SPACE}%`;
  if (pct < 100 && pct >= 99.995) return `>${UNIT_SPACE}99.99${UNIT_SPACE}%`;
  if (magnitude < 0.0001) return `${sign}<${UNIT_SPACE}0.0001${UNIT_SPACE}%`;
  const small = magnitude.toPrecision(2);
  if (Number(small) < 1) return `${sign}${small}${UNIT_SPACE}%`;
  const decimals = magnitude >= 10 && magnitude < 99 ? 1 : 2;
  return `${formatCount(pct, decimals)}${UNIT_SPACE}%`;
}
