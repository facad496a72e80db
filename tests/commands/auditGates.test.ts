import { describe, expect, it } from 'vitest';
import type { CoverageReport } from '../../src/audit/CoverageReport.js';
import { crossedGates } from '../../src/commands/auditSummary.js';
import { percent, percentsApart } from '../../src/commands/format.js';

/** Only the members the gates read: the OOV rate and the truncated share. */
function report(oovRate: number, truncatedDocuments = 0, documents = 1): CoverageReport {
  return { oovRate, truncatedDocuments, documents } as CoverageReport;
}

describe('percentsApart', () => {
  it.each<[string, number, number, string, string]>([
    ['apart at 2 decimals', 0.0612, 0.05, '6.12 %', '5.00 %'],
    ['equal at 2 decimals, apart at 4', 0.020501, 0.0205, '2.0501 %', '2.0500 %'],
    ['apart only at the 6th decimal', 0.02050001, 0.0205, '2.050001 %', '2.050000 %'],
    ['apart at the 3rd decimal', 1 / 48, 0.0208, '2.083 %', '2.080 %'],
    ['the gate above the share', 0.0208, 1 / 48, '2.080 %', '2.083 %'],
    ['equal shares: 2 decimals', 0.0205, 0.0205, '2.05 %', '2.05 %'],
    ['zero and everything', 0, 1, '0.00 %', '100.00 %'],
    // Adjacent doubles: share × 100 would round both to 2.0500000000000003; their exact decimal
    // expansions (ECMA-262 Number.prototype.toFixed is exact) still differ at the 16th decimal.
    ['adjacent doubles', 0.0205 + 2 ** -58, 0.0205, '2.0500000000000004 %', '2.0500000000000001 %'],
  ])('%s', (_what, a, b, shownA, shownB) => {
    expect(percentsApart(a, b)).toEqual([shownA, shownB]);
  });

  it('shows 2 decimals as percent does whenever they tell the shares apart', () => {
    for (const [a, b] of [[0.6154, 0.5], [0.25, 0.2], [0.333, 0.1]] as const) expect(percentsApart(a, b)).toEqual([percent(a), percent(b)]);
  });
});

describe('crossedGates', () => {
  it.each<[string, CoverageReport, number | null, number | null, string[]]>([
    ['OOV equal to the gate at 2 decimals', report(0.020501), 0.0205, null, ['OOV rate 2.0501 % is above --max-oov 2.0500 %']],
    ['OOV apart at the 6th decimal', report(0.02050001), 0.0205, null, ['OOV rate 2.050001 % is above --max-oov 2.050000 %']],
    ['OOV of exactly the gate (41 of 2,000 tokens) is not above it', report(41 / 2000), 0.0205, null, []],
    ['truncated equal at 2 decimals', report(0, 2051, 100_000), null, 0.0205, ['2.051 % of documents are truncated, above --max-truncated 2.050 %']],
    ['truncated of exactly the gate', report(0, 41, 2000), null, 0.0205, []],
  ])('%s', (_what, r, maxOov, maxTruncated, lines) => {
    expect(crossedGates(r, { maxOov, maxTruncated })).toEqual(lines);
  });
});
