// Tokenizing takes time linear in the text for every input (issue 13, denial of service): on text where
// wink-tokenizer run as it is takes quadratic time (long runs without white space), 1 MiB must cost
// about 16 times what 64 KiB costs, never the 256 times a quadratic cost would. Times are only compared
// with each other, in the same run, with a wide margin: below 64, four times linear and a quarter of
// quadratic. tests/rules/fast/scanWork.test.ts proves the same by counting steps, for every family.
import { describe, expect, it } from 'vitest';
import { tokenize } from '../../src/rules/tokenize.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { timeRatio } from '../helpers/leastTime.js';
import { hostileText, MOST_RATIO, TIMED_FAMILIES } from './fast/hostileText.js';

const rules = resolveRules();

describe('tokenize takes time linear in the text on hostile text', () => {
  it.each(TIMED_FAMILIES)('$name: 1 MiB takes less than 64 times as long as 64 KiB', (family) => {
    const small = hostileText(family, 64 * 1024);
    const large = hostileText(family, 1024 * 1024);
    expect(timeRatio(() => tokenize(small, rules), () => tokenize(large, rules), 4, 16)).toBeLessThan(MOST_RATIO);
  });
});
