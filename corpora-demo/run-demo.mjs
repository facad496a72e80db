// The demo: builds a lexicon from the invented ferry-operator messages, encodes them into .npy
// files ready for training, and verifies the lexicon, all through the lexlock CLI.
// Run with `npm run demo` (after `npm ci`; it builds dist/ first).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join, relative } from 'node:path';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const built = join(root, 'dist', 'node.js');
if (!existsSync(built)) {
  console.error('dist/ is missing: run `npm run build` first (npm run demo does).');
  process.exit(1);
}
const { run } = await import(built);
const at = (p) => relative(process.cwd(), join(root, p)) || '.';
const io = { stdout: process.stdout, stderr: process.stderr, env: process.env };

const corpus = at('corpora-demo/ferry-messages.csv');
const lexicon = at('demo-out/ferry-lexicon.json');
const heldOut = at('corpora-demo/ferry-messages.jsonl');
const encoded = at('demo-out/ferry-encoded');
const steps = [
  // 2,000 tokens of about 4,000 distinct; rows of 64 ids (p95 of the lengths is 57), zeros in front.
  ['build', corpus, '-o', lexicon, '--label', 'topic', '--cap', '2000', '--length', '64', '--pad', 'start', '--force'],
  // Keys from the id column; 80/10/10 by a hash of each key, so a message keeps its split as the corpus grows.
  ['encode', corpus, '--lexicon', lexicon, '-o', encoded, '--key', 'id', '--split', 'train=0.8,valid=0.1,test=0.1', '--force'],
  // Messages the lexicon never saw: their OOV rate is the one to watch after launch.
  ['encode', heldOut, '--lexicon', lexicon, '-o', at('demo-out/held-out.jsonl'), '--force'],
  ['verify', lexicon],
];
for (const argv of steps) {
  console.log(`\n$ lexlock ${argv.join(' ')}`);
  const code = await run(argv, io);
  if (code !== 0) process.exit(code);
}
console.log(`\nDone: ${encoded}/train, valid and test each hold ids.npy, lengths.npy, labels.npy and keys.jsonl, ready for a training script.`);
