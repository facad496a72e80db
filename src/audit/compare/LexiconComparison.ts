import type { Shape } from '../../lexicon/Shape.js';
import type { TextRules } from '../../rules/TextRules.js';

/** One member that differs between two settings objects: its name and the value in each lexicon. */
export type MemberDifference<T, K extends keyof T> = { [M in K]: { member: M; a: T[M]; b: T[M] } }[K];

/** A text rule that differs (`member` is one of level, unicode, case, drop, collapse, spaces, tokenizer). */
export type RuleDifference = MemberDifference<TextRules, keyof TextRules>;

/** The id layout of a lexicon: where OOV goes and how many reserved tokens lead the token list. */
export interface Layout {
  oov: 'first' | 'last';
  reserved: number;
}

/** A layout member that differs (`member` is oov or reserved). */
export type LayoutDifference = MemberDifference<Layout, keyof Layout>;

/** How many tokens a list holds, and the first few of them in id order. */
export interface TokenSample {
  count: number;
  first: string[];
}

/** A shared token whose id differs: its id in lexicon a and in lexicon b. */
export interface MovedToken {
  token: string;
  a: number;
  b: number;
}

/** How many shared tokens changed id, and the first few of them in lexicon a's id order. */
export interface MovedTokens {
  count: number;
  first: MovedToken[];
}

/** How many of the K top-ranked tokens the two lexicons share; `share` is `shared / k`. */
export interface TopOverlap {
  k: number;
  shared: number;
  share: number;
}

/** A label both lexicons know under different ids. */
export interface MovedLabel {
  label: string;
  a: number;
  b: number;
}

/**
 * Labels side by side: `a` and `b` are how many labels each lexicon has (null: it stores no labels);
 * the lists are complete (labels are few), in each lexicon's label id order.
 */
export interface LabelComparison {
  a: number | null;
  b: number | null;
  onlyInA: string[];
  onlyInB: string[];
  moved: MovedLabel[];
}

/**
 * Two lexicons side by side (`compareLexicons`). Member names are a public contract
 * (`lexlock compare --json`). Every part of the encoding the fingerprint covers shows up in one
 * member: `rules`, `layout`, `shape`, the token list (`onlyInA`, `onlyInB`, `moved`) and `labels`,
 * so `sameFingerprint` is true exactly when none of them reports a difference.
 */
export interface LexiconComparison {
  /** True when both have the same fingerprint: they encode every text identically. */
  sameFingerprint: boolean;
  fingerprints: { a: string; b: string };
  /** The text rules that differ, in the order level, unicode, case, drop, collapse, spaces, tokenizer. */
  rules: RuleDifference[];
  /** The layout members that differ, in the order oov, reserved. */
  layout: LayoutDifference[];
  /** Both stored shapes (null: variable length) when they differ; null when they are the same. */
  shape: { a: Shape | null; b: Shape | null } | null;
  /** Tokens with an id of their own (reserved ones included) in each, and in both. */
  tokens: { a: number; b: number; shared: number };
  /** Tokens lexicon b has no id for; `first` in a's id order. */
  onlyInA: TokenSample;
  /** Tokens lexicon a has no id for; `first` in b's id order. */
  onlyInB: TokenSample;
  /** Shared tokens whose id differs. */
  moved: MovedTokens;
  /** Overlap of the top-K ranked tokens (reserved ones left out), for each K asked for, ascending. */
  topOverlap: TopOverlap[];
  labels: LabelComparison;
}
