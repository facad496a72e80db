import emojiRegex from 'emoji-regex';

/**
 * wink-tokenizer 5.3.0's regular expressions, written out again because the library does not export
 * them: each is the literal of a `var rgx…` line of node_modules/wink-tokenizer/src/wink-tokenizer.js
 * (`url` is `rgxURL`, `hashtagL1` is `rgxHashtagL1`…), and tests/rules/fast/winkPatterns.test.ts
 * reads that file and fails if one ever differs. Callers that run one with `lastIndex` use a copy
 * (`new RegExp(pattern)`). `email`, `ordinalL1` and the two possessives are kept as the definition
 * that findEmail, findOrdinal and splitWord reproduce: run as regular expressions they take time
 * quadratic in the length of a run without white space, so only tests run them.
 */
export const WINK_PATTERNS = {
  url: /(?:https?:\/\/)(?:[\da-z\.-]+)\.(?:[a-z\.]{2,6})(?:[\/\w\.\-\?#=]*)*\/?/gi,
  email: /[-!#$%&'*+\/=?^\w{|}~](?:\.?[-!#$%&'*+\/=?^\w`{|}~])*@[a-z0-9](?:-?\.?[a-z0-9])*(?:\.[a-z](?:-?[a-z0-9])*)+/gi,
  mention: /@\w+/g,
  hashtagL1: /#[a-z\u00C0-\u00D6\u00D8-\u00F6\u00F8-\u00FF_][a-z0-9\u00C0-\u00D6\u00D8-\u00F6\u00F8-\u00FF_]*/gi,
  hashtagDV: /#[\u0900-\u0963\u0970-\u097F_][\u0900-\u0963\u0970-\u097F\u0966-\u096F0-9_]*/gi,
  /** wink's emoji pattern: the emoji-regex package it requires (9.2.2, pinned beside it). */
  emoji: emojiRegex(),
  emoticon: /:-?[dps\*\/\[\]{}\(\)]|;-?[/(/)d]|<3/gi,
  time: /(?:\d|[01]\d|2[0-3]):?(?:[0-5][0-9])?\s?(?:[ap]\.?m\.?|hours|hrs)/gi,
  ordinalL1: /1\dth|[04-9]th|1st|2nd|3rd|[02-9]1st|[02-9]2nd|[02-9]3rd|[02-9][04-9]th|\d+\d[04-9]th|\d+\d1st|\d+\d2nd|\d+\d3rd/g,
  numberL1: /\d+\/\d+|\d(?:[\.,-\/]?\d)*(?:\.\d+)?/g,
  numberDV: /[\u0966-\u096F]+\/[\u0966-\u096F]+|[\u0966-\u096F](?:[\.,-\/]?[\u0966-\u096F])*(?:\.[\u0966-\u096F]+)?/g,
  currency: /[₿₽₹₨$£¥€₩]/g,
  wordL1: /[a-z\u00C0-\u00D6\u00D8-\u00F6\u00F8-\u00FF][a-z\u00C0-\u00D6\u00D8-\u00F6\u00F8-\u00FF']*/gi,
  wordDV: /[\u0900-\u094F\u0951-\u0963\u0970-\u097F]+/gi,
  punctuation: /[’'‘’`“”"\[\]\(\){}…,\.!;\?\-:\u0964\u0965]/g,
  symbol: /[\u0950~@#%\^\+=\*\|\/<>&]/g,
  /** What wink splits text no rule matched on (its last step, `alien` tokens). */
  spaces: /\s+/g,
  possessiveSingular: /([a-z]+)('s)$/i,
  possessivePlural: /([a-z]+s)(')$/i,
} as const;
