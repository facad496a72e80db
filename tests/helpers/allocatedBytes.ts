import v8 from 'node:v8';

/** Results kept alive while measuring, so the engine cannot leave an allocation out as unused. */
const kept: unknown[] = new Array<unknown>(16).fill(null);

/**
 * Bytes of V8 heap that one call of `fn` allocates, measured without a garbage collection in between:
 * the heap's growth over `calls` calls, divided. The median of several tries that saw no collection
 * (a collection empties the young generation and would hide allocations), after `warmUp` calls so the
 * compiler has settled. The median, not the least: on a loaded machine a try now and then reads low
 * (184 bytes measured as 107 for one Int32Array(64)) or high, and either outlier alone would make a
 * bound too tight or too loose. Off-heap backing stores of large typed arrays are not counted here;
 * each typed array still shows as its on-heap objects.
 */
export function allocatedBytes(fn: () => unknown, { calls = 1_000, tries = 15, warmUp = 30_000 } = {}): number {
  for (let i = 0; i < warmUp; i++) kept[i & 15] = fn();
  const clean: number[] = [];
  for (let t = 0; t < tries; t++) {
    const profiler = new v8.GCProfiler();
    profiler.start();
    const before = process.memoryUsage().heapUsed;
    for (let i = 0; i < calls; i++) kept[i & 15] = fn();
    const after = process.memoryUsage().heapUsed;
    if (profiler.stop().statistics.length > 0) continue;
    clean.push((after - before) / calls);
  }
  if (clean.length === 0) throw new Error(`every try saw a garbage collection; measure fewer than ${calls} calls`);
  clean.sort((a, b) => a - b);
  return clean[Math.floor(clean.length / 2)] as number;
}
