import { readdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { caseFolders } from '../helpers/caseFolders.js';
import { BufferedAtomicFile } from '../../src/files/BufferedAtomicFile.js';

/** A fresh empty folder per test. */
const folder = caseFolders('buffered');

type Piece = { kind: 'bytes'; bytes: Uint8Array } | { kind: 'text'; text: string };
const piece: fc.Arbitrary<Piece> = fc.oneof(
  fc.uint8Array({ maxLength: 300 }).map((bytes) => ({ kind: 'bytes' as const, bytes })),
  // Full code points (no lone surrogates), so TextEncoder's UTF-8 (WHATWG Encoding Standard) is the reference.
  fc.string({ unit: 'grapheme', maxLength: 80 }).map((text) => ({ kind: 'text' as const, text })),
);

describe('BufferedAtomicFile', () => {
  it('writes the concatenation of what was appended, whatever the buffer size (property)', async () => {
    const dir = await folder();
    const path = join(dir, 'out.bin');
    await fc.assert(
      fc.asyncProperty(fc.array(piece, { maxLength: 40 }), fc.integer({ min: 1, max: 600 }), async (pieces, bufferBytes) => {
        const out = new BufferedAtomicFile(path, bufferBytes);
        const expected: number[] = [];
        const encoder = new TextEncoder();
        const scratch = new Uint8Array(300);
        for (const p of pieces) {
          if (p.kind === 'bytes') {
            // Appending from a reused scratch array checks the bytes are copied before append returns.
            const view = scratch.subarray(0, p.bytes.length);
            view.set(p.bytes);
            const done = out.append(view);
            scratch.fill(0xee);
            await done;
            expected.push(...p.bytes);
          } else {
            await out.appendText(p.text);
            expected.push(...encoder.encode(p.text));
          }
        }
        expect(out.size).toBe(expected.length);
        await out.commit();
        expect([...(await readFile(path))]).toEqual(expected);
        expect(await readdir(dir)).toEqual(['out.bin']);
      }),
      { numRuns: 60 },
    );
  });

  it('patches a header after later bytes were buffered', async () => {
    const dir = await folder();
    const path = join(dir, 'patched.bin');
    const out = new BufferedAtomicFile(path, 16);
    await out.append(new Uint8Array(8));
    await out.appendText('abcdefghijklmnopqrstuvwxyz');
    await out.patch(new Uint8Array([1, 2, 3, 4, 5, 6, 7, 8]), 0);
    await out.appendText('!');
    await out.commit();
    expect(await readFile(path, 'latin1')).toBe('\x01\x02\x03\x04\x05\x06\x07\x08abcdefghijklmnopqrstuvwxyz!');
  });

  it('abort leaves the old file and no temporary file', async () => {
    const dir = await folder();
    const path = join(dir, 'keep.txt');
    await writeFile(path, 'old');
    const out = new BufferedAtomicFile(path, 16);
    await out.appendText('a new text longer than one buffer of sixteen bytes');
    await out.abort();
    expect(await readFile(path, 'utf8')).toBe('old');
    expect(await readdir(dir)).toEqual(['keep.txt']);
  });

  it('reports a temporary file that cannot be made from ready()', async () => {
    const dir = await folder();
    const path = join(dir, 'missing', 'x.bin');
    const out = new BufferedAtomicFile(path);
    await expect(out.ready()).rejects.toMatchObject({ code: 'IO', where: { file: path } });
    await out.abort();
  });
});
