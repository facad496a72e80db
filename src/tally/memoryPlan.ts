import { SpaceSaving } from './SpaceSaving.js';

const MIB = 2 ** 20;

/** The least `--memory-limit` a bounded build accepts, in MiB: below it there is no room to count in. */
export const LEAST_LIMIT_MIB = 32;
/** The most it accepts: 1 TiB. */
export const MOST_LIMIT_MIB = 2 ** 20;

/** Heap a bounded count keeps besides what the plan names: the reader's state, small maps, messages. */
const SUNDRY_BYTES = 3 * MIB;
/**
 * Heap per token the lexicon keeps, from the end of counting to the written file (the token's string,
 * its entry in the result tally, the ranking, the lexicon's tables, its JSON and canonical JSON for
 * the fingerprint): this much, and {@link RESULT_BYTES_PER_UNIT} a code unit of the token. Measured
 * (the least heap that made and wrote a lexicon, see DEVELOPERS.md): 180 bytes a token of 8 units,
 * 280 of 30.
 */
const RESULT_BYTES_PER_TOKEN = 160;
const RESULT_BYTES_PER_UNIT = 6;
/** Code units a kept token is planned at before counting tells (a lexicon's tokens are short: most frequent first). */
const PLANNED_UNITS_PER_TOKEN = 16;
/** Heap the lexicon takes whatever its cap: the fit, canaries, the seen filter in base64, schema checks. */
const RESULT_BYTES = 3 * MIB;
/** Share of the limit the lexicon may take at least (so that a large enough limit holds any lexicon). */
const RESULT_SHARE = 1 / 16;
/**
 * Share of the limit for one document in flight: its text as read (three quarters, see
 * {@link recordLimitFor}), and one uncut run of it tokenized (a quarter).
 */
const DOCUMENT_SHARE = 1 / 8;
const DOCUMENT_LEAST = 2 * MIB;
/**
 * Bytes of memory a reader takes per byte of one record while it gathers, decodes and parses it, by
 * corpus kind. Measured as the peak RSS a bounded build of one record of 4 to 16 MiB added: 2.6 for a
 * line of .txt or .jsonl, 1.6 for a file of a folder, 38 for a field of .csv or .tsv (fast-csv).
 */
const READER_BYTES_PER_BYTE: Readonly<Record<string, number>> = { txt: 4, jsonl: 4, folder: 4, csv: 48, tsv: 48 };
/** Share of the limit for the labels' counts. */
const LABEL_SHARE = 1 / 64;
const LABEL_LEAST = MIB / 2;
/** Share of the limit for the tokenizer's memo of chunks it met before (src/rules/fast/GroupCache.ts). */
const MEMO_SHARE = 1 / 32;
const MEMO_MOST = 8 * MIB;
/** Heap the garbage collector needs free beyond the live data to work without running out: a quarter. */
const HEAP_SLACK = 4 / 3;
/** Of the counting pool (off the heap), the share for counters; the rest holds their tokens' code units. */
const COUNTER_SHARE = 0.75;
/** The most counters and arena code units SpaceSaving takes. */
const MOST_COUNTERS = 2 ** 30 - 1;
const MOST_ARENA_UNITS = 2 ** 31 - 1;
/** Counters a count needs at least to be worth starting. */
const LEAST_COUNTERS = 1024;
/**
 * Bytes a counter costs besides the summary's own arrays, once counting is done: its exact count
 * (pass 2), the sorted bounds then counts, its place in the lists of monitored and rankable counters,
 * the ranked counts (see boundedTally).
 */
const RANKING_BYTES_PER_COUNTER = 8 + 8 + 4 + 4 + 8;

/**
 * How a bounded build spends `--memory-limit` MiB. Off the JavaScript heap, in typed arrays whose size
 * is fixed at the start: the Space-Saving counters and the arena of their tokens (`poolBytes`). On the
 * heap, capped at `heapMiB` for the process that counts: one document in flight (`documentBytes`), the
 * labels (`labelBytes`), the tokenizer's memo (`memoBytes`), the lexicon being made (`resultBytes`) and
 * a quarter more for the garbage collector. The young generation (`youngMiB`) is capped too. What
 * the process takes before it counts anything (Node itself, the code) is not in the limit. The
 * lexicon is planned at its cap of tokens of 16 code units; when that leaves too little to count in,
 * the count goes ahead with room for a small lexicon only, and finds out how large it is.
 */
export interface MemoryPlan {
  limitMiB: number;
  /** Space-Saving counters. */
  counters: number;
  /** UTF-16 code units for the counters' tokens (SpaceSaving's arena). */
  arenaUnits: number;
  /** Bytes for one document in flight. */
  documentBytes: number;
  /** Bytes one uncut run of text (no white space to cut it at) may take while it is tokenized: a quarter of `documentBytes`. */
  runBytes: number;
  labelBytes: number;
  memoBytes: number;
  /** Heap the lexicon may take while it is made (see {@link resultBytesFor}). */
  resultBytes: number;
  poolBytes: number;
  /** The old-generation heap cap beyond what the process holds at rest. */
  heapMiB: number;
  youngMiB: number;
}

/** What a count found it needs; {@link limitFor} turns it into a limit. */
export interface MemoryNeeds {
  counters: number;
  arenaUnits: number;
  runBytes: number;
  labelBytes: number;
  resultBytes: number;
}

/**
 * Heap a lexicon of `tokens` tokens of `units` UTF-16 code units in all takes while it is made and written.
 * @example resultBytesFor(30000, 240000) // about 9.6 MiB
 */
