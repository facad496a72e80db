import { lstat, mkdir, readdir, readFile, readlink, symlink, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { interruptedLine } from '../../src/cli.js';
import { cli, freshFolderEachTest } from '../helpers/cli.js';

// Where lexlock writes is always a path on the command line (-o, --encode, --report), never a name
// taken from the corpus; it overwrites only with --force (refusing to replace an existing output
// unless asked is common practice: POSIX sh `set -C`, noclobber) and never writes through a
// symbolic link, because rename(2) replaces a link at the new path instead of the file it points to
// ("If newpath refers to a symbolic link, the link will be overwritten", Linux man-pages).

const tmp = freshFolderEachTest();
const CSV = 'text\nThe Glimmerholt ferry was late again\nLovely crossing to the north harbour\nlate late late\n';
const SUFFIX = '; lexlock does not write through symbolic links: remove the link, or name';

async function corpusAndLexicon(): Promise<void> {
  await writeFile(tmp.path('m.csv'), CSV);
  const built = await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--length', '4');
  expect([built.code, built.stderr]).toEqual([0, '']);
}

describe('without --force, an existing output is refused with exit 1 and left as it was', () => {
  it('build over an existing lexicon', async () => {
    await corpusAndLexicon();
    const before = await readFile(tmp.path('lex.json'));
    const r = await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'));
    expect([r.code, r.stderr, r.stdout]).toEqual([1, `lexlock build: ${tmp.path('lex.json')} already exists; pass --force to overwrite it\n`, '']);
    expect((await readFile(tmp.path('lex.json'))).equals(before)).toBe(true);
  });

  it('build --encode over an existing encoded file (the lexicon is new)', async () => {
    await corpusAndLexicon();
    await writeFile(tmp.path('rows.jsonl'), 'old\n');
    const r = await cli('build', tmp.path('m.csv'), '-o', tmp.path('new.json'), '--encode', tmp.path('rows.jsonl'));
    expect([r.code, r.stderr]).toEqual([1, `lexlock build: ${tmp.path('rows.jsonl')} already exists; pass --force to overwrite it\n`]);
    expect(await readFile(tmp.path('rows.jsonl'), 'utf8')).toBe('old\n');
    expect((await readdir(tmp.dir)).sort()).toEqual(['lex.json', 'm.csv', 'rows.jsonl']);
  });

  it('encode over an existing .jsonl file', async () => {
    await corpusAndLexicon();
    await writeFile(tmp.path('rows.jsonl'), 'old\n');
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('rows.jsonl'));
    expect([r.code, r.stderr]).toEqual([1, `lexlock encode: ${tmp.path('rows.jsonl')} already exists; pass --force to overwrite it\n`]);
    expect(await readFile(tmp.path('rows.jsonl'), 'utf8')).toBe('old\n');
  });

  it('encode --force into a folder that holds other files: the folder is replaced whole, so refused', async () => {
    await corpusAndLexicon();
    await mkdir(tmp.path('out'));
    await writeFile(tmp.path('out/ids.npy'), 'old');
    for (const name of ['notes.txt', '.hidden', 'b', 'a']) await writeFile(tmp.path(`out/${name}`), 'keep');
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), '--force');
    expect([r.code, r.stderr]).toEqual([1, `lexlock encode: ${tmp.path('out')} holds files an encode does not write (.hidden, a, b and 1 more); the folder is replaced whole, so move them elsewhere or name another folder\n`]);
    expect((await readdir(tmp.path('out'))).sort()).toEqual(['.hidden', 'a', 'b', 'ids.npy', 'notes.txt']);
  });

  it('encode into an existing empty folder, and into a symbolic link to a folder (refused)', async () => {
    await corpusAndLexicon();
    await mkdir(tmp.path('empty'));
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('empty'));
    expect([r.code, r.stderr]).toEqual([0, '']);
    expect((await readdir(tmp.path('empty'))).sort()).toEqual(['ids.npy', 'keys.jsonl', 'lengths.npy', 'manifest.json']);
    await symlink(tmp.path('empty'), tmp.path('linked'));
    const linked = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('linked'), '--force');
    expect([linked.code, linked.stderr]).toEqual([1, `lexlock encode: ${tmp.path('linked')} is a symbolic link to ${tmp.path('empty')}${SUFFIX} ${tmp.path('empty')} itself as the output\n`]);
  });

  it.each([['.'], ['..'], ['./'], ['sub/..'], ['/']])('refuses a folder output named %s (usage, exit 2)', async (name) => {
    await corpusAndLexicon();
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', name);
    expect(r.code).toBe(2);
    expect([r.stderr.startsWith('lexlock encode: --output: name the output folder by its own name (such as ../'), r.stderr.endsWith(`), not "${name}": the folder is replaced whole\n`)]).toEqual([true, true]);
    const b = await cli('build', tmp.path('m.csv'), '-o', tmp.path('b.json'), '--length', '4', '--encode', name);
    expect([b.code, b.stderr.startsWith('lexlock build: --encode: name the output folder by its own name')]).toEqual([2, true]);
  });

  it('build --encode naming the lexicon itself as its encoded output: usage, exit 2', async () => {
    await writeFile(tmp.path('m.csv'), CSV);
    const r = await cli('build', tmp.path('m.csv'), '-o', tmp.path('same.jsonl'), '--encode', tmp.path('same.jsonl'));
    expect([r.code, r.stderr]).toEqual([2, `lexlock build: --encode ${tmp.path('same.jsonl')}: that is where -o puts the lexicon; name another output\n`]);
    expect(await readdir(tmp.dir)).toEqual(['m.csv']);
  });

  it('encode into a folder that is not empty', async () => {
    await corpusAndLexicon();
    await mkdir(tmp.path('out'));
    await writeFile(tmp.path('out/ids.npy'), 'old');
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'));
    expect([r.code, r.stderr]).toEqual([1, `lexlock encode: ${tmp.path('out')} already exists and is not empty; pass --force to write into it\n`]);
    expect(await readdir(tmp.path('out'))).toEqual(['ids.npy']);
    expect(await readFile(tmp.path('out/ids.npy'), 'utf8')).toBe('old');
  });
});

