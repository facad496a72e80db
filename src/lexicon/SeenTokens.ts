import { LexlockError } from '../LexlockError.js';

/** The largest filter a fit record carries (2 Mibit = 256 KiB); bigger corpora get none. */
const MAX_BITS = 1 << 21;
/** Bits per token aimed for: about 0.8 % false positives with 7 hashes (Bloom 1970; Broder & Mitzenmacher 2004). */
const BITS_PER_TOKEN = 10;
/** Above this false-positive rate a filter says too little to be worth its bytes. */
const MAX_FALSE_POSITIVES = 0.02;

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

  /** A filter of these tokens, or null when the corpus has too many for {@link MAX_BITS}. */
  static of(tokens: Iterable<string>, types: number): SeenTokens | null {
    const m = Math.max(64, Math.ceil((types * BITS_PER_TOKEN) / 8) * 8);
    if (m > MAX_BITS) return null;
    const k = Math.max(1, Math.min(16, Math.round((m / Math.max(types, 1)) * Math.LN2)));
    if ((1 - Math.exp((-k * types) / m)) ** k > MAX_FALSE_POSITIVES) return null;
    const filter = new SeenTokens(new Uint8Array(m / 8), k, types);
    for (const t of tokens) filter.add(t);
    return filter;
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
    const h1 = fnv1a(token, 0);
    const h2 = fnv1a(token, 0x5bd1e995) | 1;
    for (let i = 0; i < this.hashes; i++) {
      const bit = this.bitOf(h1, h2, i);
      this.bits[bit >>> 3] = (this.bits[bit >>> 3] ?? 0) | (1 << (bit & 7));
    }
  }

  /** False when the token was certainly not in the corpus; true when it probably was. */
  has(token: string): boolean {
    const h1 = fnv1a(token, 0);
    const h2 = fnv1a(token, 0x5bd1e995) | 1;
    for (let i = 0; i < this.hashes; i++) {
      const bit = this.bitOf(h1, h2, i);
      if (((this.bits[bit >>> 3] ?? 0) & (1 << (bit & 7))) === 0) return false;
    }
    return true;
  }
}
