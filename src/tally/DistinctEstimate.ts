/** Registers: 2^14, so the estimate's standard error is about 1.04 / sqrt(2^14) = 0.8 %. */
const INDEX_BITS = 14;
const REGISTERS = 1 << INDEX_BITS;
/** HyperLogLog's bias correction for m = 2^14 registers: 0.7213 / (1 + 1.079 / m). */
const ALPHA = 0.7213 / (1 + 1.079 / REGISTERS);

/** murmur3's 32-bit finalizer: every input bit moves every output bit. */
function mix(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85eb_ca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2_ae35);
  return (h ^ (h >>> 16)) >>> 0;
}

/**
 * How many distinct tokens a stream had, estimated in 16 KiB whatever their number: HyperLogLog
 * (Flajolet, Fusy, Gandouet, Meunier, "HyperLogLog: the analysis of a near-optimal cardinality
 * estimation algorithm", AofA 2007) with 2^14 registers and its small-range correction (linear
 * counting while registers are still empty). Tokens come in as two 32-bit hashes of each (the
 * Bloom filter's, see spanHashes): one picks the register, the other gives the rank.
 * @example
 * const d = new DistinctEstimate();
 * d.add(h1, h2); // for every token
 * d.estimate() // within about 1 % of the number of distinct tokens
 */
export class DistinctEstimate {
  readonly #registers = new Uint8Array(REGISTERS);

  /** Counts a token by two hashes of it. */
  add(first: number, second: number): void {
    const index = mix(first) >>> (32 - INDEX_BITS);
    const w = mix(second ^ 0x9e37_79b9);
    // The rank: the position of the first 1 bit of w (33 when w is 0).
    const rank = Math.clz32(w) + 1;
    if (rank > (this.#registers[index] as number)) this.#registers[index] = rank;
  }

  /** The estimated number of distinct tokens added, rounded to a whole number. */
  estimate(): number {
    let sum = 0;
    let zeros = 0;
    for (let i = 0; i < REGISTERS; i++) {
      const r = this.#registers[i] as number;
      sum += 2 ** -r;
      if (r === 0) zeros += 1;
    }
    const raw = (ALPHA * REGISTERS * REGISTERS) / sum;
    if (raw <= 2.5 * REGISTERS && zeros > 0) return Math.round(REGISTERS * Math.log(REGISTERS / zeros));
    return Math.round(raw);
  }
}
