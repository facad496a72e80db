// Preloaded into a lexlock process by tests (node --import): when it exits, appends "<pid> <peak RSS
// in KiB>" to the file named by LEXLOCK_TEST_PEAK_RSS. process.resourceUsage().maxRSS is the whole
// process's peak resident set (getrusage(2) RUSAGE_SELF: every thread, worker threads included), so
// only the main thread reports it (a preload runs in worker threads too).
import { appendFileSync } from 'node:fs';
import { isMainThread } from 'node:worker_threads';

const file = process.env.LEXLOCK_TEST_PEAK_RSS;
if (file && isMainThread) process.on('exit', () => appendFileSync(file, `${process.pid} ${process.resourceUsage().maxRSS}\n`));
