import { readFile, writeFile } from 'node:fs/promises';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { compare, COMPARE_HELP } from '../../src/commands/compare.js';
import { saveLexicon } from '../../src/files/saveLexicon.js';
import { freeze, type FreezeOptions } from '../../src/lexicon/freeze.js';
import type { Lexicon } from '../../src/lexicon/Lexicon.js';
import { resolveRules, type TextRules } from '../../src/rules/TextRules.js';
import { Tally, type LabelledText } from '../../src/tally/Tally.js';
import { tempFolder } from '../helpers/tempFolder.js';

const lower = resolveRules();
const keep = resolveRules({ case: 'keep' });

function lex(texts: Array<string | LabelledText>, options: FreezeOptions = {}, rules: TextRules = lower): Lexicon {
  return freeze(Tally.fromTexts(texts, rules), options);
}

// Ranked by hand: ferry 2, the 3, late 4, left 5, was 6 (OOV 1).
const FERRY = ['the ferry was late', 'the ferry left'];
const labelled: LabelledText[] = [
  { text: 'the ferry', label: 'pos' },
  { text: 'late', label: 'neg' },
];

/** Runs the command in-process with collecting streams, as tests/helpers/cli.ts does for the CLI. */
async function runCompare(...argv: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const code = await compare(argv, {
    stdout: { write: (t: string) => (stdout += t) },
    stderr: { write: (t: string) => (stderr += t), isTTY: false },
    env: {},
  });
  return { code, stdout, stderr };
}

/**
 * The error the command throws. src/cli.ts prints its message and exits 2 when `isUsage`, 1 otherwise.
 */
async function failure(...argv: string[]): Promise<{ code: string; usage: boolean; message: string }> {
  try {
    await runCompare(...argv);
  } catch (e) {
    const err = e as { code: string; isUsage: boolean; message: string; name: string };
    expect(err.name).toBe('LexlockError');
    return { code: err.code, usage: err.isUsage, message: err.message };
  }
  throw new Error(`lexlock compare ${argv.join(' ')} did not fail`);
}

let tmp: Awaited<ReturnType<typeof tempFolder>>;
let base: string;
beforeEach(async () => {
  tmp = await tempFolder();
  base = await save('base.json', lex(FERRY));
});
afterEach(async () => {
  await tmp.remove();
});

async function save(name: string, lexicon: Lexicon): Promise<string> {
  const path = tmp.path(name);
  await saveLexicon(path, lexicon);
  return path;
}

