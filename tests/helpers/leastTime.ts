/**
 * How many times longer `large` takes than `small`: the least time of each over `rounds` rounds,
 * measured alternately (small, large, small, large…) so that a busy moment of the machine falls on both
 * alike. Each small measurement runs `small` `smallRuns` times in one block (give the ratio of the two
 * sizes): both blocks then last about as long as each other, so a busy machine's pauses, which are
 * longer than a small run alone, fall on both alike too (with one small run a round, a small run that
 * found a quiet moment against a large one that never did read 71 where linear is 16). Times are CPU
 * times, so a core taken by another process does not count at all. The result is per run of `small`. Only a ratio of two times taken in the same run: no test compares a time with a
 * fixed number.
 */
export function timeRatio(small: () => unknown, large: () => unknown, rounds: number, smallRuns = 1): number {
  let leastSmall = Number.POSITIVE_INFINITY;
  let leastLarge = Number.POSITIVE_INFINITY;
  const smallBlock = () => {
    for (let i = 0; i < smallRuns; i++) small();
  };
  for (let r = 0; r < rounds; r++) {
    leastSmall = Math.min(leastSmall, timed(smallBlock) / smallRuns);
    leastLarge = Math.min(leastLarge, timed(large));
  }
  return leastLarge / leastSmall;
}

/**
 * The CPU time `fn` takes in this process (user and system, in ms), not the time on the clock: time
 * spent waiting while other processes have the cores is not counted (vitest runs each test file in a
 * process of its own).
 */
function timed(fn: () => unknown): number {
  const start = process.cpuUsage();
  fn();
  const used = process.cpuUsage(start);
  return (used.user + used.system) / 1000;
}
