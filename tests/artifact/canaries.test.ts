import { describe, expect, it } from 'vitest';
import { PROBE_TEXTS, checkCanaries, makeCanaries } from '../../src/artifact/canaries.js';
import { resolveRules } from '../../src/rules/TextRules.js';

describe('canaries', () => {
  it('cover contractions, numbers, URLs, e-mail, emoji, accented Latin, Cyrillic and CJK', () => {
    const all = PROBE_TEXTS.join(' ');
    for (const probe of ["can't", '10 am', 'https://', '@harbour.example', '😀', 'Café', 'Паром', '東京']) expect(all).toContain(probe);
  });

  it('store the tokens each probe and snippet gives, and find none changed under the same rules', () => {
    const rules = resolveRules();
    const canaries = makeCanaries(rules, ['the 10 am ferry']);
    expect(canaries).toHaveLength(PROBE_TEXTS.length + 1);
    expect(canaries.at(-1)).toEqual({ text: 'the 10 am ferry', tokens: ['the', '10 am', 'ferry'] });
    expect(checkCanaries(rules, canaries)).toEqual([]);
  });

  it('report every canary that tokenizes differently now', () => {
    const canaries = makeCanaries(resolveRules(), ['Ferry LATE']);
    const differences = checkCanaries(resolveRules({ case: 'keep' }), canaries);
    expect(differences.map((d) => d.index)).toContain(PROBE_TEXTS.length);
    expect(differences.find((d) => d.index === PROBE_TEXTS.length)).toEqual({ index: PROBE_TEXTS.length, text: 'Ferry LATE', expected: ['ferry', 'late'], actual: ['Ferry', 'LATE'] });
  });
});
