// WorkerPool hands a batch to the calling thread when its workers are well fed, but never one holding a
// very long document (issue 13): the calling thread is the one that sees SIGINT and SIGTERM, and a
// document that takes seconds there would keep them waiting. Observed through where the batch was
// counted: on the calling thread straight into the job's tally, in a worker only at the flush.
import { describe, expect, it } from 'vitest';
import { LONG_DOCUMENT } from '../../src/pipeline/loopTurns.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import type { Batch } from '../../src/workers/messages.js';
import { WorkerPool } from '../../src/workers/WorkerPool.js';

const rules = resolveRules();
const batch = (id: number, text: string): Batch => ({ id, texts: [text], labels: [null] });

describe('WorkerPool', () => {
  it.each([
    ['a short document is handled on the calling thread', 'ferry late again', 1],
    ['a very long one goes to a worker', `${'ferry '.repeat(LONG_DOCUMENT / 6)}late`, 0],
  ])('with every worker fed: %s', async (_name, text, countedHere) => {
    const tally = new Tally(rules);
    const pool = WorkerPool.start({ kind: 'tally', rules }, 2, { tally });
    try {
      // Submitted in one go, so no reply can come back in between: the one worker has four queued.
      const queued = [1, 2, 3, 4].map((id) => pool.submit(batch(id, 'a b')));
      const last = pool.submit(batch(5, text));
      await Promise.all([...queued, last]);
      expect(tally.documents).toBe(countedHere);
      for (const reply of await pool.flush()) if ('tally' in reply) tally.mergeCounts(reply.tally);
      expect(tally.documents).toBe(5);
    } finally {
      await pool.close();
    }
  });
});
