import { canonicalJson } from './canonicalJson.js';
import { sha256Hex } from './sha256.js';

/**
 * The fingerprint of an encoding: `sha256:` + hex SHA-256 of its RFC 8785 canonical JSON. Two
 * lexicons that encode identically have the same fingerprint, whatever built them.
 * @example fingerprintOf(lexicon.encoding) === lexicon.fingerprint // true for every checked lexicon
 */
export function fingerprintOf(encoding: unknown): string {
  return `sha256:${sha256Hex(canonicalJson(encoding))}`;
}
