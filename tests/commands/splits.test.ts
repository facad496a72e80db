// Keys and stable splits end to end (issue 14, points 1, 3 and 5). Outside checks:
// - round trip by key: the outputs read back with general-purpose readers (npyjs for .npy, JSON.parse
//   for .jsonl) and joined by key give exactly the documents a plain RFC 4180 reader written here reads,
//   each encoded by the library's Lexicon.encode;
// - shares: the binomial bound |k - np| <= 4 sqrt(np(1 - p)) (four standard deviations of a binomial
//   count; the normal approximation, common practice), overall and within every label. The seed is
//   fixed, so every assignment is too: these checks pass or fail for good, never by chance.
import { readdir, readFile, writeFile, mkdir } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import npyjs from 'npyjs';
import { describe, expect, it } from 'vitest';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import type { Lexicon } from '../../src/lexicon/Lexicon.js';
import { realFileSystem, replaceFileSystem } from '../../src/files/fileSystem.js';
import { splitOf } from '../../src/split/splitOf.js';
import { cli, freshFolderEachTest } from '../helpers/cli.js';
import { plainCsv } from '../helpers/plainCsv.js';

const demo = new URL('../../corpora-demo/ferry-messages.csv', import.meta.url).pathname;
const SPLITS = [
  { name: 'train', share: 0.8 },
  { name: 'valid', share: 0.1 },
  { name: 'test', share: 0.1 },
];
const tmp = freshFolderEachTest();

/** The demo corpus as the plain reader reads it: id, text, topic of every data row. */
async function demoDocuments(): Promise<Array<{ id: string; text: string; topic: string }>> {
  const [header, ...rows] = plainCsv(await readFile(demo, 'utf8'));
  expect(header).toEqual(['id', 'text', 'topic', 'sentiment']);
  return rows.map(([id, text, topic]) => ({ id: id as string, text: text as string, topic: topic as string }));
}

function readNpy(bytes: Buffer): { data: number[]; shape: number[] } {
  const parsed = new npyjs().parse(new Uint8Array(bytes).buffer);
  return { data: Array.from(parsed.data as Int32Array), shape: parsed.shape };
}

/** The binomial bound named above. */
function withinBinomial(k: number, n: number, p: number): boolean {
  return Math.abs(k - n * p) <= 4 * Math.sqrt(n * p * (1 - p));
}

/** Every row of an encoded folder, by key: ids, length, label id. */
async function folderRows(folder: string): Promise<Map<string, { ids: number[]; length: number; label: number }>> {
  const ids = readNpy(await readFile(join(folder, 'ids.npy')));
  const lengths = readNpy(await readFile(join(folder, 'lengths.npy'))).data;
  const labels = readNpy(await readFile(join(folder, 'labels.npy'))).data;
  const keys = (await readFile(join(folder, 'keys.jsonl'), 'utf8')).split('\n').slice(0, -1).map((line) => JSON.parse(line) as string);
  const width = ids.shape[1] as number;
  expect([ids.shape[0], lengths.length, labels.length]).toEqual([keys.length, keys.length, keys.length]);
  const rows = new Map<string, { ids: number[]; length: number; label: number }>();
  keys.forEach((key, i) => rows.set(key, { ids: ids.data.slice(i * width, (i + 1) * width), length: lengths[i] as number, label: labels[i] as number }));
  return rows;
}

async function buildDemoLexicon(path: string): Promise<Lexicon> {
  const built = await cli('build', demo, '-o', path, '--label', 'topic', '--cap', '2000', '--length', '24', '--pad', 'start');
  expect([built.code, built.stderr]).toEqual([0, '']);
  return parseLexicon(await readFile(path, 'utf8'));
}

