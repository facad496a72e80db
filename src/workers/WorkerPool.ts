import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { LexlockError, type LexlockErrorCode } from '../LexlockError.js';
import type { Batch, WorkerReply, WorkerSetup } from './messages.js';

/** The thread count used when none is asked for: the machine's available parallelism. */
export function defaultThreads(): number {
  return availableParallelism();
}

// Built code runs dist/worker.js beside it; run from the TypeScript sources (tests, tsx) the worker is
// worker.ts, loaded through tsx the same way.
const fromSources = import.meta.url.endsWith('.ts');
const workerUrl = new URL(fromSources ? './worker.ts' : './worker.js', import.meta.url);

interface Slot {
  worker: Worker;
  busy: number;
  waiting: Map<number, { resolve: (r: WorkerReply) => void; reject: (e: Error) => void }>;
}

/** A fixed set of worker threads that each take batches of documents and answer one reply a batch. */
export class WorkerPool {
  private readonly slots: Slot[];

  private constructor(slots: Slot[]) {
    this.slots = slots;
  }

  /** Starts `threads` workers set up for one job (tally under rules, or encode with a lexicon). */
  static start(setup: WorkerSetup, threads: number): WorkerPool {
    const slots: Slot[] = [];
    for (let i = 0; i < threads; i++) {
      const worker = fromSources
        ? new Worker(`import('tsx/esm/api').then((m) => m.tsImport(${JSON.stringify(workerUrl.href)}, ${JSON.stringify(import.meta.url)}))`, { eval: true, workerData: setup })
        : new Worker(workerUrl, { workerData: setup });
      const slot: Slot = { worker, busy: 0, waiting: new Map() };
      worker.on('message', (reply: WorkerReply) => {
        const w = slot.waiting.get(reply.id);
        if (w === undefined) return;
        slot.waiting.delete(reply.id);
        slot.busy -= 1;
        if ('error' in reply) w.reject(new LexlockError((reply.error.code ?? 'IO') as LexlockErrorCode, reply.error.message));
        else w.resolve(reply);
      });
      worker.on('error', (e) => {
        for (const w of slot.waiting.values()) w.reject(e);
        slot.waiting.clear();
      });
      slots.push(slot);
    }
    return new WorkerPool(slots);
  }

  /** Sends a batch to the least busy worker. */
  submit(batch: Batch): Promise<WorkerReply> {
    let slot = this.slots[0] as Slot;
    for (const s of this.slots) if (s.busy < slot.busy) slot = s;
    slot.busy += 1;
    return new Promise((resolve, reject) => {
      slot.waiting.set(batch.id, { resolve, reject });
      slot.worker.postMessage(batch);
    });
  }

  /** Stops every worker. */
  async close(): Promise<void> {
    await Promise.all(this.slots.map((s) => s.worker.terminate()));
  }
}
