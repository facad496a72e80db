// The bench's bounded-memory comparison (`--large`): `lexlock build` unbounded against
// `lexlock build --memory-limit`, on the same corpus, as plain functions the bench's tests check.

/** The `--memory-limit` the bench builds the large-vocabulary corpus with, MiB (README, Bounded memory). */
export const BENCH_MEMORY_LIMIT_MIB = 256;
/** The cap of the large-vocabulary corpus's builds: what README's Bounded memory figures use. */
export const LARGE_CAP = 50_000;

/** One build as the bench measured it. */
export interface MeasuredBuild {
  seconds: number;
  maxRssKiB: number;
  /** The lexicon file's `fingerprint`. */
  fingerprint: string;
}

/** The `fingerprint` of a lexicon file's text; throws, naming the file, when it has none. */
export function fingerprintOf(text: string, path: string): string {
  const fingerprint = (JSON.parse(text) as { fingerprint?: unknown }).fingerprint;
  if (typeof fingerprint !== 'string' || !fingerprint.startsWith('sha256:')) throw new Error(`${path} holds no lexicon fingerprint`);
  return fingerprint;
}

/**
 * Checks that the bounded build wrote the unbounded build's lexicon (README's promise: the same
 * fingerprint), throwing loudly with both when it did not.
 */
export function checkSameFingerprint(unbounded: MeasuredBuild, bounded: MeasuredBuild, limitMiB: number): void {
  if (unbounded.fingerprint !== bounded.fingerprint) {
    throw new Error(
      `BOUNDED BUILD DIFFERS: lexlock build --memory-limit ${limitMiB} wrote fingerprint ${bounded.fingerprint}, the unbounded build ${unbounded.fingerprint}; the bounded build must write the same lexicon`,
    );
  }
}

const mib = (kib: number) => (kib / 1024).toFixed(0);
const ratio = (a: number, b: number) => (b > 0 ? `${(a / b).toFixed(2)}x` : 'n/a');

/**
 * The bench's lines about the bounded build: its time over each unbounded build's (all cores, the
 * default, and one thread, since the bounded count runs on one thread), the three peak RSS, and the
 * one fingerprint they share.
 * @example boundedLines(all, one, bounded, 256) // ['--memory-limit 256: 38.50 s at 224 MiB peak RSS; …', …]
 */
export function boundedLines(allCores: MeasuredBuild, oneThread: MeasuredBuild, bounded: MeasuredBuild, limitMiB: number): string[] {
  return [
    `lexlock build --memory-limit ${limitMiB} (counts on one thread): ${bounded.seconds.toFixed(2)} s at ${mib(bounded.maxRssKiB)} MiB peak RSS`,
    `  vs lexlock build unbounded, all cores (the default --threads): ${allCores.seconds.toFixed(2)} s at ${mib(allCores.maxRssKiB)} MiB: time ${ratio(bounded.seconds, allCores.seconds)}`,
    `  vs lexlock build unbounded, --threads 1: ${oneThread.seconds.toFixed(2)} s at ${mib(oneThread.maxRssKiB)} MiB: time ${ratio(bounded.seconds, oneThread.seconds)}`,
    `  same lexicon: fingerprint ${bounded.fingerprint}`,
  ];
}
