import type { HistogramBin } from './svg/histogram.js';

/** Document lengths in equal-width bins, each split into documents kept whole and truncated ones. */
export interface LengthBins {
  /** Lengths per bin (1: one bar per length). */
  width: number;
  bins: HistogramBin[];
}

/** Up to this many distinct lengths get one bar each; more are binned. */
const UNBINNED = 80;
const MAX_BINS = 60;
const MANTISSAS = [1, 1.5, 2, 2.5, 3, 4, 5, 6, 7.5, 8];

/**
 * The smallest friendly whole bin width (1, 2, 3, 4, 5, 6, 8, 10, 15, 20, 25, 30…) that splits `span`
 * lengths into at most 60 bins; neighbouring widths differ by at most 1.5×, so there are over 40.
 */
export function binWidthFor(span: number): number {
  if (span <= UNBINNED) return 1;
  for (let k = 0; k < 16; k++) {
    for (const m of MANTISSAS) {
      const width = m * 10 ** k;
      if (Number.isInteger(width) && span / width <= MAX_BINS) return width;
    }
  }
  return Math.ceil(span / MAX_BINS);
}

/**
 * Bins a length histogram (ascending or not) into equal-width bins aligned on multiples of the width;
 * documents longer than `cutAbove` count as `over` (truncated), the rest as `base`. Null: nothing is cut.
 * @example binLengths([{ length: 3, documents: 2 }, { length: 5, documents: 1 }], 4).bins.length // 3
 */
export function binLengths(histogram: ReadonlyArray<{ length: number; documents: number }>, cutAbove: number | null): LengthBins {
  if (histogram.length === 0) return { width: 1, bins: [] };
  let min = Infinity;
  let max = -Infinity;
  for (const h of histogram) {
    min = Math.min(min, h.length);
    max = Math.max(max, h.length);
  }
  const width = binWidthFor(max - min + 1);
  const start = Math.floor(min / width) * width;
  const count = Math.floor((max - start) / width) + 1;
  const bins: HistogramBin[] = Array.from({ length: count }, (_, i) => ({ from: start + i * width, to: start + (i + 1) * width - 1, base: 0, over: 0 }));
  for (const h of histogram) {
    const bin = bins[Math.floor((h.length - start) / width)];
    if (bin === undefined) continue;
    if (cutAbove !== null && h.length > cutAbove) bin.over += h.documents;
    else bin.base += h.documents;
  }
  return { width, bins };
}
