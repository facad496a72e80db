import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatBytes, LEAST_LIMIT_MIB, limitFor, memoryPlan, MOST_LIMIT_MIB, recordLimitFor, resultBytesFor } from '../../src/tally/memoryPlan.js';
import { SpaceSaving } from '../../src/tally/SpaceSaving.js';

const MIB = 2 ** 20;

describe('memoryPlan', () => {
  it('spends no more than the limit: young generation, the heap it plans (with the collector\'s share) and the counting pool (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: LEAST_LIMIT_MIB, max: 1 << 16 }), fc.integer({ min: 1, max: 2_000_000 }), (limit, kept) => {
        const p = memoryPlan(limit, kept);
        const counting = SpaceSaving.bytesFor(p.counters, p.arenaUnits);
        expect(p.youngMiB * MIB + p.heapMiB * MIB + p.poolBytes).toBeLessThanOrEqual(limit * MIB + MIB);
        expect(counting).toBeLessThanOrEqual(p.poolBytes);
        expect(recordLimitFor(p, 'txt') * 4 + p.runBytes).toBeLessThanOrEqual(p.documentBytes);
        expect(recordLimitFor(p, 'csv') * 48 + p.runBytes).toBeLessThanOrEqual(p.documentBytes);
      }),
    );
  });

  it('grows with the limit', () => {
    let before = memoryPlan(LEAST_LIMIT_MIB, 30000);
    for (let limit = LEAST_LIMIT_MIB + 1; limit < 3000; limit += 7) {
      const p = memoryPlan(limit, 30000);
      for (const member of ['arenaUnits', 'documentBytes', 'runBytes', 'labelBytes', 'resultBytes'] as const) expect(p[member]).toBeGreaterThanOrEqual(before[member]);
      if (before.resultBytes === p.resultBytes) expect(p.counters).toBeGreaterThanOrEqual(before.counters);
      before = p;
    }
  });

  it('names the smallest limit that meets a count\'s needs (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 20_000_000 }), fc.integer({ min: 0, max: 200_000_000 }), fc.integer({ min: 0, max: 1e9 }), fc.integer({ min: 1, max: 500_000 }), (counters, arenaUnits, runBytes, kept) => {
        const needs = { counters, arenaUnits, runBytes, labelBytes: 0, resultBytes: resultBytesFor(kept, kept * 8) };
        const limit = limitFor(needs, kept);
        if (limit === null) return;
        const p = memoryPlan(limit, kept);
        expect(p.counters).toBeGreaterThanOrEqual(counters);
        expect(p.arenaUnits).toBeGreaterThanOrEqual(arenaUnits);
        expect(p.runBytes).toBeGreaterThanOrEqual(runBytes);
        expect(p.resultBytes).toBeGreaterThanOrEqual(needs.resultBytes);
        if (limit > LEAST_LIMIT_MIB) {
          const less = memoryPlan(limit - 1, kept);
          expect(less.counters >= counters && less.arenaUnits >= arenaUnits && less.runBytes >= runBytes && less.resultBytes >= needs.resultBytes).toBe(false);
        }
      }),
    );
  });

  it.each([
    [1000, '1 KiB'],
    [512 * 1024, '512 KiB'],
    [3.413 * MIB, '3.42 MiB'],
    [10 * MIB, '10 MiB'],
    [1234.5 * MIB, '1,235 MiB'],
  ])('says %d bytes as %s (rounded up)', (bytes, text) => {
    expect(formatBytes(bytes)).toBe(text);
  });

  it('says when no limit would do', () => {
    expect(limitFor({ counters: 2 ** 40, arenaUnits: 0, runBytes: 0, labelBytes: 0, resultBytes: 0 }, 10)).toBeNull();
    expect(MOST_LIMIT_MIB).toBe(2 ** 20);
  });
});
