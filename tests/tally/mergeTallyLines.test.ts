import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isLexlockError } from '../../src/LexlockError.js';
import { resolveRules, type TextRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import type { TallyFile } from '../../src/tally/tallyFile.js';
import { tallyFileMerge } from '../../src/tally/tallyFileMerge.js';
import { tallyFileText, tallyHeaderLines, TALLY_COUNTS_CLOSE, TALLY_COUNTS_OPEN } from '../../src/tally/tallyFileText.js';
import { mergeTallyLines } from '../../src/tally/mergeTallyLines.js';
import { TallyPartReader, type TallyLines } from '../../src/tally/TallyPartReader.js';

interface Doc {
  text: string;
  label: string | undefined;
}

function part(docs: readonly Doc[], fields: TallyFile['fields'] = { text: 'text', label: 'topic' }, rules: TextRules = resolveRules()): TallyFile {
  const tally = new Tally(rules);
  const snippets: string[] = [];
  for (const d of docs) {
    tally.add(d);
    if (snippets.length < 3 && d.text !== '' && !snippets.includes(d.text)) snippets.push(d.text);
  }
  return { tally, snippets, fields };
}

/** A file's text as groups of `size` lines (the last may be shorter), as the node side hands them out: a final line feed ends the last line. */
async function* grouped(text: string, size: number): AsyncGenerator<string[]> {
  const lines = text.split('\n');
  if (lines[lines.length - 1] === '') lines.pop();
  for (let i = 0; i < lines.length; i += size) yield lines.slice(i, i + size);
}

const source = (name: string, text: string, size = 3): TallyLines => ({ name, lines: grouped(text, size) });

/** The whole file a streaming merge makes: its header, then the count lines it wrote. */
async function streamed(sources: readonly TallyLines[]): Promise<string> {
  let counts = '';
  const { file, types } = await mergeTallyLines(sources, (text) => {
    counts += text;
  });
  return [...tallyHeaderLines(file, types)].join('') + TALLY_COUNTS_OPEN + counts + TALLY_COUNTS_CLOSE;
}

async function failure(sources: readonly TallyLines[]): Promise<[string, string]> {
  try {
    await streamed(sources);
  } catch (e) {
    if (isLexlockError(e)) return [e.code, e.message];
    throw e;
  }
  throw new Error('merged');
}

// Tokens chosen where JavaScript string order (UTF-16 code units) differs from code point order
// (an astral emoji sorts before U+FF01), and object-key traps.
const word = fc.constantFrom('the', 'ferry', 'late', 'Late', '__proto__', 'constructor', 'ÉTÉ', '😀', '！', '10', 'am', ',', '東京', 'x', 'xx', 'a\u0301');
const doc = fc.record({
  text: fc.array(word, { maxLength: 8 }).map((w) => w.join(' ')),
  label: fc.option(fc.constantFrom('delays', 'praise', 'constructor'), { nil: undefined }),
});

const AGAIN = 'count the part again with lexlock tally';
const LAYOUT = 'lexlock merge reads tally files laid out as lexlock tally and merge write them (one count a line)';

describe('mergeTallyLines', () => {
  // Invariant: the streaming merge writes exactly the bytes of the in-memory merge, whatever the
  // parts, their number and how their lines come in groups.
  it('writes the bytes tallyFileText(tallyFileMerge(parts)) writes, for random corpora split into 1 to 9 parts (property)', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.array(doc, { maxLength: 12 }), { minLength: 1, maxLength: 9 }),
        fc.array(fc.boolean(), { maxLength: 9 }),
        fc.integer({ min: 1, max: 7 }),
        async (corpora, otherField, size) => {
          const files = corpora.map((docs, i) => part(docs, { text: otherField[i] === true ? 'body' : 'text', label: 'topic' }));
          const expected = tallyFileText(tallyFileMerge(files.map((file, i) => ({ name: `p${i}.tally`, file }))));
          const got = await streamed(files.map((file, i) => source(`p${i}.tally`, tallyFileText(file), size)));
          expect(got).toBe(expected);
        },
      ),
      { numRuns: 150 },
    );
  });

  it('adds equal tokens across parts and keeps the rest (hand-counted)', async () => {
    const a = part([{ text: 'late late ferry', label: 'delays' }]);
    const b = part([{ text: 'ferry', label: 'praise' }, { text: 'a b', label: undefined }]);
    const text = await streamed([source('a.tally', tallyFileText(a)), source('b.tally', tallyFileText(b), 1)]);
    const all = JSON.parse(text) as { documents: number; tokens: number; types: number; counts: unknown[] };
    expect([all.documents, all.tokens, all.types]).toEqual([3, 6, 4]);
    expect(all.counts).toEqual([['a', 1, 1], ['b', 1, 1], ['ferry', 2, 2], ['late', 2, 1]]);
  });

  it('refuses parts counted under other rules in tallyFileMerge\'s words', async () => {
    const a = part([{ text: 'a', label: undefined }]);
    const b = part([{ text: 'a', label: undefined }], { text: 'text', label: 'topic' }, resolveRules({ case: 'keep' }));
    expect(await failure([source('a.tally', tallyFileText(a)), source('b.tally', tallyFileText(b))])).toEqual([
      'TALLY_RULES_DIFFER',
      'a.tally and b.tally were counted under different rules (case: "lower" in a.tally, "keep" in b.tally); count every part with the same --case',
    ]);
  });

  // A valid part of two documents, 'b b' and 'a': its lines are numbered below as the file's lines.
  const valid = tallyFileText(part([{ text: 'b b', label: undefined }, { text: 'a', label: undefined }], { text: null, label: null }));
  const lines = valid.split('\n');
  const countsAt = lines.indexOf('  "counts": [') + 1; // 1-based line of "counts": [
  const edit = (change: (l: string[]) => void) => {
    const l = [...lines];
    change(l);
    return l.join('\n');
  };
  it('has the layout the cases below edit', () => {
    expect(lines.slice(countsAt - 1)).toEqual(['  "counts": [', '    ["a",1,1],', '    ["b",2,1]', '  ]', '}', '']);
  });

  it.each<[string, () => string, string, string]>([
    ['tokens out of order', () => edit((l) => l.splice(countsAt, 2, '    ["b",2,1],', '    ["a",1,1]')), 'BAD_TALLY', `p.tally line ${countsAt + 2}: token "a" comes after "b"; tokens must be distinct and in JavaScript string order; ${AGAIN}`],
    ['a token twice', () => edit((l) => l.splice(countsAt, 2, '    ["a",1,1],', '    ["a",2,1]')), 'BAD_TALLY', `p.tally line ${countsAt + 2}: token "a" comes after "a"; tokens must be distinct and in JavaScript string order; ${AGAIN}`],
    ['more documents than occurrences', () => edit((l) => (l[countsAt + 1] = '    ["b",2,3]')), 'BAD_TALLY', `p.tally line ${countsAt + 2}: token "b" occurs 2 times but in 3 documents; ${AGAIN}`],
    ['counts that do not add up', () => edit((l) => (l[countsAt + 1] = '    ["b",3,1]')), 'BAD_TALLY', `p.tally member counts: the counts add up to 4 tokens but tokens is 3; ${AGAIN}`],
    ['a wrong types', () => valid.replace('"types": 2', '"types": 3'), 'BAD_TALLY', `p.tally member types: types is 3 but counts has 2 entries; ${AGAIN}`],
    ['a line that is not JSON', () => edit((l) => (l[countsAt] = '    ["a",1,1')), 'BAD_TALLY', `p.tally line ${countsAt + 1}: expected one [token, occurrences, documents] entry (a token that is not empty, two whole numbers from 1 up), got "[\\"a\\",1,1"; ${LAYOUT}; ${AGAIN}`],
    ['an entry of two', () => edit((l) => (l[countsAt] = '    ["a",1],')), 'BAD_TALLY', `p.tally line ${countsAt + 1}: expected one [token, occurrences, documents] entry (a token that is not empty, two whole numbers from 1 up), got "[\\"a\\",1],"; ${LAYOUT}; ${AGAIN}`],
    ['a count that is text', () => edit((l) => (l[countsAt] = '    ["a","1",1],')), 'BAD_TALLY', `p.tally line ${countsAt + 1}: expected one [token, occurrences, documents] entry (a token that is not empty, two whole numbers from 1 up), got "[\\"a\\",\\"1\\",1],"; ${LAYOUT}; ${AGAIN}`],
    ['an empty token', () => edit((l) => (l[countsAt] = '    ["",1,1],')), 'BAD_TALLY', `p.tally line ${countsAt + 1}: expected one [token, occurrences, documents] entry (a token that is not empty, two whole numbers from 1 up), got "[\\"\\",1,1],"; ${LAYOUT}; ${AGAIN}`],
    ['a comma before the end', () => edit((l) => (l[countsAt + 1] = '    ["b",2,1],')), 'BAD_TALLY', `p.tally line ${countsAt + 3}: expected one [token, occurrences, documents] entry after the comma on the line before (a token that is not empty, two whole numbers from 1 up), got "]"; ${LAYOUT}; ${AGAIN}`],
    ['a missing comma', () => edit((l) => (l[countsAt] = '    ["a",1,1]')), 'BAD_TALLY', `p.tally line ${countsAt + 2}: expected "]" after the last entry (the one without a comma), got "    [\\"b\\",2,1]"; ${AGAIN}`],
    ['a file cut inside counts', () => lines.slice(0, countsAt + 1).join('\n') + '\n', 'BAD_TALLY', `p.tally line ${countsAt + 1}: the file ends after this line, before "counts" and the file are closed (was it cut short?); ${AGAIN}`],
    ['a file cut after counts', () => lines.slice(0, countsAt + 3).join('\n'), 'BAD_TALLY', `p.tally line ${countsAt + 3}: the file ends after this line, before "counts" and the file are closed (was it cut short?); ${AGAIN}`],
    ['text after the end', () => `${valid}{}\n`, 'BAD_TALLY', `p.tally line ${countsAt + 5}: expected nothing after the closing "}", got "{}"; ${AGAIN}`],
    ['another tally layout', () => JSON.stringify(JSON.parse(valid)), 'BAD_TALLY', `p.tally member counts: "counts" does not open on a line of its own; ${LAYOUT}; ${AGAIN}`],
    ['a lexicon', () => '{\n  "format": "lexlock.lexicon"\n}\n', 'NOT_A_TALLY', 'p.tally: not a lexlock tally (no "format": "lexlock.tally" member); pass a file written by lexlock tally or lexlock merge'],
    ['a newer version', () => valid.replace('"formatVersion": 2', '"formatVersion": 3'), 'NEWER_FORMAT', 'p.tally member formatVersion: tally format version 3 needs a newer lexlock; this one (0.2.0) reads versions up to 2; upgrade lexlock'],
    ['a histogram that does not add up', () => valid.replace('[1,1],', '[1,2],'), 'BAD_TALLY', `p.tally member lengths: the length histogram holds 3 documents but documents is 2; ${AGAIN}`],
  ])('refuses %s, naming the file and line (or member)', async (_what, text, code, message) => {
    const good = source('ok.tally', valid);
    expect(await failure([good, source('p.tally', text(), 2)])).toEqual([code, message]);
  });

  it('stops reading every part when one is broken (each source is closed: its file would be)', async () => {
    const closed: string[] = [];
    const watched = (name: string, text: string): TallyLines => ({
      name,
      lines: (async function* () {
        try {
          yield* grouped(text, 1);
        } finally {
          closed.push(name);
        }
      })(),
    });
    const big = tallyFileText(part([{ text: 'a b c d e f g h i j k l m n o p', label: undefined }]));
    const broken = valid.replace('    ["b",2,1]', '    ["b",2,1');
    const [code] = await failure([watched('big.tally', big), watched('p.tally', broken), watched('late.tally', big)]);
    expect(code).toBe('BAD_TALLY');
    expect(closed.sort()).toEqual(['big.tally', 'late.tally', 'p.tally']);
  });

  // loadTally reads a large tally with one TallyPartReader and no merge around it: the reader itself
  // must stop its source when a line is broken, or the file stays open until garbage collection.
  it('a part reader closes its source when a line is broken, with nothing around it to do so', async () => {
    let closed = false;
    const broken = valid.replace('    ["b",2,1]', '    ["b",2,1');
    const lines = (async function* () {
      try {
        yield* grouped(broken, 1);
      } finally {
        closed = true;
      }
    })();
    const part = await TallyPartReader.open({ name: 'p.tally', lines });
    let error: unknown;
    try {
      while (await part.next());
    } catch (e) {
      error = e;
    }
    expect([isLexlockError(error) ? error.code : error, closed]).toEqual(['BAD_TALLY', true]);
  });

  it('reads a file that starts with a byte order mark', async () => {
    expect(await streamed([source('p.tally', `\uFEFF${valid}`)])).toBe(valid);
  });
});
