/**
 * Byte length of the white-space character at `bytes[i]` as fast-csv skips it before a quote or after
 * a closing quote (JavaScript `\s`: tab, VT, FF, space, U+00A0, U+1680, U+2000–U+200A, U+2028,
 * U+2029, U+202F, U+205F, U+3000, U+FEFF), or 0. CR and LF end records instead, and the delimiter
 * (a tab for TSV) is never white space here.
 */
export function csvWhitespace(bytes: Uint8Array, i: number, end: number, delimiter: number): number {
  const b = bytes[i]!;
  if (b === delimiter) return 0;
  if (b === 0x20 || b === 0x09 || b === 0x0b || b === 0x0c) return 1;
  if (b < 0xc2) return 0;
  const b1 = i + 1 < end ? bytes[i + 1]! : -1;
  if (b === 0xc2) return b1 === 0xa0 ? 2 : 0;
  const b2 = i + 2 < end ? bytes[i + 2]! : -1;
  switch (b) {
    case 0xe1: // U+1680
      return b1 === 0x9a && b2 === 0x80 ? 3 : 0;
    case 0xe2: // U+2000–U+200A, U+2028, U+2029, U+202F; U+205F
      if (b1 === 0x80) return (b2 >= 0x80 && b2 <= 0x8a) || b2 === 0xa8 || b2 === 0xa9 || b2 === 0xaf ? 3 : 0;
      return b1 === 0x81 && b2 === 0x9f ? 3 : 0;
    case 0xe3: // U+3000
      return b1 === 0x80 && b2 === 0x80 ? 3 : 0;
    case 0xef: // U+FEFF
      return b1 === 0xbb && b2 === 0xbf ? 3 : 0;
    default:
      return 0;
  }
}

/** The index of the first byte at or after `i` that is not {@link csvWhitespace}. */
export function skipCsvWhitespace(bytes: Uint8Array, i: number, end: number, delimiter: number): number {
  while (i < end) {
    const n = csvWhitespace(bytes, i, end, delimiter);
    if (n === 0) return i;
    i += n;
  }
  return i;
}
