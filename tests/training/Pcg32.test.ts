// PCG32 against outside references: the output of pcg32-demo, the demo program of the PCG reference
// C implementation (pcg-c-basic, M. E. O'Neill 2014), seeded pcg32_srandom_r(42, 54): six 32-bit
// outputs, 65 coin tosses (boundedrand 2), 33 dice rolls (boundedrand 6, plus 1) and a deal of 52
// cards (Fisher-Yates with boundedrand). The values are quoted from memory of that output; the six
// 32-bit outputs are also what the `pcg` npm package (an independent implementation) gives, and a
// plain BigInt transcription of the reference's 64-bit arithmetic, written here, checks the rest.
import fc from 'fast-check';
import { createPcg32, getOutput, nextState } from 'pcg';
import { describe, expect, it } from 'vitest';
import { Pcg32 } from '../../src/training/Pcg32.js';

const DEMO_32BIT = [0xa15c02b7, 0x7b47f409, 0xba1d3330, 0x83d2f293, 0xbfa4784b, 0xcbed606e];
const DEMO_COINS = 'HHTTTHTHHHTHTTTHHHHHTTTHHHTHTHTHTTHTTTHHHHHHTTTTHHTTTTTHTTTTTTTHT';
const DEMO_ROLLS = '3 4 1 1 2 2 3 2 4 3 2 4 3 3 5 2 3 1 3 1 5 1 4 1 5 6 4 6 6 2 6 3 3';
const DEMO_CARDS =
  'Qd Ks 6d 3s 3d 4c 3h Td Kc 5c Jh Kd Jd As 4s 4h Ad Th Ac Jc 7s Qs 2s 7h Kh 2d 6c Ah 4d Qh 9h 6s 5s 2c 9c Ts 8d 9s 3c 8c Js 5d 2h 6h 7d 8s 9d 5h 8h Qc 7c Tc';

/** The reference's pcg32_random_r and pcg32_srandom_r, transcribed with BigInt. */
function bigIntPcg32(seed: bigint, stream: bigint): () => number {
  const mask = (1n << 64n) - 1n;
  let state = 0n;
  const inc = ((stream << 1n) | 1n) & mask;
  const next = () => {
    const old = state;
    state = (old * 6364136223846793005n + inc) & mask;
    const xorshifted = Number((((old >> 18n) ^ old) >> 27n) & 0xffffffffn);
    const rot = Number(old >> 59n);
    return ((xorshifted >>> rot) | (xorshifted << (-rot & 31))) >>> 0;
  };
  next();
  state = (state + seed) & mask;
  next();
  return next;
}

describe('Pcg32', () => {
  it('gives the reference demo output for seed 42, stream 54', () => {
    const rng = new Pcg32(42, 54);
    expect(Array.from({ length: 6 }, () => rng.next())).toEqual(DEMO_32BIT);
    expect(Array.from({ length: 65 }, () => (rng.below(2) ? 'H' : 'T')).join('')).toBe(DEMO_COINS);
    expect(Array.from({ length: 33 }, () => rng.below(6) + 1).join(' ')).toBe(DEMO_ROLLS);
    const cards = Array.from({ length: 52 }, (_, i) => i);
    for (let i = 52; i > 1; i--) {
      const chosen = rng.below(i);
      const card = cards[chosen] as number;
      cards[chosen] = cards[i - 1] as number;
      cards[i - 1] = card;
    }
    expect(cards.map((c) => 'A23456789TJQK'[Math.floor(c / 4)]! + 'hcds'[c % 4]!).join(' ')).toBe(DEMO_CARDS);
  });

  it('matches the pcg package for the demo seed', () => {
    let state = createPcg32({}, 42, 54);
    const theirs: number[] = [];
    for (let i = 0; i < 6; i++) {
      theirs.push(getOutput(state) >>> 0);
      state = nextState(state);
    }
    expect(theirs).toEqual(DEMO_32BIT);
  });

  it('matches a BigInt transcription of the reference for any seed and stream up to 2^53 - 1 (property)', () => {
    fc.assert(
      fc.property(fc.maxSafeNat(), fc.maxSafeNat(), (seed, stream) => {
        const ours = new Pcg32(seed, stream);
        const reference = bigIntPcg32(BigInt(seed), BigInt(stream));
        for (let i = 0; i < 20; i++) expect(ours.next()).toBe(reference());
      }),
    );
  });

  it('draws below a bound as pcg32_boundedrand_r does, rejections included (property)', () => {
    // Bounds just above 2^31 make the reference throw away about half of the outputs.
    const bounds = fc.oneof(fc.integer({ min: 1, max: 2 ** 32 }), fc.integer({ min: 2 ** 31, max: 2 ** 31 + 1000 }));
    fc.assert(
      fc.property(fc.maxSafeNat(), bounds, (seed, bound) => {
        const ours = new Pcg32(seed);
        const reference = bigIntPcg32(BigInt(seed), 0n);
        const threshold = (-bound >>> 0) % bound; // the reference's `-bound % bound` in uint32_t
        for (let i = 0; i < 20; i++) {
          let r = reference();
          while (r < threshold) r = reference();
          expect(ours.below(bound)).toBe(r % bound);
        }
      }),
    );
    const rng = new Pcg32(7);
    expect([...new Set(Array.from({ length: 200 }, () => rng.below(5)))].sort()).toEqual([0, 1, 2, 3, 4]);
  });

  it.each([-1, 0.5, 2 ** 53, Number.NaN])('refuses the seed %s', (seed) => {
    expect(() => new Pcg32(seed)).toThrow(`seed: ${String(seed)} is not a whole number from 0 to 2^53 - 1`);
  });
});
