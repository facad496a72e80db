import { describe, expect, it } from 'vitest';
import { heapLimitFor, RESTING_HEAP_MIB } from '../src/heapLimitFor.js';
import { memoryPlan } from '../src/tally/memoryPlan.js';

const capped = (limit: number, kept: number) => ({ oldMiB: RESTING_HEAP_MIB + memoryPlan(limit, kept).heapMiB, youngMiB: memoryPlan(limit, kept).youngMiB });

describe('heapLimitFor', () => {
  it.each<[string[], ReturnType<typeof heapLimitFor>]>([
    [['build', 'c.txt'], null],
    [['build', 'c.txt', '--memory-limit', '256'], capped(256, 30000)],
    [['build', 'c.txt', '--memory-limit=100', '--cap', '500', '--reserve', '<s>', '--reserve=</s>'], capped(100, 502)],
    [['build', 'c.txt', '--memory-limit', '64', '--cap=12000', '--reserve', 'x', '--reserve', 'x'], capped(64, 12001)],
    // Not a limit the command takes, or not a whole number: left to the command, which refuses it with its own usage message.
    [['build', 'c.txt', '--memory-limit', '16'], null],
    [['build', 'c.txt', '--memory-limit', 'lots'], null],
    [['build', 'c.txt', '--memory-limit'], null],
    [['build', 'c.txt', '--memory-limit', '64', '--cap', 'many'], null],
    [['audit', 'c.txt', '--memory-limit', '64'], null],
  ])('%j -> %j', (argv, expected) => {
    expect(heapLimitFor(argv)).toEqual(expected);
  });

  it('gives the heap what the plan puts on it, and the plan grows with the limit', () => {
    const small = heapLimitFor(['build', 'c.txt', '--memory-limit', '64']);
    const large = heapLimitFor(['build', 'c.txt', '--memory-limit', '1024']);
    expect(small?.oldMiB).toBeLessThan(large?.oldMiB ?? 0);
    expect(large?.youngMiB).toBe(16);
  });
});
