/**
 * How many times longer `large` takes than `small`: the least time of each over `rounds` rounds,
 * measured alternately (small, large, small, large…) so that a busy moment of the machine falls on both
 * alike. Only a ratio of two times taken in the same run: no test compares a time with a fixed number.
 */
export function timeRatio(small: () => unknown, large: () => unknown, rounds: number): number {
  let leastSmall = Number.POSITIVE_INFINITY;
  let leastLarge = Number.POSITIVE_INFINITY;
  for (let r = 0; r < rounds; r++) {
    leastSmall = Math.min(leastSmall, timed(small));
    leastLarge = Math.min(leastLarge, timed(large));
  }
  return leastLarge / leastSmall;
}

function timed(fn: () => unknown): number {
  const start = performance.now();
  fn();
  return performance.now() - start;
}
