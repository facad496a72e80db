import { describe, expect, it } from 'vitest';
import { heapLimitFor } from '../src/heapLimitFor.js';

describe('heapLimitFor', () => {
  it.each<[string[], number | null]>([
    [['build', 'c.txt'], null],
    [['build', 'c.txt', '--memory-limit', '256'], 192],
    [['build', 'c.txt', '--memory-limit=100'], 75],
    [['build', 'c.txt', '--memory-limit', '16'], 16],
    // Not a whole number: left to the command, which refuses it with its own usage message.
    [['build', 'c.txt', '--memory-limit', 'lots'], null],
    [['build', 'c.txt', '--memory-limit'], null],
  ])('%j -> %j', (argv, expected) => {
    expect(heapLimitFor(argv)).toBe(expected);
  });
});
