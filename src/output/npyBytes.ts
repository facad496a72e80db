import { LexlockError } from '../LexlockError.js';
import { int32LittleEndian } from './int32LittleEndian.js';
import { npyHeader, npyShapeLiteral } from './npyHeader.js';

/**
 * A whole NPY 1.0 file in memory: `data` as little-endian int32 in C order with the given shape.
 * Throws `NPY_SHAPE` when the shape does not hold exactly `data.length` values.
 * @example npyBytes(batch.ids, [batch.rows, batch.length])
 */
export function npyBytes(data: Int32Array, shape: readonly number[]): Uint8Array {
  const literal = npyShapeLiteral(shape);
  const count = shape.reduce((product, dim) => product * dim, 1);
  if (count !== data.length) {
    throw new LexlockError(
      'NPY_SHAPE',
      `NPY shape ${literal} holds ${count} values but ${data.length} were given; pass data whose length is the product of the shape`,
      {},
    );
  }
  const header = npyHeader(shape);
  const out = new Uint8Array(header.byteLength + data.byteLength);
  out.set(header, 0);
  out.set(int32LittleEndian(data), header.byteLength);
  return out;
}
