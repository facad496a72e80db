import { LexlockError } from '../LexlockError.js';

/** The largest filter a fit record carries (2 Mibit = 256 KiB); bigger corpora get none. */
export const MAX_BITS = 1 << 21;
/**
 * Bits per token at least: with {@link HASHES} hashes, at most 0.82 % false positives at 10 bits a token
 * and fewer with more (Bloom 1970; Broder & Mitzenmacher 2004). Sizes are powers of two, so a filter of
 * {@link MAX_BITS} folds into any smaller one (a bounded build fills one while it counts, see `folded`).
 */
const BITS_PER_TOKEN = 10;
/** Hashes per token. */
export const HASHES = 7;
/** The second hash's offset basis is FNV's XOR this. */
const SECOND_SEED = 0x5bd1e995;

/** The filter size for `types` tokens: a power of two of at least 64 bits and 10 a token, or null past {@link MAX_BITS}. */
function bitsFor(types: number): number | null {
  let m = 64;
  while (m < types * BITS_PER_TOKEN) m *= 2;
  return m > MAX_BITS ? null : m;
}

/** FNV-1a over UTF-16 code units, 32 bits; `seed` varies the offset basis. */
function fnv1a(text: string, seed: number): number {
  let h = (0x811c9dc5 ^ seed) >>> 0;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h;
}

/**
 * A Bloom filter of every token a corpus had, kept in the fit record so a later audit can tell a token
 * that was never seen from one that was seen but fell below the cap. "Seen" may be wrong with a small
 * probability (a false positive); "not seen" is always right.
 */
export class SeenTokens {
  readonly bits: Uint8Array;
  readonly hashes: number;
  readonly types: number;

  private constructor(bits: Uint8Array, hashes: number, types: number) {
    this.bits = bits;
    this.hashes = hashes;
    this.types = types;
  }

  /** A filter of these tokens (`types` of them), or null when there are too many for {@link MAX_BITS}. */
  static of(tokens: Iterable<string>, types: number): SeenTokens | null {
    const m = bitsFor(types);
    if (m === null) return null;
    const filter = new SeenTokens(new Uint8Array(m / 8), HASHES, types);
    for (const t of tokens) filter.add(t);
    return filter;
  }

  /**
   * An empty filter of {@link MAX_BITS}, to be filled by {@link addHashes} while tokens stream past
   * (their number unknown yet), then {@link folded} to the size their number calls for.
   */
  static collecting(): SeenTokens {
    return new SeenTokens(new Uint8Array(MAX_BITS / 8), HASHES, 0);
  }

  /**
   * This filter folded into the size {@link of} gives `types` tokens (OR of its parts: bit b lands on
   * bit b mod m, where a filter of m bits would have set it), or null past {@link MAX_BITS}. Folding a
   * filter of the same tokens gives the filter {@link of} makes of them, bit for bit.
   */
  folded(types: number): SeenTokens | null {
    const m = bitsFor(types);
    if (m === null) return null;
    const bytes = m / 8;
    const out = new Uint8Array(bytes);
    for (let i = 0; i < this.bits.length; i++) out[i % bytes] = (out[i % bytes] as number) | (this.bits[i] as number);
    return new SeenTokens(out, this.hashes, types);
  }

  /** Adds a token by its two hashes (FNV-1a with the offset bases {@link fnv1a} uses here, as spanHashes gives them). */
  addHashes(first: number, second: number): void {
    const h1 = first >>> 0;
    const h2 = (second | 1) >>> 0;
    for (let i = 0; i < this.hashes; i++) {
      const bit = this.bitOf(h1, h2, i);
      this.bits[bit >>> 3] = (this.bits[bit >>> 3] ?? 0) | (1 << (bit & 7));
    }
  }

  /** Reads the stored form (`bits` in base64). */
  static parse(stored: { bits: string; hashes: number; types: number }): SeenTokens {
    const binary = atob(stored.bits);
    const bits = new Uint8Array(binary.length);
    for (let i = 0; i < binary.length; i++) bits[i] = binary.charCodeAt(i);
    if (bits.length === 0) throw new LexlockError('BAD_LEXICON', 'fit.seen.bits: an empty filter; rebuild the lexicon', { field: 'fit.seen.bits' });
    return new SeenTokens(bits, stored.hashes, stored.types);
  }

  /** The stored form: bits as base64. */
  toJSON(): { bits: string; hashes: number; types: number } {
    let binary = '';
    for (let i = 0; i < this.bits.length; i += 0x8000) binary += String.fromCharCode(...this.bits.subarray(i, i + 0x8000));
    return { bits: btoa(binary), hashes: this.hashes, types: this.types };
  }

  /** The i-th bit position of a token (double hashing: h1 + i * h2, Kirsch & Mitzenmacher 2006). */
  private bitOf(h1: number, h2: number, i: number): number {
    return ((h1 + Math.imul(i, h2)) >>> 0) % (this.bits.length * 8);
  }

  private add(token: string): void {
    this.addHashes(fnv1a(token, 0), fnv1a(token, SECOND_SEED));
  }

  /** False when the token was certainly not in the corpus; true when it probably was. */
  has(token: string): boolean {
    const h1 = fnv1a(token, 0);
    const h2 = (fnv1a(token, SECOND_SEED) | 1) >>> 0;
    for (let i = 0; i < this.hashes; i++) {
      const bit = this.bitOf(h1, h2, i);
      if (((this.bits[bit >>> 3] ?? 0) & (1 << (bit & 7))) === 0) return false;
    }
    return true;
  }
}
