// base64Of writes a CSP hash source's digest (RFC 4648 base64), checked against RFC 4648 §10's test vectors.
import { describe, expect, it } from 'vitest';
import { base64Of } from '../../../src/audit/report/live/base64Of.js';

describe('base64Of', () => {
  // RFC 4648 §10 test vectors.
  it.each([
    ['', ''],
    ['f', 'Zg=='],
    ['fo', 'Zm8='],
    ['foo', 'Zm9v'],
    ['foob', 'Zm9vYg=='],
    ['fooba', 'Zm9vYmE='],
    ['foobar', 'Zm9vYmFy'],
  ])('%j -> %j', (text, expected) => {
    expect(base64Of(new TextEncoder().encode(text))).toBe(expected);
  });
});
