/** Sizes of one benchmark run, from the command line. */
export interface BenchOptions {
  /** Files of the mail-like folder corpus (default 6,000: about 32 MB). */
  mailFiles: number;
  /** Rows of the review-like CSV (default 30,000: about 8.7 MB). */
  reviewRows: number;
  /** Megabytes of the large-vocabulary text, or 0 to leave it out (default 0; `--large`: 236). */
  largeMegabytes: number;
  seed: number;
}

const USAGE = `npm run bench -- [--files N] [--rows N] [--large] [--large-mb N] [--scale F] [--seed N]
  --files N      mail-like corpus: N files (default 6000, about 32 MB)
  --rows N       review-like CSV: N rows (default 30000, about 8.7 MB)
  --large        add the large-vocabulary corpus (236 MB, about 3.5 million distinct tokens)
  --large-mb N   its size in MB (implies --large)
  --scale F      multiply every size by F (0.1 for a quick look)
  --seed N       generator seed (default 1)`;

function numberAfter(argv: readonly string[], i: number, flag: string): number {
  const value = Number(argv[i + 1]);
  if (!Number.isFinite(value) || value <= 0) throw new Error(`${flag} needs a positive number\n${USAGE}`);
  return value;
}

/** Reads the benchmark's flags; throws with the usage text for anything unknown. */
export function benchOptions(argv: readonly string[]): BenchOptions {
  const options: BenchOptions = { mailFiles: 6_000, reviewRows: 30_000, largeMegabytes: 0, seed: 1 };
  let scale = 1;
  for (let i = 0; i < argv.length; i++) {
    const flag = argv[i];
    if (flag === '--large') options.largeMegabytes = options.largeMegabytes || 236;
    else if (flag === '--files') options.mailFiles = numberAfter(argv, i++, flag);
    else if (flag === '--rows') options.reviewRows = numberAfter(argv, i++, flag);
    else if (flag === '--large-mb') options.largeMegabytes = numberAfter(argv, i++, flag);
    else if (flag === '--scale') scale = numberAfter(argv, i++, flag);
    else if (flag === '--seed') options.seed = numberAfter(argv, i++, flag);
    else throw new Error(`unknown flag ${String(flag)}\n${USAGE}`);
  }
  return {
    mailFiles: Math.max(1, Math.round(options.mailFiles * scale)),
    reviewRows: Math.max(1, Math.round(options.reviewRows * scale)),
    largeMegabytes: options.largeMegabytes * scale,
    seed: options.seed,
  };
}
