/** The phases the benchmark runs, each in a child process of its own. */
export type PhaseName =
  | 'tokenize'
  /** Tokenize and count (a Tally) the texts, loaded first: counting's own speed. */
  | 'count'
  | 'plain'
  | 'build'
  /** `lexlock build` as users run it: the CLI, default thread count. */
  | 'build-cli'
  /** `lexlock build --threads 1`: the CLI unbounded on one thread, as the bounded count runs (`--large` only). */
  | 'build-cli-one-thread'
  /** `lexlock build --memory-limit <memoryLimitMiB>`: the CLI in bounded memory (`--large` only). */
  | 'build-cli-bounded'
  /** `lexlock build --encode`: fit and encode from one reading, through the CLI. */
  | 'build-encode-cli'
  | 'baseline-build'
  | 'encode-noop'
  | 'encode-npy'
  | 'baseline-encode'
  /** The careful user's one script: read and tokenize each document once, keep the tokens, count, sort, encode from them. */
  | 'baseline-one-script'
  | 'audit'
  | 'latency'
  /** Nothing: the floor of every child's memory (Node, the tsx loader, lexlock imported). */
  | 'idle';

/** What a child process is asked to run. */
export interface PhaseSpec {
  phase: PhaseName;
  /** The corpus path. */
  corpus: string;
  /** Label field for csv corpora (folders take theirs from the path). */
  label?: string;
  /** The lexicon file: written by `build`, read by the encode and audit phases. */
  lexicon: string;
  /** Scratch output (the `.npy` folder). */
  out: string;
  cap: number;
  length: number;
  /** The `--memory-limit` of `build-cli-bounded`, MiB. */
  memoryLimitMiB?: number;
  /** Worker threads for the build, encode-noop and audit phases (default 1; audit runs `auditOnThreads` when given). */
  threads?: number;
}

/** What a child process reports. */
export interface PhaseResult {
  phase: PhaseName;
  /** Seconds of the measured part (setup such as loading documents or a lexicon excluded). */
  seconds: number;
  /** Peak resident set size of the child process, in KiB (`process.resourceUsage().maxRSS`). */
  maxRssKiB: number;
  /** Phase-specific figures (tokens, distinct tokens, latency percentiles...). */
  figures: Record<string, number>;
}
