import { describe, expect, it } from 'vitest';
import { DistinctEstimate } from '../../src/tally/DistinctEstimate.js';
import { spanHashes } from '../../src/tally/spanHashes.js';
import { letters } from '../helpers/generatedCorpora.js';

// HyperLogLog (Flajolet, Fusy, Gandouet, Meunier 2007): with m = 2^14 registers the relative standard
// error is 1.04 / sqrt(m) = 0.81 %. Checked at three standard errors (2.4 %) on made-up tokens, and
// exact-ish where linear counting applies (few tokens).
function estimateOf(tokens: Iterable<string>): number {
  const d = new DistinctEstimate();
  const h = new Int32Array(3);
  for (const t of tokens) {
    spanHashes(t, 0, t.length, false, h);
    d.add(h[1] as number, h[2] as number);
  }
  return d.estimate();
}

function* distinct(n: number, repeat = 1): Generator<string> {
  for (let r = 0; r < repeat; r++) for (let i = 0; i < n; i++) yield `w${letters(i)}`;
}

describe('DistinctEstimate', () => {
  it.each([0, 1, 10, 1000])('is within a token or two of %i distinct tokens (linear counting)', (n) => {
    expect(Math.abs(estimateOf(distinct(n, 3)) - n)).toBeLessThanOrEqual(Math.max(1, n * 0.01));
  });

  it.each([20_000, 200_000, 1_000_000])('is within three standard errors of %i distinct tokens, however often each comes', (n) => {
    expect(Math.abs(estimateOf(distinct(n, 2)) - n) / n).toBeLessThan(0.024);
  });
});
