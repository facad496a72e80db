import { readdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { writeEncodedFolder } from '../../src/pipeline/writeEncoded.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { saveLexicon } from '../../src/files/saveLexicon.js';
import { caughtError } from '../helpers/caughtError.js';
import { cli, freshFolderEachTest } from '../helpers/cli.js';

// The library's writer of encoded folders is the CLI's (issue 14, point 5): same bytes, keys and splits.
const demo = new URL('../../corpora-demo/ferry-messages.csv', import.meta.url).pathname;
const tmp = freshFolderEachTest();

/** Every file below `dir` with its bytes, as sorted `path base64` lines. */
async function listing(dir: string, prefix = ''): Promise<string[]> {
  const out: string[] = [];
  for (const entry of await readdir(dir, { withFileTypes: true })) {
    if (entry.isDirectory()) out.push(...(await listing(join(dir, entry.name), `${prefix}${entry.name}/`)));
    else out.push(`${prefix}${entry.name} ${(await readFile(join(dir, entry.name))).toString('base64')}`);
  }
  return out.sort();
}

describe('writeEncodedFolder', () => {
  it('writes byte for byte what lexlock encode -o writes, splits and keys included', async () => {
    const built = await cli('build', demo, '-o', tmp.path('lex.json'), '--label', 'topic', '--cap', '1500', '--length', '20');
    expect([built.code, built.stderr]).toEqual([0, '']);
    const r = await cli('encode', demo, '--lexicon', tmp.path('lex.json'), '-o', tmp.path('by-cli'), '--key', 'id', '--split', 'train=0.9,test=0.1', '--seed', '3');
    expect([r.code, r.stderr]).toEqual([0, '']);
    const { loadLexicon } = await import('../../src/files/loadLexicon.js');
    const lexicon = await loadLexicon(tmp.path('lex.json'));
    const result = await writeEncodedFolder(readCorpus(demo, { label: 'topic', key: 'id' }), lexicon, tmp.path('by-library'), {
      lexiconPath: tmp.path('lex.json'),
      split: { splits: [{ name: 'train', share: 0.9 }, { name: 'test', share: 0.1 }], seed: 3 },
    });
    expect(result.stats.documents).toBe(4000);
    expect(result.parts.map((p) => [p.name, p.output])).toEqual([
      ['train', join(tmp.path('by-library'), 'train')],
      ['test', join(tmp.path('by-library'), 'test')],
    ]);
    expect(result.parts[0]!.stats.documents + result.parts[1]!.stats.documents).toBe(4000);
    // Same depth, so the manifests' relative lexicon paths are the same too.
    expect(await listing(tmp.path('by-library'))).toEqual(await listing(tmp.path('by-cli')));
  });

  it('keys plain texts by their place from 1; the manifest has no corpus, policy or lexicon file to name', async () => {
    const lexicon = freeze(Tally.fromTexts(['late ferry', 'kind crew'], resolveRules()), { shape: { length: 3, pad: 'end', cut: 'end' } });
    const { stats } = await writeEncodedFolder(['late ferry', { text: 'kind crew', label: 'praise' }, { text: 'lost bag', key: 'x-9' }], lexicon, tmp.path('out'));
    expect(stats.documents).toBe(3);
    expect(await readFile(tmp.path('out/keys.jsonl'), 'utf8')).toBe('"1"\n"2"\n"x-9"\n');
    const manifest = JSON.parse(await readFile(tmp.path('out/manifest.json'), 'utf8'));
    expect([manifest.source, manifest.badText, manifest.keyField, manifest.lexicon.file, manifest.split]).toEqual([null, null, null, null, null]);
    expect((await readdir(tmp.path('out'))).sort()).toEqual(['ids.npy', 'keys.jsonl', 'labels.npy', 'lengths.npy', 'manifest.json']);
  });

  it('names the lexicon relative to the manifest, is refused over an existing folder without force, and replaces it with force', async () => {
    const lexicon = freeze(Tally.fromTexts(['late ferry'], resolveRules()), { shape: { length: 2, pad: 'end', cut: 'end' } });
    await saveLexicon(tmp.path('models/lex.json'), lexicon);
    await writeEncodedFolder(['late'], lexicon, tmp.path('data/enc'), { lexiconPath: tmp.path('models/lex.json') });
    expect(JSON.parse(await readFile(tmp.path('data/enc/manifest.json'), 'utf8')).lexicon.file).toBe('../../models/lex.json');
    const refused = await caughtError(() => writeEncodedFolder(['ferry'], lexicon, tmp.path('data/enc')));
    expect([refused.code, refused.message]).toEqual(['OUTPUT_EXISTS', `${tmp.path('data/enc')} already exists and is not empty; pass --force to write into it`]);
    await writeEncodedFolder(['ferry', 'late'], lexicon, tmp.path('data/enc'), { force: true });
    expect(await readFile(tmp.path('data/enc/keys.jsonl'), 'utf8')).toBe('"1"\n"2"\n');
  });

  it.each([
    ['out.jsonl', 'ends in .jsonl, but this writes a folder; name a folder'],
    ['out.npy', 'ends in .npy, but encoded outputs are a .jsonl file or a folder (of .npy files, a manifest and keys); name a .jsonl file, or a folder without that ending'],
    ['out.JSON', 'ends in .JSON, but encoded outputs are a .jsonl file or a folder (of .npy files, a manifest and keys); name a .jsonl file, or a folder without that ending'],
  ])('refuses the folder name %s (BAD_OPTION), writing nothing', async (name, why) => {
    const lexicon = freeze(Tally.fromTexts(['late'], resolveRules()), { shape: { length: 2, pad: 'end', cut: 'end' } });
    const error = await caughtError(() => writeEncodedFolder(['late'], lexicon, tmp.path(name)));
    expect([error.code, error.message]).toEqual(['BAD_OPTION', `"${tmp.path(name)}" ${why}`]);
    expect(await readdir(tmp.dir)).toEqual([]);
  });

  it('needs a shape: the lexicon\'s or the one given', async () => {
    const lexicon = freeze(Tally.fromTexts(['late'], resolveRules()));
    const error = await caughtError(() => writeEncodedFolder(['late'], lexicon, tmp.path('out')));
    expect([error.code, error.message]).toEqual(['BAD_OPTION', `${tmp.path('out')}: .npy output needs a fixed length, and the lexicon has no shape; pass a shape, or write .jsonl for variable-length rows`]);
    await writeEncodedFolder(['late'], lexicon, tmp.path('out'), { shape: { length: 3, pad: 'start', cut: 'end' } });
    expect(JSON.parse(await readFile(tmp.path('out/manifest.json'), 'utf8')).shape).toEqual({ length: 3, pad: 'start', cut: 'end' });
  });
});
