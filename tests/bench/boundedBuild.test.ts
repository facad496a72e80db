import { describe, expect, it } from 'vitest';
import { boundedLines, checkSameFingerprint, fingerprintOf, type MeasuredBuild } from './boundedBuild.js';

const fingerprint = `sha256:${'ab'.repeat(32)}`;
const build = (seconds: number, maxRssKiB: number, f = fingerprint): MeasuredBuild => ({ seconds, maxRssKiB, fingerprint: f });

describe('the bench line of the bounded build', () => {
  it('prints the time over both unbounded builds, the three peak RSS and the shared fingerprint', () => {
    expect(boundedLines(build(23.8, 663 * 1024), build(30.1, 600 * 1024), build(38.5, 224 * 1024), 256)).toEqual([
      'lexlock build --memory-limit 256 (counts on one thread): 38.50 s at 224 MiB peak RSS',
      '  vs lexlock build unbounded, all cores (the default --threads): 23.80 s at 663 MiB: time 1.62x',
      '  vs lexlock build unbounded, --threads 1: 30.10 s at 600 MiB: time 1.28x',
      `  same lexicon: fingerprint ${fingerprint}`,
    ]);
  });

  it('says n/a rather than dividing by a zero time', () => {
    expect(boundedLines(build(0, 0), build(0, 0), build(1, 1024), 64)[1]).toBe('  vs lexlock build unbounded, all cores (the default --threads): 0.00 s at 0 MiB: time n/a');
  });

  it('passes equal fingerprints and fails loudly, with both, on different ones', () => {
    expect(() => checkSameFingerprint(build(1, 1), build(2, 2), 256)).not.toThrow();
    const other = `sha256:${'cd'.repeat(32)}`;
    expect(() => checkSameFingerprint(build(1, 1), build(2, 2, other), 256)).toThrow(
      `BOUNDED BUILD DIFFERS: lexlock build --memory-limit 256 wrote fingerprint ${other}, the unbounded build ${fingerprint}; the bounded build must write the same lexicon`,
    );
  });

  it('reads the fingerprint of a lexicon file, and refuses a file without one', () => {
    expect(fingerprintOf(JSON.stringify({ format: 'lexlock.lexicon', fingerprint }), 'a.json')).toBe(fingerprint);
    expect(() => fingerprintOf('{"format":"lexlock.lexicon"}', 'b.json')).toThrow('b.json holds no lexicon fingerprint');
  });
});
