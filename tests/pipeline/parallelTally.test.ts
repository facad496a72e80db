import { spawnSync } from 'node:child_process';
import { chmod, cp, mkdir, readdir, readFile, writeFile } from 'node:fs/promises';
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import type { Lexicon } from '../../src/lexicon/Lexicon.js';
import { writeZipfCorpus } from '../helpers/generatedCorpora.js';
import { cli, freshFolderEachTest } from '../helpers/cli.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const FERRY = join(root, 'corpora-demo', 'ferry-messages.csv');
const FERRY_FOLDER = join(root, 'corpora-demo', 'ferry-folder');
const README = join(root, 'README.md');

/** GNU parallel (Debian package `parallel`): `.ci/run` installs it; elsewhere this file is skipped. */
const PARALLEL = '/usr/bin/parallel';
const hasParallel = existsSync(PARALLEL);

// The commands as README "Many machines" shows them, run by bash in the parts' folder with `lexlock`
// (the built dist/bin.js) on PATH; the test checks README still shows each one.
const SPLIT_CSV = `awk -v parts=8 'NR == 1 { for (i = 0; i < parts; i++) print > ("part-" i ".csv"); next } !open { n++ } { print > ("part-" (n % parts) ".csv"); if (gsub(/"/, "\\"") % 2) open = !open }' messages.csv`;
const SPLIT_TXT = 'split -n l/8 -d --additional-suffix=.txt messages.txt part-';
const TALLY_CSV = 'parallel -j 2 --will-cite lexlock tally {} -o {.}.tally --label topic --collapse number --quiet ::: part-*.csv';
const TALLY_TXT = 'parallel -j 2 --will-cite lexlock tally {} -o {.}.tally --quiet ::: part-*.txt';
const SPLIT_FOLDER = `find messages -type f | sort | awk '{ print NR % 8, $0 }' | while read -r n f; do mkdir -p "part-$n/\${f%/*}" && ln "$f" "part-$n/$f"; done`;
const TALLY_FOLDER = 'parallel -j 2 --will-cite lexlock tally {}/messages -o {}.tally --quiet ::: part-?';
const MERGE = 'lexlock merge part-*.tally -o all.tally';

const tmp = freshFolderEachTest();

/** Runs a shell command in `dir` with `lexlock` on PATH; returns its stdout, failing the test on a non-zero exit. */
function sh(dir: string, command: string): string {
  const r = spawnSync('bash', ['-c', command], { cwd: dir, encoding: 'utf8', env: { ...process.env, PATH: `${join(dir, '.bin')}:${process.env.PATH ?? ''}` } });
  expect({ command, status: r.status, stderr: r.stderr }).toEqual({ command, status: 0, stderr: '' });
  return r.stdout;
}

/** A folder holding the file or folder `corpus` as `name` and a `lexlock` on PATH that starts the built CLI. */
async function workFolder(corpus: string | null, name: string): Promise<string> {
  const dir = tmp.path('work');
  await mkdir(join(dir, '.bin'), { recursive: true });
  await writeFile(join(dir, '.bin', 'lexlock'), `#!/bin/sh\nexec "${process.execPath}" "${join(root, 'dist', 'bin.js')}" "$@"\n`);
  await chmod(join(dir, '.bin', 'lexlock'), 0o755);
  if (corpus !== null) await cp(corpus, join(dir, name), { recursive: true });
  return dir;
}

const lexicon = async (path: string): Promise<Lexicon> => parseLexicon(await readFile(path, 'utf8'));

/**
 * Builds from the merged tally and from the whole corpus, and checks what README "Counting in shards"
 * promises: the same fingerprint and encoding (tokens, layout, rules, labels), and a fit that differs
 * only in `source` and `createdAt`. The merged tally is also byte for byte the tally of the whole.
 */
