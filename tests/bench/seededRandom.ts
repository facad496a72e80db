/** A seeded source of numbers in [0, 1): the same seed always gives the same sequence. */
export type Random = () => number;

/**
 * A small, fast, seeded generator (a 32-bit state mixed with multiply and xor-shift steps), so every
 * generated corpus is the same on every machine and run.
 * @example const random = seededRandom(7); random(); // 0 <= x < 1, the same for seed 7 every time
 */
export function seededRandom(seed: number): Random {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A whole number from `min` to `max`, both included. */
export function randomInt(random: Random, min: number, max: number): number {
  return min + Math.floor(random() * (max - min + 1));
}

/** One element of a non-empty list, chosen uniformly. */
export function pickOne<T>(random: Random, items: readonly T[]): T {
  const item = items[Math.floor(random() * items.length)];
  if (item === undefined) throw new Error('pickOne: empty list');
  return item;
}

/** `digits` random lower-case hexadecimal digits. */
export function randomHex(random: Random, digits: number): string {
  let out = '';
  for (let i = 0; i < digits; i++) out += '0123456789abcdef'[Math.floor(random() * 16)];
  return out;
}
