import winkTokenizer from 'wink-tokenizer';
import type { Lexicon } from '../lexicon/Lexicon.js';
import type { TokenType } from '../rules/TextRules.js';

/**
 * The kinds of token that may identify a person or a machine: e-mail addresses, URLs and @mentions
 * (wink-tokenizer's own tags `email`, `url`, `mention`), phone-like numbers and IPv4 addresses (tokens
 * wink tags `number` that match {@link PHONE_LIKE} or {@link IPV4}).
 */
export const IDENTIFYING_KINDS = ['email', 'url', 'mention', 'phone', 'ip'] as const;

/** One of {@link IDENTIFYING_KINDS}. */
export type IdentifyingKind = (typeof IDENTIFYING_KINDS)[number];

/** How many tokens of one kind, and up to {@link EXAMPLES} of them, most frequent first, shortened. */
export interface IdentifyingKindCount {
  tokens: number;
  examples: string[];
}

/**
 * The tokens of a lexicon's vocabulary that look like they identify someone, by kind. Member names
 * are a public contract (`lexlock verify --json`, `lexlock audit --json`).
 */
export interface IdentifyingTokens {
  /** All of them, every kind together. */
  tokens: number;
  email: IdentifyingKindCount;
  url: IdentifyingKindCount;
  mention: IdentifyingKindCount;
  phone: IdentifyingKindCount;
  ip: IdentifyingKindCount;
}

/** Examples kept per kind. */
const EXAMPLES = 3;

/** The `--collapse` type that folds each kind into a placeholder (phone numbers and IPs are numbers). */
export const COLLAPSE_TYPE: Readonly<Record<IdentifyingKind, TokenType>> = { email: 'email', url: 'url', mention: 'mention', phone: 'number', ip: 'number' };

/**
 * An IPv4 address in dotted-decimal form: four decimal octets 0-255 without leading zeros (the
 * `IPv4address` rule of RFC 3986, section 3.2.2). wink-tokenizer tags such a token `number`.
 * (IPv6 literals never reach a vocabulary as one token: wink splits them at their colons.)
 */
export const IPV4 = /^(?:25[0-5]|2[0-4]\d|1\d\d|[1-9]?\d)(?:\.(?:25[0-5]|2[0-4]\d|1\d\d|[1-9]?\d)){3}$/;

/**
 * A phone-like number: digit groups joined by `-` or `.`, each group after the first of 2 digits or
 * more (as wink-tokenizer keeps them in one number token; it splits a leading `+` off), with 7 to 15
 * digits in all (ITU-T E.164 numbers have at most 15; 7 is a local number without its area code).
 * Decimals (one `.` and nothing else) and dates ({@link DATE_LIKE}) are not phone-like; other long
 * digit strings (order numbers, timestamps) are, since a token alone cannot tell them apart.
 */
export const PHONE_LIKE = /^\d+(?:[-.]\d{2,})*$/;

/** Dates written with `-` or `.`: day, month, year (12-12-2026, 1.5.26) or year, month, day (2026-12-12). */
export const DATE_LIKE = /^(?:\d{1,2}([-.])\d{1,2}\1(?:\d{2}|\d{4})|\d{4}([-.])\d{1,2}\2\d{1,2})$/;

/** A decimal number: digits, one point, digits. */
const DECIMAL = /^\d+\.\d+$/;

/** True for a token {@link PHONE_LIKE} describes. */
export function isPhoneLike(token: string): boolean {
  if (!PHONE_LIKE.test(token) || DECIMAL.test(token) || DATE_LIKE.test(token)) return false;
  let digits = 0;
  for (let i = 0; i < token.length; i++) if (token.charCodeAt(i) !== 0x2d && token.charCodeAt(i) !== 0x2e) digits++;
  return digits >= 7 && digits <= 15;
}

// One tokenizer instance with default settings, as the word level uses.
const wink = winkTokenizer();

/** Tokens wink may tag `email`, `url` or `mention`: those with an `@` or a `:` (a URL's scheme). */
const MAY_BE_ADDRESS = /[@:]/;

/**
 * Digits, points and hyphens only. Every such token that {@link IPV4} or {@link PHONE_LIKE} matches is
 * one `number` to wink-tokenizer (its number rule takes digits joined by single `.`, `,`, `-` or `/`;
 * tests/audit/identifyingTokens.test.ts checks it), so these are decided without calling wink.
 */
