import { describe, expect, it } from 'vitest';
import { shortNames } from '../../../src/audit/report/svg/shortNames.js';

describe('shortNames', () => {
  it('leaves short names alone and cuts long ones in the middle', () => {
    expect(shortNames(['billing', 'lost-property-north'], 12)).toEqual(['billing', 'lost-p…north']);
  });

  it('keeps more of the ends where cut names would look alike', () => {
    expect(shortNames(['lost-property-north-pier', 'lost-property-south-pier'], 12)).toEqual(['los…rth-pier', 'los…uth-pier']);
    const names = Array.from({ length: 12 }, (_, i) => `a-rather-long-desk-name-number-${String(i)}-for-overflow`);
    const cut = shortNames(names, 24);
    expect(new Set(cut).size).toBe(12);
    for (const name of cut) expect([...name].length).toBeLessThanOrEqual(24);
  });

  it('gives up at a three-character start when the difference is deeper inside', () => {
    const names = [`${'x'.repeat(30)}1${'y'.repeat(30)}`, `${'x'.repeat(30)}2${'y'.repeat(30)}`];
    expect(shortNames(names, 24)).toEqual([`xxx…${'y'.repeat(20)}`, `xxx…${'y'.repeat(20)}`]);
  });

  it('counts characters, not UTF-16 units', () => {
    expect(shortNames(['渡し船の遅延と払い戻しに関するお問い合わせ'], 8)).toEqual(['渡し船の…合わせ']);
    expect(shortNames(['𝔣'.repeat(10)], 5)).toEqual(['𝔣𝔣…𝔣𝔣']); // astral characters are one each
  });
});
