// A worker thread: tallies or encodes batches of documents with the same code as the main thread.
import { parentPort, workerData } from 'node:worker_threads';
import { parseLexicon } from '../artifact/parseLexicon.js';
import { AuditCounts } from '../audit/AuditCounts.js';
import { isLexlockError } from '../LexlockError.js';
import { Tally } from '../tally/Tally.js';
import type { Batch, WorkerReply, WorkerSetup } from './messages.js';

const setup = workerData as WorkerSetup;
const lexicon = setup.kind === 'tally' ? null : parseLexicon(setup.lexicon, { checkCanaries: false });

function handle(batch: Batch): WorkerReply {
  if (lexicon === null) {
    if (setup.kind !== 'tally') throw new Error('worker set up without a lexicon');
    const tally = new Tally(setup.rules);
    batch.texts.forEach((text, i) => tally.add({ text, label: batch.labels[i] ?? undefined }));
    return { id: batch.id, tally: tally.toCounts() };
  }
  if (setup.kind === 'audit') {
    const counts = new AuditCounts(lexicon, setup.length);
    batch.texts.forEach((text, i) => counts.add(text, batch.labels[i] ?? undefined));
    return { id: batch.id, audit: counts.parts() };
  }
  const rows = batch.texts.map((text) => lexicon.idsOf(lexicon.tokenize(text)));
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
}

parentPort?.on('message', (batch: Batch) => {
  let reply: WorkerReply;
  try {
    reply = handle(batch);
  } catch (e) {
    reply = { id: batch.id, error: isLexlockError(e) ? { message: e.message, code: e.code } : { message: e instanceof Error ? e.message : String(e) } };
  }
  // The id arrays are made here with their own ArrayBuffers, so they can be handed over, not copied.
  if ('encoded' in reply) parentPort?.postMessage(reply, [reply.encoded.ids.buffer as ArrayBuffer, reply.encoded.lengths.buffer as ArrayBuffer]);
  else parentPort?.postMessage(reply);
});
