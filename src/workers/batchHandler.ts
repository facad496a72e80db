import { parseLexicon } from '../artifact/parseLexicon.js';
import { AuditCounts } from '../audit/AuditCounts.js';
import { isLexlockError } from '../LexlockError.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { Tally } from '../tally/Tally.js';
import type { Batch, WorkerReply, WorkerSetup } from './messages.js';

/**
 * The one way a batch is handled, in a worker thread or on the thread that reads the corpus: tallied
 * under the rules, counted for an audit, or encoded, answered as a {@link WorkerReply} (errors too).
 * `lexicon` saves parsing the setup's lexicon text again where it is already loaded.
 */
export function batchHandler(setup: WorkerSetup, lexicon?: Lexicon): (batch: Batch) => WorkerReply {
  const loaded = setup.kind === 'tally' ? null : (lexicon ?? parseLexicon(setup.lexicon, { checkCanaries: false }));
  const handle = (batch: Batch): WorkerReply => {
    if (setup.kind === 'tally') {
      const tally = new Tally(setup.rules);
      batch.texts.forEach((text, i) => tally.add({ text, label: batch.labels[i] ?? undefined }));
      return { id: batch.id, tally: tally.toCounts() };
    }
    const lex = loaded as Lexicon;
    if (setup.kind === 'audit') {
      const counts = new AuditCounts(lex, setup.length);
      batch.texts.forEach((text, i) => counts.add(text, batch.labels[i] ?? undefined));
      return { id: batch.id, audit: counts.parts() };
    }
    const rows = batch.texts.map((text) => lex.idsOf(lex.tokenize(text)));
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
    return { id: batch.id, encoded: { ids, lengths } };
  };
  return (batch) => {
    try {
      return handle(batch);
    } catch (e) {
      return { id: batch.id, error: isLexlockError(e) ? { message: e.message, code: e.code } : { message: e instanceof Error ? e.message : String(e) } };
    }
  };
}
