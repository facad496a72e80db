import { sha256 as nobleSha256 } from '@noble/hashes/sha2';
import { bytesToHex } from '@noble/hashes/utils';

const utf8 = new TextEncoder();

/**
 * SHA-256 (FIPS 180-4) of a string's UTF-8 bytes or of raw bytes, as lower-case hex. Synchronous and
 * browser-safe (audited @noble/hashes implementation).
 * @example sha256Hex('abc') // 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'
 */
export function sha256Hex(data: string | Uint8Array): string {
  return bytesToHex(nobleSha256(typeof data === 'string' ? utf8.encode(data) : data));
}

/**
 * SHA-256 (FIPS 180-4) of raw bytes: the 32 bytes of the digest. Synchronous and browser-safe.
 * @example sha256Bytes(new TextEncoder().encode('abc'))[0] // 0xba
 */
export function sha256Bytes(data: Uint8Array): Uint8Array {
  return nobleSha256(data);
}
