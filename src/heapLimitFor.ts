/** Share of `--memory-limit` the JavaScript heap may take; the rest is code, stacks and I/O buffers. */
const HEAP_SHARE = 0.75;

/**
 * The V8 old-generation limit (MiB) a `lexlock` process should run with for these arguments, or null
 * when none is needed. Only `--memory-limit <MiB>` asks for one: the counters stay within their share
 * of it by construction, but V8 grows its heap well past the live data before collecting (a bounded
 * build of a 236 MB corpus peaked at 712 MB with 129 MB live), so the heap itself must be capped.
 * @example heapLimitFor(['build', 'c.txt', '--memory-limit', '256']) // 192
 */
export function heapLimitFor(argv: readonly string[]): number | null {
  let value: string | undefined;
  argv.forEach((a, i) => {
    if (a === '--memory-limit') value = argv[i + 1];
    else if (a.startsWith('--memory-limit=')) value = a.slice('--memory-limit='.length);
  });
  if (value === undefined || !/^\d+$/.test(value)) return null;
  return Math.max(16, Math.floor(Number(value) * HEAP_SHARE));
}
