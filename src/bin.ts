#!/usr/bin/env node
// The `lexlock` executable: hands argv and the process streams to the CLI and exits with its code.
import { run } from './cli.js';

process.exitCode = await run(process.argv.slice(2), { stdout: process.stdout, stderr: process.stderr, env: process.env });
