// The copies of wink-tokenizer's patterns (src/rules/fast/winkPatterns.ts) checked against the
// library's own source: each must be the literal of its `var rgx…` line, so the linear tokenizer
// (cascadePairs) runs exactly the rules wink runs. The emoji pattern comes from the emoji-regex
// package wink requires; it must be the very file wink loads.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DOMAIN } from '../../../src/rules/fast/findEmail.js';
import { WINK_PATTERNS } from '../../../src/rules/fast/winkPatterns.js';

const require = createRequire(import.meta.url);
const winkFile = require.resolve('wink-tokenizer');
const source = readFileSync(winkFile, 'utf8');

/** wink's pattern literals by variable name: `var rgxURL = /…/gi;` -> ['/…/gi']. */
const literals = new Map([...source.matchAll(/^var (rgx\w+) = (\/.+\/[a-z]*);$/gm)].map((m) => [m[1] as string, m[2] as string]));

const NAMES: readonly [keyof typeof WINK_PATTERNS, string][] = [
  ['url', 'rgxURL'],
  ['email', 'rgxEmail'],
  ['mention', 'rgxMention'],
  ['hashtagL1', 'rgxHashtagL1'],
  ['hashtagDV', 'rgxHashtagDV'],
  ['emoticon', 'rgxEmoticon'],
  ['time', 'rgxTime'],
  ['ordinalL1', 'rgxOrdinalL1'],
  ['numberL1', 'rgxNumberL1'],
  ['numberDV', 'rgxNumberDV'],
  ['currency', 'rgxCurrency'],
  ['wordL1', 'rgxWordL1'],
  ['wordDV', 'rgxWordDV'],
  ['punctuation', 'rgxPunctuation'],
  ['symbol', 'rgxSymbol'],
  ['spaces', 'rgxSpaces'],
  ['possessiveSingular', 'rgxPosSingular'],
  ['possessivePlural', 'rgxPosPlural'],
];

describe('WINK_PATTERNS', () => {
  it('is wink-tokenizer 5.3.0', () => {
    expect((require('wink-tokenizer/package.json') as { version: string }).version).toBe('5.3.0');
  });

  it.each(NAMES)('%s is wink\'s %s, character for character', (ours, theirs) => {
    expect(literals.get(theirs)).toBe(String(WINK_PATTERNS[ours]));
  });

  it('has every pattern wink applies to text, in its order (the quoted phrase is off by default)', () => {
    const order = source.slice(source.indexOf('var rgxsMaster'), source.indexOf('];', source.indexOf('var rgxsMaster')));
    const applied = [...order.matchAll(/regex: (rgx\w+)/g)].map((m) => m[1]);
    expect(applied).toEqual([
      'rgxQuotedPhrase', 'rgxURL', 'rgxEmail', 'rgxMention', 'rgxHashtagL1', 'rgxHashtagDV', 'rgxEmoji', 'rgxEmoticon', 'rgxTime',
      'rgxOrdinalL1', 'rgxNumberL1', 'rgxNumberDV', 'rgxCurrency', 'rgxWordL1', 'rgxWordDV', 'rgxPunctuation', 'rgxSymbol',
    ]);
    expect(source).toContain('defineConfig( { quoted_phrase: false } )');
  });

  it('takes the emoji pattern from the emoji-regex file wink itself loads', () => {
    const fromWink = createRequire(winkFile).resolve('emoji-regex');
    expect(require.resolve('emoji-regex')).toBe(fromWink);
    expect((require(`${dirname(fromWink)}/package.json`) as { version: string }).version).toBe('9.2.2');
    expect(String(WINK_PATTERNS.emoji)).toBe(String((require(fromWink) as () => RegExp)()));
    expect(source).toContain("var rgxEmoji = emojiRegex();");
  });

  it('has no pattern that can match the empty string (none has an assertion, so none matches it anywhere)', () => {
    for (const [name, pattern] of Object.entries(WINK_PATTERNS)) {
      if (name.startsWith('possessive')) continue; // run on whole words, never searched through text
      const outsideClasses = pattern.source.replace(/\[(?:\\.|[^\]\\])*\]/g, '[]');
      expect(/\\[bB]/.test(outsideClasses), name).toBe(false);
      expect(/[\^$]|\(\?[=!<]/.test(outsideClasses.replace(/\\./g, '')), name).toBe(false);
      expect(new RegExp(pattern.source, pattern.flags.replace('g', '')).test(''), name).toBe(false);
    }
  });

  it('has no ASCII characters in the emoji pattern but syntax and the class [#*0-9]: a match without those holds a non-ASCII one', () => {
    // cascadePairs skips the emoji rule on a text with none of them (its `needs`).
    const atoms = WINK_PATTERNS.emoji.source.replace(/\\u[0-9A-Fa-f]{4}|\\x[0-9A-Fa-f]{2}/g, '');
    expect([...new Set([...atoms].filter((c) => c.charCodeAt(0) < 0x80))].sort().join('')).toBe('#()*-09:?[\\]|');
    expect(WINK_PATTERNS.emoji.source.match(/[#*]/g)).toEqual(['#', '*', '#', '*']);
    expect(WINK_PATTERNS.emoji.source.match(/\[#\\\*0-9/g)).toHaveLength(2);
  });

  it('has the e-mail pattern end in the part findEmail matches after the @', () => {
    expect(WINK_PATTERNS.email.source.endsWith(`@${DOMAIN.source}`)).toBe(true);
    expect(DOMAIN.flags).toBe('iy');
  });
});