describe('lexlock compare', () => {
  it('says two lexicons with one fingerprint encode identically, and exits 0', async () => {
    const twice = lex([...FERRY, ...FERRY]);
    const other = await save('twice.json', twice);
    const r = await runCompare(base, other);
    const fp = twice.fingerprint;
    expect(r).toEqual({
      code: 0,
      stdout:
        `a        ${base}  ${fp}\n` +
        `b        ${other}  ${fp}\n` +
        'verdict  same fingerprint: both encode every text identically\n' +
        'tokens   5\n',
      stderr: '',
    });
  });

  it('prints an aligned summary of ids moved by a count change, and exits 0', async () => {
    // b ranks late (3) first: late 2, ferry 3, the 4, left 5, was 6.
    const b = lex(['the ferry was late', 'the ferry left late', 'late']);
    const other = await save('b.json', b);
    const r = await runCompare(base, other);
    expect(r.code).toBe(0);
    expect(r.stdout).toBe(
      `a          ${base}  ${lex(FERRY).fingerprint}\n` +
        `b          ${other}  ${b.fingerprint}\n` +
        'verdict    different fingerprints: the same text can get other ids\n' +
        'rules      same\n' +
        'layout     same\n' +
        'shape      same\n' +
        'tokens     5 -> 5, 5 shared\n' +
        'only in a  0\n' +
        'only in b  0\n' +
        'moved      3: "ferry" 2->3, "the" 3->4, "late" 4->2\n' +
        'top 5      5 shared (100.00 %)\n' +
        'labels     none\n',
    );
  });

  it('prints rule, layout, shape and label differences', async () => {
    const a = await save('a.json', lex(labelled));
    // b, case kept: Ferry 1, The 2, ferry 3, late 4, the 5, OOV 6; labels aardvark 0, neg 1, pos 2.
    const b = lex([...labelled, { text: 'The Ferry', label: 'aardvark' }], { oov: 'last', shape: { length: 4, pad: 'start', cut: 'end' } }, keep);
    const r = await runCompare(a, await save('b.json', b));
    expect(r.stdout.split('\n').slice(2)).toEqual([
      'verdict    different fingerprints: the same text can get other ids',
      'rules      case lower -> keep',
      'layout     oov first -> last',
      'shape      none -> length 4; zeros at the start; long documents lose their end',
      'tokens     3 -> 5, 3 shared',
      'only in a  0',
      'only in b  2: "Ferry", "The"',
      'moved      3: "ferry" 2->3, "late" 3->4, "the" 4->5',
      // top 3: ferry, late, the against Ferry, The, ferry.
      'top 3      1 shared (33.33 %)',
      'labels     2 -> 3; only in b "aardvark"; moved "neg" 0->1, "pos" 1->2',
      '',
    ]);
  });

  it('says when only labels differ that token ids still agree', async () => {
    const a = await save('a.json', lex(labelled));
    const b = await save('b.json', lex([...labelled, { text: '', label: 'aardvark' }]));
    const lines = (await runCompare(a, b)).stdout.split('\n');
    expect(lines[2]).toBe('verdict    different fingerprints, but every text gets the same token ids (before shape)');
    expect(lines.at(-2)).toBe('labels     2 -> 3; only in b "aardvark"; moved "neg" 0->1, "pos" 1->2');
  });

  it('says when only the shape differs that token ids still agree, and labels are the same', async () => {
    const a = await save('a.json', lex(labelled));
    const b = await save('b.json', lex(labelled, { shape: { length: 2, pad: 'end', cut: 'start' } }));
    const lines = (await runCompare(a, b)).stdout.split('\n');
    expect([lines[2], lines[5], lines.at(-2)]).toEqual([
      'verdict    different fingerprints, but every text gets the same token ids (before shape)',
      'shape      none -> length 2; zeros at the end; long documents lose their start',
      'labels     same (2)',
    ]);
  });

  it('names at most 8 tokens a line, then …', async () => {
    // a…i (1 each) rank between the (2) and late: late 4 -> 13, left 5 -> 14, was 6 -> 15.
    const other = await save('b.json', lex([...FERRY, 'a b c d e f g h i']));
    const lines = (await runCompare(base, other, '--top', '2,1000')).stdout.split('\n');
    expect(lines.slice(3)).toEqual([
      'rules      same',
      'layout     same',
      'shape      same',
      'tokens     5 -> 14, 5 shared',
      'only in a  0',
      'only in b  9: "a", "b", "c", "d", "e", "f", "g", "h", …',
      'moved      3: "late" 4->13, "left" 5->14, "was" 6->15',
      'top 2      2 shared (100.00 %)',
      'top 1,000  5 shared (0.50 %)',
      'labels     none',
      '',
    ]);
  });

  it('prints the comparison as one JSON object with --json, members named exactly', async () => {
    const a = lex(labelled);
    const b = lex([...labelled, { text: 'The Ferry', label: 'aardvark' }], { oov: 'last', shape: { length: 4, pad: 'start', cut: 'end' } }, keep);
    const r = await runCompare('--json', await save('a.json', a), await save('b.json', b), '--top', '3,1');
    expect(r.code).toBe(0);
    expect(r.stdout.endsWith('}\n')).toBe(true);
    expect(r.stdout.split('\n')).toHaveLength(2);
    const json = JSON.parse(r.stdout);
    expect(Object.keys(json)).toEqual([
      'sameFingerprint',
      'fingerprints',
      'rules',
      'layout',
      'shape',
      'tokens',
      'onlyInA',
      'onlyInB',
      'moved',
      'topOverlap',
      'labels',
    ]);
    expect(Object.keys(json.labels)).toEqual(['a', 'b', 'onlyInA', 'onlyInB', 'moved']);
    expect(json).toEqual({
      sameFingerprint: false,
      fingerprints: { a: a.fingerprint, b: b.fingerprint },
      rules: [{ member: 'case', a: 'lower', b: 'keep' }],
      layout: [{ member: 'oov', a: 'first', b: 'last' }],
      shape: { a: null, b: { length: 4, pad: 'start', cut: 'end' } },
      tokens: { a: 3, b: 5, shared: 3 },
      onlyInA: { count: 0, first: [] },
      onlyInB: { count: 2, first: ['Ferry', 'The'] },
      moved: {
        count: 3,
        first: [
          { token: 'ferry', a: 2, b: 3 },
          { token: 'late', a: 3, b: 4 },
          { token: 'the', a: 4, b: 5 },
        ],
      },
      // top 1: ferry vs Ferry; top 3: ferry, late, the vs Ferry, The, ferry.
      topOverlap: [
        { k: 1, shared: 0, share: 0 },
        { k: 3, shared: 1, share: 1 / 3 },
      ],
      labels: { a: 2, b: 3, onlyInA: [], onlyInB: ['aardvark'], moved: [{ label: 'neg', a: 0, b: 1 }, { label: 'pos', a: 1, b: 2 }] },
    });
  });

  it('fails as bad input (exit 1) for a file loadLexicon refuses', async () => {
    const missing = tmp.path('nope.json');
    expect(await failure(base, missing)).toEqual({
      code: 'IO',
      usage: false,
      message: `${missing}: cannot read the lexicon (no such file); pass the path of a file written by lexlock build`,
    });
    const edited = tmp.path('edited.json');
    const zeros = `sha256:${'0'.repeat(64)}`;
    const text = JSON.stringify({ ...JSON.parse(await readFile(base, 'utf8')), fingerprint: zeros });
    await writeFile(edited, text);
    expect(await failure(edited, base)).toEqual({
      code: 'FINGERPRINT_MISMATCH',
      usage: false,
      message:
        `${edited} member fingerprint: fingerprint ${zeros} does not match the encoding, which hashes to ` +
        `${lex(FERRY).fingerprint}; the file was edited or damaged: restore it or rebuild it`,
    });
    const broken = tmp.path('broken.json');
    await writeFile(broken, '{');
    const notJson = await failure(base, broken);
    expect([notJson.code, notJson.usage, notJson.message.startsWith(`${broken}: not JSON (`)]).toEqual(['NOT_JSON', false, true]);
  });

  it.each<[string, string[], string, string]>([
    ['no arguments', [], 'USAGE_MISSING', 'expected <a.json> <b.json>, got none; see lexlock compare --help'],
    ['one argument', ['x.json'], 'USAGE_MISSING', 'expected <a.json> <b.json>, got "x.json"; see lexlock compare --help'],
    [
      'three arguments',
      ['x.json', 'y.json', 'z.json'],
      'USAGE_MISSING',
      'expected <a.json> <b.json>, got "x.json" "y.json" "z.json"; see lexlock compare --help',
    ],
    ['--top 0', ['x.json', 'y.json', '--top', '0'], 'USAGE_BAD_VALUE', '--top: "0" is not a whole number of at least 1'],
    ['--top 100,ten', ['x.json', 'y.json', '--top', '100,ten'], 'USAGE_BAD_VALUE', '--top: "ten" is not a whole number of at least 1'],
    ['--top -5', ['x.json', 'y.json', '--top', '-5'], 'USAGE_BAD_VALUE', '--top: "-5" is not a whole number of at least 1'],
    ['--top 1.5', ['x.json', 'y.json', '--top=1.5'], 'USAGE_BAD_VALUE', '--top: "1.5" is not a whole number of at least 1'],
    ['--top ,', ['x.json', 'y.json', '--top', ','], 'USAGE_BAD_VALUE', '--top: give at least one K, e.g. --top 100,1000'],
    ['--top twice', ['x.json', 'y.json', '--top', '1', '--top', '2'], 'USAGE_BAD_VALUE', '--top is given twice; give it once'],
    ['--top without a value', ['x.json', 'y.json', '--top'], 'USAGE_MISSING', '--top needs a value'],
    ['an unknown flag', ['x.json', 'y.json', '--cap', '5'], 'USAGE_UNKNOWN_FLAG', 'unknown flag --cap; see lexlock compare --help'],
    ['--json=yes', ['x.json', 'y.json', '--json=yes'], 'USAGE_BAD_VALUE', '--json takes no value (got "yes")'],
  ])('is a usage error (exit 2) with %s, before reading any file', async (_what, argv, code, message) => {
    expect(await failure(...argv)).toEqual({ code, usage: true, message });
  });

  it('has help in the style of the other commands', () => {
    expect(COMPARE_HELP.split('\n')[0]).toBe('lexlock compare <a.json> <b.json> [--json] [--top K,K,…]');
    expect(COMPARE_HELP).toContain('\n  --json        print the comparison as one JSON object\n');
    expect(COMPARE_HELP).toContain('\n  --top K,K,…   top-K overlaps to report');
  });
});
