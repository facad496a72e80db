import fc from 'fast-check';
import { dump, parse } from 'npyjs';
import { describe, expect, it } from 'vitest';
import { npyBytes } from '../../src/output/npyBytes.js';

// Outside checks: npyjs (a general-purpose NPY reader/writer) parses our bytes, and its own writer's
// data section must equal ours for the same Int32Array (its header differs: it aligns to 8, not 64).

/** A random int32 matrix: rows x columns values. */
const matrix = fc
  .record({ rows: fc.nat(20), columns: fc.integer({ min: 1, max: 20 }) })
  .chain(({ rows, columns }) =>
    fc.array(fc.integer({ min: -(2 ** 31), max: 2 ** 31 - 1 }), { minLength: rows * columns, maxLength: rows * columns }).map((values) => ({
      rows,
      columns,
      data: Int32Array.from(values),
    })),
  );

describe('npyBytes', () => {
  it('round-trips random int32 matrices through npyjs (property)', () => {
    fc.assert(
      fc.property(matrix, ({ rows, columns, data }) => {
        const bytes = npyBytes(data, [rows, columns]);
        expect(bytes.byteLength).toBe(128 + data.byteLength);
        const parsed = parse(bytes.slice().buffer);
        expect(parsed.dtype).toBe('i4');
        expect(parsed.fortranOrder).toBe(false);
        expect(parsed.shape).toEqual([rows, columns]);
        expect(parsed.data).toBeInstanceOf(Int32Array);
        expect([...(parsed.data as Int32Array)]).toEqual([...data]);
      }),
    );
  });

  it('has the same data bytes as npyjs.dump', () => {
    const data = new Int32Array([0, 1, -1, 2147483647, -2147483648, 65536]);
    const ours = npyBytes(data, [2, 3]);
    const theirs = new Uint8Array(dump(data, [2, 3]));
    const theirHeader = (theirs[8] ?? 0) | ((theirs[9] ?? 0) << 8);
    expect([...ours.subarray(128)]).toEqual([...theirs.subarray(10 + theirHeader)]);
  });

  it.each([
    [[0, 5], 0],
    [[3], 3],
    [[], 1],
  ])('writes shape %j with %d values', (shape, count) => {
    const data = Int32Array.from({ length: count }, (_, i) => i - 1);
    const parsed = parse(npyBytes(data, shape).slice().buffer);
    expect(parsed.shape).toEqual(shape);
    expect([...(parsed.data as Int32Array)]).toEqual([...data]);
  });

  it.each([
    [[2, 3], 5, 'NPY shape (2, 3) holds 6 values but 5 were given; pass data whose length is the product of the shape'],
    [[4], 0, 'NPY shape (4,) holds 4 values but 0 were given; pass data whose length is the product of the shape'],
    [[2, -3], 6, 'NPY shape [2, -3]: -3 is not a valid dimension; every dimension must be a whole number from 0 to 9007199254740991'],
  ])('refuses shape %j for %d values with NPY_SHAPE', (shape, count, message) => {
    expect(() => npyBytes(new Int32Array(count), shape)).toThrow(expect.objectContaining({ code: 'NPY_SHAPE', message }));
  });
});
