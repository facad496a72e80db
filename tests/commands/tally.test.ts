import { readFile, writeFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import { cli, freshFolderEachTest } from '../helpers/cli.js';

const tmp = freshFolderEachTest();

const CSV = 'text,topic\n"The ferry was late, again",delays\nLovely crossing,praise\nLate late late,delays\n';

describe('lexlock tally', () => {
  it('writes a tally file with the counts, rules and fields, and no corpus text (hand-counted)', async () => {
    await writeFile(tmp.path('m.csv'), CSV);
    const r = await cli('tally', tmp.path('m.csv'), '-o', tmp.path('m.tally'), '--label', 'topic');
    expect([r.code, r.stderr]).toEqual([0, '']);
    expect(r.stdout).toBe(`wrote ${tmp.path('m.tally')}\nrules   word level, NFKC, case lower, wink-tokenizer@5.3.0\ncorpus  3 documents, 11 tokens, 8 distinct\nlabels  2\n`);
    const doc = JSON.parse(await readFile(tmp.path('m.tally'), 'utf8')) as Record<string, unknown>;
    expect(doc.fields).toEqual({ text: 'text', label: 'topic' });
    expect([doc.documents, doc.tokens, doc.types]).toEqual([3, 11, 8]);
    // 'the ferry was late , again' is 6 tokens (the comma is one), 'lovely crossing' 2, 'late late late' 3: 11.
    expect(doc.lengths).toEqual([[2, 1], [3, 1], [6, 1]]);
    expect(doc.labels).toEqual([['delays', 2, 9], ['praise', 1, 2]]);
    expect(doc.snippets).toEqual([]);
    expect(doc.counts).toEqual([[',', 1, 1], ['again', 1, 1], ['crossing', 1, 1], ['ferry', 1, 1], ['late', 4, 2], ['lovely', 1, 1], ['the', 1, 1], ['was', 1, 1]]);
  });

  it('gives byte-identical files for the same documents read from different corpus kinds', async () => {
    await writeFile(tmp.path('a.txt'), 'one two\ntwo three\n');
    await writeFile(tmp.path('b.jsonl'), '{"text":"one two"}\n{"text":"two three"}\n');
    expect((await cli('tally', tmp.path('a.txt'), '-o', tmp.path('a.tally'))).code).toBe(0);
    expect((await cli('tally', tmp.path('a.txt'), '-o', tmp.path('a2.tally'))).code).toBe(0);
    expect((await cli('tally', tmp.path('b.jsonl'), '-o', tmp.path('b.tally'))).code).toBe(0);
    const a = await readFile(tmp.path('a.tally'), 'utf8');
    expect(await readFile(tmp.path('a2.tally'), 'utf8')).toBe(a);
    // The only difference: a .txt corpus has no text field, a .jsonl one reads "text".
    expect((await readFile(tmp.path('b.tally'), 'utf8')).replace('"fields": {"text":"text","label":null}', '"fields": {"text":null,"label":null}')).toBe(a);
  });

  it('refuses to overwrite without --force, and overwrites with it', async () => {
    await writeFile(tmp.path('m.csv'), CSV);
    await writeFile(tmp.path('m.tally'), 'old');
    const r = await cli('tally', tmp.path('m.csv'), '-o', tmp.path('m.tally'));
    expect([r.code, r.stderr]).toEqual([1, `lexlock tally: ${tmp.path('m.tally')} already exists; pass --force to overwrite it\n`]);
    expect(await readFile(tmp.path('m.tally'), 'utf8')).toBe('old');
    expect((await cli('tally', tmp.path('m.csv'), '-o', tmp.path('m.tally'), '--force')).code).toBe(0);
    expect(await readFile(tmp.path('m.tally'), 'utf8')).toMatch(/^\{\n {2}"format": "lexlock.tally",\n/);
  });

  it.each([
    [['-o', 'x.json'], 'lexlock tally: --output: "x.json" must end in .tally, so lexlock build knows it for a tally\n'],
    [[], 'lexlock tally: -o/--output is required: where should the tally go?\n'],
    [['-o', 'x.tally', '--cap', '3'], 'lexlock tally: unknown flag --cap; see lexlock tally --help\n'],
    [['-o', 'x.tally', '--level', 'line'], 'lexlock tally: --level: "line" is not one of word, char\n'],
  ])('exits 2 naming the flag for %j', async (flags, message) => {
    await writeFile(tmp.path('m.csv'), CSV);
    const r = await cli('tally', tmp.path('m.csv'), ...flags);
    expect([r.code, r.stderr]).toEqual([2, message]);
  });
});

describe('lexlock build <file.tally>', () => {
  it('freezes a tally into the lexicon a build of the corpus gives', async () => {
    await writeFile(tmp.path('m.csv'), CSV);
    expect((await cli('tally', tmp.path('m.csv'), '-o', tmp.path('m.tally'), '--label', 'topic', '--case', 'keep')).code).toBe(0);
    const fromTally = await cli('build', tmp.path('m.tally'), '-o', tmp.path('t.json'), '--cap', '3', '--length', '4');
    expect([fromTally.code, fromTally.stderr]).toEqual([0, '']);
    expect((await cli('build', tmp.path('m.csv'), '-o', tmp.path('c.json'), '--label', 'topic', '--case', 'keep', '--cap', '3', '--length', '4')).code).toBe(0);
    const t = parseLexicon(await readFile(tmp.path('t.json'), 'utf8'));
    const c = parseLexicon(await readFile(tmp.path('c.json'), 'utf8'));
    expect(t.fingerprint).toBe(c.fingerprint);
    // With case kept: 'late' 3, then the ones in code-unit order: ',' (U+002C) before 'Late' (U+004C).
    expect(t.encoding.tokens).toEqual(['late', ',', 'Late']);
    expect(t.fit?.source).toBe('m.tally');
    expect(t.fit?.labelField).toBe('topic');
  });

  it.each([
    ['--level', 'char', 'lexlock build: --level cannot be used with a tally: the tally fixes the rules it was counted under; leave it out, or count the parts again with lexlock tally --level\n'],
    ['--drop', 'punctuation', 'lexlock build: --drop cannot be used with a tally: the tally fixes the rules it was counted under; leave it out, or count the parts again with lexlock tally --drop\n'],
    ['--label', 'topic', 'lexlock build: --label cannot be used with a tally: its corpus was read when it was counted; leave it out, or pass it to lexlock tally\n'],
    ['--bad-text', 'skip', 'lexlock build: --bad-text cannot be used with a tally: its corpus was read when it was counted; leave it out, or pass it to lexlock tally\n'],
    ['--memory-limit', '64', 'lexlock build: --memory-limit cannot be used with a tally: it bounds counting a corpus, and a tally is counted already (its counts are read whole); leave it out\n'],
  ])('exits 2 on %s with a tally', async (flag, value, message) => {
    await writeFile(tmp.path('m.csv'), CSV);
    expect((await cli('tally', tmp.path('m.csv'), '-o', tmp.path('m.tally'))).code).toBe(0);
    const r = await cli('build', tmp.path('m.tally'), '-o', tmp.path('lex.json'), flag, value);
    expect([r.code, r.stderr]).toEqual([2, message]);
  });

  it.each([
    ['not JSON at all', 'nope', /^lexlock build: \S+bad\.tally: not JSON \(.*\); pass a tally file written by lexlock tally or lexlock merge\n$/],
    ['a damaged count', null, /^lexlock build: \S+bad\.tally member counts: the counts add up to 12 tokens but tokens is 11; count the part again with lexlock tally\n$/],
  ])('exits 1 on a tally that is %s, writing nothing', async (_what, text, message) => {
    await writeFile(tmp.path('m.csv'), CSV);
    expect((await cli('tally', tmp.path('m.csv'), '-o', tmp.path('m.tally'))).code).toBe(0);
    const damaged = (await readFile(tmp.path('m.tally'), 'utf8')).replace('["again",1,1]', '["again",2,1]');
    await writeFile(tmp.path('bad.tally'), text ?? damaged);
    const r = await cli('build', tmp.path('bad.tally'), '-o', tmp.path('lex.json'));
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(message);
    await expect(readFile(tmp.path('lex.json'))).rejects.toThrow(/ENOENT/);
  });

  it('exits 1 on a tally counted with another tokenizer version', async () => {
    await writeFile(tmp.path('m.csv'), CSV);
    expect((await cli('tally', tmp.path('m.csv'), '-o', tmp.path('m.tally'))).code).toBe(0);
    await writeFile(tmp.path('old.tally'), (await readFile(tmp.path('m.tally'), 'utf8')).replace('wink-tokenizer@5.3.0', 'wink-tokenizer@5.2.0'));
    const r = await cli('build', tmp.path('old.tally'), '-o', tmp.path('lex.json'));
    expect([r.code, r.stderr]).toEqual([1, `lexlock build: ${tmp.path('old.tally')}: counted with wink-tokenizer@5.2.0, but this lexlock tokenizes with wink-tokenizer@5.3.0; count the parts again with this lexlock\n`]);
  });

  it('exits 1 on a missing tally', async () => {
    const r = await cli('build', tmp.path('none.tally'), '-o', tmp.path('lex.json'));
    expect([r.code, r.stderr]).toEqual([1, `lexlock build: ${tmp.path('none.tally')}: cannot read the tally (no such file); pass the path of a file written by lexlock tally or lexlock merge\n`]);
  });
});
