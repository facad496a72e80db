import { AuditCounts } from '../audit/AuditCounts.js';
import { PageCounts } from '../audit/explore/PageCounts.js';
import { isLexlockError } from '../LexlockError.js';
import { Lexicon } from '../lexicon/Lexicon.js';
import { Tally } from '../tally/Tally.js';
import type { Batch, NumberedBatch, WorkerReply, WorkerSetup } from './messages.js';

/**
 * Distinct tokens a tally or audit job keeps across batches before it sends them on: merging a
 * thread's counts costs a lookup per distinct token, so keeping them saves merging the common tokens
 * again for every batch, and the bound keeps a thread's memory from growing with the corpus.
 */
export const KEPT_TYPES = 100_000;

/** Groups of token numbers a thread may send (see {@link NumberedBatch}): thread `index` uses `index * GROUPS_PER_THREAD + 1` on. */
const GROUPS_PER_THREAD = 1 << 20;

/** Where the calling thread's own batches are counted: straight into the job's final counts. */
export interface LocalTargets {
  lexicon?: Lexicon;
  tally?: Tally;
  audit?: AuditCounts;
}

/** Handles batches of one job and answers flushes. */
export interface BatchHandler {
  handle(batch: Batch): WorkerReply;
  /** The counts kept so far (tally and audit jobs; `kept` when there are none or they went to a target). */
  flush(id: number): WorkerReply;
}

/**
 * The one way a batch is handled, in a worker thread or on the thread that reads the corpus: tallied
 * under the rules, counted for an audit, or encoded, answered as a {@link WorkerReply} (errors too).
 * Tally and audit counts are kept across batches (see {@link KEPT_TYPES}); given `targets`, the
 * calling thread counts into the job's final tally or audit counts instead, and never sends them.
 * The encoding of a setup was checked where it was loaded, so it is not checked again (and a worker
 * never loads the schema code). `index` tells threads' groups of token numbers apart (0: the calling thread).
 */
export function batchHandler(setup: WorkerSetup, targets: LocalTargets = {}, index = 0): BatchHandler {
  const lexicon = setup.kind === 'tally' ? null : (targets.lexicon ?? new Lexicon(setup.encoding, null, [], setup.fingerprint));
  let tally: Tally | null = null;
  let audit: AuditCounts | null = null;
  // The lexicon that ranks tokens for the report page, when it is not the one audited (made once).
  const ranking =
    setup.kind === 'audit' && setup.page !== undefined && setup.page.ranking !== null ? new Lexicon(setup.page.ranking.encoding, null, [], setup.page.ranking.fingerprint) : null;
  // Each set of counts this thread sends is a group; token numbers name the group they belong to.
  let sent = 0;
  const group = () => (tally !== null && tally === targets.tally ? 0 : index * GROUPS_PER_THREAD + sent + 1);
  const take = (id: number): WorkerReply => {
    if (tally !== null && tally !== targets.tally) {
      const reply: WorkerReply = { id, tally: tally.toCounts(), group: group() };
      tally = null;
      sent += 1;
      return reply;
    }
    if (audit !== null && audit !== targets.audit) {
      const reply: WorkerReply = { id, audit: audit.parts() };
      audit = null;
      return reply;
    }
    return { id, kept: true };
  };
  const handle = (batch: Batch): WorkerReply => {
    if (setup.kind === 'tally') {
      const t = (tally ??= targets.tally ?? new Tally(setup.rules));
      let numbered: NumberedBatch | undefined;
      if (setup.numbered === true) {
        const rows = batch.texts.map((text, i) => t.addNumberedText(text, batch.labels[i] ?? undefined));
        const { ids, lengths } = joinRows(rows);
        numbered = { numbers: ids, lengths, group: group() };
      } else batch.texts.forEach((text, i) => t.add({ text, label: batch.labels[i] ?? undefined }));
      const reply = t !== targets.tally && t.types >= KEPT_TYPES ? take(batch.id) : { id: batch.id, kept: true as const };
      return numbered === undefined ? reply : { ...reply, numbered };
    }
    const lex = lexicon as Lexicon;
    if (setup.kind === 'audit') {
      const page = setup.page === undefined ? null : new PageCounts(setup.page.grid, ranking ?? lex);
      const a = (audit ??= targets.audit ?? new AuditCounts(lex, setup.length, page));
      batch.texts.forEach((text, i) => a.add(text, batch.labels[i] ?? undefined));
      return a !== targets.audit && a.keptTypes >= KEPT_TYPES ? take(batch.id) : { id: batch.id, kept: true };
    }
    return { id: batch.id, encoded: joinRows(batch.texts.map((text) => lex.encode(text, { shape: null }))) };
  };
  return {
    handle: (batch) => safely(batch.id, () => handle(batch)),
    flush: (id) => safely(id, () => take(id)),
  };
}

/** Rows one after another in one array (with their own ArrayBuffer, to hand over), and each row's length. */
function joinRows(rows: readonly Int32Array[]): { ids: Int32Array; lengths: Int32Array } {
  let total = 0;
  for (const r of rows) total += r.length;
  const ids = new Int32Array(total);
  const lengths = new Int32Array(rows.length);
  let at = 0;
  rows.forEach((r, i) => {
    ids.set(r, at);
    at += r.length;
    lengths[i] = r.length;
  });
  return { ids, lengths };
}

/** Runs `f`, answering an error reply for anything it throws. */
function safely(id: number, f: () => WorkerReply): WorkerReply {
  try {
    return f();
  } catch (e) {
    return { id, error: isLexlockError(e) ? { message: e.message, code: e.code } : { message: e instanceof Error ? e.message : String(e) } };
  }
}
