// Generators of adversarial text for the fast path's differential tests (fast-check): pieces that
// exercise every wink-tokenizer rule and the places the fast path cuts, glued by odd white space.
import fc from 'fast-check';

/** Pieces covering wink's rules and the fast path's chunk shapes and edges. */
export const PIECES: readonly string[] = [
  // times, also split over chunks and with odd suffixes
  '10', 'am', 'pm', 'hrs', 'hours', 'h', 'a.m.', 'p.m', '10 am', '3:45pm', '10 hrs', '10:', '23:59', '7:', 'AM', 'Hrs',
  // urls, e-mails, mentions, hashtags
  'https://ferry.example.org/a?b=1#c', 'http://x.io', 'help.desk@ferry.example', 'a@b.co', '@deck', '#sun', '#', '@', '#१२',
  // contractions and possessives
  "can't", "won't", "it's", "boats'", "captain's", "I'll", "'", "''", "o'clock", "’", 'don’t',
  // quotes and punctuation
  '"', '"a b"', '(x)', '[y]', '{z}', '...', '…', '—', '-', '--', 'well-known', 'a:b', 'x;)', ':', ';', '?!', ',', '.',
  // emoticons
  ':)', ':-(', ';d', ':p', '<3', ':[', ';-)', ':D',
  // emoji: plain, skin tone, ZWJ sequence, variation selector, keycap, flag
  '😀', '👍🏽', '👨‍👩‍👧', '❤️', '1️⃣', '#️⃣', '🇬🇧', '©', '®',
  // numbers, ordinals, currency, symbols
  '12.5', '1,200', '12-12-2026', '8.8.8.8', '1/4', '2nd', '21st', '11th', '3rd', '$', '€14.50', '£', '%', '+', '&', '~', '|',
  // scripts: Cyrillic, Greek, CJK, Hangul, Devanagari (with its digits), Thai, Latin-1 and beyond
  'Паром', 'πλοίο', 'Μ', 'µ', '東京へ', 'フェリー', '서울', 'नमस्ते', '१२३', '।', 'ฉันชอบ', 'ß', 'Ærø', 'Straße', '×', '÷', 'ſ', 'Ÿ', 'K',
  // plain words and ids
  'ferry', 'Late', 'a3f9c2', 'id-77', 'x', '0', 'e-ticket',
  // mail-like shapes: headers, addresses in brackets, ids, hex, symbols, slashes between digits
  '<ann.lee@example.net>;', '(mx4.example.org', '[192.0.2.7])', 'text/plain;', 'charset=utf-8', 'v=1;', '+0000', 'ref-46943-91f2',
  '835484f3e322', 'b=2c11e4', '>', '>>', '1/2.5', '12/3/4', '10/20am', '4th.', '5a.m', 'x=a.b@c.io', 'https://example.net/help),',
  // characters the fast path treats specially
  '\uE000', '\u0000', '\uFE0F', '\u200D', '\uD83D',
];

/** White space (and none) to glue pieces: tabs, NBSP, line and paragraph separators, ideographic space, BOM. */
export const GLUE: readonly string[] = [' ', ' ', ' ', '  ', '   ', '\t', '\n', '\r\n', '\u00A0', '\u2028', '\u2029', '\u3000', '\uFEFF', '\u200A', ''];

/** Adversarial text: pieces and random strings glued by {@link GLUE}, with optional leading/trailing white space. */
export const adversarialText: fc.Arbitrary<string> = fc
  .tuple(
    fc.constantFrom(...GLUE),
    fc.array(
      fc.tuple(
        fc.oneof(
          { weight: 6, arbitrary: fc.constantFrom(...PIECES) },
          { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 4 }) },
          { weight: 1, arbitrary: fc.string({ unit: 'grapheme-ascii', maxLength: 6 }) },
        ),
        fc.constantFrom(...GLUE),
      ),
      { maxLength: 24 },
    ),
  )
  .map(([lead, parts]) => lead + parts.map(([piece, glue]) => piece + glue).join(''));
