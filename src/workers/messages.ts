import type { AuditParts } from '../audit/AuditCounts.js';
import type { TallyCounts } from '../tally/Tally.js';
import type { TextRules } from '../rules/TextRules.js';

/** What a worker is started with: the rules to tally under, or the lexicon file text to encode or audit with. */
export type WorkerSetup =
  | { kind: 'tally'; rules: TextRules }
  | { kind: 'encode'; lexicon: string }
  | { kind: 'audit'; lexicon: string; length: number | null };

/** A batch of documents sent to a worker. */
export interface Batch {
  id: number;
  texts: string[];
  labels: Array<string | null>;
}

/** A worker's tally of one batch (Maps survive structured cloning as they are). */
export type TallyParts = TallyCounts;

/** A worker's ids for one batch: every document's ids one after another, and each one's length. */
export interface EncodedBatch {
  ids: Int32Array;
  lengths: Int32Array;
}

/** A worker's answer for batch `id`. */
export type WorkerReply =
  | { id: number; tally: TallyParts }
  | { id: number; encoded: EncodedBatch }
  | { id: number; audit: AuditParts }
  | { id: number; error: { message: string; code?: string } };
