import { tokenize } from '../rules/tokenize.js';
import type { TextRules } from '../rules/TextRules.js';
import type { Canary } from './schema.js';

/**
 * Fixed probe texts covering the tokenizer's riskier paths: contractions, numbers and times, URLs,
 * e-mail addresses, emoji, accented Latin, compatibility characters (NFKC), Cyrillic, Greek, CJK, and
 * white space of many kinds (at the character level each run of it is one space token).
 */
export const PROBE_TEXTS: readonly string[] = [
  "I can't believe it's not late; we'll see, won't we? The captain's boats' ropes.",
  'Depart 10 am, arrive 3:45pm; 2nd deck, 12.5 km, 1,200 seats, 12-12-2026, 8.8.8.8, €14.50',
  'Timetable at https://ferries.example.org/routes?id=7#north or mail help.desk@harbour.example',
  'Loved it 😀👍🏽 #sunset @deckhand :) <3 ❤️ 👨‍👩‍👧',
  'Café naïve façade Ærø Øresund Straße ﬁne ① Ｆｕｌｌｗｉｄｔｈ Å',
  'Паром опоздал на двадцать минут. Το πλοίο ήταν γεμάτο.',
  '東京へ行くフェリーは遅れました。서울 항구 ฉันชอบเรือ',
  'Tabs\tand  two spaces,\u00a0no-break\u2003em\u3000wide\r\nnew line\u2028end \ufeff!',
];

/** Canaries for the given rules: each probe text and snippet with the tokens it gives now. */
export function makeCanaries(rules: TextRules, snippets: readonly string[] = []): Canary[] {
  return [...PROBE_TEXTS, ...snippets].map((text) => ({ text, tokens: tokenize(text, rules) }));
}

/** A canary whose tokens differ today from those stored. */
export interface CanaryDifference {
  index: number;
  text: string;
  expected: string[];
  actual: string[];
}

/** Re-tokenizes every canary and returns those that no longer give the stored tokens. */
export function checkCanaries(rules: TextRules, canaries: readonly Canary[]): CanaryDifference[] {
  const out: CanaryDifference[] = [];
  canaries.forEach((c, index) => {
    const actual = tokenize(c.text, rules);
    const same = actual.length === c.tokens.length && actual.every((t, i) => t === c.tokens[i]);
    if (!same) out.push({ index, text: c.text, expected: c.tokens, actual });
  });
  return out;
}
