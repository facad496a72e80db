import type { PhaseSpec } from './PhaseSpec.js';
import { spawnPhase } from './spawnPhase.js';

/** The build's speed-up from 1 to 2 worker threads: seconds with 1 thread / seconds with 2. */
export async function threadScaling(spec: PhaseSpec): Promise<number | null> {
  const one = await spawnPhase({ ...spec, threads: 1 });
  const two = await spawnPhase({ ...spec, threads: 2 });
  return two.seconds > 0 ? one.seconds / two.seconds : null;
}
