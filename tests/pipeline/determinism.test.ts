// Determinism (issue 6): the same documents in any order, split into any shards, counted on any number
// of threads, give the same lexicon: the same fingerprint and the same file bytes apart from the fit's
// `createdAt` timestamp. Checked on the demo corpus and on generated corpora (fast-check), through the
// library, through tally files (the shard route), and through the command line.
import { readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { serializeLexicon } from '../../src/artifact/serializeLexicon.js';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { tallyCorpus } from '../../src/pipeline/tallyCorpus.js';
import { resolveRules, type TextRules } from '../../src/rules/TextRules.js';
import type { LabelledText } from '../../src/tally/Tally.js';
import { tallyFileMerge } from '../../src/tally/tallyFileMerge.js';
import { tallyFileParse } from '../../src/tally/tallyFileParse.js';
import { tallyFileText } from '../../src/tally/tallyFileText.js';
import { adversarialText } from '../rules/fast/adversarialText.js';
import { cli, freshFolderEachTest } from '../helpers/cli.js';

const NOW = new Date('2026-12-02T00:00:00Z');
const demo: LabelledText[] = [];
for await (const doc of readCorpus(join(import.meta.dirname, '../../corpora-demo/ferry-messages.csv'))) demo.push({ text: doc.text, label: doc.label ?? '' });

/** The lexicon file of `docs` cut into `cuts` shards, each counted on `threads`, merged through tally files. */
async function lexiconText(docs: readonly LabelledText[], cuts: readonly number[], threads: number, rules: TextRules): Promise<string> {
  const bounds = [0, ...[...cuts].sort((a, b) => a - b), docs.length];
  const files = [];
  for (let s = 0; s + 1 < bounds.length; s++) {
    const { tally, snippets } = await tallyCorpus(docs.slice(bounds[s], bounds[s + 1]), rules, { threads });
    // Through the file's text, as `lexlock tally` then `lexlock merge` would.
    files.push({ name: `shard ${s}`, file: tallyFileParse(tallyFileText({ tally, snippets, fields: { text: 'text', label: 'label' } })) });
  }
  const merged = tallyFileMerge(files);
  return serializeLexicon(freeze(merged.tally, { cap: 500, snippets: merged.snippets, shape: { length: 40, pad: 'start', cut: 'end' }, now: NOW }));
}

/** `docs` in the order `order` gives (a permutation of their indexes). */
function reordered<T>(docs: readonly T[], order: readonly number[]): T[] {
  return order.map((i) => docs[i] as T);
}

const permutation = (n: number) => fc.shuffledSubarray([...Array(n).keys()], { minLength: n, maxLength: n });

describe('the same documents give the same lexicon in any order, shards and thread count', () => {
  it('the demo corpus: reversed, shuffled, in 1 to 5 shards, on 1 to 3 threads', async () => {
    const rules = resolveRules();
    const whole = await lexiconText(demo, [], 1, rules);
    expect(JSON.parse(whole).fit.documents).toBe(demo.length);
    const cases: [string, LabelledText[], number[], number][] = [
      ['reversed, one shard, 2 threads', [...demo].reverse(), [], 2],
      ['shuffled, 5 shards, 1 thread', reordered(demo, fc.sample(permutation(demo.length), { numRuns: 1, seed: 5 })[0] ?? []), [1, 700, 701, 2_500], 1],
      ['shuffled again, 2 shards, 3 threads', reordered(demo, fc.sample(permutation(demo.length), { numRuns: 1, seed: 9 })[0] ?? []), [1_999], 3],
    ];
    for (const [name, docs, cuts, threads] of cases) {
      expect(docs.length, name).toBe(demo.length);
      expect(await lexiconText(docs, cuts, threads, rules), name).toBe(whole);
    }
  });

  it('generated corpora (fast-check): any order and any shards, under several rule sets', async () => {
    const doc = fc.record({ text: adversarialText, label: fc.constantFrom('delays', 'refunds', 'praise', '') });
    const ruleSets = [resolveRules(), resolveRules({ case: 'keep', collapse: ['number'], drop: ['punctuation'] }), resolveRules({ level: 'char' })];
    await fc.assert(
      fc.asyncProperty(
        fc.array(doc, { minLength: 1, maxLength: 40 }).chain((docs) => fc.tuple(fc.constant(docs), permutation(docs.length), fc.array(fc.nat(docs.length), { maxLength: 4 }))),
        fc.constantFrom(...ruleSets),
        async ([docs, order, cuts], rules) => {
          expect(await lexiconText(reordered(docs, order), cuts, 1, rules)).toBe(await lexiconText(docs, [], 1, rules));
        },
      ),
      { numRuns: 60 },
    );
  });
});

describe('lexlock build: same bytes from shuffled files and any --threads, apart from createdAt', () => {
  const folder = freshFolderEachTest();

  it('builds the demo documents and a shuffled copy of them to the same lexicon', async () => {
    // Written as JSONL, one document a line, so shuffling lines shuffles documents.
    const lines = demo.map((doc) => JSON.stringify(doc));
    const order = fc.sample(permutation(lines.length), { numRuns: 1, seed: 3 })[0] ?? [];
    await writeFile(folder.path('a.jsonl'), `${lines.join('\n')}\n`);
    await writeFile(folder.path('b.jsonl'), `${reordered(lines, order).join('\n')}\n`);
    expect(await readFile(folder.path('b.jsonl'), 'utf8')).not.toBe(await readFile(folder.path('a.jsonl'), 'utf8'));
    const texts: string[] = [];
    for (const [input, threads] of [['a.jsonl', '1'], ['b.jsonl', '2'], ['b.jsonl', '3']] as const) {
      const out = folder.path(`${input}.${threads}.lexicon.json`);
      const result = await cli('build', folder.path(input), '--label', 'label', '--cap', '2000', '--length', '64', '--threads', threads, '-o', out, '--quiet');
      expect(result.stderr).toBe('');
      expect(result.code).toBe(0);
      // The fit names its source file; both files have the same documents, under different names.
      texts.push((await readFile(out, 'utf8')).replace(/"createdAt": *"[^"]*"/, '"createdAt": ""').replace(/"source": *"[^"]*"/, '"source": ""'));
    }
    expect(texts[1]).toBe(texts[0]);
    expect(texts[2]).toBe(texts[0]);
    expect(JSON.parse(texts[0] as string).fit.documents).toBe(demo.length);
  });
});