async function sameAsWhole(dir: string, whole: string, flags: readonly string[], shape: readonly string[]): Promise<void> {
  // In this process (no Node start-up each): the built CLI's part is done.
  const at = (name: string) => join(dir, name);
  for (const argv of [
    ['build', at('all.tally'), '-o', at('parts.json'), ...shape],
    ['build', at(whole), '-o', at('whole.json'), ...flags, ...shape],
    ['tally', at(whole), '-o', at('whole.tally'), ...flags],
  ]) {
    const r = await cli(...argv);
    expect([argv, r.code, r.stderr]).toEqual([argv, 0, '']);
  }
  expect(await readFile(at('all.tally'), 'utf8')).toBe(await readFile(at('whole.tally'), 'utf8'));
  const parts = await lexicon(join(dir, 'parts.json'));
  const wholeLexicon = await lexicon(join(dir, 'whole.json'));
  expect(parts.fingerprint).toBe(wholeLexicon.fingerprint);
  expect(parts.encoding).toEqual(wholeLexicon.encoding);
  const { createdAt: _a, source: sourceParts, ...fitParts } = parts.fit ?? { createdAt: '', source: null };
  const { createdAt: _b, source: sourceWhole, ...fitWhole } = wholeLexicon.fit ?? { createdAt: '', source: null };
  expect(fitParts).toEqual(fitWhole);
  expect([sourceParts, sourceWhole]).toEqual(['all.tally', whole]);
}

describe.skipIf(!hasParallel)(`a corpus counted in 8 parts through GNU parallel (skipped where ${PARALLEL} is missing: apt-get install parallel)`, () => {
  it('README "Many machines" shows the commands this test runs', async () => {
    const readme = await readFile(README, 'utf8');
    for (const command of [SPLIT_CSV, SPLIT_TXT, SPLIT_FOLDER, TALLY_CSV, MERGE]) expect(readme.includes(command), command).toBe(true);
  });

  it('the demo corpus, split by records with its header in each part: merged, it builds the lexicon of the whole', async () => {
    const dir = await workFolder(FERRY, 'messages.csv');
    sh(dir, SPLIT_CSV);
    const parts = (await readdir(dir)).filter((f) => /^part-\d\.csv$/.test(f)).sort();
    expect(parts).toEqual(['part-0.csv', 'part-1.csv', 'part-2.csv', 'part-3.csv', 'part-4.csv', 'part-5.csv', 'part-6.csv', 'part-7.csv']);
    for (const p of parts) expect((await readFile(join(dir, p), 'utf8')).split('\n')[0]).toBe('id,text,topic,sentiment');
    sh(dir, TALLY_CSV);
    expect(sh(dir, MERGE)).toContain('4,000 documents');
    await sameAsWhole(dir, 'messages.csv', ['--label', 'topic', '--collapse', 'number'], ['--cap', '500', '--length', '40', '--pad', 'start']);
    const labels = (await lexicon(join(dir, 'parts.json'))).encoding.labels;
    expect(labels?.length).toBe(8);
  });

  it('a generated Zipf corpus split by lines: merged, it builds the lexicon of the whole', async () => {
    const dir = await workFolder(null, 'messages.txt');
    await writeZipfCorpus(join(dir, 'messages.txt'), 4000, 20000, 17);
    sh(dir, SPLIT_TXT);
    const parts = (await readdir(dir)).filter((f) => /^part-\d+\.txt$/.test(f)).sort();
    expect(parts).toEqual(['part-00.txt', 'part-01.txt', 'part-02.txt', 'part-03.txt', 'part-04.txt', 'part-05.txt', 'part-06.txt', 'part-07.txt']);
    sh(dir, TALLY_TXT);
    expect(sh(dir, MERGE)).toContain('4,000 documents, 48,000 tokens');
    await sameAsWhole(dir, 'messages.txt', [], ['--cap', '2000', '--length', '16', '--pad', 'end']);
  });

  it('the demo folder corpus, its files dealt out into 8 folders that keep their label folders: merged, it builds the lexicon of the whole', async () => {
    const dir = await workFolder(FERRY_FOLDER, 'messages');
    sh(dir, SPLIT_FOLDER);
    const parts = (await readdir(dir)).filter((f) => f.startsWith('part-')).sort();
    expect(parts).toEqual(['part-0', 'part-1', 'part-2', 'part-3', 'part-4', 'part-5', 'part-6', 'part-7']);
    sh(dir, TALLY_FOLDER);
    expect(sh(dir, MERGE)).toContain('150 documents');
    await sameAsWhole(dir, 'messages', [], ['--cap', '300', '--length', '24', '--pad', 'start']);
  });
});
