import { AuditCounts } from '../audit/AuditCounts.js';
import { auditCorpus, auditReport, type AuditOptions } from '../audit/auditCorpus.js';
import type { CoverageReport } from '../audit/CoverageReport.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import type { LabelledText } from '../tally/Tally.js';
import { IN_FLIGHT_PER_THREAD, batchesOf, inOrder } from '../workers/batches.js';
import type { WorkerReply } from '../workers/messages.js';
import { WorkerPool } from '../workers/WorkerPool.js';
import { withTurns } from './loopTurns.js';

/**
 * `auditCorpus` on worker threads: each thread counts batches with the same AuditCounts, the counts
 * are merged and the report made once, so it is the same report as on one thread.
 * @example const report = await auditOnThreads(readCorpus('live.jsonl'), lexicon, { threads: 4 }); // report.oovRate
 */
export async function auditOnThreads(
  documents: AsyncIterable<string | LabelledText> | Iterable<string | LabelledText>,
  lexicon: Lexicon,
  options: AuditOptions & { threads?: number } = {},
): Promise<CoverageReport> {
  const threads = options.threads ?? 1;
  // One thread: the event loop still gets a turn every 100 ms or so, a very long document included.
  if (threads <= 1) return auditCorpus(withTurns(documents, { rules: lexicon.rules, strings: false }), lexicon, options);
  const shape = options.shape === undefined ? lexicon.shape : options.shape;
  const length = shape === null ? null : shape.length;
  const counts = new AuditCounts(lexicon, length);
  const pool = WorkerPool.start({ kind: 'audit', encoding: lexicon.encoding, fingerprint: lexicon.fingerprint, length }, threads, { lexicon, audit: counts });
  const merge = (reply: WorkerReply) => {
    if ('audit' in reply) counts.merge(reply.audit);
  };
  try {
    await inOrder(batchesOf(documents), (b) => pool.submit(b), (_b, reply) => merge(reply), threads * IN_FLIGHT_PER_THREAD);
    for (const reply of await pool.flush()) merge(reply);
  } finally {
    await pool.close();
  }
  return auditReport(counts, lexicon, options);
}
