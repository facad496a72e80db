import { describe, expect, it } from 'vitest';
import { escapeHtml } from '../../../src/audit/report/escapeHtml.js';

// Outside source: the OWASP Cross Site Scripting Prevention Cheat Sheet, output encoding for HTML
// contexts: & < > " ' become &amp; &lt; &gt; &quot; &#x27; (or &#39;), which also covers quoted
// attribute values. The browser test checks the same strings against Chromium's HTML parser.
describe('escapeHtml', () => {
  it.each([
    ['<script>alert(1)</script>', '&lt;script&gt;alert(1)&lt;/script&gt;'],
    ['a&b', 'a&amp;b'],
    ['&amp;', '&amp;amp;'],
    ['"quoted"', '&quot;quoted&quot;'],
    ["o'clock", 'o&#39;clock'],
    ['" onmouseover="x', '&quot; onmouseover=&quot;x'],
    ['</svg><img src=x>', '&lt;/svg&gt;&lt;img src=x&gt;'],
    ['plain ferry — ✓ 渡し船', 'plain ferry — ✓ 渡し船'],
    ['', ''],
  ])('escapes %j', (text, escaped) => {
    expect(escapeHtml(text)).toBe(escaped);
  });

  it('leaves no markup-significant character behind', () => {
    const all = Array.from({ length: 128 }, (_, i) => String.fromCharCode(i)).join('');
    expect(escapeHtml(all)).not.toMatch(/[<>"']/);
    expect(escapeHtml(all).replace(/&(amp|lt|gt|quot|#39);/g, '')).not.toContain('&');
  });
});
