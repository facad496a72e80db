import { readdir, readFile, writeFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import { loadTally } from '../../src/files/loadTally.js';
import { tallyFileMerge } from '../../src/tally/tallyFileMerge.js';
import { tallyFileText } from '../../src/tally/tallyFileText.js';
import { cli, freshFolderEachTest } from '../helpers/cli.js';
import { letters } from '../helpers/generatedCorpora.js';

const FERRY = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'corpora-demo', 'ferry-messages.csv');

const tmp = freshFolderEachTest();

/** Splits CSV text into its header and records (a record ends at a newline outside quotes). */
function csvRecords(text: string): { header: string; records: string[] } {
  const lines = text.split('\n');
  const header = lines.shift() as string;
  const records: string[] = [];
  let open = '';
  for (const line of lines) {
    open = open === '' ? line : `${open}\n${line}`;
    if ((open.split('"').length - 1) % 2 === 0) {
      if (open !== '') records.push(open);
      open = '';
    }
  }
  return { header, records };
}

async function ok(...argv: string[]): Promise<string> {
  const r = await cli(...argv);
  expect([r.code, r.stderr]).toEqual([0, '']);
  return r.stdout;
}

const read = (name: string) => readFile(tmp.path(name), 'utf8');

describe('lexlock merge', () => {
  it('builds from 3 merged shards of the ferry corpus the lexicon of the whole: same fingerprint and encoding', async () => {
    const { header, records } = csvRecords(await readFile(FERRY, 'utf8'));
    const third = Math.ceil(records.length / 3);
    for (let i = 0; i < 3; i++) {
      await writeFile(tmp.path(`part-${i}.csv`), `${header}\n${records.slice(i * third, (i + 1) * third).join('\n')}\n`);
      await ok('tally', tmp.path(`part-${i}.csv`), '-o', tmp.path(`part-${i}.tally`), '--label', 'topic', '--collapse', 'number');
    }
    await ok('merge', tmp.path('part-0.tally'), tmp.path('part-1.tally'), tmp.path('part-2.tally'), '-o', tmp.path('all.tally'));
    const shape = ['--cap', '500', '--length', '40', '--pad', 'start', '--min-count', '2'];
    await ok('build', tmp.path('all.tally'), '-o', tmp.path('shards.json'), ...shape);
    await ok('build', FERRY, '-o', tmp.path('whole.json'), '--label', 'topic', '--collapse', 'number', ...shape);
    const shards = parseLexicon(await read('shards.json'));
    const whole = parseLexicon(await read('whole.json'));
    expect(whole.fit?.documents).toBe(records.length);
    expect(shards.fingerprint).toBe(whole.fingerprint);
    expect(shards.encoding).toEqual(whole.encoding);
    // The fit differs only in where and when it was made.
    const { createdAt: _a, source: sourceShards, ...fitShards } = shards.fit ?? { createdAt: '', source: null };
    const { createdAt: _b, source: sourceWhole, ...fitWhole } = whole.fit ?? { createdAt: '', source: null };
    expect(fitShards).toEqual(fitWhole);
    // Only the last segment of each path is recorded, never the folders of the machine.
    expect([sourceShards, sourceWhole]).toEqual(['all.tally', 'ferry-messages.csv']);
    // No corpus document is kept as a canary, whether built from the corpus or from its tallies.
    expect(shards.canaries).toEqual(whole.canaries);
  });

  it('is commutative and associative down to the bytes', async () => {
    await writeFile(tmp.path('a.txt'), 'the ferry\nlate again\n');
    await writeFile(tmp.path('b.txt'), 'the late ferry\n__proto__ constructor\n');
    await writeFile(tmp.path('c.txt'), 'again and again\n');
    for (const p of ['a', 'b', 'c']) await ok('tally', tmp.path(`${p}.txt`), '-o', tmp.path(`${p}.tally`));
    await ok('merge', tmp.path('a.tally'), tmp.path('b.tally'), '-o', tmp.path('ab.tally'));
    await ok('merge', tmp.path('b.tally'), tmp.path('a.tally'), '-o', tmp.path('ba.tally'));
    await ok('merge', tmp.path('b.tally'), tmp.path('c.tally'), '-o', tmp.path('bc.tally'));
    await ok('merge', tmp.path('ab.tally'), tmp.path('c.tally'), '-o', tmp.path('ab-c.tally'));
    await ok('merge', tmp.path('a.tally'), tmp.path('bc.tally'), '-o', tmp.path('a-bc.tally'));
    await ok('merge', tmp.path('c.tally'), tmp.path('a.tally'), tmp.path('b.tally'), '-o', tmp.path('cab.tally'));
    expect(await read('ba.tally')).toBe(await read('ab.tally'));
    expect(await read('a-bc.tally')).toBe(await read('ab-c.tally'));
    expect(await read('cab.tally')).toBe(await read('ab-c.tally'));
    const all = JSON.parse(await read('cab.tally')) as { documents: number; counts: unknown[] };
    expect(all.documents).toBe(5);
    // Hand-counted. wink-tokenizer splits __proto__ into _ _ proto _ _; constructor stays one token.
    expect(all.counts).toEqual([['_', 4, 1], ['again', 3, 2], ['and', 1, 1], ['constructor', 1, 1], ['ferry', 2, 2], ['late', 2, 2], ['proto', 1, 1], ['the', 2, 2]]);
  });

  it('writes the bytes of the in-memory merge for parts read in many 64 KiB pieces, characters of 2 to 4 bytes split between reads', async () => {
    // Mostly 2-byte letters (Greek), some 3- and 4-byte ones: a 64 KiB read ends inside a character.
    const greek = (n: number) => [...letters(n)].map((c) => String.fromCharCode(0x3b1 + c.charCodeAt(0) - 97)).join('');
    const words = ['μεγάλοπλοίο', '東京', 'πορθμείο😀', 'καθυστέρηση', 'ωμέγα', 'εισιτήριο'];
    for (const [p, offset] of [['a', 0], ['b', 7]] as const) {
      const lines = Array.from({ length: 6000 }, (_, i) => `${words[(i + offset) % words.length]}${greek(i % 4001)} ${greek((i * 7 + offset) % 3011)}${words[i % 5]}`);
      await writeFile(tmp.path(`${p}.txt`), `${lines.join('\n')}\n`);
      await ok('tally', tmp.path(`${p}.txt`), '-o', tmp.path(`${p}.tally`));
    }
    expect((await readFile(tmp.path('a.tally'))).length).toBeGreaterThan(3 * 65536);
    await ok('merge', tmp.path('a.tally'), tmp.path('b.tally'), '-o', tmp.path('all.tally'));
    const inMemory = tallyFileText(tallyFileMerge([{ name: 'a', file: await loadTally(tmp.path('a.tally')) }, { name: 'b', file: await loadTally(tmp.path('b.tally')) }]));
    expect(await read('all.tally')).toBe(inMemory);
  });

  it('exits 1 naming both files and the rule when the parts were counted under different rules', async () => {
    await writeFile(tmp.path('a.txt'), 'one two\n');
    await ok('tally', tmp.path('a.txt'), '-o', tmp.path('a.tally'));
    await ok('tally', tmp.path('a.txt'), '-o', tmp.path('b.tally'));
    await ok('tally', tmp.path('a.txt'), '-o', tmp.path('c.tally'), '--unicode', 'NFC');
    const r = await cli('merge', tmp.path('a.tally'), tmp.path('b.tally'), tmp.path('c.tally'), '-o', tmp.path('all.tally'));
    expect([r.code, r.stderr]).toEqual([
      1,
      `lexlock merge: ${tmp.path('a.tally')} and ${tmp.path('c.tally')} were counted under different rules (unicode: "NFKC" in ${tmp.path('a.tally')}, "NFC" in ${tmp.path('c.tally')}); count every part with the same --unicode\n`,
    ]);
    await expect(readFile(tmp.path('all.tally'))).rejects.toThrow(/ENOENT/);
  });

  it('exits 1 naming the file and line of a part cut short, and leaves no output and no temporary file', async () => {
    await writeFile(tmp.path('a.txt'), 'one two\nthree\n');
    await ok('tally', tmp.path('a.txt'), '-o', tmp.path('a.tally'));
    await ok('tally', tmp.path('a.txt'), '-o', tmp.path('b.tally'));
    const lines = (await read('b.tally')).split('\n');
    const cut = lines.indexOf('  "counts": [') + 2; // the line of the first count
    await writeFile(tmp.path('b.tally'), `${lines.slice(0, cut).join('\n')}\n`);
    const r = await cli('merge', tmp.path('a.tally'), tmp.path('b.tally'), '-o', tmp.path('all.tally'));
    expect([r.code, r.stderr]).toEqual([
      1,
      `lexlock merge: ${tmp.path('b.tally')} line ${cut}: the file ends after this line, before "counts" and the file are closed (was it cut short?); count the part again with lexlock tally\n`,
    ]);
    expect((await readdir(tmp.dir)).sort()).toEqual(['a.tally', 'a.txt', 'b.tally']);
  });

  it('exits 1 on a part that does not exist, in the words loadTally uses', async () => {
    await writeFile(tmp.path('a.txt'), 'one two\n');
    await ok('tally', tmp.path('a.txt'), '-o', tmp.path('a.tally'));
    const r = await cli('merge', tmp.path('a.tally'), tmp.path('none.tally'), '-o', tmp.path('all.tally'));
    expect([r.code, r.stderr]).toEqual([1, `lexlock merge: ${tmp.path('none.tally')}: cannot read the tally (no such file); pass the path of a file written by lexlock tally or lexlock merge\n`]);
    expect((await readdir(tmp.dir)).sort()).toEqual(['a.tally', 'a.txt']);
  });

  it('refuses to overwrite without --force', async () => {
    await writeFile(tmp.path('a.txt'), 'one two\n');
    await ok('tally', tmp.path('a.txt'), '-o', tmp.path('a.tally'));
    await writeFile(tmp.path('all.tally'), 'old');
    const r = await cli('merge', tmp.path('a.tally'), '-o', tmp.path('all.tally'));
    expect([r.code, r.stderr]).toEqual([1, `lexlock merge: ${tmp.path('all.tally')} already exists; pass --force to overwrite it\n`]);
    await ok('merge', tmp.path('a.tally'), '-o', tmp.path('all.tally'), '--force');
    expect(await read('all.tally')).toBe(await read('a.tally'));
  });

  it.each([
    [['-o', 'all.tally'], 'lexlock merge: expected <part.tally>..., got none; see lexlock merge --help\n'],
    [['a.tally'], 'lexlock merge: -o/--output is required: where should the merged tally go?\n'],
    [['a.tally', '-o', 'all.json'], 'lexlock merge: --output: "all.json" must end in .tally, so lexlock build knows it for a tally\n'],
    [['a.tally', 'a.tally', '-o', 'all.tally'], 'lexlock merge: a.tally is named twice; name each part once, or its counts would be added twice\n'],
  ])('exits 2 for %j', async (argv, message) => {
    const r = await cli('merge', ...argv);
    expect([r.code, r.stderr]).toEqual([2, message]);
  });

  it('exits 1 on an input that is a lexicon, not a tally', async () => {
    await writeFile(tmp.path('a.txt'), 'one two\n');
    await ok('build', tmp.path('a.txt'), '-o', tmp.path('lex.json'));
    const r = await cli('merge', tmp.path('lex.json'), '-o', tmp.path('all.tally'));
    expect([r.code, r.stderr]).toEqual([1, `lexlock merge: ${tmp.path('lex.json')}: not a lexlock tally (no "format": "lexlock.tally" member); pass a file written by lexlock tally or lexlock merge\n`]);
  });
});