describe('encode --split into a folder', () => {
  it('round trip by key: the split folders joined by key are the documents a plain reader reads, each in the split of its key', async () => {
    await mkdir(tmp.path('models'));
    await mkdir(tmp.path('data'));
    const lexicon = await buildDemoLexicon(tmp.path('models/lex.json'));
    const out = tmp.path('data/enc');
    const r = await cli('encode', demo, '--lexicon', tmp.path('models/lex.json'), '-o', out, '--key', 'id', '--split', 'train=0.8,valid=0.1,test=0.1', '--seed', '7', '--threads', '2');
    expect([r.code, r.stderr]).toEqual([0, '']);
    expect((await readdir(out)).sort()).toEqual(['test', 'train', 'valid']);
    const documents = await demoDocuments();
    expect(documents).toHaveLength(4000);
    const seen = new Set<string>();
    for (const { name } of SPLITS) {
      const folder = join(out, name);
      expect((await readdir(folder)).sort()).toEqual(['ids.npy', 'keys.jsonl', 'labels.npy', 'lengths.npy', 'manifest.json']);
      const rows = await folderRows(folder);
      for (const [key, row] of rows) {
        expect(seen.has(key), `${key} is in two splits`).toBe(false);
        seen.add(key);
        expect(splitOf(key, SPLITS, 7)).toBe(name);
      }
      for (const d of documents.filter((doc) => splitOf(doc.id, SPLITS, 7) === name)) {
        const row = rows.get(d.id);
        expect(row, d.id).toBeDefined();
        expect(row?.ids).toEqual(Array.from(lexicon.encode(d.text)));
        expect(row?.length).toBe(Math.min(24, lexicon.encode(d.text, { shape: null }).length));
        expect(row?.label).toBe(lexicon.labels.indexOf(d.topic));
      }
      // The manifest names the lexicon relative to its own folder, wherever -o put it.
      const manifest = JSON.parse(await readFile(join(folder, 'manifest.json'), 'utf8'));
      expect(manifest.lexicon.file).toBe('../../../models/lex.json');
      expect(resolve(folder, manifest.lexicon.file)).toBe(tmp.path('models/lex.json'));
      expect(manifest.split).toEqual({ name, seed: 7, hash: 'sha256', splits: SPLITS });
      expect([manifest.keyField, manifest.badText, manifest.rows]).toEqual(['id', 'fail', rows.size]);
      expect(manifest.files).toEqual({ ids: 'ids.npy', lengths: 'lengths.npy', labels: 'labels.npy', keys: 'keys.jsonl' });
    }
    expect(seen.size).toBe(4000);
  });

  it('meets the shares overall and within every label, within the binomial bound; summary, --json and manifests agree', async () => {
    const lexicon = await buildDemoLexicon(tmp.path('lex.json'));
    const r = await cli('encode', demo, '--lexicon', tmp.path('lex.json'), '-o', tmp.path('enc'), '--key', 'id', '--split', 'train=0.8,valid=0.1,test=0.1', '--json');
    expect([r.code, r.stderr]).toEqual([0, '']);
    const json = JSON.parse(r.stdout);
    expect(json.rows).toBe(4000);
    expect(json.split.seed).toBe(0);
    expect(json.split.parts.map((p: { name: string; share: number; output: string }) => [p.name, p.share, p.output])).toEqual(SPLITS.map((s) => [s.name, s.share, join(tmp.path('enc'), s.name)]));
    const documents = await demoDocuments();
    const perLabel = lexicon.labels.map((l) => documents.filter((d) => d.topic === l).length);
    expect(json.labelRows).toEqual(perLabel);
    for (const [i, { name, share }] of SPLITS.entries()) {
      const part = json.split.parts[i];
      const manifest = JSON.parse(await readFile(tmp.path(`enc/${name}/manifest.json`), 'utf8'));
      expect([manifest.rows, manifest.labelRows, manifest.labels]).toEqual([part.rows, part.labelRows, lexicon.labels]);
      expect(withinBinomial(part.rows, 4000, share), `${name}: ${part.rows} of 4000`).toBe(true);
      lexicon.labels.forEach((label, l) => {
        expect(withinBinomial(part.labelRows[l], perLabel[l] as number, share), `${name}, ${label}: ${part.labelRows[l]} of ${perLabel[l]}`).toBe(true);
      });
    }
    // The parts add up to the whole, label by label.
    expect(lexicon.labels.map((_, l) => json.split.parts.reduce((sum: number, p: { labelRows: number[] }) => sum + (p.labelRows[l] as number), 0))).toEqual(perLabel);
    const text = await cli('encode', demo, '--lexicon', tmp.path('lex.json'), '-o', tmp.path('enc'), '--key', 'id', '--split', 'train=0.8,valid=0.1,test=0.1', '--force');
    const parts = json.split.parts as Array<{ name: string; rows: number; labelRows: number[] }>;
    const shares = parts.map((p) => `${p.name} ${p.rows.toLocaleString('en-US')} \\(\\d+\\.\\d\\d %\\)`).join(', ');
    expect(text.stdout).toMatch(new RegExp(`\nsplit    seed 0: ${shares}\n`));
    expect(text.stdout).toContain(`\n         valid: ${lexicon.labels.map((l, i) => `${l} ${parts[1]?.labelRows[i]}`).join(', ')}\n`);
  });

  it('keeps every document in its split when the corpus grows and is reordered', async () => {
    await buildDemoLexicon(tmp.path('lex.json'));
    const [header, ...lines] = (await readFile(demo, 'utf8')).split(/\n(?=m\d{4},)/);
    // Half of the corpus, then all of it backwards with 50 new documents among them.
    await writeFile(tmp.path('half.csv'), `${[header, ...lines.slice(0, 2000)].join('\n').trimEnd()}\n`);
    const fresh = Array.from({ length: 50 }, (_, i) => `n${String(i).padStart(4, '0')},the new pier at Tiverack ${i},praise,positive`);
    await writeFile(tmp.path('grown.csv'), `${[header, ...fresh, ...lines.map((l) => l.trimEnd()).reverse()].join('\n')}\n`);
    const splitOfKey = new Map<string, string>();
    for (const corpus of ['half.csv', 'grown.csv']) {
      const r = await cli('encode', tmp.path(corpus), '--lexicon', tmp.path('lex.json'), '-o', tmp.path(`${corpus}-out/rows.jsonl`), '--key', 'id', '--split', 'train=0.8,valid=0.1,test=0.1');
      expect([r.code, r.stderr]).toEqual([0, '']);
      let rows = 0;
      for (const { name } of SPLITS) {
        for (const line of (await readFile(tmp.path(`${corpus}-out/${name}.jsonl`), 'utf8')).split('\n').slice(0, -1)) {
          const { key } = JSON.parse(line) as { key: string };
          rows += 1;
          if (corpus === 'half.csv') splitOfKey.set(key, name);
          else if (splitOfKey.has(key)) expect(name, key).toBe(splitOfKey.get(key));
        }
      }
      expect(rows).toBe(corpus === 'half.csv' ? 2000 : 4050);
    }
    expect(splitOfKey.size).toBe(2000);
  });
});

