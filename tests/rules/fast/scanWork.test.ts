// Tokenizing costs a bounded number of steps per code unit (of the normalized text) on any text
// (issue 13): counted, not timed.
// scanWork counts what the word level's searches step over; on the hostile families (where
// wink-tokenizer run as it is takes quadratic time) and on fast-check's, at 16 KiB, 64 KiB and 1 MiB,
// it must stay under a fixed number of steps per code unit, the same at every size. The bound: each of
// wink's 16 rules searches what the rules before it left once, the e-mail scanner and a word split step
// over a code unit at most twice, and the last step splits what is left once (16 + 2 + 2 + 1 = 21).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { scanWork } from '../../../src/rules/fast/scanWork.js';
import { normalize } from '../../../src/rules/normalize.js';
import { tokenize } from '../../../src/rules/tokenize.js';
import { resolveRules } from '../../../src/rules/TextRules.js';
import { HOSTILE_FAMILIES, hostileFamily, hostileText } from './hostileText.js';

const STEPS_PER_UNIT = 21;
const SIZES = [16 * 1024, 64 * 1024, 1024 * 1024];
const rules = resolveRules();

/**
 * Steps counted per code unit of the normalized text while tokenizing `text` (normalization may make
 * a text longer: NFKC makes `…` three dots, U+FDFA 18 characters), and the tokens' count.
 */
function stepsPerUnit(text: string): { perUnit: number; tokens: number } {
  const length = normalize(text, rules).length;
  const before = scanWork.units;
  const tokens = tokenize(text, rules).length;
  return { perUnit: (scanWork.units - before) / length, tokens };
}

describe('tokenize steps over each code unit a bounded number of times', () => {
  it.each(HOSTILE_FAMILIES)('$name: at most 21 steps a code unit at 16 KiB, 64 KiB and 1 MiB, the same at each size', (family) => {
    // Smallest first, each checked at once: a quadratic cost fails at 16 KiB instead of running for hours.
    const perUnit: number[] = [];
    for (const size of SIZES) {
      const counted = stepsPerUnit(hostileText(family, size));
      expect(counted.perUnit).toBeLessThanOrEqual(STEPS_PER_UNIT);
      expect(counted.tokens).toBeGreaterThan(0);
      perUnit.push(counted.perUnit);
    }
    // Linear: the steps per code unit do not grow with the size (prefix and suffix aside).
    const [small, , large] = perUnit as [number, number, number];
    expect(small).toBeGreaterThan(0);
    expect(large).toBeLessThanOrEqual(small * 1.01 + 0.01);
  });

  it('at most 21 steps a code unit on fast-check hostile text of 64 KiB', () => {
    fc.assert(
      fc.property(hostileFamily, (family) => {
        expect(stepsPerUnit(hostileText(family, 64 * 1024)).perUnit).toBeLessThanOrEqual(STEPS_PER_UNIT);
      }),
      { numRuns: 40 },
    );
  });
});
