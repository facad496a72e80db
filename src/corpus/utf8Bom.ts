/** 3 when `bytes` start with the UTF-8 byte order mark (EF BB BF), else 0. */
export function utf8BomLength(bytes: Uint8Array): 0 | 3 {
  return bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
}
