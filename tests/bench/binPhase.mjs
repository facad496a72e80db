// Runs the built `lexlock` executable in this process exactly as `node dist/bin.js <args>` would (no
// TypeScript loader, so the memory is lexlock's own), then prints one JSON line: seconds from loading
// the executable to exit, peak RSS in KiB and the exit code. Plain JavaScript on purpose.
// usage: node tests/bench/binPhase.mjs <path of dist/bin.js> <lexlock arguments...>
import { writeSync } from 'node:fs';
import { pathToFileURL } from 'node:url';

const [bin, ...args] = process.argv.slice(2);
if (bin === undefined) throw new Error('usage: node tests/bench/binPhase.mjs <dist/bin.js> <arguments...>');
process.argv = [process.argv[0], bin, ...args];
const start = process.hrtime.bigint();
process.on('exit', (code) => {
  const seconds = Number(process.hrtime.bigint() - start) / 1e9;
  writeSync(1, `${JSON.stringify({ seconds, maxRssKiB: process.resourceUsage().maxRSS, code })}\n`);
});
await import(pathToFileURL(bin).href);
