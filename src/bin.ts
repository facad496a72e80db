#!/usr/bin/env node
// The `lexlock` executable: hands argv and the process streams to the CLI and exits with its code.
import { run } from './cli.js';

// A closed pipe (`lexlock audit … | head`) is not an error: stop quietly, as other command-line tools do.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw e;
  });
}

process.exitCode = await run(process.argv.slice(2), { stdout: process.stdout, stderr: process.stderr, env: process.env });
