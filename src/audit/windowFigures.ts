import type { Shape } from '../lexicon/Shape.js';
import type { LengthSummary } from '../tally/nearestRank.js';
import type { ByCutEnd, CutAdvice, LengthCandidate, WindowFigures } from './CoverageReport.js';
import { OOV_POSITIONS, type OovPositions } from './OovPositions.js';

/** The candidate lengths of a corpus: its p50, p90, p95 and p99 document lengths, and the length audited. */
export function lengthCandidates(length: LengthSummary, shape: Shape | null): Array<[LengthCandidate, number]> {
  const out: Array<[LengthCandidate, number]> = [
    ['p50', length.p50],
    ['p90', length.p90],
    ['p95', length.p95],
    ['p99', length.p99],
  ];
  if (shape !== null) out.push(['chosen', shape.length]);
  return out;
}

/** OOV tokens rows of `length` keep for each cut end, or null where positions are not counted. */
function keptOovAt(positions: OovPositions, length: number, longest: number): ByCutEnd | null {
  if (length > OOV_POSITIONS && longest > OOV_POSITIONS) return null;
  return { cutStart: positions.keptOov(length, 'start'), cutEnd: positions.keptOov(length, 'end') };
}

/**
 * The rows of each candidate length (those of at least 1 token, one entry a length, ascending) from
 * the corpus's length histogram (tokens -> documents) and where its OOV tokens are.
 * @example windowFigures(new Map([[3, 1], [6, 1]]), positions, [['chosen', 4]]) // [{ length: 4, truncatedDocuments: 1, droppedTokens: 2, keptTokens: 7, paddingTokens: 1, paddingShare: 0.125, … }]
 */
export function windowFigures(lengths: ReadonlyMap<number, number>, positions: OovPositions, candidates: ReadonlyArray<[LengthCandidate, number]>): WindowFigures[] {
  const byLength = new Map<number, LengthCandidate[]>();
  for (const [name, length] of candidates) {
    if (length < 1) continue;
    const names = byLength.get(length) ?? [];
    names.push(name);
    byLength.set(length, names);
  }
  let documents = 0;
  let longest = 0;
  for (const [n, d] of lengths) {
    documents += d;
    if (d > 0 && n > longest) longest = n;
  }
  return [...byLength.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([length, names]) => {
      let truncatedDocuments = 0;
      let droppedTokens = 0;
      let keptTokens = 0;
      let paddingTokens = 0;
      for (const [n, d] of lengths) {
        if (n > length) {
          truncatedDocuments += d;
          droppedTokens += (n - length) * d;
          keptTokens += length * d;
        } else {
          paddingTokens += (length - n) * d;
          keptTokens += n * d;
        }
      }
      const keptOov = keptOovAt(positions, length, longest);
      const rate = (oov: number) => (keptTokens === 0 ? 0 : oov / keptTokens);
      return {
        length,
        candidates: names,
        truncatedDocuments,
        droppedTokens,
        keptTokens,
        paddingTokens,
        paddingShare: documents === 0 ? 0 : paddingTokens / (documents * length),
        keptOov,
        keptOovRate: keptOov === null ? null : { cutStart: rate(keptOov.cutStart), cutEnd: rate(keptOov.cutEnd) },
      };
    });
}

/**
 * Which end to cut at the length audited (else at the corpus's p95, kept within 1 and the longest
 * storable row), by the tokens with an id of their own the rows keep.
 */
export function cutAdvice(lengths: ReadonlyMap<number, number>, positions: OovPositions, shape: Shape | null, p95: number): CutAdvice {
  const length = Math.min(OOV_POSITIONS, Math.max(1, shape?.length ?? p95));
  let kept = 0;
  for (const [n, d] of lengths) kept += Math.min(n, length) * d;
  const knownKept = { cutStart: kept - positions.keptOov(length, 'start'), cutEnd: kept - positions.keptOov(length, 'end') };
  const cut = knownKept.cutStart === knownKept.cutEnd ? null : knownKept.cutStart > knownKept.cutEnd ? 'start' : 'end';
  return { length, knownKept, cut };
}
