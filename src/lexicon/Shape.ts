import { LexlockError } from '../LexlockError.js';

/**
 * A fixed sequence shape (encoding contract, rule 5): every row has `length` ids; `pad` says where
 * the 0s go when a document is shorter, `cut` which end loses tokens when it is longer.
 */
export interface Shape {
  length: number;
  pad: 'pre' | 'post';
  cut: 'pre' | 'post';
}

/** Checks a shape's members, throwing `BAD_OPTION` naming the member. */
export function checkShape(shape: Shape): Shape {
  if (!Number.isSafeInteger(shape.length) || shape.length < 1) {
    throw new LexlockError('BAD_OPTION', `length: ${String(shape.length)} is not a positive whole number of tokens`, { field: 'length' });
  }
  if (shape.pad !== 'pre' && shape.pad !== 'post') {
    throw new LexlockError('BAD_OPTION', `pad: "${String(shape.pad)}" is not a side; use pre or post`, { field: 'pad' });
  }
  if (shape.cut !== 'pre' && shape.cut !== 'post') {
    throw new LexlockError('BAD_OPTION', `cut: "${String(shape.cut)}" is not a side; use pre or post`, { field: 'cut' });
  }
  return shape;
}

/**
 * Writes `ids` shaped into `out` at `offset` (which must hold `shape.length` zeroed slots) and
 * returns how many ids were kept: min(ids.length, shape.length).
 * @example shapeInto([5, 6, 7], { length: 2, pad: 'pre', cut: 'pre' }, out, 0) // out = [6, 7], returns 2
 */
export function shapeInto(ids: ArrayLike<number>, shape: Shape, out: Int32Array, offset: number): number {
  return shapeEach(ids.length, shape, out, offset, (k) => ids[k] ?? 0);
}

/**
 * The same for `count` items that `idAt(k)` turns into ids: only the kept items are asked for.
 * @example shapeEach(3, { length: 2, pad: 'pre', cut: 'post' }, out, 0, (k) => 10 + k) // out = [10, 11], returns 2
 */
export function shapeEach(count: number, shape: Shape, out: Int32Array, offset: number, idAt: (k: number) => number): number {
  const length = shape.length;
  const kept = count < length ? count : length;
  const from = count > length && shape.cut === 'pre' ? count - length : 0;
  const to = offset + (shape.pad === 'pre' ? length - kept : 0);
  for (let i = 0; i < kept; i++) out[to + i] = idAt(from + i);
  return kept;
}
