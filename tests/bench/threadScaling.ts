import type { PhaseName, PhaseSpec } from './PhaseSpec.js';
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

/**
 * Measures the ceiling (one build alone before and after two at once, each in its own process, so each writes its
 * own lexicon next to `scratchLexicon`) and the 1 -> 2 thread speed-up of build, encode and audit
 * (encode and audit read `spec.lexicon`, which must exist).
 */
export async function threadScaling(spec: Omit<PhaseSpec, 'phase'>, scratchLexicon: string): Promise<ThreadScaling> {
  const build = { ...spec, phase: 'build' as const, lexicon: scratchLexicon, threads: 1 };
  const before = await spawnPhase(build);
  const pair = await Promise.all([spawnPhase({ ...build, lexicon: `${scratchLexicon}.a` }), spawnPhase({ ...build, lexicon: `${scratchLexicon}.b` })]);
  // One alone before the pair and one after, the faster kept: a busy moment on one lone run would raise the ceiling.
  const after = await spawnPhase(build);
  const alone = before.seconds <= after.seconds ? before : after;
  const slower = Math.max(...pair.map((r) => r.seconds));
  const ceiling = ratio(2 * alone.seconds, slower);
  const speedUp = { build: null, 'encode-noop': null, audit: null } as Record<ScaledPhase, number | null>;
  for (const phase of SCALED_PHASES) {
    const at = phase === 'build' ? build : { ...spec, phase };
    const one = phase === 'build' ? alone : await spawnPhase({ ...at, threads: 1 });
    const two = await spawnPhase({ ...at, threads: 2 });
    speedUp[phase] = ratio(one.seconds, two.seconds);
  }
  return { ceiling, speedUp };
}
