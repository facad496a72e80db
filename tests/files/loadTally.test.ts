import { readFile, truncate, writeFile } from 'node:fs/promises';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { loadTally, loadTallyWithin } from '../../src/files/loadTally.js';
import { saveTally } from '../../src/files/saveTally.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { tallyFileParse } from '../../src/tally/tallyFileParse.js';
import { tallyFileText } from '../../src/tally/tallyFileText.js';
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

// A tally larger than one JSON text can be is read line by line, as merge reads its parts (tests pass
// loadTallyWithin a small size for "larger" so small files take that path).
describe('loadTally past the size of one JSON text', () => {
  const texts = fc.array(fc.tuple(fc.array(fc.constantFrom('ferry', 'late', 'été', '😀', 'quay', 'a', 'b', '10:30'), { maxLength: 12 }), fc.option(fc.constantFrom('x', 'y'), { nil: undefined })), { maxLength: 20 });

  it('reads a tally line by line into the same counts as reading it whole (fast-check)', async () => {
    await fc.assert(
      fc.asyncProperty(texts, async (docs) => {
        const t = new Tally(resolveRules());
        for (const [words, label] of docs) t.add(label === undefined ? words.join(' ') : { text: words.join(' '), label });
        const file = { tally: t, snippets: ['a b'], fields: { text: 'text', label: 'topic' } };
        await saveTally(tmp.path('p.tally'), file, { force: true });
        const written = await readFile(tmp.path('p.tally'), 'utf8');
        expect(tallyFileText(await loadTallyWithin(tmp.path('p.tally'), 0))).toBe(written);
        expect(tallyFileText(await loadTally(tmp.path('p.tally')))).toBe(written);
      }),
      { numRuns: 40 },
    );
  });

  it('reads one saved with a byte order mark', async () => {
    await saveTally(tmp.path('a.tally'), { tally, snippets: [], fields: { text: 'text', label: null } });
    const text = await readFile(tmp.path('a.tally'), 'utf8');
    await writeFile(tmp.path('bom.tally'), `\ufeff${text}`);
    expect(tallyFileText(await loadTallyWithin(tmp.path('bom.tally'), 0))).toBe(text);
  });

  it('names the line of a broken count, and refuses a large file not laid out as lexlock writes tallies', async () => {
    await saveTally(tmp.path('a.tally'), { tally, snippets: [], fields: { text: 'text', label: null } });
    const text = await readFile(tmp.path('a.tally'), 'utf8');
    await writeFile(tmp.path('broken.tally'), text.replace('["ferry",2,2]', '["ferry",2,3]'));
    const broken = await caughtError(() => loadTallyWithin(tmp.path('broken.tally'), 0));
    expect([broken.code, broken.where.line]).toEqual(['BAD_TALLY', text.split('\n').findIndex((l) => l.includes('"ferry"')) + 1]);
    await writeFile(tmp.path('one-line.tally'), JSON.stringify(JSON.parse(text)));
    const size = (await readFile(tmp.path('one-line.tally'))).length;
    const error = await caughtError(() => loadTallyWithin(tmp.path('one-line.tally'), 10));
    expect([error.code, error.message]).toEqual([
      'FILE_TOO_LARGE',
      `${tmp.path('one-line.tally')}: this file has ${size} bytes, more than the 536,870,888 bytes a tally file may have (the longest string V8 makes); ` +
        'build from the corpus itself (with --memory-limit if memory is short), or count the parts with --collapse number,url so they hold fewer distinct tokens',
    ]);
  });
});
