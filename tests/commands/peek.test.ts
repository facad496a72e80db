import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli.js';
import { saveLexicon } from '../../src/files/saveLexicon.js';
import { freeze } from '../../src/lexicon/freeze.js';
import type { Shape } from '../../src/lexicon/Shape.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { freshFolderEachTest } from '../helpers/tempFolder.js';

// lexlock peek: a text token by token. The lexicon is ranked by hand: late 4 times, then ferry, the and
// was twice each (string order), then again and lovely once: ids late 2, ferry 3, the 4, was 5, again 6,
// lovely 7; OOV 1 (first), padding 0.
const tally = Tally.fromTexts(['the ferry was late again', 'the ferry was lovely', 'late late late'], resolveRules());
const tmp = freshFolderEachTest();

/** Writes the lexicon with `shape` (and `badText`) and returns its path and fingerprint. */
async function lexiconWith(shape: Shape | null, badText: 'fail' | 'replace' | 'skip' = 'fail'): Promise<{ path: string; fingerprint: string }> {
  const lexicon = freeze(tally, { shape, badText });
  const path = tmp.path('lex.json');
  await saveLexicon(path, lexicon, { force: true });
  return { path, fingerprint: lexicon.fingerprint };
}

/** Runs the CLI with `input` as standard input (chunks as given). */
async function cli(argv: string[], input: Array<string | Buffer> = []): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const stdin = Readable.from(input.map((c) => (typeof c === 'string' ? Buffer.from(c) : c)));
  const code = await run(argv, { stdout: { write: (t: string) => (stdout += t) }, stderr: { write: (t: string) => (stderr += t), isTTY: false }, stdin, env: {} });
  return { code, stdout, stderr };
}

const TEXT = ['The', 'ferry', 'was', 'late', 'again,', 'sadly'];

