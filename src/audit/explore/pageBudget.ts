import { stopGrid, type StopGrid } from './StopGrid.js';

/**
 * How many figures the report page embeds for its controls, at most: `CAP_FIGURES` occurrences by
 * cap stop (overall and per label) and `LENGTH_FIGURES` documents and tokens by length stop. Every
 * figure is a whole count below 2^53 (16 digits at most) and a comma, so they take at most
 * (48,000 + 32,000) x 17 bytes = 1,360,000 bytes; with the rest of the page (its tables and lists
 * bounded too) the page stays within 2 MB however many tokens, documents and labels the corpus has.
 */
export const CAP_FIGURES = 48_000;
export const LENGTH_FIGURES = 32_000;
/** The most labels whose figures follow the controls (those with the most documents). */
export const LIVE_LABELS = 200;
/** The page's size bound in bytes, which the tests hold it to. */
export const PAGE_BYTES = 2_000_000;

/**
 * The cap grid, fixed before an audit counts: stops from 0 to the ranking's `ranked` tokens, as many as
 * the budget gives each of the `labels` expected plus the whole corpus; `chosen` (the audited cap) is one.
 * @example capGrid(5_000, 1_200, 4).step // 1 (every cap: 5,001 stops fit 48,000 / 5)
 */
export function capGrid(ranked: number, chosen: number, labels: number): StopGrid {
  return stopGrid(ranked, Math.floor(CAP_FIGURES / (1 + Math.min(Math.max(0, labels), LIVE_LABELS))), [Math.min(chosen, ranked)]);
}

/** The length grid, made once lengths are known: stops from 0 to `last`, two figures a stop for each of `labels` plus the whole. */
export function lengthGrid(last: number, chosen: number | null, labels: number): StopGrid {
  return stopGrid(last, Math.floor(LENGTH_FIGURES / (2 * (1 + labels))), chosen === null ? [] : [chosen]);
}