const DIGITS_AND_DOTS = /^[\d.-]+$/;

/**
 * The identifying kind of one vocabulary token, or null: wink-tokenizer (default settings, as the word
 * level) must read the token as one token of its own, and its tag decides (`email`, `url`, `mention`;
 * `number` when {@link IPV4} or {@link isPhoneLike} says so).
 * @example identifyingKindOf('help.desk@harbour.example') // 'email'
 */
export function identifyingKindOf(token: string): IdentifyingKind | null {
  if (DIGITS_AND_DOTS.test(token)) return IPV4.test(token) ? 'ip' : isPhoneLike(token) ? 'phone' : null;
  if (!MAY_BE_ADDRESS.test(token)) return null;
  const tagged = wink.tokenize(token);
  if (tagged.length !== 1 || tagged[0]?.value !== token) return null;
  switch (tagged[0].tag) {
    case 'email':
      return 'email';
    case 'url':
      return 'url';
    case 'mention':
      return 'mention';
    case 'number':
      return IPV4.test(token) ? 'ip' : isPhoneLike(token) ? 'phone' : null;
    default:
      return null;
  }
}

/** A token cut to `most` characters with `…` at the end when longer. */
function cut(token: string, most: number): string {
  const chars = Array.from(token);
  return chars.length <= most ? token : `${chars.slice(0, most - 1).join('')}…`;
}

/**
 * An example as messages show it, shortened so a summary never prints a whole address: an e-mail
 * address keeps 2 characters before the `@` (`ta…@mail.example`), a phone-like number or an IP
 * address its first two thirds (`555-01…`, `192.168.…`), a URL (without its `https://`) or a mention
 * at most 28 characters.
 */
export function shortExample(token: string, kind: IdentifyingKind): string {
  if (kind === 'email') {
    const at = token.lastIndexOf('@');
    return `${Array.from(token.slice(0, at)).slice(0, 2).join('')}…@${cut(token.slice(at + 1), 24)}`;
  }
  if (kind === 'phone' || kind === 'ip') return `${token.slice(0, Math.ceil((token.length * 2) / 3))}…`;
  if (kind === 'url') return cut(token.replace(/^[a-z]+:\/\//i, ''), 28);
  return cut(token, 28);
}

/**
 * Counts the tokens of `tokens` (in id order, most frequent first) that look identifying, by kind,
 * with up to 3 shortened examples of each. Browser-safe.
 * @example identifyingTokens(['the', 'ta.s@mail.example', '555-0134']).email // { tokens: 1, examples: ['ta…@mail.example'] }
 */
export function identifyingTokens(tokens: Iterable<string>): IdentifyingTokens {
  const found: IdentifyingTokens = {
    tokens: 0,
    email: { tokens: 0, examples: [] },
    url: { tokens: 0, examples: [] },
    mention: { tokens: 0, examples: [] },
    phone: { tokens: 0, examples: [] },
    ip: { tokens: 0, examples: [] },
  };
  for (const token of tokens) {
    const kind = identifyingKindOf(token);
    if (kind === null) continue;
    const entry = found[kind];
    entry.tokens += 1;
    found.tokens += 1;
    if (entry.examples.length < EXAMPLES) entry.examples.push(shortExample(token, kind));
  }
  return found;
}

/**
 * {@link identifyingTokens} of a lexicon's vocabulary: its ranked tokens, not the reserved ones the
 * user chose. At the character level every token is one character, so none is found.
 */
export function identifyingTokensOf(lexicon: Lexicon): IdentifyingTokens {
  const { rules, tokens, layout } = lexicon.encoding;
  return identifyingTokens(rules.level === 'char' ? [] : tokens.slice(layout.reserved));
}

/** The `--collapse` value that folds every kind found into placeholders, e.g. `email,url,number`. */
export function collapseAdvice(found: IdentifyingTokens): string {
  const types = new Set<TokenType>();
  for (const kind of IDENTIFYING_KINDS) if (found[kind].tokens > 0) types.add(COLLAPSE_TYPE[kind]);
  return [...types].join(',');
}
