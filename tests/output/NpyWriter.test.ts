import { readdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import fc from 'fast-check';
import { parse } from 'npyjs';
import { describe, expect, it } from 'vitest';
import { caseFolders } from '../helpers/caseFolders.js';
import { npyBytes } from '../../src/output/npyBytes.js';
import { NpyWriter } from '../../src/output/NpyWriter.js';

// Outside checks: npyjs (a general-purpose NPY reader) reads the files back; the header layout is the
// NumPy NPY 1.0 specification (numpy.lib.format docs / NEP 1, from memory), see npyHeader.test.ts.

/** A fresh empty folder per test. */
const folder = caseFolders('npy');

async function readNpy(path: string): Promise<{ bytes: Uint8Array; shape: number[]; dtype: string; fortranOrder: boolean; data: number[] }> {
  const file = await readFile(path);
  const bytes = new Uint8Array(file);
  const parsed = parse(bytes.slice().buffer);
  return { bytes, shape: parsed.shape, dtype: parsed.dtype, fortranOrder: parsed.fortranOrder, data: [...(parsed.data as Int32Array)] };
}

const int32 = fc.integer({ min: -(2 ** 31), max: 2 ** 31 - 1 });

describe('NpyWriter', () => {
  it('streams rows one at a time into a file npyjs reads back as (rows, columns) <i4', async () => {
    const dir = await folder();
    const path = join(dir, 'ids.npy');
    const out = await NpyWriter.open(path, 4);
    const row = new Int32Array(4);
    for (let r = 0; r < 3; r++) {
      row.set([r, r + 10, -r, 7]); // the same array reused, as encodeCorpus does
      await out.appendRows(row);
    }
    expect(out.rows).toBe(3);
    await out.finish();
    const read = await readNpy(path);
    expect(read).toMatchObject({ shape: [3, 4], dtype: 'i4', fortranOrder: false, data: [0, 10, 0, 7, 1, 11, -1, 7, 2, 12, -2, 7] });
    expect(await readdir(dir)).toEqual(['ids.npy']);
  });

  it('patches the header to the real shape: the file equals the in-memory encoding byte for byte', async () => {
    // The reserved header (room for a 16-digit row count) is 128 bytes here, the same as the
    // minimal header of the final shape, so the streamed file is exactly npyBytes' output.
    const dir = await folder();
    const path = join(dir, 'ids.npy');
    const data = Int32Array.from({ length: 5 * 3 }, (_, i) => i * 1000 - 7);
    const out = new NpyWriter(path, 3);
    await out.appendRows(data.subarray(0, 6));
    await out.appendRows(data.subarray(6));
    await out.finish();
    expect([...(await readNpy(path)).bytes]).toEqual([...npyBytes(data, [5, 3])]);
    const header = Buffer.from((await readNpy(path)).bytes.subarray(0, 128)).toString('latin1');
    expect(header).toBe(`\x93NUMPY\x01\x00v\x00{'descr': '<i4', 'fortran_order': False, 'shape': (5, 3), }${' '.repeat(58)}\n`);
  });

  it.each([
    ['two dimensions', 6, [0, 6]],
    ['one dimension', null, [0]],
  ])('writes 0 rows in %s as a valid file', async (_what, columns, shape) => {
    const dir = await folder();
    const path = join(dir, 'empty.npy');
    const out = await NpyWriter.open(path, columns);
    await out.finish();
    const read = await readNpy(path);
    expect(read.shape).toEqual(shape);
    expect(read.data).toEqual([]);
    expect(read.bytes.byteLength).toBe(128);
  });

  it('writes one value a row for null columns: shape (R,)', async () => {
    const dir = await folder();
    const path = join(dir, 'lengths.npy');
    const out = await NpyWriter.open(path, null);
    await out.appendRows(new Int32Array([12]));
    await out.appendRows(new Int32Array([3, 0]));
    await out.finish();
    const read = await readNpy(path);
    expect(read.shape).toEqual([3]);
    expect(read.data).toEqual([12, 3, 0]);
    // dict with "(3,)" is 57 chars; 10 + 57 + 1 = 68 -> 128: 60 spaces (rules in npyHeader.test.ts).
    expect(Buffer.from(read.bytes.subarray(0, 128)).toString('latin1')).toBe(
      `\x93NUMPY\x01\x00v\x00{'descr': '<i4', 'fortran_order': False, 'shape': (3,), }${' '.repeat(60)}\n`,
    );
  });

  it('round-trips random int32 matrices appended in random pieces, whatever the buffer size (property)', async () => {
    const dir = await folder();
    const path = join(dir, 'random.npy');
    const matrix = fc
      .record({ rows: fc.nat(30), columns: fc.integer({ min: 1, max: 12 }), bufferBytes: fc.integer({ min: 1, max: 300 }) })
      .chain((m) =>
        fc.record({
          m: fc.constant(m),
          values: fc.array(int32, { minLength: m.rows * m.columns, maxLength: m.rows * m.columns }),
          cuts: fc.array(fc.nat(m.rows), { maxLength: 5 }),
        }),
      );
    await fc.assert(
      fc.asyncProperty(matrix, async ({ m, values, cuts }) => {
        const data = Int32Array.from(values);
        const out = new NpyWriter(path, m.columns, { bufferBytes: m.bufferBytes });
        const bounds = [...new Set([0, ...cuts, m.rows])].sort((a, b) => a - b);
        for (let i = 1; i < bounds.length; i++) {
          await out.appendRows(data.subarray((bounds[i - 1] ?? 0) * m.columns, (bounds[i] ?? 0) * m.columns));
        }
        await out.finish();
        const read = await readNpy(path);
        expect(read.shape).toEqual([m.rows, m.columns]);
        expect(read.dtype).toBe('i4');
        expect(read.data).toEqual(values);
        expect(read.bytes.byteLength).toBe(128 + 4 * values.length);
      }),
      { numRuns: 60 },
    );
    expect(await readdir(dir)).toEqual(['random.npy']);
  });

  it('handles many single rows across 1 MiB buffer boundaries', async () => {
    const dir = await folder();
    const path = join(dir, 'big.npy');
    const columns = 100;
    const rows = 3000; // 1.2 MB of ids: more than one default buffer
    const out = await NpyWriter.open(path, columns);
    const row = new Int32Array(columns);
    for (let r = 0; r < rows; r++) {
      row.fill(r);
      await out.appendRows(row);
    }
    await out.finish();
    const read = await readNpy(path);
    expect(read.shape).toEqual([rows, columns]);
    expect(read.data.length).toBe(rows * columns);
    expect(read.data[0]).toBe(0);
    expect(read.data[columns * 1234 + 5]).toBe(1234);
    expect(read.data[rows * columns - 1]).toBe(rows - 1);
  });

  it('abort leaves the old file intact and no temporary file', async () => {
    const dir = await folder();
    const path = join(dir, 'ids.npy');
    await writeFile(path, 'old');
    const out = await NpyWriter.open(path, 2);
    await out.appendRows(new Int32Array(2 * 100_000));
    await out.abort();
    expect(await readFile(path, 'utf8')).toBe('old');
    expect(await readdir(dir)).toEqual(['ids.npy']);
  });

  it.each([
    [0, 'NPY columns must be a whole number from 1 up, or null for one dimension; got 0'],
    [-2, 'NPY columns must be a whole number from 1 up, or null for one dimension; got -2'],
    [2.5, 'NPY columns must be a whole number from 1 up, or null for one dimension; got 2.5'],
  ])('refuses %d columns with NPY_SHAPE', (columns, tail) => {
    expect(() => new NpyWriter('x.npy', columns)).toThrow(expect.objectContaining({ code: 'NPY_SHAPE', message: `x.npy: ${tail}` }));
  });

  it('refuses a partial row with NPY_SHAPE and stays usable', async () => {
    const dir = await folder();
    const path = join(dir, 'ids.npy');
    const out = await NpyWriter.open(path, 4);
    await expect(out.appendRows(new Int32Array(6))).rejects.toMatchObject({
      code: 'NPY_SHAPE',
      message: `${path}: 6 ids do not make whole rows of 4; pass a multiple of 4`,
    });
    await out.appendRows(new Int32Array([1, 2, 3, 4]));
    await out.finish();
    expect((await readNpy(path)).shape).toEqual([1, 4]);
  });

  it('refuses use after finish with WRITER_CLOSED, and abort after finish keeps the file', async () => {
    const dir = await folder();
    const path = join(dir, 'ids.npy');
    const out = await NpyWriter.open(path, null);
    await out.appendRows(new Int32Array([9]));
    await out.finish();
    const message = `${path}: the writer is already finished or aborted; open a new one to write again`;
    await expect(out.appendRows(new Int32Array([1]))).rejects.toMatchObject({ code: 'WRITER_CLOSED', message });
    await expect(out.finish()).rejects.toMatchObject({ code: 'WRITER_CLOSED', message });
    await out.abort();
    expect((await readNpy(path)).data).toEqual([9]);
  });

  it('fails to open with IO when the folder does not exist', async () => {
    const dir = await folder();
    const path = join(dir, 'nope', 'ids.npy');
    await expect(NpyWriter.open(path, 3)).rejects.toMatchObject({
      code: 'IO',
      message: `${path}: not written: a folder on the way does not exist (ENOENT while creating a temporary file beside it); check the path`,
    });
    expect(await readdir(dir)).toEqual([]);
  });

  it('reports a folder that vanished before finish as IO and leaves nothing', async () => {
    const dir = await folder();
    const path = join(dir, 'nope', 'ids.npy');
    const out = new NpyWriter(path, 2);
    await out.appendRows(new Int32Array([1, 2]));
    await expect(out.finish()).rejects.toMatchObject({ code: 'IO', where: { file: path } });
    expect(await readdir(dir)).toEqual([]);
  });
});
