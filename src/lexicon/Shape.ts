import { LexlockError } from '../LexlockError.js';
import { MAX_SHAPE_LENGTH } from '../artifact/maxShapeLength.js';

/**
 * A fixed sequence shape (encoding contract, rule 5): every row has `length` ids; `pad` says where
 * the 0s go when a document is shorter, `cut` which end loses tokens when it is longer.
 */
export interface Shape {
  length: number;
  pad: ShapeEnd;
  cut: ShapeEnd;
}

/** An end of a row: where the padding zeros go, or which end of a long document loses tokens. */
export type ShapeEnd = 'start' | 'end';

/** Both ends, in the order help and messages name them. */
export const SHAPE_ENDS: readonly ShapeEnd[] = ['start', 'end'];

/** Checks a shape's members, throwing `BAD_OPTION` naming the member. */
export function checkShape(shape: Shape): Shape {
  if (!Number.isSafeInteger(shape.length) || shape.length < 1) {
    throw new LexlockError('BAD_OPTION', `length: ${String(shape.length)} is not a positive whole number of tokens`, { field: 'length' });
  }
  if (shape.length > MAX_SHAPE_LENGTH) {
    throw new LexlockError('BAD_OPTION', `length: ${shape.length} is longer than a lexicon can store (${MAX_SHAPE_LENGTH} tokens at most)`, { field: 'length' });
  }
  if (shape.pad !== 'start' && shape.pad !== 'end') {
    throw new LexlockError('BAD_OPTION', `pad: "${String(shape.pad)}" is not an end of a row; use start (zeros before the tokens) or end (zeros after them)`, { field: 'pad' });
  }
  if (shape.cut !== 'start' && shape.cut !== 'end') {
    throw new LexlockError('BAD_OPTION', `cut: "${String(shape.cut)}" is not an end of a row; use start (a long document loses its first tokens) or end (it loses its last)`, { field: 'cut' });
  }
  return shape;
}

/**
 * A shape in plain words, for summaries, messages and the report.
 * @example describeShape({ length: 96, pad: 'start', cut: 'end' }) // 'length 96; zeros at the start; long documents lose their end'
 */
export function describeShape(shape: Shape): string {
  return `length ${shape.length}; zeros at the ${shape.pad}; long documents lose their ${shape.cut}`;
}

/** How many of `count` items a row of `shape` keeps. */
export function keptOf(count: number, shape: Shape): number {
  return count < shape.length ? count : shape.length;
}

/** The first of `count` items a row of `shape` keeps (the others cut are before it when `cut` is start). */
export function firstKept(count: number, shape: Shape): number {
  return count > shape.length && shape.cut === 'start' ? count - shape.length : 0;
}

/** How many padding ids come before `kept` items in a row of `shape`. */
export function paddingBefore(kept: number, shape: Shape): number {
  return shape.pad === 'start' ? shape.length - kept : 0;
}

/**
 * Writes `ids` shaped into `out` at `offset` (which must hold `shape.length` zeroed slots) and
 * returns how many ids were kept: min(ids.length, shape.length).
 * @example shapeInto([5, 6, 7], { length: 2, pad: 'start', cut: 'start' }, out, 0) // out = [6, 7], returns 2
 */
export function shapeInto(ids: ArrayLike<number>, shape: Shape, out: Int32Array, offset: number): number {
  const kept = keptOf(ids.length, shape);
  const from = firstKept(ids.length, shape);
  const to = offset + paddingBefore(kept, shape);
  for (let i = 0; i < kept; i++) out[to + i] = ids[from + i] ?? 0;
  return kept;
}
