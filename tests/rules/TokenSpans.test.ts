import { describe, expect, it } from 'vitest';
import { resolveRules } from '../../src/rules/TextRules.js';
import { TokenSpans, TYPE_CODE } from '../../src/rules/TokenSpans.js';

describe('TokenSpans', () => {
  it('holds spans and strings in order and makes strings of them on demand', () => {
    const spans = new TokenSpans();
    spans.begin('the ferry, late', false, resolveRules());
    spans.span(4, 9, TYPE_CODE.word);
    spans.addString('<x>');
    spans.span(9, 10, TYPE_CODE.punctuation);
    expect(spans.count).toBe(3);
    expect(spans.toArray()).toEqual(['ferry', '<x>', ',']);
    expect([spans.starts[0], spans.ends[0], spans.starts[1]]).toEqual([4, 9, -1]);
  });

  it('reads a folded text lower-cased', () => {
    const spans = new TokenSpans();
    spans.begin('The FERRY', true, resolveRules());
    spans.span(0, 3, TYPE_CODE.word);
    spans.span(4, 9, TYPE_CODE.word);
    expect(spans.toArray()).toEqual(['the', 'ferry']);
  });

  it('applies drop and collapse by type to spans and to wink pairs, and splits alien tokens', () => {
    const spans = new TokenSpans();
    spans.begin('ferry 12 , x', false, resolveRules({ drop: ['punctuation'], collapse: ['number', 'url'] }));
    spans.span(0, 5, TYPE_CODE.word);
    spans.span(6, 8, TYPE_CODE.number);
    spans.span(9, 10, TYPE_CODE.punctuation);
    spans.pair('https://x.io', 'url');
    spans.pair('', 'word');
    spans.pair('!', 'punctuation');
    spans.pair('東京', 'alien');
    expect(spans.toArray()).toEqual(['ferry', '<number>', '<url>', '東', '京']);
  });

  it('grows past its first room, and lets large buffers go at the next text', () => {
    const spans = new TokenSpans();
    const text = 'x '.repeat(100_000);
    spans.begin(text, false, resolveRules());
    for (let i = 0; i < 100_000; i++) spans.span(2 * i, 2 * i + 1, TYPE_CODE.word);
    expect(spans.count).toBe(100_000);
    expect(spans.tokenAt(99_999)).toBe('x');
    spans.begin('y', false, resolveRules());
    expect(spans.count).toBe(0);
    expect(spans.starts.length).toBeLessThan(1_000);
  });
});

describe('TokenSpans that make strings as they go', () => {
  it('gives the same tokens as spans made strings after', () => {
    const rules = resolveRules({ collapse: ['number'] });
    const made = (makeStrings: boolean, folded: boolean): string[] => {
      const spans = new TokenSpans(makeStrings);
      spans.begin('The FERRY 12 x', folded, rules);
      spans.span(0, 3, TYPE_CODE.word);
      spans.pair('ferry', 'word');
      spans.span(10, 12, TYPE_CODE.number);
      spans.span(13, 14, TYPE_CODE.word);
      return spans.toArray();
    };
    expect(made(true, true)).toEqual(['the', 'ferry', '<number>', 'x']);
    expect(made(false, true)).toEqual(made(true, true));
    expect(made(true, false)).toEqual(['The', 'ferry', '<number>', 'x']);
    expect(made(false, false)).toEqual(made(true, false));
  });
});
