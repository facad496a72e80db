import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { LexlockError, type LexlockErrorCode } from '../LexlockError.js';
import { LONG_DOCUMENT } from '../pipeline/loopTurns.js';
import { batchHandler, type BatchHandler, type LocalTargets } from './batchHandler.js';
import type { Batch, Flush, WorkerReply, WorkerSetup } from './messages.js';

/** The thread count used when none is asked for: the machine's available parallelism. */
export function defaultThreads(): number {
  return availableParallelism();
}

// Built code runs dist/worker.js beside it; run from the TypeScript sources (tests, tsx) the worker is
// worker.ts, loaded through tsx the same way.
const fromSources = import.meta.url.endsWith('.ts');
const workerUrl = new URL(fromSources ? './worker.ts' : './worker.js', import.meta.url);

/** Where a batch's reply goes. */
interface Waiting {
  resolve: (r: WorkerReply) => void;
  reject: (e: Error) => void;
}

interface Slot {
  worker: Worker;
  busy: number;
  waiting: Map<number, Waiting>;
}

/**
 * The young generation of a worker thread, in MiB (V8's default is larger). Measured on 2 cores with
 * `lexlock build --encode` of a 32.6 MB mail folder: peak RSS 222-236 MiB against 258-270 by default in
 * the same time (3.0 s); a build of 236 MB with 3.5 million distinct tokens took 2-3 % longer (4-7 % more
 * CPU) at 20-30 MiB less. Tokens that live on (a tally's) are few next to the garbage a batch makes.
 */
export const WORKER_YOUNG_GENERATION_MIB = 8;

/**
 * Batches a worker may have queued before the next one is handled on the calling thread instead: the
 * calling thread also reads (and for encode writes), so it takes a batch only when workers are well fed.
 */
const QUEUED_PER_WORKER = 4;

/**
 * Threads that each take batches of documents and answer one reply a batch: `threads - 1` worker
 * threads, and the calling thread itself, which handles a batch whenever every worker already has
 * {@link QUEUED_PER_WORKER} queued. So `threads` counts the thread that reads the corpus too, and the
 * memory of one worker is saved. Replies are the same wherever a batch ran.
 */
export class WorkerPool {
  private readonly slots: Slot[];
  private readonly local: BatchHandler;

  private constructor(slots: Slot[], local: BatchHandler) {
    this.slots = slots;
    this.local = local;
  }

  /**
   * Starts a pool of `threads` (at least 2) for one job: tally under rules, or encode or audit with a
   * lexicon. `local` is for the calling thread: the already loaded lexicon of the setup, and the
   * job's final tally or audit counts, which its own batches are counted into.
   */
  static start(setup: WorkerSetup, threads: number, local: LocalTargets = {}): WorkerPool {
    const slots: Slot[] = [];
    for (let i = 0; i < Math.max(1, threads - 1); i++) {
      const options = { workerData: { setup, index: i + 1 }, resourceLimits: { maxYoungGenerationSizeMb: WORKER_YOUNG_GENERATION_MIB } };
      const worker = fromSources
        ? new Worker(`import('tsx/esm/api').then((m) => m.tsImport(${JSON.stringify(workerUrl.href)}, ${JSON.stringify(import.meta.url)}))`, { eval: true, ...options })
        : new Worker(workerUrl, options);
      const slot: Slot = { worker, busy: 0, waiting: new Map() };
      worker.on('message', (reply: WorkerReply) => {
        const w = slot.waiting.get(reply.id);
        if (w === undefined) return;
        slot.waiting.delete(reply.id);
        slot.busy -= 1;
        settle(reply, w);
      });
      worker.on('error', (e) => {
        for (const w of slot.waiting.values()) w.reject(e);
        slot.waiting.clear();
      });
      slots.push(slot);
    }
    return new WorkerPool(slots, batchHandler(setup, local));
  }

  /**
   * Sends a batch to the least busy worker, or handles it here when every worker has enough queued,
   * unless it holds a very long document: that would keep this thread, the one that sees signals
   * (src/bin.ts), busy for seconds, while a worker's time does not delay them.
   */
  submit(batch: Batch): Promise<WorkerReply> {
    let slot = this.slots[0] as Slot;
    for (const s of this.slots) if (s.busy < slot.busy) slot = s;
    return new Promise((resolve, reject) => {
      if (slot.busy >= QUEUED_PER_WORKER && !batch.texts.some((t) => t.length >= LONG_DOCUMENT)) {
        settle(this.local.handle(batch), { resolve, reject });
        return;
      }
      send(slot, batch, { resolve, reject });
    });
  }

  /**
   * Asks every thread for the counts it still keeps (tally and audit jobs), once all batches are in:
   * the replies to merge, the calling thread's too. Flushes are numbered below zero, apart from batches.
   */
  async flush(): Promise<WorkerReply[]> {
    const replies = this.slots.map(
      (slot, i) =>
        new Promise<WorkerReply>((resolve, reject) => {
          send(slot, { id: -1 - i, flush: true }, { resolve, reject });
        }),
    );
    const own = new Promise<WorkerReply>((resolve, reject) => settle(this.local.flush(-1 - this.slots.length), { resolve, reject }));
    return Promise.all([own, ...replies]);
  }

  /** Stops every worker. */
  async close(): Promise<void> {
    await Promise.all(this.slots.map((s) => s.worker.terminate()));
  }
}

function send(slot: Slot, message: Batch | Flush, w: Waiting): void {
  slot.busy += 1;
  slot.waiting.set(message.id, w);
  slot.worker.postMessage(message);
}

function settle(reply: WorkerReply, w: Waiting): void {
  if ('error' in reply) w.reject(new LexlockError((reply.error.code ?? 'IO') as LexlockErrorCode, reply.error.message));
  else w.resolve(reply);
}
