import { describe, expect, it } from 'vitest';
import { GroupCache } from '../../../src/rules/fast/GroupCache.js';

describe('GroupCache', () => {
  it('returns what was stored and empties itself when full, so it stays bounded', () => {
    const cache = new GroupCache(3);
    cache.set('a', ['a', 'word']);
    cache.set('b', ['b', 'word']);
    cache.set('c', ['c', 'word']);
    expect(cache.get('b')).toEqual(['b', 'word']);
    expect(cache.size).toBe(3);
    cache.set('d', ['d', 'word']);
    expect(cache.size).toBe(1);
    expect(cache.get('a')).toBeUndefined();
    expect(cache.get('d')).toEqual(['d', 'word']);
  });
});
