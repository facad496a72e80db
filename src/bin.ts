#!/usr/bin/env node
// The `lexlock` executable: hands argv and the process streams to the CLI and exits with its code.
import { spawn } from 'node:child_process';
import { constants } from 'node:os';
import { fileURLToPath } from 'node:url';
import { EXIT, interruptedLine, run, type StopSignal } from './cli.js';
import { removeOpenTemps } from './files/openTemps.js';
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
const heapLimit = heapLimitFor(argv);
if (heapLimit !== null && !process.execArgv.some((a) => a.startsWith('--max-old-space-size'))) {
  // `--memory-limit` must bound the heap too, and V8 takes that limit only at start: run again with it.
  const child = spawn(process.execPath, [...process.execArgv, `--max-old-space-size=${heapLimit}`, fileURLToPath(import.meta.url), ...argv], { stdio: 'inherit' });
  // The child cleans up, prints the line and exits 130 or 143; this process passes the signal on and
  // then the child's code (a child killed outright by a signal: 128 + its number, as shells report it).
  for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => child.kill(signal));
  child.on('exit', (code, signal) => {
    process.exitCode = code ?? (signal === null ? EXIT.badInput : 128 + constants.signals[signal]);
  });
} else {
  // Ctrl-C (SIGINT) or SIGTERM: remove this run's temporary files, say which outputs were left as they
  // were, and exit 130 or 143. Kept listening after the first, so a second signal (a terminal sends
  // one to the whole process group, and a --memory-limit parent passes its own on) cannot kill the
  // process halfway through cleaning up.
  let stopping = false;
  const stop = (signal: StopSignal, code: number) => {
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
  limitHeapGrowth();
  process.exitCode = await run(argv, { stdout: process.stdout, stderr: process.stderr, env: process.env });
}