export function resultBytesFor(tokens: number, units: number): number {
  return RESULT_BYTES + tokens * RESULT_BYTES_PER_TOKEN + units * RESULT_BYTES_PER_UNIT;
}

/**
 * The plan for a limit of `limitMiB` and a lexicon of `kept` tokens (the cap and the reserved ones).
 * @example memoryPlan(256, 30000).counters // the Space-Saving counters 256 MiB pays for
 */
export function memoryPlan(limitMiB: number, kept: number): MemoryPlan {
  const limit = limitMiB * MIB;
  const youngMiB = Math.min(16, Math.max(2, Math.floor(limitMiB / 16)));
  const documentBytes = Math.max(DOCUMENT_LEAST, Math.floor(limit * DOCUMENT_SHARE));
  const labelBytes = Math.max(LABEL_LEAST, Math.floor(limit * LABEL_SHARE));
  const memoBytes = Math.min(MEMO_MOST, Math.floor(limit * MEMO_SHARE));
  // The labels count twice: in the count, and in the lexicon being made.
  const heapFor = (result: number) => Math.ceil((SUNDRY_BYTES + documentBytes + labelBytes + memoBytes + labelBytes + result) * HEAP_SLACK);
  let resultBytes = Math.max(resultBytesFor(kept, kept * PLANNED_UNITS_PER_TOKEN), Math.floor(limit * RESULT_SHARE));
  let poolBytes = limit - youngMiB * MIB - heapFor(resultBytes);
  if (countersIn(poolBytes) < LEAST_COUNTERS) {
    // The planned lexicon leaves too little to count in: count anyway, to find out how large the
    // lexicon really is (a small corpus has few tokens to keep) and what would do if it does not fit.
    resultBytes = RESULT_BYTES;
    poolBytes = limit - youngMiB * MIB - heapFor(resultBytes);
  }
  poolBytes = Math.max(0, poolBytes);
  const heapBytes = heapFor(resultBytes);
  return {
    limitMiB,
    // Within what SpaceSaving takes (its offsets are 32-bit): past some 100 GiB a larger limit adds nothing.
    counters: Math.min(MOST_COUNTERS, Math.max(1, countersIn(poolBytes))),
    arenaUnits: Math.min(MOST_ARENA_UNITS, Math.max(64, Math.floor((poolBytes * (1 - COUNTER_SHARE)) / 2))),
    documentBytes,
    runBytes: Math.floor(documentBytes / 4),
    labelBytes,
    memoBytes,
    resultBytes,
    poolBytes,
    heapMiB: Math.ceil(heapBytes / MIB),
    youngMiB,
  };
}

/**
 * The longest record (a line, a CSV record, a file of a folder) a reader of `kind` may gather under
 * the plan, in bytes: three quarters of the document's share, over what the reader takes a byte.
 * @example recordLimitFor(memoryPlan(256, 30000), 'txt') // 6 MiB
 */
export function recordLimitFor(plan: MemoryPlan, kind: string): number {
  return Math.max(1, Math.floor((plan.documentBytes * 3) / 4 / (READER_BYTES_PER_BYTE[kind] ?? 48)));
}

/**
 * Bytes as messages say them: `512 KiB`, `3.41 MiB`, `120 MiB` (rounded up, so a need is never understated).
 * @example formatBytes(3.41 * 2 ** 20) // '3.41 MiB'
 */
export function formatBytes(bytes: number): string {
  if (bytes < MIB) return `${Math.ceil(bytes / 1024)} KiB`;
  const mib = bytes / MIB;
  return mib < 10 ? `${Math.ceil(mib * 100) / 100} MiB` : `${Math.ceil(mib).toLocaleString('en-US')} MiB`;
}

/** The most counters (and their arena's share) that fit in `poolBytes`. */
function countersIn(poolBytes: number): number {
  const budget = poolBytes * COUNTER_SHARE;
  if (budget <= 0) return 0;
  // SpaceSaving.bytesFor rises with the counters (in steps where its hash table doubles): search.
  let lo = 0;
  let hi = Math.max(1, Math.floor(budget / 40));
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (SpaceSaving.bytesFor(mid, 0) + mid * RANKING_BYTES_PER_COUNTER <= budget) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Whether the plan meets the needs. */
function meets(plan: MemoryPlan, needs: MemoryNeeds): boolean {
  return (
    plan.counters >= needs.counters &&
    plan.arenaUnits >= needs.arenaUnits &&
    plan.runBytes >= needs.runBytes &&
    plan.labelBytes >= needs.labelBytes &&
    plan.resultBytes >= needs.resultBytes
  );
}

/**
 * The smallest limit (MiB) whose plan meets `needs` for a lexicon of `kept` tokens, or null when no
 * limit up to {@link MOST_LIMIT_MIB} does.
 * @example limitFor({ counters: 200000, arenaUnits: 2400000, runBytes: 0, labelBytes: 0, resultBytes: 0 }, 30000) // 62
 */
export function limitFor(needs: MemoryNeeds, kept: number): number | null {
  if (!meets(memoryPlan(MOST_LIMIT_MIB, kept), needs)) return null;
  let lo = LEAST_LIMIT_MIB;
  let hi = MOST_LIMIT_MIB;
  while (lo < hi) {
    const mid = Math.floor((lo + hi) / 2);
    if (meets(memoryPlan(mid, kept), needs)) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}
