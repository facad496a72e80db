import { canonicalJson } from '../../artifact/canonicalJson.js';
import type { MemberDifference } from './LexiconComparison.js';

/**
 * The members of `a` and `b` (checked in the order of `members`) whose values differ as JSON, the
 * way the fingerprint sees them (so `['x','y']` and `['y','x']` differ).
 * @example memberDifferences({ oov: 'first', reserved: 0 }, { oov: 'last', reserved: 0 }, ['oov', 'reserved'])
 * // [{ member: 'oov', a: 'first', b: 'last' }]
 */
export function memberDifferences<T extends object, K extends keyof T & string>(a: T, b: T, members: readonly K[]): Array<MemberDifference<T, K>> {
  const out: Array<MemberDifference<T, K>> = [];
  for (const member of members) {
    if (canonicalJson(a[member]) !== canonicalJson(b[member])) {
      // The object literal is one arm of the union for this `member`; TypeScript cannot see that.
      out.push({ member, a: a[member], b: b[member] } as MemberDifference<T, K>);
    }
  }
  return out;
}
