import { LexlockError } from '../LexlockError.js';

// The multiplier of PCG's 64-bit linear congruential step, 6364136223846793005, as two 32-bit halves.
const MULTIPLIER_HI = 0x5851f42d;
const MULTIPLIER_LO = 0x4c957f2d;
const TWO_32 = 2 ** 32;

/**
 * PCG32, the generator of M. E. O'Neill, "PCG: A Family of Simple Fast Space-Efficient Statistically
 * Good Algorithms for Random Number Generation" (2014), as its reference C implementation has it
 * (`pcg32_random_r`: a 64-bit linear congruential state, each output the old state's XSH RR
 * permutation to 32 bits; `pcg32_srandom_r` for seeding; `pcg32_boundedrand_r` for unbiased draws
 * below a bound). The 64-bit arithmetic is done in 32-bit halves, so it runs the same everywhere,
 * browsers included. tests/training/Pcg32.test.ts checks it against the reference's demo output.
 */
export class Pcg32 {
  private hi = 0;
  private lo = 0;
  private readonly incHi: number;
  private readonly incLo: number;

  /**
   * Seeds like `pcg32_srandom_r(seed, stream)`: `seed` is the initial state and `stream` picks one of
   * 2^63 sequences; both whole numbers from 0 to 2^53 - 1.
   */
  constructor(seed: number, stream = 0) {
    checkSeed(seed, 'seed');
    checkSeed(stream, 'stream');
    // inc = (stream << 1) | 1, in 64 bits.
    const streamHi = Math.floor(stream / TWO_32);
    const streamLo = stream >>> 0;
    this.incHi = ((streamHi << 1) | (streamLo >>> 31)) >>> 0;
    this.incLo = ((streamLo << 1) | 1) >>> 0;
    this.step();
    this.add(Math.floor(seed / TWO_32), seed >>> 0);
    this.step();
  }

  /** The next 32-bit output, from 0 to 2^32 - 1. */
  next(): number {
    const hi = this.hi;
    const lo = this.lo;
    this.step();
    // xorshifted = ((old >> 18) ^ old) >> 27, its low 32 bits; rot = old >> 59.
    const xHi = hi ^ (hi >>> 18);
    const xLo = lo ^ ((lo >>> 18) | (hi << 14));
    const xorshifted = ((xLo >>> 27) | (xHi << 5)) >>> 0;
    const rot = hi >>> 27;
    return ((xorshifted >>> rot) | (xorshifted << (-rot & 31))) >>> 0;
  }

  /** A whole number from 0 to `bound` - 1, each equally likely (`pcg32_boundedrand_r`); `bound` from 1 to 2^32. */
  below(bound: number): number {
    // Outputs under 2^32 mod bound are drawn again, so every remainder has as many outputs behind it.
    const threshold = (TWO_32 - bound) % bound;
    for (;;) {
      const r = this.next();
      if (r >= threshold) return r % bound;
    }
  }

  /** state = state * MULTIPLIER + inc (mod 2^64). */
  private step(): void {
    const { hi, lo } = this;
    // lo * MULTIPLIER_LO in full (64 bits), from 16-bit halves so no partial product passes 2^53.
    const a0 = lo & 0xffff;
    const a1 = lo >>> 16;
    const b0 = MULTIPLIER_LO & 0xffff;
    const b1 = MULTIPLIER_LO >>> 16;
    const p00 = a0 * b0;
    const p01 = a0 * b1;
    const p10 = a1 * b0;
    const middle = (p00 >>> 16) + (p01 & 0xffff) + (p10 & 0xffff);
    const productLo = ((middle << 16) | (p00 & 0xffff)) >>> 0;
    const productHi = a1 * b1 + (p01 >>> 16) + (p10 >>> 16) + (middle >>> 16);
    this.hi = (productHi + Math.imul(lo, MULTIPLIER_HI) + Math.imul(hi, MULTIPLIER_LO)) >>> 0;
    this.lo = productLo;
    this.add(this.incHi, this.incLo);
  }

  /** state += (hi, lo) (mod 2^64). */
  private add(hi: number, lo: number): void {
    const sum = this.lo + lo;
    this.lo = sum >>> 0;
    this.hi = (this.hi + hi + (sum >= TWO_32 ? 1 : 0)) >>> 0;
  }
}

function checkSeed(value: number, name: string): void {
  if (!Number.isSafeInteger(value) || value < 0) {
    throw new LexlockError('BAD_OPTION', `${name}: ${String(value)} is not a whole number from 0 to 2^53 - 1`, { field: name });
  }
}
