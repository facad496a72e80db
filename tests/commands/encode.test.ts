import { readdir, readFile, writeFile } from 'node:fs/promises';
import npyjs from 'npyjs';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { cli, tempFolder } from '../helpers/cli.js';

let tmp: Awaited<ReturnType<typeof tempFolder>>;
beforeEach(async () => {
  tmp = await tempFolder();
  // The lexicon is built from m.csv; held.csv adds a document with a label m.csv lacks.
  await writeFile(tmp.path('m.csv'), 'text,topic\n"The ferry was late, again",delays\nLovely crossing,praise\nLate late late,delays\n');
  await writeFile(tmp.path('held.csv'), 'text,topic\n"The ferry was late, again",delays\nLovely crossing,praise\nLate late late,delays\nunknown words here,refunds\n');
});
afterEach(async () => {
  await tmp.remove();
});

/** Reads an .npy file with the general-purpose npyjs reader. */
async function readNpy(path: string): Promise<{ data: number[]; shape: number[]; dtype: string }> {
  const bytes = await readFile(path);
  const parsed = new npyjs().parse(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
  return { data: Array.from(parsed.data as Int32Array), shape: parsed.shape, dtype: parsed.dtype };
}

describe('lexlock encode', () => {
  it('gives label weights n / (C · n_c) in the manifest, from the lexicon\'s label counts', async () => {
    // Worked by hand: m.csv has 2 "delays" and 1 "praise" documents, n = 3, C = 2 (labels in string
    // order: delays 0, praise 1): delays 3 / (2 · 2) = 0.75, praise 3 / (2 · 1) = 1.5.
    expect((await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--length', '4')).code).toBe(0);
    expect((await cli('encode', tmp.path('held.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'))).code).toBe(0);
    const manifest = JSON.parse(await readFile(tmp.path('out/manifest.json'), 'utf8'));
    expect([manifest.labels, manifest.labelWeights]).toEqual([['delays', 'praise'], [0.75, 1.5]]);
    expect((await cli('encode', tmp.path('held.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('bare'), '--no-labels')).code).toBe(0);
    expect(JSON.parse(await readFile(tmp.path('bare/manifest.json'), 'utf8')).labelWeights).toBeNull();
  });

  it('an unlabelled run over a labelled run\'s folder (--force) leaves no labels.npy behind', async () => {
    expect((await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--length', '4')).code).toBe(0);
    expect((await cli('encode', tmp.path('held.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'))).code).toBe(0);
    await writeFile(tmp.path('plain.txt'), 'late again\nlovely\n');
    const r = await cli('encode', tmp.path('plain.txt'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), '--force', '--no-labels');
    expect([r.code, r.stderr]).toEqual([0, '']);
    expect((await readdir(tmp.path('out'))).sort()).toEqual(['ids.npy', 'keys.jsonl', 'lengths.npy', 'manifest.json']);
    expect(JSON.parse(await readFile(tmp.path('out/manifest.json'), 'utf8')).files.labels).toBeNull();
  });

  it('writes ids.npy, lengths.npy, labels.npy and manifest.json with the lexicon shape', async () => {
    expect((await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--cap', '3', '--length', '4', '--pad', 'start')).code).toBe(0);
    const r = await cli('encode', tmp.path('held.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'));
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    // tokens: late=2 ','=3 again=4 (OOV 1). Rows hand-encoded, zeros at the start, 4 ids, long rows lose their end.
    const ids = await readNpy(tmp.path('out/ids.npy'));
    expect(ids.dtype).toBe('i4'); // npyjs reports the descr without its byte-order mark: little-endian int32
    expect(ids.shape).toEqual([4, 4]);
    expect(ids.data).toEqual([
      1, 1, 1, 2, // the ferry was late , again -> 6 tokens cut to the first 4
      0, 0, 1, 1, // lovely crossing
      0, 2, 2, 2, // late late late
      0, 1, 1, 1, // unknown words here
    ]);
    expect((await readNpy(tmp.path('out/lengths.npy'))).data).toEqual([4, 2, 3, 3]);
    expect((await readNpy(tmp.path('out/labels.npy'))).data).toEqual([0, 1, 0, -1]);
    const manifest = JSON.parse(await readFile(tmp.path('out/manifest.json'), 'utf8'));
    expect([manifest.format, manifest.formatVersion]).toEqual(['lexlock.encoded', 3]);
    expect(manifest.files).toEqual({ ids: 'ids.npy', lengths: 'lengths.npy', labels: 'labels.npy', keys: 'keys.jsonl' });
    expect([manifest.badText, manifest.keyField, manifest.split]).toEqual(['fail', null, null]);
    expect([manifest.labels, manifest.labelRows]).toEqual([['delays', 'praise'], [2, 1]]);
    expect(await readFile(tmp.path('out/keys.jsonl'), 'utf8')).toBe('"1"\n"2"\n"3"\n"4"\n');
    expect(manifest.shape).toEqual({ length: 4, pad: 'start', cut: 'end' });
    expect(manifest.rows).toBe(4);
    expect(manifest.unknownLabels).toBe(1);
    expect(manifest.replacedDocuments).toBe(0);
    expect(manifest.skippedDocuments).toBe(0);
    expect(manifest.truncatedDocuments).toBe(1);
    expect(manifest.lexicon.fingerprint).toMatch(/^sha256:/);
  });

  it('writes JSONL, variable length without a shape', async () => {
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--cap', '3');
    const r = await cli('encode', tmp.path('held.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out.jsonl'));
    expect(r.code).toBe(0);
    const lines = (await readFile(tmp.path('out.jsonl'), 'utf8')).trim().split('\n').map((l) => JSON.parse(l));
    expect(lines).toEqual([
      { ids: [1, 1, 1, 2, 3, 4], length: 6, label: 0, key: '1' },
      { ids: [1, 1], length: 2, label: 1, key: '2' },
      { ids: [2, 2, 2], length: 3, label: 0, key: '3' },
      { ids: [1, 1, 1], length: 3, label: -1, key: '4' },
    ]);
  });

  it('takes --length for a lexicon without a shape, and refuses it for one with a shape', async () => {
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('free.json'), '--cap', '3');
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('shaped.json'), '--cap', '3', '--length', '4');
    const ok = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('free.json'), '-o', tmp.path('out'), '--length', '2', '--cut', 'start');
    expect(ok.code).toBe(0);
    expect((await readNpy(tmp.path('out/ids.npy'))).data).toEqual([3, 4, 1, 1, 2, 2]);
    const refused = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('shaped.json'), '-o', tmp.path('out2'), '--length', '2');
    expect(refused.code).toBe(2);
    expect(refused.stderr).toBe(
      `lexlock encode: --length: ${tmp.path('shaped.json')} already fixes the shape (length 4; zeros at the end; long documents lose their end) as part of its fingerprint; drop --length, or build a lexicon without --length\n`,
    );
  });

  it('refuses .npy output without any length', async () => {
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('free.json'));
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('free.json'), '-o', tmp.path('out'));
    expect(r.code).toBe(2);
    expect(r.stderr).toBe(`lexlock encode: .npy output needs a fixed length and ${tmp.path('free.json')} has no shape; pass --length L (or write .jsonl for variable-length rows)\n`);
  });

  it('exits 1 naming the place of invalid UTF-8, and replaces or skips on request', async () => {
    await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--cap', '3');
    const bad = Buffer.concat([Buffer.from('text\nlate\nla'), Buffer.from([0xff]), Buffer.from('te\nlate\n')]);
    await writeFile(tmp.path('bad.csv'), bad);
    const failed = await cli('encode', tmp.path('bad.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('o.jsonl'));
    expect(failed.code).toBe(1);
    expect(failed.stderr).toContain(`${tmp.path('bad.csv')} line 3`);
    expect(failed.stderr).toContain('byte 12');
    const replaced = await cli('encode', tmp.path('bad.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('r.jsonl'), '--bad-text', 'replace');
    expect(replaced.code).toBe(0);
    expect(replaced.stdout).toContain('replaced  1 documents had invalid UTF-8 replaced');
    const skipped = await cli('encode', tmp.path('bad.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('s.jsonl'), '--bad-text', 'skip');
    expect(skipped.code).toBe(0);
    expect((await readFile(tmp.path('s.jsonl'), 'utf8')).trim().split('\n')).toHaveLength(2);
  });
});

describe('lexlock encode field defaults', () => {
  it('takes the label field from the lexicon for corpora with fields, and none for .txt', async () => {
    const dir = await tempFolder();
    try {
      await writeFile(dir.path('m.csv'), 'body,topic\nlate ferry,delays\nlovely crossing,praise\n');
      await writeFile(dir.path('m.txt'), 'late ferry\n');
      await cli('build', dir.path('m.csv'), '-o', dir.path('lex.json'), '--text', 'body', '--label', 'topic');
      expect((await cli('encode', dir.path('m.csv'), '--lexicon', dir.path('lex.json'), '-o', dir.path('a.jsonl'))).code).toBe(0);
      expect(JSON.parse((await readFile(dir.path('a.jsonl'), 'utf8')).split('\n')[1]!)).toEqual({ ids: [5, 2], length: 2, label: 1, key: '2' }); // crossing 2, ferry 3, late 4, lovely 5 (all once: string order)
      const txt = await cli('encode', dir.path('m.txt'), '--lexicon', dir.path('lex.json'), '-o', dir.path('b.jsonl'), '--no-labels');
      expect(txt.stderr).toBe('');
      expect(JSON.parse((await readFile(dir.path('b.jsonl'), 'utf8')).trim())).toEqual({ ids: [4, 3], length: 2, key: '1' });
    } finally {
      await dir.remove();
    }
  });
});
