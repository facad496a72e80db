import { writeFile } from 'node:fs/promises';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { tallyFileLineGroups, tallyReadError } from '../../src/files/tallyFileLineGroups.js';
import { caughtError } from '../helpers/caughtError.js';
import { freshFolderEachTest } from '../helpers/tempFolder.js';

const tmp = freshFolderEachTest();

async function linesOf(path: string): Promise<{ lines: string[]; groups: number }> {
  const lines: string[] = [];
  let groups = 0;
  for await (const group of tallyFileLineGroups(path)) {
    groups += 1;
    lines.push(...group);
  }
  return { lines, groups };
}

/** What the reader must give: the text's lines, a final line feed ending the last one (common practice for text files). */
function expected(text: string): string[] {
  const lines = text.split('\n');
  if (lines[lines.length - 1] === '') lines.pop();
  return lines;
}

describe('tallyFileLineGroups', () => {
  // Lines of 0 to 200,000 code units from 1- to 4-byte characters, so lines and characters cross
  // the 64 KiB reads anywhere.
  it('gives a file\'s lines exactly, whatever their length and however reads cut them (property)', async () => {
    const piece = fc.constantFrom('a', 'é', '東', '😀', '["ferry",2,1],', ' ');
    const line = fc.tuple(fc.array(piece, { maxLength: 30 }), fc.constantFrom(1, 1, 1, 500, 7000)).map(([p, times]) => p.join('').repeat(times));
    await fc.assert(
      fc.asyncProperty(fc.array(line, { maxLength: 40 }), fc.boolean(), async (lines, finalFeed) => {
        const text = lines.join('\n') + (finalFeed && lines.length > 0 ? '\n' : '');
        await writeFile(tmp.path('p.tally'), text);
        expect((await linesOf(tmp.path('p.tally'))).lines).toEqual(expected(text));
      }),
      { numRuns: 40 },
    );
  });

  it('reads a 5 MiB line in one piece, and hands lines out a read at a time', async () => {
    const long = 'x'.repeat(5 * 1024 * 1024);
    await writeFile(tmp.path('p.tally'), `{\n${long}\n}\n`);
    const { lines, groups } = await linesOf(tmp.path('p.tally'));
    expect(lines.map((l) => l.length)).toEqual([1, long.length, 1]);
    expect(groups).toBe(2); // '{' ends in the first read; the long line in the 81st, with '}'
  });

  it.each([
    ['no such file', 'none.tally', (p: string) => `${p}: cannot read the tally (no such file); pass the path of a file written by lexlock tally or lexlock merge`],
    ['a folder', '.', (p: string) => `${p}: cannot read the tally (is a folder, not a tally file); pass the path of a file written by lexlock tally or lexlock merge`],
  ])('refuses %s in loadTally\'s words', async (_what, name, message) => {
    const path = tmp.path(name);
    const error = await caughtError(() => linesOf(path));
    expect([error.code, error.message]).toEqual(['IO', message(path)]);
  });

  it('says what to do when too many files are open (a merge keeps every part open)', () => {
    const err = Object.assign(new Error("EMFILE: too many open files, open 'p36.tally'"), { code: 'EMFILE' });
    const error = tallyReadError('p36.tally', err);
    expect([error.code, error.message]).toEqual([
      'IO',
      'p36.tally: cannot read the tally (too many files open: merge keeps every part open); merge fewer parts at once and merge the results (any grouping gives the same file), or raise the limit of open files (ulimit -n)',
    ]);
  });
});
