/**
 * Index of the first byte of the first ill-formed UTF-8 sequence in `bytes[start, end)`, or -1 when
 * the range is well-formed (Unicode 15 §3.9, table 3-7). A truncated sequence is reported at its lead byte.
 * Browser-safe: used for corpora and for lexicon files alike.
 * @example firstInvalidUtf8(new Uint8Array([0x61, 0xe2, 0x82, 0x41])) // 1
 */
export function firstInvalidUtf8(bytes: Uint8Array, start = 0, end = bytes.length): number {
  let i = start;
  while (i < end) {
    const b = bytes[i] as number;
    if (b < 0x80) {
      i += 1;
      continue;
    }
    let need: number;
    let lo = 0x80;
    let hi = 0xbf;
    if (b >= 0xc2 && b <= 0xdf) need = 1;
    else if (b >= 0xe0 && b <= 0xef) {
      need = 2;
      if (b === 0xe0) lo = 0xa0;
      else if (b === 0xed) hi = 0x9f;
    } else if (b >= 0xf0 && b <= 0xf4) {
      need = 3;
      if (b === 0xf0) lo = 0x90;
      else if (b === 0xf4) hi = 0x8f;
    } else return i;
    if (i + need >= end) return i; // the sequence runs past the end: truncated
    const second = bytes[i + 1] as number;
    if (second < lo || second > hi) return i;
    for (let k = 2; k <= need; k++) {
      const c = bytes[i + k] as number;
      if (c < 0x80 || c > 0xbf) return i;
    }
    i += need + 1;
  }
  return -1;
}
