import { readFile, writeFile } from 'node:fs/promises';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { cli, tempFolder } from '../helpers/cli.js';
import { MAIN_HELP } from '../../src/cli.js';

let tmp: Awaited<ReturnType<typeof tempFolder>>;
beforeEach(async () => {
  tmp = await tempFolder();
  await writeFile(tmp.path('m.txt'), 'the ferry was late\nlovely crossing\n');
  await cli('build', tmp.path('m.txt'), '-o', tmp.path('lex.json'));
});
afterEach(async () => {
  await tmp.remove();
});

describe('lexlock verify', () => {
  it('prints the fingerprint and a summary', async () => {
    const r = await cli('verify', tmp.path('lex.json'));
    const fingerprint = JSON.parse(await readFile(tmp.path('lex.json'), 'utf8')).fingerprint as string;
    expect(r.code).toBe(0);
    expect(r.stdout.split('\n')[0]).toBe(`ok ${tmp.path('lex.json')}: schema, fingerprint and 8 canaries check out`);
    expect(r.stdout).toContain(`fingerprint      ${fingerprint}`);
    const json = JSON.parse((await cli('verify', tmp.path('lex.json'), '--json')).stdout);
    const none = { tokens: 0, examples: [] };
    const identifyingTokens = { tokens: 0, email: none, url: none, mention: none, phone: none, ip: none };
    expect(json).toEqual({ ok: true, fingerprint, formatVersion: 2, tokens: 6, size: 8, labels: 0, canaries: 8, identifyingTokens });
    // verify --help lists every member --json prints.
    const help = (await cli('verify', '--help')).stdout;
    for (const member of Object.keys(json)) expect(help).toContain(`"${member}"`);
  });

  it.each<[string, (text: string) => string, RegExp]>([
    [
      'edited tokens',
      (t) => {
        const d = JSON.parse(t);
        d.encoding.tokens[0] = 'fairy';
        return JSON.stringify(d);
      },
      /member fingerprint: fingerprint sha256:[0-9a-f]{64} does not match the encoding/],
    ['not JSON', () => '{', /: not JSON \(/],
    ['not a lexicon', () => '{"a":1}', /not a lexlock lexicon/],
    ['a changed canary', (t) => t.replace('"timetable"', '"schedule"'), /member canaries\[2\]: canary "Timetable at/],
    ['a newer version', (t) => t.replace('"formatVersion":2', '"formatVersion":3'), /lexicon format version 3 needs a newer lexlock/],
    ['format version 1', (t) => t.replace('"formatVersion":2', '"formatVersion":1'), /member formatVersion: lexicon format version 1 was written by lexlock 0\.2\.0; this lexlock \(0\.2\.0\) reads version 2 only .*; rebuild it with this lexlock's build/],
  ])('exits 1 on %s', async (_what, edit, message) => {
    await writeFile(tmp.path('lex.json'), edit(await readFile(tmp.path('lex.json'), 'utf8')));
    const r = await cli('verify', tmp.path('lex.json'));
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(message);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });

  it('exits 1 for a missing file and 2 for a missing argument', async () => {
    const missing = await cli('verify', tmp.path('nope.json'));
    expect([missing.code, missing.stderr]).toEqual([1, `lexlock verify: ${tmp.path('nope.json')}: cannot read the lexicon (no such file); pass the path of a file written by lexlock build\n`]);
    const none = await cli('verify');
    expect([none.code, none.stderr]).toEqual([2, 'lexlock verify: expected <lexicon.json>, got none; see lexlock verify --help\n']);
  });
});

describe('lexlock', () => {
  it('exits 2 on an unknown command and prints help on --help', async () => {
    const r = await cli('train');
    expect([r.code, r.stderr]).toEqual([2, 'lexlock: unknown command "train"; the commands are build, encode, verify, peek, audit, compare, tally, merge (lexlock --help)\n']);
    expect((await cli('--help')).stdout).toContain('lexlock build <corpus> -o <lexicon.json>');
    expect((await cli('build', '--help')).stdout).toContain('--min-count N');
  });

  // Common practice (POSIX utility conventions): usage asked for goes to stdout with exit 0; usage
  // printed because the call was wrong goes to stderr with the usage error status, so a pipe sees none.
  it('without a command prints the usage on stderr and exits 2; --help prints it on stdout and exits 0', async () => {
    const bare = await cli();
    expect([bare.code, bare.stdout, bare.stderr]).toEqual([2, '', MAIN_HELP]);
    expect(MAIN_HELP).toMatch(/^lexlock \d+\.\d+\.\d+: one fingerprinted lexicon file/);
    for (const flag of ['--help', '-h', 'help']) {
      const asked = await cli(flag);
      expect([asked.code, asked.stdout, asked.stderr]).toEqual([0, MAIN_HELP, '']);
    }
  });
});
