import { readFile, truncate, writeFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { loadTally } from '../../src/files/loadTally.js';
import { saveTally } from '../../src/files/saveTally.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { tallyFileParse } from '../../src/tally/tallyFileParse.js';
import { caughtError } from '../helpers/caughtError.js';
import { freshFolderEachTest } from '../helpers/tempFolder.js';

const tmp = freshFolderEachTest();
const tally = Tally.fromTexts(['the ferry was late', 'lovely ferry'], resolveRules());

describe('loadTally on odd files', () => {
  it('refuses a 1 GiB file as too large, from its size, before reading it', async () => {
    await writeFile(tmp.path('big.tally'), '');
    await truncate(tmp.path('big.tally'), 2 ** 30);
    const error = await caughtError(() => loadTally(tmp.path('big.tally')));
    expect([error.code, error.message]).toEqual([
      'FILE_TOO_LARGE',
      `${tmp.path('big.tally')}: this file has 1,073,741,824 bytes, more than the 536,870,888 bytes a tally file may have (the longest string V8 makes); ` +
        'build from the corpus itself (with --memory-limit if memory is short), or count the parts with --collapse number,url so they hold fewer distinct tokens',
    ]);
  });

  // The Unicode Standard (§23.8) allows a byte order mark at the start of UTF-8; an editor may save one.
  it('reads a tally saved with a UTF-8 byte order mark (file and text alike)', async () => {
    await saveTally(tmp.path('a.tally'), { tally, snippets: [], fields: { text: 'text', label: null } });
    const text = await readFile(tmp.path('a.tally'), 'utf8');
    await writeFile(tmp.path('bom.tally'), `\ufeff${text}`);
    const back = await loadTally(tmp.path('bom.tally'));
    const sorted = (t: Tally) => [...t.entries()].sort((a, b) => (a[0] < b[0] ? -1 : 1));
    expect(sorted(back.tally)).toEqual(sorted(tally));
    expect(sorted(tallyFileParse(`\ufeff${text}`).tally)).toEqual(sorted(tally));
  });
});