describe('a symbolic link as the output is refused with exit 1, --force or not; link and target stay', () => {
  it.each([
    ['build -o, a link to a file outside its folder', 'outside', ['--force']],
    ['build -o, a link to a file in the same folder', 'inside', ['--force']],
    ['build -o, without --force', 'outside', []],
  ] as const)('%s', async (_what, where, force) => {
    await writeFile(tmp.path('m.csv'), CSV);
    await mkdir(tmp.path('models'));
    await mkdir(tmp.path('elsewhere'));
    const target = where === 'outside' ? tmp.path('elsewhere/keep.json') : tmp.path('models/keep.json');
    await writeFile(target, 'someone else\'s file');
    await symlink(target, tmp.path('models/lex.json'));
    const r = await cli('build', tmp.path('m.csv'), '-o', tmp.path('models/lex.json'), ...force);
    expect([r.code, r.stderr]).toEqual([1, `lexlock build: ${tmp.path('models/lex.json')} is a symbolic link to ${target}${SUFFIX} ${target} itself as the output\n`]);
    expect(await readFile(target, 'utf8')).toBe('someone else\'s file');
    expect(await readlink(tmp.path('models/lex.json'))).toBe(target);
  });

  it('encode --force into a folder whose ids.npy is a link to a file outside it', async () => {
    await corpusAndLexicon();
    await mkdir(tmp.path('out'));
    await writeFile(tmp.path('precious.bin'), 'not an array');
    await symlink(tmp.path('precious.bin'), tmp.path('out/ids.npy'));
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), '--force');
    expect([r.code, r.stderr]).toEqual([1, `lexlock encode: ${tmp.path('out/ids.npy')} is a symbolic link to ${tmp.path('precious.bin')}${SUFFIX} ${tmp.path('precious.bin')} itself as the output\n`]);
    expect(await readFile(tmp.path('precious.bin'), 'utf8')).toBe('not an array');
    expect((await lstat(tmp.path('out/ids.npy'))).isSymbolicLink()).toBe(true);
    expect(await readdir(tmp.path('out'))).toEqual(['ids.npy']); // no temporary file, nothing written
  });

  it('encode --force to a .jsonl link', async () => {
    await corpusAndLexicon();
    await writeFile(tmp.path('precious.txt'), 'keep');
    await symlink(tmp.path('precious.txt'), tmp.path('rows.jsonl'));
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('rows.jsonl'), '--force');
    expect([r.code, r.stderr]).toEqual([1, `lexlock encode: ${tmp.path('rows.jsonl')} is a symbolic link to ${tmp.path('precious.txt')}${SUFFIX} ${tmp.path('precious.txt')} itself as the output\n`]);
    expect(await readFile(tmp.path('precious.txt'), 'utf8')).toBe('keep');
  });
});

describe('interruptedLine', () => {
  it.each([
    ['SIGINT', ['lex.json'], [], 'lexlock: interrupted (SIGINT); nothing was written to lex.json\n'],
    ['SIGINT', ['out/ids.npy', 'out/lengths.npy'], [], 'lexlock: interrupted (SIGINT); nothing was written to out/ids.npy, out/lengths.npy\n'],
    ['SIGTERM', [], [], 'lexlock: interrupted (SIGTERM); no file was being written\n'],
    ['SIGINT', ['lex.json'], ['.lex.json.7.0123456789ab.tmp (EACCES: permission denied)'], 'lexlock: interrupted (SIGINT); nothing was written to lex.json; could not remove .lex.json.7.0123456789ab.tmp (EACCES: permission denied): delete it by hand\n'],
    ['SIGTERM', [], ['a.tmp (EBUSY: resource busy or locked)', 'b.tmp (EPERM: operation not permitted)'], 'lexlock: interrupted (SIGTERM); no file was being written; could not remove a.tmp (EBUSY: resource busy or locked), b.tmp (EPERM: operation not permitted): delete them by hand\n'],
  ] as const)('%s, untouched %j, not removed %j', (signal, untouched, notRemoved, line) => {
    expect(interruptedLine(signal, untouched, notRemoved)).toBe(line);
  });

  it.each([
    [[], ['enc/out', 'lex.json'], 'lexlock: interrupted (SIGINT); enc/out, lex.json were written in full before it\n'],
    [[], ['report.html'], 'lexlock: interrupted (SIGINT); report.html was written in full before it\n'],
    [['lex.json'], ['rows.jsonl'], 'lexlock: interrupted (SIGINT); nothing was written to lex.json; rows.jsonl was written in full before it\n'],
  ] as const)('names what was already written: untouched %j, written %j', (untouched, written, line) => {
    expect(interruptedLine('SIGINT', untouched, [], written)).toBe(line);
  });
});
