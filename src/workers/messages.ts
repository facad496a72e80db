import type { Encoding } from '../artifact/schema.js';
import type { AuditParts } from '../audit/AuditCounts.js';
import type { StopGrid } from '../audit/explore/StopGrid.js';
import type { TallyCounts } from '../tally/Tally.js';
import type { TextRules } from '../rules/TextRules.js';

/**
 * What a worker is started with: the rules to tally under, or the encoding of a lexicon the calling
 * thread has already loaded and checked, with its fingerprint, to encode or audit with.
 */
export type WorkerSetup =
  /** `numbered`: also answer each batch's token numbers (see {@link NumberedBatch}). */
  | { kind: 'tally'; rules: TextRules; numbered?: boolean }
  | { kind: 'encode'; encoding: Encoding; fingerprint: string }
  /** `page`: also count what the report page's controls need, on this cap grid, ranked by `ranking` (null: the encoding's own order). */
  | { kind: 'audit'; encoding: Encoding; fingerprint: string; length: number | null; page?: { grid: StopGrid; ranking: { encoding: Encoding; fingerprint: string } | null } };

/** A batch of documents sent to a worker. */
export interface Batch {
  id: number;
  texts: string[];
  labels: Array<string | null>;
}

/** Asks a worker for the counts it has kept so far (tally and audit jobs), which it then forgets. */
export interface Flush {
  id: number;
  flush: true;
}

/**
 * A batch's documents as token numbers, one after another, and each one's length. The numbers are
 * those of the tally the thread keeps (`Tally.numberOf`), which its counts reply for the same `group`
 * carries; group 0 numbers are those of the job's final tally itself (the calling thread's batches).
 */
export interface NumberedBatch {
  numbers: Int32Array;
  lengths: Int32Array;
  group: number;
}

/** A worker's ids for one batch: every document's ids one after another, and each one's length. */
export interface EncodedBatch {
  ids: Int32Array;
  lengths: Int32Array;
}

/**
 * A worker's answer for batch or flush `id`. Tally and audit jobs keep counting across batches and
 * answer `kept` until a flush, or until what they keep grows past a bound; then they send it.
 */
export type WorkerReply =
  | { id: number; kept: true; numbered?: NumberedBatch }
  | { id: number; tally: TallyCounts; group: number; numbered?: NumberedBatch }
  | { id: number; encoded: EncodedBatch }
  | { id: number; audit: AuditParts }
  | { id: number; error: { message: string; code?: string } };
