import { AuditCounts } from '../audit/AuditCounts.js';
import { auditReport, type AuditOptions } from '../audit/auditCorpus.js';
import type { CoverageReport } from '../audit/CoverageReport.js';
import { PageCounts } from '../audit/explore/PageCounts.js';
import type { StopGrid } from '../audit/explore/StopGrid.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import type { LabelledText } from '../tally/Tally.js';
import { IN_FLIGHT_PER_THREAD, batchesOf, inOrder } from '../workers/batches.js';
import type { WorkerReply } from '../workers/messages.js';
import { WorkerPool } from '../workers/WorkerPool.js';
import { withTurns } from './loopTurns.js';

/** What the report page's controls need counted: the cap grid, and the lexicon that ranks tokens (default the one audited). */
export interface PageRequest {
  grid: StopGrid;
  ranking?: Lexicon;
}

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
  return auditReport(await auditCountsOnThreads(documents, lexicon, options), lexicon, options);
}

/**
 * The counts behind {@link auditOnThreads}, on `threads` threads (one: this thread, the event loop
 * turning every 100 ms or so), with the report page's counts when `page` asks for them.
 */
export async function auditCountsOnThreads(
  documents: AsyncIterable<string | LabelledText> | Iterable<string | LabelledText>,
  lexicon: Lexicon,
  options: AuditOptions & { threads?: number; page?: PageRequest } = {},
): Promise<AuditCounts> {
  const threads = options.threads ?? 1;
  const shape = options.shape === undefined ? lexicon.shape : options.shape;
  const length = shape === null ? null : shape.length;
  const page = options.page === undefined ? null : new PageCounts(options.page.grid, options.page.ranking ?? lexicon);
  const counts = new AuditCounts(lexicon, length, page);
  if (threads <= 1) {
    for await (const doc of withTurns(documents, { rules: lexicon.rules, strings: false })) {
      if (typeof doc === 'string') counts.add(doc, undefined);
      else counts.add(doc.text, doc.label);
    }
    return counts;
  }
  const ranking = page === null || page.ranking === lexicon ? null : { encoding: page.ranking.encoding, fingerprint: page.ranking.fingerprint };
  const pageSetup = page === null ? {} : { page: { grid: page.index.grid, ranking } };
  const pool = WorkerPool.start({ kind: 'audit', encoding: lexicon.encoding, fingerprint: lexicon.fingerprint, length, ...pageSetup }, threads, { lexicon, audit: counts });
  const merge = (reply: WorkerReply) => {
    if ('audit' in reply) counts.merge(reply.audit);
  };
  try {
    await inOrder(batchesOf(documents), (b) => pool.submit(b), (_b, reply) => merge(reply), threads * IN_FLIGHT_PER_THREAD);
    for (const reply of await pool.flush()) merge(reply);
  } finally {
    await pool.close();
  }
  return counts;
}
