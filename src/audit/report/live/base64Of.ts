const DIGITS = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';

/**
 * Bytes in base64 (RFC 4648 §4, with padding), browser-safe without `btoa` or `Buffer`: the form a
 * Content-Security-Policy hash source takes.
 * @example base64Of(new TextEncoder().encode('foobar')) // 'Zm9vYmFy' (RFC 4648 §10)
 */
export function base64Of(bytes: Uint8Array): string {
  let out = '';
  for (let i = 0; i < bytes.length; i += 3) {
    const a = bytes[i] as number;
    const b = bytes[i + 1];
    const c = bytes[i + 2];
    const n = (a << 16) | ((b ?? 0) << 8) | (c ?? 0);
    out += (DIGITS[(n >> 18) & 63] as string) + (DIGITS[(n >> 12) & 63] as string);
    out += b === undefined ? '=' : (DIGITS[(n >> 6) & 63] as string);
    out += c === undefined ? '=' : (DIGITS[n & 63] as string);
  }
  return out;
}
