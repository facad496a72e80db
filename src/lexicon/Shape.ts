import { LexlockError } from '../LexlockError.js';
import { MAX_SHAPE_LENGTH } from '../artifact/schema.js';

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
  if (shape.length > MAX_SHAPE_LENGTH) {
    throw new LexlockError('BAD_OPTION', `length: ${shape.length} is longer than a lexicon can store (${MAX_SHAPE_LENGTH} tokens at most)`, { field: 'length' });
  }
  if (shape.pad !== 'pre' && shape.pad !== 'post') {
    throw new LexlockError('BAD_OPTION', `pad: "${String(shape.pad)}" is not a side; use pre or post`, { field: 'pad' });
  }
  if (shape.cut !== 'pre' && shape.cut !== 'post') {
    throw new LexlockError('BAD_OPTION', `cut: "${String(shape.cut)}" is not a side; use pre or post`, { field: 'cut' });
  }
  return shape;
}

/** How many of `count` items a row of `shape` keeps. */
export function keptOf(count: number, shape: Shape): number {
  return count < shape.length ? count : shape.length;
}

/** The first of `count` items a row of `shape` keeps (the others cut are before it when `cut` is pre). */
export function firstKept(count: number, shape: Shape): number {
  return count > shape.length && shape.cut === 'pre' ? count - shape.length : 0;
}

/** How many padding ids come before `kept` items in a row of `shape`. */
export function paddingBefore(kept: number, shape: Shape): number {
  return shape.pad === 'pre' ? shape.length - kept : 0;
}

/**
 * Writes `ids` shaped into `out` at `offset` (which must hold `shape.length` zeroed slots) and
 * returns how many ids were kept: min(ids.length, shape.length).
 * @example shapeInto([5, 6, 7], { length: 2, pad: 'pre', cut: 'pre' }, out, 0) // out = [6, 7], returns 2
 */
export function shapeInto(ids: ArrayLike<number>, shape: Shape, out: Int32Array, offset: number): number {
  const kept = keptOf(ids.length, shape);
  const from = firstKept(ids.length, shape);
  const to = offset + paddingBefore(kept, shape);
  for (let i = 0; i < kept; i++) out[to + i] = ids[from + i] ?? 0;
  return kept;
}