describe('encode --split into .jsonl files', () => {
  it('writes train.jsonl … in the folder of the name given, rows keyed by data-row number, the same on 1 and 2 threads', async () => {
    const lexicon = await buildDemoLexicon(tmp.path('lex.json'));
    await mkdir(tmp.path('one'));
    await mkdir(tmp.path('two'));
    for (const [folder, threads] of [['one', '1'], ['two', '2']] as const) {
      const r = await cli('encode', demo, '--lexicon', tmp.path('lex.json'), '-o', tmp.path(`${folder}/rows.jsonl`), '--split', 'train=0.8,valid=0.1,test=0.1', '--threads', threads);
      expect([r.code, r.stderr]).toEqual([0, '']);
      expect(r.stdout.split('\n')[0]).toBe(`wrote ${SPLITS.map((s) => tmp.path(`${folder}/${s.name}.jsonl`)).join(', ')}`);
      expect((await readdir(tmp.path(folder))).sort()).toEqual(['test.jsonl', 'train.jsonl', 'valid.jsonl']);
    }
    for (const { name } of SPLITS) expect((await readFile(tmp.path(`one/${name}.jsonl`))).equals(await readFile(tmp.path(`two/${name}.jsonl`)))).toBe(true);
    const documents = await demoDocuments();
    const byKey = new Map<string, { ids: number[]; length: number; label: number; split: string }>();
    for (const { name } of SPLITS) {
      for (const line of (await readFile(tmp.path(`one/${name}.jsonl`), 'utf8')).split('\n').slice(0, -1)) {
        const row = JSON.parse(line) as { ids: number[]; length: number; label: number; key: string };
        expect(byKey.has(row.key)).toBe(false);
        byKey.set(row.key, { ids: row.ids, length: row.length, label: row.label, split: name });
      }
    }
    expect(byKey.size).toBe(4000);
    documents.forEach((d, i) => {
      const key = String(i + 1); // the data-row number: the header is row 0
      const row = byKey.get(key);
      expect(row?.ids).toEqual(Array.from(lexicon.encode(d.text)));
      expect(row?.label).toBe(lexicon.labels.indexOf(d.topic));
      expect(row?.split).toBe(splitOf(key, SPLITS, 0));
    });
  });

  it('is all or nothing: when the last file cannot be put in place, the ones before it go back to what they were', async () => {
    await buildDemoLexicon(tmp.path('lex.json'));
    const flags = ['--lexicon', tmp.path('lex.json'), '-o', tmp.path('rows.jsonl'), '--split', 'train=0.8,valid=0.1,test=0.1', '--force'];
    expect((await cli('encode', demo, ...flags)).code).toBe(0);
    const before = await Promise.all(SPLITS.map((s) => readFile(tmp.path(`${s.name}.jsonl`))));
    // A rename refused (EACCES, as rename(2) may answer; Linux man-pages), for test.jsonl only.
    const restore = replaceFileSystem({
      renameSync: (from, to) => {
        if (String(to).endsWith('test.jsonl')) throw Object.assign(new Error('EACCES: permission denied, rename'), { code: 'EACCES', syscall: 'rename' });
        realFileSystem.renameSync(from, to);
      },
    });
    let r;
    try {
      r = await cli('encode', demo, ...flags, '--seed', '5');
    } finally {
      restore();
    }
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/^lexlock encode: .*test\.jsonl: not written: /);
    const after = await Promise.all(SPLITS.map((s) => readFile(tmp.path(`${s.name}.jsonl`))));
    after.forEach((bytes, i) => expect(bytes.equals(before[i] as Buffer), SPLITS[i]?.name).toBe(true));
    expect((await readdir(tmp.dir)).sort()).toEqual(['lex.json', 'test.jsonl', 'train.jsonl', 'valid.jsonl']);
  });

  it('is all or nothing: an existing split file without --force stops the run before anything is written', async () => {
    await buildDemoLexicon(tmp.path('lex.json'));
    await writeFile(tmp.path('valid.jsonl'), 'old\n');
    const r = await cli('encode', demo, '--lexicon', tmp.path('lex.json'), '-o', tmp.path('rows.jsonl'), '--split', 'train=0.8,valid=0.1,test=0.1');
    expect([r.code, r.stderr]).toEqual([1, `lexlock encode: ${tmp.path('valid.jsonl')} already exists; pass --force to overwrite it\n`]);
    expect((await readdir(tmp.dir)).sort()).toEqual(['lex.json', 'valid.jsonl']);
  });
});

