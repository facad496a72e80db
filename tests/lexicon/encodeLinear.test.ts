// Lexicon.encode on hostile text (issue 13): the ids of the contract's definition (wink-tokenizer on
// the whole normalized text, then each token's id, as tests/lexicon/encodeExact.test.ts compares them),
// in time linear in the text: steps counted by scanWork, and 1 MiB timed against 64 KiB in the same run.
import { describe, expect, it } from 'vitest';
import { freeze } from '../../src/lexicon/freeze.js';
import { scanWork } from '../../src/rules/fast/scanWork.js';
import { normalize } from '../../src/rules/normalize.js';
import { resolveRules, type TextRules } from '../../src/rules/TextRules.js';
import { plainWordTokens } from '../../src/rules/wordTokens.js';
import { Tally } from '../../src/tally/Tally.js';
import { timeRatio } from '../helpers/leastTime.js';
import { HOSTILE_FAMILIES, hostileText, MOST_RATIO, TIMED_FAMILIES } from '../rules/fast/hostileText.js';

const RULE_SETS: readonly [string, TextRules][] = [
  ['default rules', resolveRules()],
  ['case keep, NFC, number/url collapsed, punctuation and symbols dropped', resolveRules({ case: 'keep', unicode: 'NFC', collapse: ['number', 'url'], drop: ['punctuation', 'symbol'] })],
];

/** A lexicon fitted on a few hostile texts, capped so that some of their tokens are unknown. */
function lexiconOf(rules: TextRules) {
  return freeze(Tally.fromTexts(HOSTILE_FAMILIES.map((f) => hostileText(f, 300)), rules), { cap: 40 });
}

describe('encode gives the definition\'s ids on hostile text', () => {
  it.each(RULE_SETS)('every family at 4 KiB, as it is and upper-cased; %s', (_name, rules) => {
    const lexicon = lexiconOf(rules);
    for (const family of HOSTILE_FAMILIES) {
      for (const text of [hostileText(family, 4 * 1024), hostileText(family, 4 * 1024).toUpperCase()]) {
        const expected = lexicon.idsOf(plainWordTokens(normalize(text, rules), rules));
        expect(Array.from(lexicon.encode(text, { shape: null })), family.name).toEqual(Array.from(expected));
      }
    }
  });

  it('letters and underscores at 16 KiB', () => {
    const rules = resolveRules();
    const lexicon = lexiconOf(rules);
    const text = hostileText(HOSTILE_FAMILIES[0] as (typeof HOSTILE_FAMILIES)[number], 16 * 1024);
    expect(Array.from(lexicon.encode(text, { shape: null }))).toEqual(Array.from(lexicon.idsOf(plainWordTokens(normalize(text, rules), rules))));
  });
});

describe('encode takes time linear in the text on hostile text', () => {
  const rules = resolveRules();
  const lexicon = lexiconOf(rules);

  // Every family is counted through tokenize in tests/rules/fast/scanWork.test.ts; these through encode.
  it.each(TIMED_FAMILIES)('$name: at most 21 steps a code unit at 1 MiB', (family) => {
    const text = hostileText(family, 1024 * 1024);
    const before = scanWork.units;
    expect(lexicon.encode(text, { shape: null }).length).toBeGreaterThan(0);
    expect((scanWork.units - before) / normalize(text, rules).length).toBeLessThanOrEqual(21);
  });

  it.each(TIMED_FAMILIES)('$name: 1 MiB takes less than 64 times as long as 64 KiB', (family) => {
    const small = hostileText(family, 64 * 1024);
    const large = hostileText(family, 1024 * 1024);
    const shape = { shape: { length: 128, pad: 'start', cut: 'end' } } as const;
    expect(timeRatio(() => lexicon.encode(small, shape), () => lexicon.encode(large, shape), 4, 16)).toBeLessThan(MOST_RATIO);
  });
});