describe('lexlock peek', () => {
  it.each<[string, Shape, string]>([
    [
      'cut at the end, zeros at the start',
      { length: 4, pad: 'start', cut: 'end' },
      `"The ferry was late again, sadly"
7 tokens, 2 OOV; the row keeps tokens 1-4 and cuts 3 from the end
  #  id  slot  token
  1   4     0  "the"
  2   3     1  "ferry"
  3   5     2  "was"
  4   2     3  "late"
  5   6     -  "again"  cut
  6   1     -  ","      OOV, cut
  7   1     -  "sadly"  OOV, cut
row [4,3,5,2]
`,
    ],
    [
      'cut at the start, zeros at the end',
      { length: 4, pad: 'end', cut: 'start' },
      `"The ferry was late again, sadly"
7 tokens, 2 OOV; the row keeps tokens 4-7 and cuts 3 from the start
  #  id  slot  token
  1   4     -  "the"    cut
  2   3     -  "ferry"  cut
  3   5     -  "was"    cut
  4   2     0  "late"
  5   6     1  "again"
  6   1     2  ","      OOV
  7   1     3  "sadly"  OOV
row [2,6,1,1]
`,
    ],
    [
      'zeros at the start',
      { length: 10, pad: 'start', cut: 'end' },
      `"The ferry was late again, sadly"
7 tokens, 2 OOV; the row keeps all 7, with 3 zeros at the start
  #  id  slot  token
  1   4     3  "the"
  2   3     4  "ferry"
  3   5     5  "was"
  4   2     6  "late"
  5   6     7  "again"
  6   1     8  ","      OOV
  7   1     9  "sadly"  OOV
row [0,0,0,4,3,5,2,6,1,1]
`,
    ],
    [
      'zeros at the end',
      { length: 8, pad: 'end', cut: 'start' },
      `"The ferry was late again, sadly"
7 tokens, 2 OOV; the row keeps all 7, with 1 zero at the end
  #  id  slot  token
  1   4     0  "the"
  2   3     1  "ferry"
  3   5     2  "was"
  4   2     3  "late"
  5   6     4  "again"
  6   1     5  ","      OOV
  7   1     6  "sadly"  OOV
row [4,3,5,2,6,1,1,0]
`,
    ],
  ])('%s: every token with its id and slot, OOV and cut marked, and the row (arguments joined by a space)', async (_what, shape, block) => {
    const { path, fingerprint } = await lexiconWith(shape);
    const r = await cli(['peek', path, ...TEXT]);
    const ends = `length ${shape.length}; zeros at the ${shape.pad}; long documents lose their ${shape.cut}`;
    expect(r).toEqual({ code: 0, stdout: `lexicon ${path} (${fingerprint}): ${ends}; OOV id 1\n\n${block}`, stderr: '' });
  });

  it('without a shape: the row is every id; --length gives one', async () => {
    const { path, fingerprint } = await lexiconWith(null);
    const r = await cli(['peek', path, 'late again']);
    expect(r.stdout).toBe(`lexicon ${path} (${fingerprint}): no fixed length; OOV id 1

"late again"
2 tokens, 0 OOV; no fixed length: the row is its 2 ids
  #  id  slot  token
  1   2     0  "late"
  2   6     1  "again"
row [2,6]
`);
    const shaped = await cli(['peek', path, '--length', '3', '--pad', 'start', 'late again']);
    expect(shaped.stdout).toContain('2 tokens, 0 OOV; the row keeps both, with 1 zero at the start\n');
    expect(shaped.stdout).toContain('row [0,2,6]\n');
  });

  it('an empty text: no tokens, a row of zeros', async () => {
    const { path } = await lexiconWith({ length: 3, pad: 'end', cut: 'end' });
    const r = await cli(['peek', path, '']);
    expect(r.stdout.split('\n').slice(1)).toEqual(['', '""', '0 tokens; the row is 3 zeros', 'row [0,0,0]', '']);
  });

  it('shows characters that would not show as escapes', async () => {
    const lexicon = freeze(Tally.fromTexts(['a b'], resolveRules({ level: 'char' })), { shape: null });
    await saveLexicon(tmp.path('chars.json'), lexicon);
    const r = await cli(['peek', tmp.path('chars.json'), 'a\u00a0b\u200b']);
    // NFKC makes the no-break space a space, one ' ' token at the character level; U+200B stays.
    // Ids by string order of tokens seen once each: ' ' 2, a 3, b 4.
    expect(r.stdout.split('\n').slice(2)).toEqual([
      '"a\\u00a0b\\u200b"',
      '4 tokens, 1 OOV; no fixed length: the row is its 4 ids',
      '  #  id  slot  token',
      '  1   3     0  "a"',
      '  2   2     1  " "',
      '  3   4     2  "b"',
      '  4   1     3  "\\u200b"  OOV',
      'row [3,2,4,1]',
      '',
    ]);
  });

  it('--json: one object a text with a stable set of members', async () => {
    const { path, fingerprint } = await lexiconWith({ length: 3, pad: 'start', cut: 'end' });
    const r = await cli(['peek', path, '--json', 'late', 'again', 'sadly', 'ferry']);
    expect(r.code).toBe(0);
    expect(r.stdout.endsWith('\n') && r.stdout.trim().split('\n')).toHaveLength(1);
    expect(JSON.parse(r.stdout)).toEqual({
      line: null,
      text: 'late again sadly ferry',
      badText: null,
      fingerprint,
      shape: { length: 3, pad: 'start', cut: 'end' },
      tokens: [
        { token: 'late', id: 2, oov: false, slot: 0 },
        { token: 'again', id: 6, oov: false, slot: 1 },
        { token: 'sadly', id: 1, oov: true, slot: 2 },
        { token: 'ferry', id: 3, oov: false, slot: null },
      ],
      oovTokens: 1,
      cutTokens: 1,
      zeros: 0,
      row: [2, 6, 1],
    });
    // --help names every member --json prints.
    const help = (await cli(['peek', '--help'])).stdout;
    for (const member of [...Object.keys(JSON.parse(r.stdout) as object), 'length', 'pad', 'cut', 'token', 'id', 'oov', 'slot']) expect(help).toContain(`"${member}"`);
  });

  it('reads each non-empty line of standard input as one text, as a .txt corpus does', async () => {
    const { path } = await lexiconWith({ length: 2, pad: 'start', cut: 'end' });
    // A BOM before line 1, a CRLF line end, a blank line, a line split across two chunks, no final line feed.
    const r = await cli(['peek', path, '--json'], ['\uFEFFlate\r\n\nthe fe', 'rry\nlovely']);
    expect([r.code, r.stderr]).toEqual([0, '']);
    const lines = r.stdout.trim().split('\n').map((l) => JSON.parse(l) as { line: number; text: string; row: number[] });
    expect(lines.map((l) => [l.line, l.text, l.row])).toEqual([
      [1, 'late', [0, 2]],
      [3, 'the ferry', [4, 3]],
      [4, 'lovely', [0, 7]],
    ]);
    const human = await cli(['peek', path], ['late\nlovely\n']);
    expect(human.stdout.split('\n').filter((l) => l.startsWith('line '))).toEqual(['line 1: "late"', 'line 2: "lovely"']);
  });

  it('says on stderr that it reads standard input when that is a terminal', async () => {
    const { path } = await lexiconWith({ length: 2, pad: 'start', cut: 'end' });
    let stderr = '';
    const stdin = Object.assign(Readable.from([Buffer.from('late\n')]), { isTTY: true });
    const code = await run(['peek', path, '--json'], { stdout: { write: () => true }, stderr: { write: (t: string) => (stderr += t) }, stdin, env: {} });
    expect([code, stderr]).toEqual([0, 'lexlock peek: reading one text a line from standard input (Ctrl-D ends it)\n']);
  });

  it('standard input follows the lexicon\'s bad-text policy; --bad-text wins', async () => {
    const bad = ['late\n', Buffer.from([0x6c, 0x61, 0xff, 0x0a]), 'ferry\n'];
    const failing = await lexiconWith({ length: 2, pad: 'start', cut: 'end' });
    const failed = await cli(['peek', failing.path, '--json'], bad);
    expect([failed.code, failed.stderr]).toEqual([1, "lexlock peek: standard input line 2: invalid UTF-8 at byte 7; fix the file's encoding or pass --bad-text replace or --bad-text skip\n"]);
    // The line before the bad one was shown already: output streams.
    expect(failed.stdout.trim().split('\n')).toHaveLength(1);
    const replaced = await cli(['peek', failing.path, '--json', '--bad-text', 'replace'], bad);
    const second = JSON.parse(replaced.stdout.split('\n')[1] as string) as { text: string; badText: string; row: number[] };
    // la and U+FFFD: two tokens the lexicon lacks.
    expect([second.text, second.badText, second.row]).toEqual(['la\uFFFD', 'replaced', [1, 1]]);
    const skipping = await lexiconWith({ length: 2, pad: 'start', cut: 'end' }, 'skip');
    const skipped = await cli(['peek', skipping.path, '--json'], bad);
    expect(JSON.parse(skipped.stdout.split('\n')[1] as string)).toEqual({
      line: 2,
      text: null,
      badText: 'skipped',
      fingerprint: skipping.fingerprint,
      shape: { length: 2, pad: 'start', cut: 'end' },
      tokens: [],
      oovTokens: 0,
      cutTokens: 0,
      zeros: 0,
      row: null,
    });
    const human = await cli(['peek', skipping.path], bad);
    expect(human.stdout).toContain('\nline 2: left out: invalid UTF-8 (--bad-text skip)\n\nline 3: "ferry"\n');
    const replacedHuman = await cli(['peek', skipping.path, '--bad-text', 'replace'], bad);
    expect(replacedHuman.stdout).toContain('\nline 2: "la\uFFFD" (invalid UTF-8 replaced by U+FFFD)\n');
  });

  it.each<[string, string[], Array<string | Buffer>, number, string]>([
    ['no lexicon', ['peek'], [], 2, 'lexlock peek: expected <lexicon.json> [text...], got none; see lexlock peek --help\n'],
    ['an unknown flag', ['peek', 'LEX', '--cap', '3', 'late'], [], 2, 'lexlock peek: unknown flag --cap; see lexlock peek --help\n'],
    [
      '--length with a lexicon that has a shape',
      ['peek', 'LEX', '--length', '3', 'late'],
      [],
      2,
      'lexlock peek: --length: LEX already fixes the shape (length 4; zeros at the start; long documents lose their end) as part of its fingerprint; drop --length\n',
    ],
    ['a lexicon that is not there', ['peek', 'MISSING', 'late'], [], 1, 'lexlock peek: MISSING: cannot read the lexicon (no such file); pass the path of a file written by lexlock build\n'],
    ['standard input without a text', ['peek', 'LEX'], ['\n\r\n'], 1, 'lexlock peek: standard input held no text (no non-empty line); give the text as arguments after the lexicon, or one text a line on standard input\n'],
  ])('%s: the exit code and one line on stderr', async (_what, argv, input, code, stderr) => {
    const { path } = await lexiconWith({ length: 4, pad: 'start', cut: 'end' });
    const named = (s: string) => s.replaceAll('MISSING', tmp.path('missing.json')).replaceAll('LEX', path);
    const r = await cli(argv.map(named), input);
    expect([r.code, r.stdout, r.stderr]).toEqual([code, '', named(stderr)]);
  });
});
