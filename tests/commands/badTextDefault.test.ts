import { readFile, writeFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { loadLexicon } from '../../src/files/loadLexicon.js';
import { readCorpusFor, lexiconReadDefaults } from '../../src/corpus/readCorpusFor.js';
import { cli } from '../helpers/cli.js';
import { freshFolderEachTest } from '../helpers/tempFolder.js';

// One bad-text policy: the one a lexicon was built with (fit.badText) is what encode, audit and the
// library's readers use unless told otherwise; an explicit --bad-text still wins.
const tmp = freshFolderEachTest();

/** A CSV whose second document has a byte that is never UTF-8 (0xFF) at byte 17 of the file. */
async function corpora(): Promise<void> {
  await writeFile(tmp.path('m.csv'), Buffer.concat([Buffer.from('text,topic\nla'), Buffer.from([0xff]), Buffer.from('te ferry,delays\nlovely crossing,praise\nlate again,delays\n')]));
}

async function jsonl(name: string): Promise<unknown[]> {
  return (await readFile(tmp.path(name), 'utf8')).trim().split('\n').map((l) => JSON.parse(l) as unknown);
}

describe('the bad-text policy a lexicon was built with', () => {
  it('is stored in fit.badText by build (fail by default)', async () => {
    await corpora();
    await writeFile(tmp.path('ok.txt'), 'late ferry\n');
    expect((await cli('build', tmp.path('ok.txt'), '-o', tmp.path('plain.json'))).code).toBe(0);
    expect((await loadLexicon(tmp.path('plain.json'))).fit?.badText).toBe('fail');
    for (const policy of ['replace', 'skip']) {
      expect((await cli('build', tmp.path('m.csv'), '-o', tmp.path(`${policy}.json`), '--label', 'topic', '--bad-text', policy)).code).toBe(0);
      expect((await loadLexicon(tmp.path(`${policy}.json`))).fit?.badText).toBe(policy);
    }
  });

  it('is encode\'s default; --bad-text still wins', async () => {
    await corpora();
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('replace.json'), '--label', 'topic', '--bad-text', 'replace');
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('skip.json'), '--label', 'topic', '--bad-text', 'skip');
    const replaced = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('replace.json'), '-o', tmp.path('r.jsonl'));
    expect([replaced.code, replaced.stderr]).toEqual([0, '']);
    expect(replaced.stdout).toContain('replaced  1 documents had invalid UTF-8 replaced');
    expect(await jsonl('r.jsonl')).toHaveLength(3);
    const skipped = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('skip.json'), '-o', tmp.path('s.jsonl'));
    expect([skipped.code, skipped.stderr]).toEqual([0, '']);
    expect(skipped.stdout).toContain('skipped  1 documents with invalid UTF-8 left out');
    expect(await jsonl('s.jsonl')).toHaveLength(2);
    const failed = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('replace.json'), '-o', tmp.path('f.jsonl'), '--bad-text', 'fail');
    expect([failed.code, failed.stderr]).toEqual([1, `lexlock encode: ${tmp.path('m.csv')} line 2 (row 1): invalid UTF-8 at byte 13; fix the file's encoding or pass --bad-text replace or --bad-text skip\n`]);
  });

  it('is audit\'s default; --bad-text still wins', async () => {
    await corpora();
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('skip.json'), '--label', 'topic', '--bad-text', 'skip');
    const audited = await cli('audit', tmp.path('m.csv'), '--lexicon', tmp.path('skip.json'), '--json');
    expect([audited.code, audited.stderr]).toEqual([0, 'lexlock audit: note: 0 documents had invalid UTF-8 replaced, 1 were skipped\n']);
    expect((JSON.parse(audited.stdout) as { documents: number }).documents).toBe(2);
    const replaced = await cli('audit', tmp.path('m.csv'), '--lexicon', tmp.path('skip.json'), '--json', '--bad-text', 'replace');
    expect((JSON.parse(replaced.stdout) as { documents: number }).documents).toBe(3);
    const failed = await cli('audit', tmp.path('m.csv'), '--lexicon', tmp.path('skip.json'), '--json', '--bad-text', 'fail');
    expect(failed.code).toBe(1);
  });

  it('is what readCorpusFor reads with, with the lexicon\'s fields; options given win', async () => {
    await corpora();
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('replace.json'), '--label', 'topic', '--bad-text', 'replace');
    const lexicon = await loadLexicon(tmp.path('replace.json'));
    expect(lexiconReadDefaults(tmp.path('m.csv'), lexicon)).toEqual({ badText: 'replace', text: 'text', label: 'topic' });
    const read = [];
    for await (const doc of readCorpusFor(tmp.path('m.csv'), lexicon)) read.push([doc.text, doc.label]);
    expect(read).toEqual([['la\uFFFDte ferry', 'delays'], ['lovely crossing', 'praise'], ['late again', 'delays']]);
    const skipping = readCorpusFor(tmp.path('m.csv'), lexicon, { badText: 'skip' });
    const kept = [];
    for await (const doc of skipping) kept.push(doc.text);
    expect([kept, skipping.stats.skipped]).toEqual([['lovely crossing', 'late again'], 1]);
    // A .txt corpus has no fields: only the policy carries over.
    await writeFile(tmp.path('t.txt'), 'late\n');
    expect(lexiconReadDefaults(tmp.path('t.txt'), lexicon)).toEqual({ badText: 'replace' });
  });
});
