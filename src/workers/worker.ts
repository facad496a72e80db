// A worker thread: tallies, audits or encodes batches of documents with the same code as the main thread.
import { parentPort, workerData } from 'node:worker_threads';
import { batchHandler } from './batchHandler.js';
import type { Batch, Flush, WorkerSetup } from './messages.js';

const { setup, index } = workerData as { setup: WorkerSetup; index: number };
const handler = batchHandler(setup, {}, index);

parentPort?.on('message', (message: Batch | Flush) => {
  const reply = 'flush' in message ? handler.flush(message.id) : handler.handle(message);
  // The id arrays are made here with their own ArrayBuffers, so they can be handed over, not copied.
  if ('encoded' in reply) parentPort?.postMessage(reply, [reply.encoded.ids.buffer as ArrayBuffer, reply.encoded.lengths.buffer as ArrayBuffer]);
  else if ('numbered' in reply && reply.numbered !== undefined) parentPort?.postMessage(reply, [reply.numbered.numbers.buffer as ArrayBuffer, reply.numbered.lengths.buffer as ArrayBuffer]);
  else parentPort?.postMessage(reply);
});