describe('--split, --seed and --key refusals', () => {
  it.each([
    [['--split', 'train=0.8,test=0.1'], 2, '--split: the shares add up to 0.9, not 1 (train 0.8, test 0.1); make them add up to 1'],
    [['--split', 'train=0.5,Train=0.5'], 2, '--split: "Train" is named twice (as "train": letter case aside, one file name); give every part a name of its own'],
    [['--split', '../up=1'], 2, '--split: "../up" cannot name a part: it names a file or folder, so use letters, digits, -, _ and . (first a letter or digit), at most 64 characters'],
    [['--seed', '3'], 2, '--seed goes with --split: it picks how documents fall into the splits; add --split, or leave out --seed'],
    [['--split', 'a=0.5,b=0.5', '--seed', '-1'], 2, '--seed: "-1" is not a whole number from 0 to 2^53 - 1 (9007199254740991)'],
    [['--split', 'a=0.5,b=0.5', '--seed', '9007199254740992'], 2, '--seed: "9007199254740992" is not a whole number from 0 to 2^53 - 1 (9007199254740991)'],
  ])('encode %j: exit %i', async (flags, code, message) => {
    await writeFile(tmp.path('m.csv'), 'id,text\na,late ferry\n');
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--length', '4');
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), ...flags);
    expect([r.code, r.stderr]).toEqual([code, `lexlock encode: ${message}\n`]);
    expect((await readdir(tmp.dir)).sort()).toEqual(['lex.json', 'm.csv']);
  });

  it('an output that is the corpus or the lexicon is a usage error, --force or not', async () => {
    await writeFile(tmp.path('train.jsonl'), '{"text":"late ferry"}\n');
    await cli('build', tmp.path('train.jsonl'), '-o', tmp.path('lex.json'));
    const split = await cli('encode', tmp.path('train.jsonl'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('rows.jsonl'), '--split', 'train=0.5,test=0.5', '--force');
    expect([split.code, split.stderr]).toEqual([2, `lexlock encode: --output: ${tmp.path('train.jsonl')} is the corpus being read; name another output\n`]);
    const same = await cli('encode', tmp.path('train.jsonl'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('train.jsonl'), '--force');
    expect([same.code, same.stderr]).toEqual([2, `lexlock encode: --output: ${tmp.path('train.jsonl')} is the corpus being read; name another output\n`]);
    expect(await readFile(tmp.path('train.jsonl'), 'utf8')).toBe('{"text":"late ferry"}\n');
  });

  it('a duplicate key stops encode with exit 1 naming both places, and nothing is written', async () => {
    await writeFile(tmp.path('m.csv'), 'id,text\nA-1,late ferry\nA-2,kind crew\nA-1,late again\n');
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--length', '4');
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), '--key', 'id');
    expect([r.code, r.stderr]).toEqual([
      1,
      `lexlock encode: ${tmp.path('m.csv')} line 4 (row 3): key "A-1" (field "id") is also the key of ${tmp.path('m.csv')} line 2; keys must be unique, so that every row traces back to one document: fix one of the two, or leave out --key to number the rows\n`,
    ]);
    expect((await readdir(tmp.dir)).sort()).toEqual(['lex.json', 'm.csv']);
  });

  it('--key on a .txt corpus is a usage error; on build it goes with --encode', async () => {
    await writeFile(tmp.path('m.txt'), 'late ferry\n');
    await cli('build', tmp.path('m.txt'), '-o', tmp.path('lex.json'), '--length', '4');
    const r = await cli('encode', tmp.path('m.txt'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), '--key', 'id');
    expect([r.code, r.stderr]).toEqual([2, `lexlock encode: ${tmp.path('m.txt')}: --key cannot be used here: a .txt corpus has no fields; its keys are line numbers; leave out --key, or use a .csv, .tsv or .jsonl corpus\n`]);
    const b = await cli('build', tmp.path('m.txt'), '-o', tmp.path('other.json'), '--key', 'id');
    expect([b.code, b.stderr]).toEqual([2, 'lexlock build: --key goes with --encode: it names the field that keys the encoded rows; add --encode OUT, or leave out --key\n']);
  });

  it('build --encode --key keeps the keys, as encode --key does', async () => {
    await writeFile(tmp.path('m.csv'), 'id,text,topic\nm-7,late ferry,delays\nm-3,kind crew,praise\n');
    const b = await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--length', '4', '--key', 'id', '--encode', tmp.path('one'));
    expect([b.code, b.stderr]).toEqual([0, '']);
    expect(b.stdout).toContain('\nkeys     field "id"\n');
    const e = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('two'), '--key', 'id');
    expect([e.code, e.stderr]).toEqual([0, '']);
    for (const name of ['ids.npy', 'lengths.npy', 'labels.npy', 'keys.jsonl']) expect((await readFile(tmp.path(`one/${name}`))).equals(await readFile(tmp.path(`two/${name}`)))).toBe(true);
    expect(await readFile(tmp.path('one/keys.jsonl'), 'utf8')).toBe('"m-7"\n"m-3"\n');
  });

  it('--force replaces an earlier split output, but not a folder that holds other things', async () => {
    await writeFile(tmp.path('m.csv'), 'id,text\na,late ferry\nb,kind crew\nc,lost bag\n');
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--length', '4');
    const split = ['--split', 'x=0.5,y=0.5'];
    expect((await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), ...split)).code).toBe(0);
    const again = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), '--force');
    expect([again.code, again.stderr]).toEqual([0, '']);
    expect((await readdir(tmp.path('out'))).sort()).toEqual(['ids.npy', 'keys.jsonl', 'lengths.npy', 'manifest.json']);
    expect((await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), ...split, '--force')).code).toBe(0);
    await writeFile(tmp.path('out/x/notes.txt'), 'mine');
    const refused = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), ...split, '--force');
    expect([refused.code, refused.stderr]).toEqual([1, `lexlock encode: ${tmp.path('out')} holds files an encode does not write (x); the folder is replaced whole, so move them elsewhere or name another folder\n`]);
    expect(await readFile(tmp.path('out/x/notes.txt'), 'utf8')).toBe('mine');
  });
});
