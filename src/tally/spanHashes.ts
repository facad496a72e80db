/**
 * The seed of the table hash: random per process, so text written to make tokens collide cannot be
 * prepared in advance (counts never depend on it, only where entries land).
 */
const SEED = Math.floor(Math.random() * 0x1_0000_0000) | 0;
const A = 0x41;
const Z = 0x5a;
const FNV_PRIME = 0x0100_0193;
const FNV_BASIS = 0x811c_9dc5;
/** The second Bloom hash's offset basis is FNV's XOR this (see SeenTokens). */
export const SECOND_BASIS = 0x5bd1_e995;

/**
 * Three hashes of one token, computed in one pass over its code units and left in `out`: `out[0]` a
 * seeded table hash (FNV-1a, then murmur3's finalizer), `out[1]` and `out[2]` FNV-1a with the offset
 * bases SeenTokens uses (its Bloom filter bits), as unsigned 32-bit values in an Int32Array. The token is
 * `text[from, to)`, read with A-Z as a-z when `folded`: the same hashes as the lower-cased string's.
 * @example spanHashes('The ferry', 0, 3, true, out) // out holds the hashes of 'the'
 */
export function spanHashes(text: string, from: number, to: number, folded: boolean, out: Int32Array): void {
  let h0 = SEED ^ (to - from);
  let h1 = FNV_BASIS;
  let h2 = (FNV_BASIS ^ SECOND_BASIS) >>> 0;
  for (let i = from; i < to; i++) {
    let c = text.charCodeAt(i);
    if (folded && c >= A && c <= Z) c += 32;
    h0 = Math.imul(h0 ^ c, FNV_PRIME);
    h1 = Math.imul(h1 ^ c, FNV_PRIME);
    h2 = Math.imul(h2 ^ c, FNV_PRIME);
  }
  h0 ^= h0 >>> 16;
  h0 = Math.imul(h0, 0x85eb_ca6b);
  h0 ^= h0 >>> 13;
  h0 = Math.imul(h0, 0xc2b2_ae35);
  out[0] = h0 ^ (h0 >>> 16);
  out[1] = h1;
  out[2] = h2;
}

/**
 * The table hash alone (`out[0]` of {@link spanHashes}), for a pass that only looks tokens up.
 * @example spanHash('The ferry', 0, 3, true) // spanHashes' out[0] for 'the'
 */
export function spanHash(text: string, from: number, to: number, folded: boolean): number {
  let h0 = SEED ^ (to - from);
  for (let i = from; i < to; i++) {
    let c = text.charCodeAt(i);
    if (folded && c >= A && c <= Z) c += 32;
    h0 = Math.imul(h0 ^ c, FNV_PRIME);
  }
  h0 ^= h0 >>> 16;
  h0 = Math.imul(h0, 0x85eb_ca6b);
  h0 ^= h0 >>> 13;
  h0 = Math.imul(h0, 0xc2b2_ae35);
  return h0 ^ (h0 >>> 16);
}
