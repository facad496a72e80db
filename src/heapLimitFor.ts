// Kept light: the main thread of a capped build loads this and little else (not the tokenizer, the schema).
import { DEFAULT_CAP } from './lexicon/defaultCap.js';
import { LEAST_LIMIT_MIB, memoryPlan, MOST_LIMIT_MIB } from './tally/memoryPlan.js';

/**
 * The JavaScript heap the counting thread holds at rest, with the whole command-line tool loaded,
 * beside what a memory plan gives it: measured about 9 MiB (a worker thread that imported dist/cli,
 * after a full collection), with room to spare.
 */
export const RESTING_HEAP_MIB = 16;

/** The heap caps of the thread that counts under `--memory-limit` (see memoryPlan). */
export interface HeapLimits {
  /** V8's old-generation cap, MiB. */
  oldMiB: number;
  /** V8's young-generation cap, MiB. */
  youngMiB: number;
}

/** The last value of a flag (`--name value` or `--name=value`), or undefined. */
function lastValue(argv: readonly string[], name: string): string | undefined {
  let value: string | undefined;
  argv.forEach((a, i) => {
    if (a === name) value = argv[i + 1];
    else if (a.startsWith(`${name}=`)) value = a.slice(name.length + 1);
  });
  return value;
}

/**
 * The heap caps a `lexlock` process should count with for these arguments, or null when none is
 * needed: only `build … --memory-limit <MiB>` asks for them. V8 grows its heap well past the live data
 * before collecting (a bounded build of a 236 MB corpus peaked at 712 MB with 129 MB live), so the
 * heap itself must be capped, at what the plan for this limit and lexicon puts on it. Flags it cannot
 * read are left to the command, which refuses them with its own usage message.
 * @example heapLimitFor(['build', 'c.txt', '--memory-limit', '256']) // { oldMiB: …, youngMiB: 16 }
 */
export function heapLimitFor(argv: readonly string[]): HeapLimits | null {
  if (argv[0] !== 'build') return null;
  const limit = lastValue(argv, '--memory-limit');
  if (limit === undefined || !/^\d+$/.test(limit) || Number(limit) < LEAST_LIMIT_MIB || Number(limit) > MOST_LIMIT_MIB) return null;
  const capText = lastValue(argv, '--cap');
  if (capText !== undefined && !/^\d+$/.test(capText)) return null;
  const cap = capText === undefined ? DEFAULT_CAP : Number(capText);
  const reserved = new Set<string>();
  argv.forEach((a, i) => {
    if (a === '--reserve' && argv[i + 1] !== undefined) reserved.add(argv[i + 1] as string);
    else if (a.startsWith('--reserve=')) reserved.add(a.slice('--reserve='.length));
  });
  const plan = memoryPlan(Number(limit), cap + reserved.size);
  return { oldMiB: RESTING_HEAP_MIB + plan.heapMiB, youngMiB: plan.youngMiB };
}
