import type { CutAdvice } from './CoverageReport.js';
import { formatCount } from './report/formatCount.js';

/** A count with its noun, singular for 1. */
function tokens(n: number): string {
  return `${formatCount(n)} known ${n === 1 ? 'token' : 'tokens'}`;
}

/**
 * Which cut end keeps more known tokens (tokens with an id of their own), in words, for summaries and
 * the report.
 * @example describeCutAdvice({ length: 96, knownKept: { cutStart: 6120, cutEnd: 8410 }, cut: 'end' })
 * // 'at length 96 rows keep 8,410 known tokens when long documents lose their end, 6,120 when they lose their start: cut the end'
 */
export function describeCutAdvice(advice: CutAdvice): string {
  const { length, knownKept, cut } = advice;
  if (cut === null) return `at length ${formatCount(length)} rows keep ${tokens(knownKept.cutEnd)} whichever end long documents lose`;
  const [better, worse] = cut === 'end' ? [knownKept.cutEnd, knownKept.cutStart] : [knownKept.cutStart, knownKept.cutEnd];
  return `at length ${formatCount(length)} rows keep ${tokens(better)} when long documents lose their ${cut}, ${formatCount(worse)} when they lose their ${cut === 'end' ? 'start' : 'end'}: cut the ${cut}`;
}
