/**
 * A number with comma thousands separators, rounded to `decimals` (default 0); locale-free.
 * @example formatCount(1234567) // '1,234,567'
 */
export function formatCount(n: number, decimals = 0): string {
  if (!Number.isFinite(n)) return String(n);
  const fixed = Math.abs(n).toFixed(decimals);
  const [whole = '0', fraction] = fixed.split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  const sign = n < 0 && Number(fixed) !== 0 ? '−' : '';
  return sign + grouped + (fraction === undefined ? '' : `.${fraction}`);
}
