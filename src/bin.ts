#!/usr/bin/env node
// The `lexlock` executable: hands argv and the process streams to the CLI and exits with its code.
import { heapLimitFor } from './heapLimitFor.js';
import { limitHeapGrowth } from './limitHeapGrowth.js';

// A closed pipe (`lexlock audit … | head`) is not an error: stop quietly, as other command-line tools do.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw e;
  });
}

const argv = process.argv.slice(2);
limitHeapGrowth();
const heapLimits = heapLimitFor(argv);
if (heapLimits !== null) {
  // `--memory-limit` must bound the heap too, and V8 takes a limit only when a heap is made: the command
  // runs on a worker thread of its own, made with that limit (and ends with this process, whatever kills it).
  const { runCapped } = await import('./runCapped.js');
  process.exitCode = await runCapped(argv, heapLimits, process);
} else {
  const { EXIT, interruptedLine, run } = await import('./cli.js');
  const { removeOpenTemps } = await import('./files/openTemps.js');
  // Ctrl-C (SIGINT) or SIGTERM: remove this run's temporary files, say which outputs were left as they
  // were, and exit 130 or 143. Kept listening after the first, so a second signal (a terminal sends
  // one to the whole process group) cannot kill the process halfway through cleaning up.
  let stopping = false;
  const stop = (signal: 'SIGINT' | 'SIGTERM', code: number) => {
    if (stopping) return;
    stopping = true;
    // Locks and staged folders are on the same list; outputs already put in place are named as written.
    const { destinations, failed, written } = removeOpenTemps();
    const clear = process.stderr.isTTY ? '\r\x1b[K' : ''; // over a progress line, if one is drawn
    process.stderr.write(clear + interruptedLine(signal, destinations, failed.map((f) => `${f.path} (${f.reason})`), written));
    process.exit(code);
  };
  process.on('SIGINT', () => stop('SIGINT', EXIT.interrupted));
  process.on('SIGTERM', () => stop('SIGTERM', EXIT.terminated));
  process.exitCode = await run(argv, { stdout: process.stdout, stderr: process.stderr, env: process.env });
}
