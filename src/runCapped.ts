import { Worker } from 'node:worker_threads';
import type { HeapLimits } from './heapLimitFor.js';

/** What the thread that runs a capped command is told. */
export interface CappedSetup {
  argv: readonly string[];
  stdoutTTY: boolean;
  stderrTTY: boolean;
}

/** What it sends back: output to write, then its exit code. */
export type CappedMessage = { stdout: string } | { stderr: string } | { exit: number };

// Built code starts dist/cappedWorker.js beside it; from the TypeScript sources (tests, tsx) the
// thread loads cappedWorker.ts through tsx, as WorkerPool does for its workers.
const fromSources = import.meta.url.endsWith('.ts');
const entry = new URL(fromSources ? './cappedWorker.ts' : './cappedWorker.js', import.meta.url);

/** The streams a capped command writes to (the process's own). */
export interface CappedStreams {
  stdout: { write(text: string): unknown; isTTY?: boolean };
  stderr: { write(text: string): unknown; isTTY?: boolean };
}

/**
 * Runs the command `argv` on a worker thread whose JavaScript heap is capped at `limits` (V8 takes a
 * heap limit only when an isolate starts, and a worker thread is one), passing SIGINT and SIGTERM on,
 * and resolves with its exit code. The thread is part of this process: if the process is killed, it
 * ends with it, so nothing can go on to write an output after that. Should the heap run out all the
 * same, the thread is stopped and the command fails with exit 1 and a message saying so.
 * @example process.exitCode = await runCapped(['build', 'big.txt', '-o', 'lex.json', '--memory-limit', '256'], { oldMiB: 200, youngMiB: 16 }, process);
 */
export function runCapped(argv: readonly string[], limits: HeapLimits, streams: CappedStreams): Promise<number> {
  const setup: CappedSetup = { argv, stdoutTTY: streams.stdout.isTTY === true, stderrTTY: streams.stderr.isTTY === true };
  const resourceLimits = { maxOldGenerationSizeMb: limits.oldMiB, maxYoungGenerationSizeMb: limits.youngMiB };
  const worker = fromSources
    ? new Worker(`import('tsx/esm/api').then((m) => m.tsImport(${JSON.stringify(entry.href)}, ${JSON.stringify(import.meta.url)}))`, { eval: true, workerData: setup, resourceLimits })
    : new Worker(entry, { workerData: setup, resourceLimits });
  const pass = (signal: 'SIGINT' | 'SIGTERM') => worker.postMessage({ stop: signal });
  const onInt = () => pass('SIGINT');
  const onTerm = () => pass('SIGTERM');
  process.on('SIGINT', onInt);
  process.on('SIGTERM', onTerm);
  return new Promise((resolve) => {
    let code: number | null = null;
    let failure: Error | null = null;
    worker.on('message', (m: CappedMessage) => {
      if ('stdout' in m) streams.stdout.write(m.stdout);
      else if ('stderr' in m) streams.stderr.write(m.stderr);
      else code = m.exit;
    });
    worker.on('error', (e) => (failure = e));
    worker.on('exit', () => {
      process.off('SIGINT', onInt);
      process.off('SIGTERM', onTerm);
      if (code !== null) return resolve(code);
      const command = argv[0] ?? 'lexlock';
      const outOfMemory = (failure as { code?: string } | null)?.code === 'ERR_WORKER_OUT_OF_MEMORY';
      streams.stderr.write(
        outOfMemory
          ? `lexlock ${command}: ran out of the memory --memory-limit allows, although it planned to stay within it (outputs are as they were, or complete). This is a bug in lexlock; please report it with the command you ran, and try a larger --memory-limit meanwhile.\n`
          : `lexlock ${command}: unexpected error: ${failure?.message ?? 'the counting thread stopped without an exit code'}\nThis is a bug in lexlock; please report it with the command you ran.\n`,
      );
      resolve(1);
    });
  });
}
