import type { PageData, PageSeries } from './PageData.js';
import { stopsOf } from './StopGrid.js';

/** What one series shows at a cap and a length: the figures the page's script recomputes. */
export interface SeriesFigures {
  keptOccurrences: number;
  oovTokens: number;
  truncatedDocuments: number;
  droppedTokens: number;
  paddingTokens: number;
}

function sumTo(values: readonly number[], index: number): number {
  let sum = 0;
  for (let i = 0; i <= index && i < values.length; i++) sum += values[i] as number;
  return sum;
}

/**
 * A series' figures at cap stop `cap` and length stop `length` (values, which must be stops of the
 * page's grids): the same sums the page's script makes. Null length: no truncation figures (0).
 * @example figuresAt(data, data.overall, 1000, 96).oovTokens
 */
export function figuresAt(data: PageData, series: PageSeries, cap: number, length: number | null): SeriesFigures {
  const capIndex = stopsOf(data.cap.grid).indexOf(cap);
  if (capIndex < 0) throw new Error(`cap ${cap} is not a stop of the page's cap grid`);
  const kept = sumTo(series.kept, capIndex);
  const out = { keptOccurrences: kept, oovTokens: series.tokens - kept, truncatedDocuments: 0, droppedTokens: 0, paddingTokens: 0 };
  if (length === null) return out;
  const lengthIndex = stopsOf(data.length.grid).indexOf(length);
  if (lengthIndex < 0) throw new Error(`length ${length} is not a stop of the page's length grid`);
  const whole = sumTo(series.documentsUpTo, lengthIndex);
  const wholeTokens = sumTo(series.tokensUpTo, lengthIndex);
  out.truncatedDocuments = series.documents - whole;
  out.droppedTokens = series.tokens - wholeTokens - length * out.truncatedDocuments;
  out.paddingTokens = length * whole - wholeTokens;
  return out;
}
