import { LexlockError } from '../LexlockError.js';

/** NumPy type descriptor for little-endian 32-bit signed integers. */
export const NPY_INT32_DESCR = '<i4';

/** Magic string, version (1, 0) and the 2-byte header length come before the header text. */
export const NPY_PREFIX_BYTES = 10;

/** Magic + version + length + header text is padded to a multiple of this. */
export const NPY_ALIGNMENT = 64;

/** Format 1.0 stores the header length as an unsigned 16-bit integer. */
const MAX_HEADER_TEXT_BYTES = 0xffff;

/** `\x93NUMPY` followed by major version 1, minor version 0. */
const MAGIC_AND_VERSION = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0] as const;

/**
 * The shape as a Python tuple literal, as the header holds it: `()`, `(5,)`, `(3, 4)`.
 * Throws `NPY_SHAPE` for a dimension that is not a whole number from 0 to 2^53 - 1.
 */
export function npyShapeLiteral(shape: readonly number[]): string {
  for (const dim of shape) {
    if (!Number.isSafeInteger(dim) || dim < 0) {
      throw new LexlockError(
        'NPY_SHAPE',
        `NPY shape [${shape.join(', ')}]: ${dim} is not a valid dimension; every dimension must be a whole number from 0 to ${Number.MAX_SAFE_INTEGER}`,
        {},
      );
    }
  }
  if (shape.length === 1) return `(${shape[0]},)`;
  return `(${shape.join(', ')})`;
}

/** The header's dictionary literal for a C-order int32 array, without padding. */
export function npyHeaderText(shape: readonly number[]): string {
  return `{'descr': '${NPY_INT32_DESCR}', 'fortran_order': False, 'shape': ${npyShapeLiteral(shape)}, }`;
}

/**
 * Everything before the data of an NPY 1.0 file holding C-order `<i4` values of `shape`: magic,
 * version, header length and the header text padded with spaces and ended by `\n`, 64-byte aligned.
 * `totalBytes` (a multiple of 64, at least the minimum) pads to a fixed size, so a header written
 * early can be patched in place later.
 */
export function npyHeader(shape: readonly number[], totalBytes?: number): Uint8Array {
  const text = npyHeaderText(shape);
  const minimum = Math.ceil((NPY_PREFIX_BYTES + text.length + 1) / NPY_ALIGNMENT) * NPY_ALIGNMENT;
  const total = totalBytes ?? minimum;
  if (total < minimum || total % NPY_ALIGNMENT !== 0) {
    throw new LexlockError(
      'NPY_SHAPE',
      `NPY shape ${npyShapeLiteral(shape)}: the header needs ${minimum} bytes but ${total} were reserved; reserve a multiple of ${NPY_ALIGNMENT} of at least ${minimum}`,
      {},
    );
  }
  const headerBytes = total - NPY_PREFIX_BYTES;
  if (headerBytes > MAX_HEADER_TEXT_BYTES) {
    throw new LexlockError(
      'NPY_SHAPE',
      `NPY shape ${npyShapeLiteral(shape)}: a ${headerBytes}-byte header does not fit NPY format 1.0 (at most ${MAX_HEADER_TEXT_BYTES}); use fewer dimensions`,
      {},
    );
  }
  const out = new Uint8Array(total);
  out.set(MAGIC_AND_VERSION, 0);
  out[8] = headerBytes & 0xff;
  out[9] = headerBytes >>> 8;
  for (let i = 0; i < text.length; i++) out[NPY_PREFIX_BYTES + i] = text.charCodeAt(i);
  out.fill(0x20, NPY_PREFIX_BYTES + text.length, total - 1);
  out[total - 1] = 0x0a;
  return out;
}
