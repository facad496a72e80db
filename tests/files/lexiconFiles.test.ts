import { readFile, readdir, truncate, writeFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { loadLexicon } from '../../src/files/loadLexicon.js';
import { saveLexicon } from '../../src/files/saveLexicon.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { caughtError } from '../helpers/caughtError.js';
import { freshFolderEachTest } from '../helpers/tempFolder.js';

const tmp = freshFolderEachTest();

const lexicon = freeze(Tally.fromTexts(['the ferry was late', 'lovely ferry'], resolveRules()));

describe('saveLexicon and loadLexicon', () => {
  it('save atomically and load with every check', async () => {
    await saveLexicon(tmp.path('lex.json'), lexicon);
    expect(await readdir(tmp.dir)).toEqual(['lex.json']);
    const back = await loadLexicon(tmp.path('lex.json'), { expectFingerprint: lexicon.fingerprint });
    expect(back.encoding).toEqual(lexicon.encoding);
  });

  it('refuse a file that is not UTF-8, naming the byte', async () => {
    await saveLexicon(tmp.path('lex.json'), lexicon);
    const bytes = await readFile(tmp.path('lex.json'));
    const at = bytes.indexOf('"createdAt": "') + 14;
    await writeFile(tmp.path('lex.json'), Buffer.concat([bytes.subarray(0, at), Buffer.from([0xff]), bytes.subarray(at)]));
    const line = bytes.subarray(0, at).toString().split('\n').length;
    await expect(loadLexicon(tmp.path('lex.json'))).rejects.toThrow(
      `${tmp.path('lex.json')} line ${line}: invalid UTF-8 at byte ${at}; a lexicon file is UTF-8 JSON as lexlock build writes it: restore the file or rebuild it`,
    );
  });

  it('refuse to overwrite unless forced', async () => {
    await writeFile(tmp.path('lex.json'), 'keep me');
    await expect(saveLexicon(tmp.path('lex.json'), lexicon)).rejects.toThrow(`${tmp.path('lex.json')} already exists; pass --force to overwrite it`);
    expect(await readFile(tmp.path('lex.json'), 'utf8')).toBe('keep me');
    await saveLexicon(tmp.path('lex.json'), lexicon, { force: true });
    expect((await loadLexicon(tmp.path('lex.json'))).fingerprint).toBe(lexicon.fingerprint);
  });

  it.each([
    ['a missing file', 'nope.json', 'no such file'],
    ['a folder', '.', 'is a folder, not a lexicon file'],
  ])('name the problem with %s', async (_what, name, why) => {
    const path = name === '.' ? tmp.dir : tmp.path(name);
    await expect(loadLexicon(path)).rejects.toThrow(`${path}: cannot read the lexicon (${why}); pass the path of a file written by lexlock build`);
  });
});

describe('odd lexicon files', () => {
  it('refuses a 1 GiB file as too large, from its size, before reading it', async () => {
    // A sparse file: 1 GiB long, no block written. Read whole, it was "invalid UTF-8 at byte 0".
    await writeFile(tmp.path('big.json'), '');
    await truncate(tmp.path('big.json'), 2 ** 30);
    const error = await caughtError(() => loadLexicon(tmp.path('big.json')));
    expect([error.code, error.message]).toEqual([
      'FILE_TOO_LARGE',
      `${tmp.path('big.json')}: this file has 1,073,741,824 bytes, more than the 536,870,888 bytes a lexicon file may have (the longest string V8 makes); check that it is a lexicon file written by lexlock build`,
    ]);
  });

  // The Unicode Standard (§23.8) allows a byte order mark at the start of UTF-8; editors on some
  // systems save one. The fingerprint covers `encoding`, not the file's bytes, so the lexicon loads.
  it('loads a lexicon saved with a UTF-8 byte order mark', async () => {
    await saveLexicon(tmp.path('lex.json'), lexicon);
    const bytes = await readFile(tmp.path('lex.json'));
    await writeFile(tmp.path('bom.json'), Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), bytes]));
    const back = await loadLexicon(tmp.path('bom.json'), { expectFingerprint: lexicon.fingerprint });
    expect(back.encoding).toEqual(lexicon.encoding);
  });
});
