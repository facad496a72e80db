import type { PhaseName, PhaseSpec } from './PhaseSpec.js';
import { percentile } from './percentile.js';
import { spawnPhase } from './spawnPhase.js';

/** The library steps whose 1 -> 2 thread speed-up the benchmark measures. */
export const SCALED_PHASES = ['build', 'encode-noop', 'audit'] as const satisfies readonly PhaseName[];
export type ScaledPhase = (typeof SCALED_PHASES)[number];

/** One corpus's thread figures. */
export interface ThreadScaling {
  /**
   * The machine's ceiling for two threads: two one-thread builds of the corpus started at the same
   * time, their combined speed (twice the corpus over the slower one's seconds) over one build alone.
   */
  ceiling: number | null;
  /** Seconds with 1 thread / seconds with 2, for each step. */
  speedUp: Record<ScaledPhase, number | null>;
}

const ratio = (a: number, b: number) => (a > 0 && b > 0 ? a / b : null);

/** The median of some seconds (nearest rank). */
function median(values: readonly number[]): number {
  return percentile([...values].sort((a, b) => a - b), 50);
}

/**
 * Measures, in `rounds` rounds taken in turn so that a busy moment of the machine falls on all alike,
 * the ceiling (one build alone, then two at once, each in its own process, so each writes its own
 * lexicon next to `scratchLexicon`) and the 1 -> 2 thread speed-up of build, encode and audit (encode and
 * audit read `spec.lexicon`, which must exist); each figure from the median of its rounds.
 */
export async function threadScaling(spec: Omit<PhaseSpec, 'phase'>, scratchLexicon: string, rounds = 3): Promise<ThreadScaling> {
  const build = { ...spec, phase: 'build' as const, lexicon: scratchLexicon, threads: 1 };
  const alone: number[] = [];
  const pairs: number[] = [];
  const one: Record<ScaledPhase, number[]> = { build: alone, 'encode-noop': [], audit: [] };
  const two: Record<ScaledPhase, number[]> = { build: [], 'encode-noop': [], audit: [] };
  for (let round = 0; round < rounds; round++) {
    alone.push((await spawnPhase(build)).seconds);
    const pair = await Promise.all([spawnPhase({ ...build, lexicon: `${scratchLexicon}.a` }), spawnPhase({ ...build, lexicon: `${scratchLexicon}.b` })]);
    pairs.push(Math.max(...pair.map((r) => r.seconds)));
    for (const phase of SCALED_PHASES) {
      const at = phase === 'build' ? build : { ...spec, phase };
      if (phase !== 'build') one[phase].push((await spawnPhase({ ...at, threads: 1 })).seconds);
      two[phase].push((await spawnPhase({ ...at, threads: 2 })).seconds);
    }
  }
  const speedUp = { build: null, 'encode-noop': null, audit: null } as Record<ScaledPhase, number | null>;
  for (const phase of SCALED_PHASES) speedUp[phase] = ratio(median(one[phase]), median(two[phase]));
  return { ceiling: ratio(2 * median(alone), median(pairs)), speedUp };
}
