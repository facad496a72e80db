#!/usr/bin/env node
// The `lexlock` executable: hands argv and the process streams to the CLI and exits with its code.
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { run } from './cli.js';
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
  for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => child.kill(signal));
  child.on('exit', (code, signal) => {
    process.exitCode = code ?? (signal === 'SIGINT' ? 130 : 1);
  });
} else {
  limitHeapGrowth();
  process.exitCode = await run(argv, { stdout: process.stdout, stderr: process.stderr, env: process.env });
}
