/**
 * One part of a corpus split for training: a name (it names the part's output: `out/train/`,
 * `train.jsonl`) and the share of documents it should get (above 0; the shares of a split add up to 1).
 */
export interface Split {
  readonly name: string;
  readonly share: number;
}

/** How a corpus is split: the parts, and the seed their assignment depends on. */
export interface SplitPlan {
  readonly splits: readonly Split[];
  /** A whole number from 0 to 2^53 - 1; another seed gives another, equally stable assignment. */
  readonly seed: number;
}

/** The seed a split uses when none is given: 0. */
export const DEFAULT_SEED = 0;

/** How far the shares of a split may be from 1 in all (they are decimals written by people). */
export const SHARE_TOLERANCE = 1e-9;
