import { readdir, readFile, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { tempFolder } from '../helpers/tempFolder.js';
import { inventedWord } from './inventedWord.js';
import { MAIL_LABELS, MAIL_MEAN_BYTES, mailMessage, writeMailCorpus } from './mailCorpus.js';
import { reviewRow, writeReviewCsv } from './reviewCsv.js';
import { seededRandom } from './seededRandom.js';
import { writeZipfText } from './zipfText.js';
import { zipfRank } from './zipfRank.js';

async function filesOf(folder: string): Promise<string[]> {
  const out: string[] = [];
  for (const label of await readdir(folder)) for (const file of await readdir(join(folder, label))) out.push(`${label}/${file}`);
  return out.sort();
}

describe('benchmark corpus generators', () => {
  let folder: Awaited<ReturnType<typeof tempFolder>>;
  beforeEach(async () => {
    folder = await tempFolder();
  });
  afterEach(() => folder.remove());
  const temp = () => folder.dir;

  it('the seeded generator repeats per seed and differs between seeds', () => {
    const draw = (seed: number) => Array.from({ length: 5 }, seededRandom(seed));
    expect(draw(3)).toEqual(draw(3));
    expect(draw(3)).not.toEqual(draw(4));
  });

  it('gives every rank its own word', () => {
    const words = new Set(Array.from({ length: 50_000 }, (_, i) => inventedWord(i)));
    expect(words.size).toBe(50_000);
  });

  it('draws Zipf ranks in range, rank 1 the most common', () => {
    const random = seededRandom(9);
    const counts = new Map<number, number>();
    for (let i = 0; i < 20_000; i++) {
      const r = zipfRank(random, 1000, 1.1);
      counts.set(r, (counts.get(r) ?? 0) + 1);
    }
    expect([...counts.keys()].every((r) => Number.isInteger(r) && r >= 1 && r <= 1000)).toBe(true);
    expect(counts.get(1) ?? 0).toBeGreaterThan(counts.get(10) ?? 0);
  });

  it('writes the stated number of mail files, the same bytes for the same seed', async () => {
    const a = join(temp(), 'a');
    const b = join(temp(), 'b');
    const written = await writeMailCorpus(a, { files: 300, seed: 5 });
    await writeMailCorpus(b, { files: 300, seed: 5 });
    const files = await filesOf(a);
    expect(files).toHaveLength(300);
    expect(files).toEqual(await filesOf(b));
    expect(files.every((f) => MAIL_LABELS.includes(f.split('/')[0] ?? ''))).toBe(true);
    let bytes = 0;
    for (const f of files) {
      const one = await readFile(join(a, f));
      expect(one.equals(await readFile(join(b, f)))).toBe(true);
      bytes += one.byteLength;
    }
    expect(bytes).toBe(written.bytes);
    expect(bytes / 300).toBeGreaterThan(MAIL_MEAN_BYTES * 0.85);
    expect(bytes / 300).toBeLessThan(MAIL_MEAN_BYTES * 1.15);
    expect(mailMessage(seededRandom(6))).not.toBe(mailMessage(seededRandom(5)));
  });

  it('writes a review CSV with a header and the stated rows, the same for the same seed', async () => {
    const path = join(temp(), 'r.csv');
    const again = join(temp(), 'r2.csv');
    const written = await writeReviewCsv(path, { rows: 400, seed: 2 });
    await writeReviewCsv(again, { rows: 400, seed: 2 });
    const text = await readFile(path, 'utf8');
    expect(text).toBe(await readFile(again, 'utf8'));
    expect(text.startsWith('id,stars,text\n')).toBe(true);
    expect(written).toEqual({ documents: 400, bytes: (await stat(path)).size });
    const random = seededRandom(2);
    const rows = Array.from({ length: 400 }, (_, i) => reviewRow(random, i + 1));
    expect(text).toBe(`id,stars,text\n${rows.join('\n')}\n`);
  });

  it('writes at least the stated bytes of Zipf text, stopping at the next line end, the same for the same seed', async () => {
    const path = join(temp(), 'z.txt');
    const again = join(temp(), 'z2.txt');
    const written = await writeZipfText(path, { bytes: 300_000, seed: 8, ranks: 1_000_000 });
    expect(await writeZipfText(again, { bytes: 300_000, seed: 8, ranks: 1_000_000 })).toEqual(written);
    const text = await readFile(path, 'utf8');
    expect(text).toBe(await readFile(again, 'utf8'));
    expect(written.bytes).toBe(Buffer.byteLength(text));
    expect(written.bytes).toBeGreaterThanOrEqual(300_000);
    expect(written.bytes).toBeLessThan(300_000 + 2_000);
    const lines = text.split('\n').slice(0, -1);
    expect(lines).toHaveLength(written.documents);
    expect(new Set(lines.join(' ').split(' ')).size).toBe(written.distinctTokens);
  });
});
