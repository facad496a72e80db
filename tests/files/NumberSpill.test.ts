import { readdir, stat, truncate } from 'node:fs/promises';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { NumberSpill, type SpilledDocument } from '../../src/files/NumberSpill.js';
import { isLexlockError } from '../../src/LexlockError.js';
import { freshFolderEachTest } from '../helpers/cli.js';

const tmp = freshFolderEachTest();

async function readBack(spill: NumberSpill): Promise<Array<{ label: number; group: number; numbers: number[]; key: string }>> {
  const out: Array<{ label: number; group: number; numbers: number[]; key: string }> = [];
  for await (const d of spill.documents()) out.push({ label: d.label, group: d.group, numbers: Array.from(d.numbers), key: d.key });
  return out;
}

/** Any UTF-16 string, lone surrogates included (a JSONL key may hold one). */
const anyKey = fc.array(fc.integer({ min: 0, max: 0xffff }), { maxLength: 20 }).map((units) => String.fromCharCode(...units));

// Common practice: a spill file must give back exactly what was written, in the same order.
describe('NumberSpill', () => {
  it('gives back every document, label, numbers and key, in the order added (fast-check)', async () => {
    let run = 0;
    await fc.assert(
      fc.asyncProperty(fc.array(fc.record({ label: fc.integer({ min: -1, max: 9 }), group: fc.integer({ min: 0, max: 2 ** 31 - 1 }), numbers: fc.array(fc.integer({ min: 0, max: 2 ** 31 - 1 }), { maxLength: 40 }), key: anyKey }), { maxLength: 60 }), async (docs) => {
        const spill = await NumberSpill.create(tmp.path(`spill-${run++}`));
        try {
          for (const d of docs) {
            // The caller's array may be longer than the document and is reused: only `length` counts.
            const scratch = Int32Array.from([...d.numbers, 7, 7, 7]);
            await spill.add(d.label, d.group, scratch, d.numbers.length, d.key);
            scratch.fill(-5);
          }
          expect(await readBack(spill)).toEqual(docs);
        } finally {
          await spill.remove();
        }
      }),
      { numRuns: 60 },
    );
  });

  it('keeps a document longer than a block whole, between shorter ones', async () => {
    const spill = await NumberSpill.create(tmp.path('big'));
    const big = Int32Array.from({ length: (1 << 20) + 3 }, (_, i) => i);
    const longKey = 'k'.repeat(20_001); // more code units than String.fromCharCode is given at a time
    await spill.add(0, 0, Int32Array.of(1, 2), 2, 'a');
    await spill.add(4, 1, big, big.length, longKey);
    await spill.add(-1, 0, Int32Array.of(), 0, '');
    await spill.add(2, 7, Int32Array.of(9), 1, 'mail/ü.txt');
    const docs: SpilledDocument[] = [];
    for await (const d of spill.documents()) docs.push({ label: d.label, group: d.group, numbers: d.numbers.slice(), key: d.key });
    expect(docs.map((d) => [d.label, d.group, d.numbers.length, d.key])).toEqual([[0, 0, 2, 'a'], [4, 1, big.length, longKey], [-1, 0, 0, ''], [2, 7, 1, 'mail/ü.txt']]);
    const second = docs[1]?.numbers ?? new Int32Array();
    expect(Buffer.from(second.buffer, second.byteOffset, second.byteLength).equals(Buffer.from(big.buffer))).toBe(true);
    expect(Array.from(docs[3]?.numbers ?? [])).toEqual([9]);
    await spill.remove();
  });

  it('says so when the file was cut short behind its back', async () => {
    const path = tmp.path('cut');
    const spill = await NumberSpill.create(path);
    await spill.add(1, 0, Int32Array.of(1, 2, 3, 4), 4, '');
    const reading = spill.documents();
    await reading.next().catch(() => undefined); // writes the block, then reads it back
    await truncate(path, 10);
    const again = spill.documents();
    let error: unknown;
    try {
      await again.next();
    } catch (e) {
      error = e;
    }
    expect(isLexlockError(error) && error.code).toBe('IO');
    expect((error as Error).message).toBe(`${path}: the temporary file of token numbers does not hold what was written to it: it ended early (6 of 32 bytes at 4); is the disk failing, or did something else write to it?`);
    await spill.remove();
  });

  it('refuses to create over an existing file, and remove deletes the file', async () => {
    const path = tmp.path('one');
    const spill = await NumberSpill.create(path);
    expect((await stat(path)).isFile()).toBe(true);
    let error: unknown;
    try {
      await NumberSpill.create(path);
    } catch (e) {
      error = e;
    }
    expect(isLexlockError(error) && error.code).toBe('IO');
    expect((error as Error).message).toBe(
      `${path}: not written: something is already there (EEXIST while creating a temporary file of token numbers); name another output, or move what is there away`,
    );
    await spill.remove();
    expect(await readdir(tmp.dir)).toEqual([]);
  });
  it('says so when a block holds fewer documents than were added', async () => {
    const path = tmp.path('short');
    const spill = await NumberSpill.create(path);
    await spill.add(1, 0, Int32Array.of(5, 6), 2, '');
    await spill.add(2, 0, Int32Array.of(7), 1, '');
    const reading = spill.documents();
    await reading.next(); // writes the block
    await reading.return(undefined);
    const { open } = await import('node:fs/promises');
    const readAll = async (): Promise<string> => {
      try {
        for await (const _ of spill.documents()) void _;
      } catch (e) {
        return (e as Error).message;
      }
      return 'no error';
    };
    const prefix = `${path}: the temporary file of token numbers does not hold what was written to it: `;
    const suffix = '; is the disk failing, or did something else write to it?';
    // Behind its back, the block's length (the first 4 bytes) is changed: each way is refused.
    for (const [length, what] of [
      [6, 'the document at byte 32 does not fit its block'], // the second document's label (2) then reads as a block's length
      [4, 'the document at byte 4 does not fit its block'],
      [-3, 'the block at byte 0 claims -3 numbers'],
      [1 << 30, `the block at byte 0 claims ${1 << 30} numbers`],
    ] as const) {
      const handle = await open(path, 'r+');
      await handle.write(new Uint8Array(Int32Array.of(length).buffer), 0, 4, 0);
      await handle.close();
      expect(await readAll()).toBe(`${prefix}${what}${suffix}`);
    }
    await spill.remove();
  });
});
