import fc from 'fast-check';
import { writeFile } from 'node:fs/promises';
import winkTokenizer from 'wink-tokenizer';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { isLexlockError, type LexlockError } from '../../src/LexlockError.js';
import { fetchLexicon } from '../../src/artifact/fetchLexicon.js';
import { fingerprintOf } from '../../src/artifact/fingerprint.js';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import { lexiconDocument, serializeLexicon } from '../../src/artifact/serializeLexicon.js';
import { loadLexicon } from '../../src/files/loadLexicon.js';
import { freeze } from '../../src/lexicon/freeze.js';
import type { Lexicon } from '../../src/lexicon/Lexicon.js';
import { resolveRules, type TextRulesInput } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';
import { Tally } from '../../src/tally/Tally.js';
import { tempFolder } from '../helpers/tempFolder.js';

/** `text` with the first `from` replaced; fails the test when `text` has no `from` (so a case cannot pass unchanged). */
function replacedOnce(text: string, from: string, to: string): string {
  if (!text.includes(from)) throw new Error(`the lexicon text has no ${from}: the case would test nothing`);
  return text.replace(from, to);
}
import {
  BASE_TEXTS,
  BASES,
  DEEP_ARRAY,
  DEEP_OBJECT,
  SAMPLE_TEXTS,
  PROTO_KEY,
  REPLACEMENTS,
  baseDoc,
  deepArrayText,
  deepObjectText,
  deleteAt,
  OPTIONAL_MEMBERS,
  fits,
  getAt,
  kindOf,
  nearValue,
  pathName,
  pathsBySlot,
  resign,
  setAt,
  textOf,
  type Json,
  type JsonObject,
  type Path,
} from './lexiconFuzz.js';

const SOURCE = 'ferries.json';
const REBUILD = 'rebuild it with lexlock build';
const NOT_A_LEXICON = `${SOURCE}: not a lexlock lexicon (no "format": "lexlock.lexicon" member); pass a file written by lexlock build`;
const utf8 = new TextEncoder();
// The WHATWG Encoding Standard's UTF-8 decoder (as the engine implements it): the outside check of UTF-8.
const whatwgStrict = new TextDecoder('utf-8', { fatal: true });
const whatwgReplacing = new TextDecoder('utf-8');

/** The LexlockError parseLexicon throws for `input`; anything else thrown (or nothing) fails the test. */
function refusal(input: string | Uint8Array | object): LexlockError {
  try {
    parseLexicon(input, { source: SOURCE });
  } catch (e) {
    if (isLexlockError(e)) return e;
    throw new Error(`a ${e instanceof Error ? e.name : typeof e} escaped parseLexicon: ${String(e)}`);
  }
  throw new Error('parseLexicon accepted it');
}

/** Outcome of parseLexicon: the lexicon, or the LexlockError; anything else thrown fails the test. */
function outcome(load: () => Lexicon): Lexicon | LexlockError {
  try {
    return load();
  } catch (e) {
    if (isLexlockError(e)) return e;
    throw new Error(`a ${e instanceof Error ? e.name : typeof e} escaped: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
  }
}

function isWellFormedUtf8(bytes: Uint8Array): boolean {
  try {
    whatwgStrict.decode(bytes);
    return true;
  } catch {
    return false;
  }
}

/** Members as written in messages, with indexes left out: `encoding.tokens[3]` -> `encoding.tokens`. */
const bare = (name: string) => name.replace(/\[\d+\]/g, '');
const within = (inner: string, outer: string) => inner === outer || inner.startsWith(`${outer}.`);

/**
 * True when an error naming `field` is about a mutation of `target`: one lies within the other, or the
 * two are members checked together (the rules as a whole; reserved tokens against the token list).
 */
function related(field: string, target: string): boolean {
  if (field === '(top level)') return true;
  const f = bare(field);
  const t = bare(target);
  if (within(f, t) || within(t, f)) return true;
  if (within(f, 'encoding.rules') && within(t, 'encoding.rules')) return true;
  return f === 'encoding.layout.reserved' && within(t, 'encoding.tokens');
}

/**
 * What every accepted lexicon must be: fingerprint the stored one and that of its encoding, the document
 * read as is (nothing dropped or coerced), encode and decode working on every probe text, labels found.
 */
function checkAccepted(lexicon: Lexicon, doc: JsonObject): void {
  expect(lexicon.fingerprint).toBe(doc.fingerprint);
  expect(fingerprintOf(lexicon.encoding)).toBe(lexicon.fingerprint);
  expect(lexiconDocument(lexicon) as unknown).toEqual(doc);
  for (const text of SAMPLE_TEXTS) {
    const ids = lexicon.encode(text);
    if (lexicon.shape !== null) expect(ids.length).toBe(lexicon.shape.length);
    let outside = 0;
    for (const id of ids) if (!(id >= 0 && id < lexicon.size)) outside += 1;
    expect(outside).toBe(0);
    expect(lexicon.decode(ids).length).toBe(ids.filter((id) => id !== 0).length);
  }
  lexicon.labels.forEach((label, i) => expect(lexicon.labelId(label)).toBe(i));
}

/** Same ids as the base lexicon for every probe text. */
function checkSameIds(lexicon: Lexicon, base: Lexicon): void {
  expect(lexicon.encoding).toEqual(base.encoding);
  expect(lexicon.fingerprint).toBe(base.fingerprint);
  for (const text of SAMPLE_TEXTS) expect(Array.from(lexicon.encode(text))).toEqual(Array.from(base.encode(text)));
}

const GROUPS = BASES.map((_, i) => pathsBySlot(baseDoc(i)));
const UNKNOWN_NAMES = ['extra', PROTO_KEY, 'constructor', 'toString', 'Format', 'valueOf'];

/** A fresh copy of the first base document (labels, shape, reserved, fit, canaries). */
const doc0 = () => baseDoc(0);
const lex0 = (BASES[0] as (typeof BASES)[number]).lexicon;
const signed = (d: JsonObject) => (resign(d), d);
const enc = (d: JsonObject) => d.encoding as JsonObject;
const schemaMessage = (field: string, detail: string) => `${SOURCE} member ${field}: not a valid lexicon: ${field}: ${detail}; ${REBUILD}`;

/** One mutation of a base document, as fast-check draws it. */
interface Draw {
  base: number;
  slot: number;
  at: number;
  op: 'delete' | 'replace' | 'near' | 'add' | 'duplicate' | 'reserved';
  pick: number;
  resign: boolean;
  indent: number;
  form: 'text' | 'bytes' | 'object';
}

/** A mutated document: its text, the member it is about, and why it must be refused (null: it may load). */
interface Mutated {
  text: string;
  target: Path;
  mustRefuse: string | null;
}

function mutate(d: Draw): Mutated {
  const original = baseDoc(d.base);
  const doc = baseDoc(d.base);
  const groups = GROUPS[d.base] as Path[][];
  const group = groups[d.slot % groups.length] as Path[];
  let target = group[d.at % group.length] as Path;
  let mustRefuse: string | null = null;
  const encoding = doc.encoding as JsonObject;
  const tokens = encoding.tokens as string[];
  const layout = encoding.layout as JsonObject;
  switch (d.op) {
    case 'delete':
      deleteAt(doc, target);
      if (typeof target[target.length - 1] === 'string' && !OPTIONAL_MEMBERS.has(pathName(target))) mustRefuse = 'a member every lexicon has is missing';
      break;
    case 'replace':
    case 'near': {
      const value = d.op === 'replace' ? (REPLACEMENTS[d.pick % REPLACEMENTS.length] as () => Json)() : nearValue(getAt(doc, target), d.pick);
      setAt(doc, target, value);
      if (value === DEEP_ARRAY || value === DEEP_OBJECT) mustRefuse = '10,000 levels of nesting fit no member';
      else if (!fits(value, target)) mustRefuse = `${kindOf(value)} fits no lexicon at ${pathName(target)}`;
      break;
    }
    case 'add': {
      let container = target;
      while (container.length > 0 && kindOf(getAt(doc, container)) !== 'object') container = container.slice(0, -1);
      const name = UNKNOWN_NAMES[d.pick % UNKNOWN_NAMES.length] as string;
      (getAt(doc, container) as JsonObject)[name] = d.pick % 2 === 0 ? 1 : { polluted: 1 };
      target = [...container, name];
      mustRefuse = 'an unknown member';
      break;
    }
    case 'duplicate': {
      if (tokens.length === 0) return mutate({ ...d, op: 'replace' });
      tokens.splice(d.at % (tokens.length + 1), 0, tokens[d.pick % tokens.length] as string);
      target = ['encoding', 'tokens'];
      mustRefuse = 'a token twice';
      break;
    }
    case 'reserved': {
      const reserved = layout.reserved as number;
      if (reserved > 0 && tokens.length > reserved) {
        tokens[d.pick % reserved] = tokens[reserved + (d.at % (tokens.length - reserved))] as string;
        target = ['encoding', 'tokens'];
        mustRefuse = 'a reserved token that is also a ranked token';
      } else {
        layout.reserved = tokens.length + 1 + (d.pick % 3);
        target = ['encoding', 'layout', 'reserved'];
        mustRefuse = 'more reserved tokens than tokens';
      }
      break;
    }
  }
  const top = target[0];
  if ((top === 'format' || top === 'formatVersion') && JSON.stringify(doc[top]) !== JSON.stringify(original[top])) mustRefuse ??= `another ${top}`;
  if (top === 'fingerprint' && doc.fingerprint !== original.fingerprint) mustRefuse ??= 'another fingerprint';
  const signed = d.resign && top !== 'fingerprint' && resign(doc);
  if (!signed && JSON.stringify(doc.encoding) !== JSON.stringify(original.encoding)) mustRefuse ??= 'the encoding changed under its fingerprint';
  return { text: textOf(doc, d.indent), target, mustRefuse };
}

function inputOf(text: string, form: Draw['form']): string | Uint8Array | object {
  if (form === 'bytes') return utf8.encode(text);
  return form === 'object' ? (JSON.parse(text) as object) : text;
}

/** The refusal of a mutated document: the right code, a place that names the mutated member, a short message. */
function checkRefusal(e: LexlockError, m: Mutated): void {
  const target = pathName(m.target);
  const top = m.target[0];
  expect(e.message.length).toBeLessThan(1500);
  if (top === 'format') {
    expect(e.message).toBe(NOT_A_LEXICON);
    return;
  }
  const field = e.where.field;
  if (field === undefined) throw new Error(`no member named: ${e.message}`);
  expect(e.message.startsWith(`${SOURCE} member ${field}: `), e.message).toBe(true);
  if (top === 'formatVersion') {
    expect([e.code, field]).toEqual([expect.stringMatching(/^(BAD_LEXICON|NEWER_FORMAT|OLD_FORMAT)$/), 'formatVersion']);
    return;
  }
  switch (e.code) {
    case 'BAD_LEXICON':
      expect(related(field, target), `${field} named for a mutation of ${target}: ${e.message}`).toBe(true);
      break;
    case 'FINGERPRINT_MISMATCH':
      expect(field).toBe('fingerprint');
      expect(top === 'encoding' || top === 'fingerprint', target).toBe(true);
      break;
    case 'DUPLICATE_TOKEN':
      expect(field).toBe('encoding.tokens');
      expect(within(bare(target), 'encoding.tokens'), target).toBe(true);
      break;
    case 'CANARY_MISMATCH':
      expect(field).toMatch(/^canaries\[\d+\]$/);
      expect(top === 'canaries' || within(bare(target), 'encoding.rules'), target).toBe(true);
      break;
    default:
      throw new Error(`${e.code} for a mutation of ${target}: ${e.message}`);
  }
}

describe('parseLexicon under fuzzing (property)', () => {
  it('loads every unmutated lexicon, as text, bytes and object', () => {
    BASES.forEach(({ lexicon }, i) => {
      const text = BASE_TEXTS[i] as string;
      for (const input of [text, utf8.encode(text), JSON.parse(text) as object]) {
        const back = parseLexicon(input, { source: SOURCE });
        checkAccepted(back, baseDoc(i));
        checkSameIds(back, lexicon);
      }
    });
  });

  it('loads the longest shape a lexicon may store, 2^20 ids, and encodes with it', () => {
    const d = baseDoc(0);
    ((d.encoding as JsonObject).shape as JsonObject).length = 2 ** 20;
    resign(d);
    const back = parseLexicon(JSON.stringify(d), { source: SOURCE });
    checkAccepted(back, d);
    const ids = back.encode('the ferry was late');
    expect([ids.length, Array.from(ids.subarray(-4))]).toEqual([2 ** 20, Array.from(lex0.encode('the ferry was late').subarray(-4))]);
  });

  // RFC 8259: white space (§2: space, tab, LF, CR) may surround any structural character, object
  // members are unordered (§4), and any character may be written as a \u escape (§7).
  it('loads a lexicon whatever its white space, member order and escapes (property)', () => {
    const ws = fc.array(fc.constantFrom(' ', '\t', '\n', '\r'), { maxLength: 3 }).map((a) => a.join(''));
    fc.assert(
      fc.property(fc.nat({ max: BASES.length - 1 }), fc.infiniteStream(ws), fc.infiniteStream(fc.nat()), (i, spaces, picks) => {
        const space = () => spaces.next().value as string;
        const coin = () => (picks.next().value as number) % 5 === 0;
        const str = (s: string) => {
          let out = '"';
          for (const ch of s) {
            const u = ch.charCodeAt(0);
            if (ch.length === 1 && (ch === '"' || ch === '\\' || u < 0x20 || coin())) out += `\\u${u.toString(16).padStart(4, '0')}`;
            else out += ch;
          }
          return `${out}"`;
        };
        const write = (v: Json): string => {
          if (typeof v === 'string') return str(v);
          if (v === null || typeof v !== 'object') return JSON.stringify(v);
          if (Array.isArray(v)) return `[${space()}${v.map((x) => `${write(x)}${space()}`).join(`,${space()}`)}]`;
          const names = Object.keys(v);
          for (let k = names.length - 1; k > 0; k--) {
            const j = (picks.next().value as number) % (k + 1);
            [names[k], names[j]] = [names[j] as string, names[k] as string];
          }
          return `{${space()}${names.map((n) => `${str(n)}${space()}:${space()}${write(v[n] as Json)}${space()}`).join(`,${space()}`)}}`;
        };
        const text = `${space()}${write(baseDoc(i))}${space()}`;
        const back = parseLexicon(text, { source: SOURCE });
        checkSameIds(back, (BASES[i] as (typeof BASES)[number]).lexicon);
        checkAccepted(back, baseDoc(i));
      }),
      { numRuns: 60 },
    );
  });

  it('refuses a mutated document with a LexlockError naming the member, or loads it as it is (property)', () => {
    const draw: fc.Arbitrary<Draw> = fc.record({
      base: fc.nat({ max: BASES.length - 1 }),
      slot: fc.nat(),
      at: fc.nat(),
      op: fc.constantFrom<Draw['op']>('replace', 'replace', 'replace', 'near', 'near', 'delete', 'add', 'duplicate', 'reserved'),
      pick: fc.nat(),
      resign: fc.boolean(),
      indent: fc.constantFrom(0, 2),
      form: fc.constantFrom<Draw['form']>('text', 'bytes', 'object'),
    });
    let accepted = 0;
    fc.assert(
      fc.property(draw, (d) => {
        const m = mutate(d);
        const result = outcome(() => parseLexicon(inputOf(m.text, d.form), { source: SOURCE }));
        if (isLexlockError(result)) {
          checkRefusal(result, m);
          return;
        }
        expect(m.mustRefuse, `accepted ${pathName(m.target)} although: ${m.mustRefuse ?? ''}`).toBeNull();
        checkAccepted(result, JSON.parse(m.text) as JsonObject);
        accepted += 1;
      }),
      { numRuns: 400 },
    );
    // Some mutations keep a file valid (a removed canary, a re-signed token list); the property must see both outcomes.
    expect(accepted).toBeGreaterThan(0);
  });

  const byteDraw = fc.record({
    base: fc.nat({ max: BASES.length - 1 }),
    op: fc.constantFrom('truncate', 'flip', 'insert', 'remove', 'ill-formed'),
    at: fc.nat(),
    bit: fc.nat({ max: 7 }),
    garbage: fc.uint8Array({ minLength: 1, maxLength: 6 }),
    // Ill-formed sequences of Unicode 15 §3.9 (table 3-7): a lone trail byte, a sequence cut short, an
    // overlong form, a surrogate, a code point past U+10FFFF, a byte that never occurs.
    bad: fc.constantFrom([0x80], [0xe2, 0x82], [0xc0, 0xaf], [0xed, 0xa0, 0x80], [0xf4, 0x90, 0x80, 0x80], [0xff]),
  });

  type ByteDraw = typeof byteDraw extends fc.Arbitrary<infer T> ? T : never;

  function mutateBytes(b: ByteDraw): Uint8Array {
    const bytes = utf8.encode(BASE_TEXTS[b.base] as string);
    const at = b.at % bytes.length;
    const join = (...parts: ArrayLike<number>[]) => Uint8Array.from(parts.flatMap((p) => Array.from(p)));
    switch (b.op) {
      case 'truncate':
        return bytes.subarray(0, at);
      case 'flip': {
        const out = bytes.slice();
        out[at] = (out[at] as number) ^ (1 << b.bit);
        return out;
      }
      case 'insert':
        return join(bytes.subarray(0, at), b.garbage, bytes.subarray(at));
      case 'remove':
        return join(bytes.subarray(0, at), bytes.subarray(at + 1));
      default:
        return join(bytes.subarray(0, at), b.bad, bytes.subarray(at));
    }
  }

  it('refuses damaged bytes (BAD_UTF8 exactly when the WHATWG decoder refuses them) or reads the same encoding (property)', () => {
    let badUtf8 = 0;
    fc.assert(
      fc.property(byteDraw, (b) => {
        const bytes = mutateBytes(b);
        const base = (BASES[b.base] as (typeof BASES)[number]).lexicon;
        const wellFormed = isWellFormedUtf8(bytes);
        const result = outcome(() => parseLexicon(bytes, { source: SOURCE }));
        if (!isLexlockError(result)) {
          expect(wellFormed).toBe(true);
          checkSameIds(result, base);
        } else if (!wellFormed) {
          badUtf8 += 1;
          const at = result.where.byteOffset as number;
          // The first ill-formed sequence starts at `at`: the bytes before it decode, those up to 4 past it do not.
          expect(isWellFormedUtf8(bytes.subarray(0, at))).toBe(true);
          expect(isWellFormedUtf8(bytes.subarray(0, Math.min(at + 4, bytes.length)))).toBe(false);
          const line = 1 + bytes.subarray(0, at).filter((x) => x === 0x0a).length;
          expect(result.message).toBe(`${SOURCE} line ${line}: invalid UTF-8 at byte ${at}; a lexicon file is UTF-8 JSON as lexlock build writes it: restore the file or rebuild it`);
          expect([result.code, result.where.line]).toEqual(['BAD_UTF8', line]);
        } else {
          expect(result.code).not.toBe('BAD_UTF8');
          expect(result.message.length).toBeLessThan(1500);
        }
        // The same bytes decoded with replacement (what reading a file as 'utf8' does) never load another encoding.
        const replaced = outcome(() => parseLexicon(whatwgReplacing.decode(bytes), { source: SOURCE }));
        if (!isLexlockError(replaced)) checkSameIds(replaced, base);
      }),
      { numRuns: 300 },
    );
    expect(badUtf8).toBeGreaterThan(0);
  });

  describe('through loadLexicon', () => {
    let folder: Awaited<ReturnType<typeof tempFolder>>;
    beforeAll(async () => {
      folder = await tempFolder();
    });
    afterAll(async () => {
      await folder.remove();
    });

    it('a damaged file is a LexlockError or the same encoding (property)', async () => {
      await fc.assert(
        fc.asyncProperty(byteDraw, async (b) => {
          const path = folder.path('lexicon.json');
          await writeFile(path, mutateBytes(b));
          let result: Lexicon | LexlockError;
          try {
            result = await loadLexicon(path);
          } catch (e) {
            if (!isLexlockError(e)) throw new Error(`a ${e instanceof Error ? e.name : typeof e} escaped loadLexicon: ${String(e)}`);
            result = e;
          }
          if (!isLexlockError(result)) checkSameIds(result, (BASES[b.base] as (typeof BASES)[number]).lexicon);
          else expect(result.message.startsWith(`${path}`)).toBe(true);
        }),
        { numRuns: 40 },
      );
    });
  });
});

describe('parseLexicon refuses one case of each kind, with this message', () => {
  it.each<[string, () => string | Uint8Array | object, string, string]>([
    // A member deleted, or set to each wrong JSON type.
    ['a deleted member', () => { const d = doc0(); delete (enc(d).layout as JsonObject).oov; return d; }, 'BAD_LEXICON', schemaMessage('encoding.layout.oov', 'expected "first" or "last", got nothing')],
    ['null for a list', () => { const d = doc0(); enc(d).tokens = null; return d; }, 'BAD_LEXICON', schemaMessage('encoding.tokens', 'expected an array, got null')],
    ['a number for an object', () => { const d = doc0(); enc(d).rules = 7; return d; }, 'BAD_LEXICON', schemaMessage('encoding.rules', 'expected an object, got a number')],
    ['a string for a number', () => { const d = doc0(); (d.fit as JsonObject).documents = '6'; return d; }, 'BAD_LEXICON', schemaMessage('fit.documents', 'expected a number, got a string')],
    ['a boolean for a string', () => { const d = doc0(); (enc(d).tokens as Json[])[3] = true; return d; }, 'BAD_LEXICON', schemaMessage('encoding.tokens[3]', 'expected a string, got a boolean')],
    ['an array for an object', () => { const d = doc0(); d.fit = []; return d; }, 'BAD_LEXICON', schemaMessage('fit', 'expected an object, got an array')],
    ['an object for a string', () => { const d = doc0(); ((d.canaries as JsonObject[])[1] as JsonObject).text = {}; return d; }, 'BAD_LEXICON', schemaMessage('canaries[1].text', 'expected a string, got an object')],
    // Long strings and huge arrays are shortened in the message.
    [
      'a very long string',
      () => { const d = doc0(); (enc(d).rules as JsonObject).unicode = 'NFKC'.repeat(250_000); return d; },
      'BAD_LEXICON',
      schemaMessage('encoding.rules.unicode', `expected "NFKC" or "NFC" or "none", got "${'NFKC'.repeat(10)}…" (1000000 characters)`),
    ],
    ['a huge array', () => { const d = doc0(); (enc(d).layout as JsonObject).oov = new Array<Json>(100_000).fill('first'); return d; }, 'BAD_LEXICON', schemaMessage('encoding.layout.oov', 'expected "first" or "last", got an array of 100000 items')],
    [
      'a huge array of wrong items',
      () => { const d = doc0(); enc(d).tokens = Array.from({ length: 100_000 }, (_, i) => i); return d; },
      'BAD_LEXICON',
      `${SOURCE} member encoding.tokens[0]: not a valid lexicon: encoding.tokens[0]: expected a string, got a number; encoding.tokens[1]: expected a string, got a number; encoding.tokens[2]: expected a string, got a number (and 99997 more); ${REBUILD}`,
    ],
    // 10,000 levels of nesting, in a member and as the whole text.
    ['deep arrays in a member', () => replacedOnce(BASE_TEXTS[0]!, '"level":"word"', `"level": ${deepArrayText(10_000)}`), 'BAD_LEXICON', schemaMessage('encoding.rules.level', 'expected "word" or "char", got an array of 1 item')],
    ['deep objects in a member', () => replacedOnce(BASE_TEXTS[0]!, '"formatVersion":2', `"formatVersion": ${deepObjectText(10_000)}`), 'BAD_LEXICON', `${SOURCE} member formatVersion: formatVersion is an object with 1 member, not a format version (a whole number from 1); ${REBUILD}`],
    ['deep arrays as the whole text', () => deepArrayText(10_000), 'NOT_A_LEXICON', NOT_A_LEXICON],
    ['deep objects as the whole text', () => deepObjectText(10_000), 'NOT_A_LEXICON', NOT_A_LEXICON],
    // V8 (Node 20) parses nesting iteratively: even a million levels are read, then refused as no lexicon.
    ['a million levels as the whole text', () => deepArrayText(1_000_000), 'NOT_A_LEXICON', NOT_A_LEXICON],
    // Duplicate tokens, and a reserved token that is also a ranked token.
    ['a duplicate token', () => { const d = doc0(); (enc(d).tokens as Json[]).push('ferry'); return signed(d); }, 'DUPLICATE_TOKEN', `${SOURCE} member encoding.tokens: "ferry" stands at ids ${lex0.idOf('ferry')} and ${lex0.size}; every token must appear once in encoding.tokens`],
    [
      'a reserved token among the ranked ones',
      () => { const d = doc0(); (enc(d).tokens as Json[])[1] = 'ferry'; return signed(d); },
      'DUPLICATE_TOKEN',
      `${SOURCE} member encoding.tokens: "ferry" stands at ids 3 and ${lex0.idOf('ferry')}; every token must appear once in encoding.tokens`,
    ],
    [
      'a duplicate token too long to show',
      () => { const d = doc0(); (enc(d).tokens as Json[]).push('ö'.repeat(5000), 'ö'.repeat(5000)); return signed(d); },
      'DUPLICATE_TOKEN',
      `${SOURCE} member encoding.tokens: "${'ö'.repeat(40)}…" (5000 characters) stands at ids ${lex0.size} and ${lex0.size + 1}; every token must appear once in encoding.tokens`,
    ],
    // Ids and lengths out of range.
    ['more reserved tokens than tokens', () => { const d = doc0(); (enc(d).layout as JsonObject).reserved = 1000; return signed(d); }, 'BAD_LEXICON', `${SOURCE} member encoding.layout.reserved: 1000 reserved tokens but only ${lex0.encoding.tokens.length} tokens; ${REBUILD}`],
    ['a negative reserved count', () => { const d = doc0(); (enc(d).layout as JsonObject).reserved = -1; return d; }, 'BAD_LEXICON', schemaMessage('encoding.layout.reserved', '-1 is below the minimum 0')],
    ['a shape longer than 2^20 ids', () => { const d = doc0(); (enc(d).shape as JsonObject).length = 2 ** 20 + 1; return signed(d); }, 'BAD_LEXICON', schemaMessage('encoding.shape.length', '1048577 is above the maximum 1048576')],
    ['a shape longer than a JSON number holds exactly', () => { const d = doc0(); (enc(d).shape as JsonObject).length = 2 ** 53; return signed(d); }, 'BAD_LEXICON', `${SOURCE} member encoding.shape.length: not a valid lexicon: encoding.shape.length: 9007199254740992 is above the maximum 9007199254740991; encoding.shape.length: 9007199254740992 is above the maximum 1048576; ${REBUILD}`],
    ['a negative shape length', () => { const d = doc0(); (enc(d).shape as JsonObject).length = -3; return d; }, 'BAD_LEXICON', schemaMessage('encoding.shape.length', '-3 is below the minimum 1')],
    ['a zero shape length', () => { const d = doc0(); (enc(d).shape as JsonObject).length = 0; return d; }, 'BAD_LEXICON', schemaMessage('encoding.shape.length', '0 is below the minimum 1')],
    ['a fractional shape length', () => { const d = doc0(); (enc(d).shape as JsonObject).length = 2.5; return d; }, 'BAD_LEXICON', schemaMessage('encoding.shape.length', 'expected a whole number, got 2.5')],
    // NaN and Infinity cannot be written in JSON (RFC 8259 §6) but can be in an object passed in.
    ['a NaN shape length (object input)', () => { const d = doc0(); (enc(d).shape as Record<string, unknown>).length = Number.NaN; return d; }, 'BAD_LEXICON', schemaMessage('encoding.shape.length', 'expected a number, got NaN')],
    ['an infinite share (object input)', () => { const d = doc0(); (d.fit as Record<string, unknown>).oovRate = Number.POSITIVE_INFINITY; return d; }, 'BAD_LEXICON', schemaMessage('fit.oovRate', 'expected a number, got Infinity')],
    ['an empty token', () => { const d = doc0(); (enc(d).tokens as Json[])[4] = ''; return d; }, 'BAD_LEXICON', schemaMessage('encoding.tokens[4]', '"" is shorter than 1 character')],
    // Unknown format and version values.
    ['another format', () => ({ ...doc0(), format: 'lexlock.tally' }), 'NOT_A_LEXICON', NOT_A_LEXICON],
    ['a newer version', () => ({ ...doc0(), formatVersion: 3 }), 'NEWER_FORMAT', `${SOURCE} member formatVersion: lexicon format version 3 needs a newer lexlock; this one (0.2.0) reads versions up to 2; upgrade lexlock`],
    ['version 0', () => ({ ...doc0(), formatVersion: 0 }), 'BAD_LEXICON', `${SOURCE} member formatVersion: formatVersion is 0, not a format version (a whole number from 1); ${REBUILD}`],
    ['a version as a string', () => ({ ...doc0(), formatVersion: '1' }), 'BAD_LEXICON', `${SOURCE} member formatVersion: formatVersion is "1", not a format version (a whole number from 1); ${REBUILD}`],
    ['no version', () => { const d = doc0(); delete d.formatVersion; return d; }, 'BAD_LEXICON', `${SOURCE} member formatVersion: formatVersion is missing (a whole number from 1); ${REBUILD}`],
    // A wrong fingerprint: another lexicon's.
    [
      "another lexicon's fingerprint",
      () => ({ ...doc0(), fingerprint: (BASES[1] as (typeof BASES)[number]).lexicon.fingerprint }),
      'FINGERPRINT_MISMATCH',
      `${SOURCE} member fingerprint: fingerprint ${(BASES[1] as (typeof BASES)[number]).lexicon.fingerprint} does not match the encoding, which hashes to ${lex0.fingerprint}; the file was edited or damaged: restore it or rebuild it`,
    ],
    // Unknown members are refused everywhere: the contract's encoding holds "everything that decides an id
    // ... Nothing else", and any incompatible change bumps formatVersion, so a member this version does
    // not know means the file was not written by it (the schema's objects are strict).
    ['an unknown member at the top', () => ({ ...doc0(), comment: 'hand edited' }), 'BAD_LEXICON', schemaMessage('(top level)', 'unknown member "comment"')],
    ['an unknown member in the fit', () => { const d = doc0(); (d.fit as JsonObject).note = 1; return d; }, 'BAD_LEXICON', schemaMessage('fit', 'unknown member "note"')],
    ['unknown members in the layout', () => { const d = doc0(); Object.assign(enc(d).layout as JsonObject, { a: 1, b: 2, c: 3, d: 4 }); return signed(d); }, 'BAD_LEXICON', schemaMessage('encoding.layout', 'unknown members "a", "b", "c" and 1 more')],
    ['an unknown member with a long name', () => ({ ...doc0(), ['n'.repeat(10_000)]: 1 }), 'BAD_LEXICON', schemaMessage('(top level)', `unknown member "${'n'.repeat(40)}…" (10000 characters)`)],
    // Rules as lexlock never writes them.
    ['unsorted dropped types', () => { const d = doc0(); (enc(d).rules as JsonObject).drop = ['url', 'email']; return signed(d); }, 'BAD_LEXICON', `${SOURCE} member encoding.rules.drop[1]: encoding.rules.drop must list distinct token types in string order ("url" then "email"); ${REBUILD}`],
    ['a type both dropped and collapsed', () => { const d = doc0(); Object.assign(enc(d).rules as JsonObject, { drop: ['url'], collapse: ['url'] }); return signed(d); }, 'BAD_LEXICON', `${SOURCE} member encoding.rules.collapse: encoding.rules.collapse: "url" is also in encoding.rules.drop; a token type is either dropped or collapsed; ${REBUILD}`],
    ['collapsed types at the char level', () => { const d = baseDoc(2); (enc(d).rules as JsonObject).collapse = ['number']; return signed(d); }, 'BAD_LEXICON', `${SOURCE} member encoding.rules.collapse: encoding.rules.collapse: token types are dropped or collapsed at the word level only, but encoding.rules.level is "char"; ${REBUILD}`],
    ['unsorted labels', () => { const d = doc0(); enc(d).labels = ['praise', 'delays', 'refunds']; return signed(d); }, 'BAD_LEXICON', `${SOURCE} member encoding.labels[1]: labels must be distinct and in JavaScript string order ("praise" then "delays"); ${REBUILD}`],
    // JSON text may spell a lone surrogate (RFC 8259 §8.2); canonical JSON (RFC 8785 §3.2.2.2) cannot hash it.
    ['a lone surrogate in a token', () => replacedOnce(BASE_TEXTS[0]!, '"<start>"', '"<start\\ud800>"'), 'BAD_LEXICON', schemaMessage('encoding.tokens[0]', 'a string holds a lone surrogate (half a UTF-16 pair), which no lexicon can hash')],
    // Byte-level damage.
    ['a truncated text', () => BASE_TEXTS[0]!.slice(0, 200), 'NOT_JSON', `${SOURCE}: not JSON (${jsonParseMessage(BASE_TEXTS[0]!.slice(0, 200))}); pass a lexicon file written by lexlock build`],
    ['garbage after the document', () => `${BASE_TEXTS[0]!}}`, 'NOT_JSON', `${SOURCE}: not JSON (${jsonParseMessage(`${BASE_TEXTS[0]!}}`)}); pass a lexicon file written by lexlock build`],
    ['a byte order mark after white space', () => ` \ufeff${BASE_TEXTS[0]!}`, 'NOT_JSON', `${SOURCE}: not JSON (${jsonParseMessage(` \ufeff${BASE_TEXTS[0]!}`)}); pass a lexicon file written by lexlock build`],
    [
      'a flipped byte in a token',
      () => {
        const bytes = utf8.encode(BASE_TEXTS[0]!);
        const at = utf8.encode(BASE_TEXTS[0]!.slice(0, BASE_TEXTS[0]!.indexOf('"<start>"'))).length + 4;
        bytes[at] = (bytes[at] as number) ^ 0x03; // "<start>" -> "<stbrt>"
        return bytes;
      },
      'FINGERPRINT_MISMATCH',
      `${SOURCE} member fingerprint: fingerprint ${lex0.fingerprint} does not match the encoding, which hashes to ${fingerprintOf({ ...lex0.encoding, tokens: ['<stbrt>', ...lex0.encoding.tokens.slice(1)] })}; the file was edited or damaged: restore it or rebuild it`,
    ],
    ['invalid UTF-8', () => badBytes(0xff), 'BAD_UTF8', `${SOURCE} line ${badLine()}: invalid UTF-8 at byte ${badOffset()}; a lexicon file is UTF-8 JSON as lexlock build writes it: restore the file or rebuild it`],
    ['a UTF-8 sequence cut short', () => badBytes(0xe2, 0x82), 'BAD_UTF8', `${SOURCE} line ${badLine()}: invalid UTF-8 at byte ${badOffset()}; a lexicon file is UTF-8 JSON as lexlock build writes it: restore the file or rebuild it`],
    ['the whole text as a number', () => '1e999', 'NOT_A_LEXICON', NOT_A_LEXICON],
  ])('%s', (_what, make, code, message) => {
    const e = refusal(make());
    expect(e.message).toBe(message);
    expect(e.code).toBe(code);
  });

  it.each<[string, () => unknown, string]>([
    ['a cycle', () => { const d = doc0(); const loop: Record<string, unknown> = {}; loop.self = loop; (d.encoding as Record<string, unknown>).rules = { ...(enc(d).rules as JsonObject), level: loop }; return d; }, 'expected "word" or "char", got an object with 1 member'],
    ['a bigint', () => { const d = doc0(); (enc(d).rules as Record<string, unknown>).level = 10n; return d; }, 'expected "word" or "char", got a bigint'],
    ['a function', () => { const d = doc0(); (enc(d).rules as Record<string, unknown>).level = () => 'word'; return d; }, 'expected "word" or "char", got a function'],
    ['undefined', () => { const d = doc0(); (enc(d).rules as Record<string, unknown>).level = undefined; return d; }, 'expected "word" or "char", got nothing'],
  ])('refuses a parsed object holding %s, which JSON cannot', (_what, make, detail) => {
    expect(refusal(make() as object).message).toBe(schemaMessage('encoding.rules.level', detail));
  });

  it('turns a parser that overflows its stack into NOT_JSON', () => {
    // V8 parses JSON without recursion; an engine that recursed would throw a RangeError on deep nesting.
    const spy = vi.spyOn(JSON, 'parse').mockImplementationOnce(() => {
      throw new RangeError('Maximum call stack size exceeded');
    });
    try {
      expect(refusal(deepArrayText(10_000)).message).toBe(
        `${SOURCE}: nested too deeply or too large for this JavaScript engine to read (Maximum call stack size exceeded); pass a lexicon file written by lexlock build`,
      );
    } finally {
      spy.mockRestore();
    }
  });

  it('refuses invalid UTF-8 fetched over HTTP instead of replacing it', async () => {
    const url = `data:application/json;base64,${Buffer.from(badBytes(0xff)).toString('base64')}`;
    await expect(fetchLexicon(url, { source: SOURCE })).rejects.toMatchObject({
      code: 'BAD_UTF8',
      message: `${SOURCE} line ${badLine()}: invalid UTF-8 at byte ${badOffset()}; a lexicon file is UTF-8 JSON as lexlock build writes it: restore the file or rebuild it`,
    });
  });
});

/** The engine's own message for a text JSON.parse refuses (the outside source of that part). */
function jsonParseMessage(text: string): string {
  try {
    JSON.parse(text);
  } catch (e) {
    return (e as Error).message;
  }
  throw new Error('JSON.parse accepted it');
}

// Ill-formed bytes put inside the first canary's text ("I can't believe..."), a member no fingerprint covers.
const CANARY_AT = utf8.encode(BASE_TEXTS[0]!.slice(0, BASE_TEXTS[0]!.indexOf("I can't"))).length;
const badBytes = (...bad: number[]) => {
  const bytes = utf8.encode(BASE_TEXTS[0]!);
  return Uint8Array.from([...bytes.subarray(0, CANARY_AT), ...bad, ...bytes.subarray(CANARY_AT)]);
};
const badOffset = () => CANARY_AT;
const badLine = () => BASE_TEXTS[0]!.slice(0, BASE_TEXTS[0]!.indexOf("I can't")).split('\n').length;

describe('names that are special in JavaScript are tokens and labels like any others', () => {
  const SPECIAL = ['__proto__', 'constructor', 'toString', 'hasOwnProperty', 'valueOf'];
  const reviews = SPECIAL.map((label, i) => ({ text: `__proto__ constructor toString hasOwnProperty valueOf ferry ${i}`, label }));

  it('"__proto__" is never one token of a text, so only a reserved token can be "__proto__"', () => {
    // wink-tokenizer 5.3.0 itself (the contract's word tokenizer) tags "__" alien; the contract's rule 2 splits
    // an alien token again with this regular expression, which leaves each "_" alone.
    const alienSplit = /[\p{sc=Han}\p{sc=Hiragana}\p{sc=Katakana}]|(?:(?![\p{sc=Han}\p{sc=Hiragana}\p{sc=Katakana}])[\p{L}\p{M}\p{N}])+|\S/gu;
    const wink = winkTokenizer().tokenize('__proto__ constructor');
    expect(wink).toEqual([
      { value: '__', tag: 'alien' },
      { value: 'proto', tag: 'word' },
      { value: '__', tag: 'alien' },
      { value: 'constructor', tag: 'word' },
    ]);
    const expected = wink.flatMap((t) => (t.tag === 'alien' ? (t.value.match(alienSplit) ?? []) : [t.value]));
    expect(expected).toEqual(['_', '_', 'proto', '_', '_', 'constructor']);
    expect(tokenize('__proto__ constructor', resolveRules())).toEqual(expected);
  });

  it.each<[string, TextRulesInput, string[]]>([
    ['as reserved tokens, case kept', { case: 'keep' }, SPECIAL],
    ['as corpus tokens, lower-cased', {}, []],
  ])('%s: freeze, serialize, parse back, encode, decode, labelId', (_what, rules, reserved) => {
    const lexicon = freeze(Tally.fromTexts(reviews, resolveRules(rules)), { reserved, now: new Date(0) });
    const back = parseLexicon(serializeLexicon(lexicon), { source: SOURCE });
    expect(back.fingerprint).toBe(lexicon.fingerprint);
    const text = '__proto__ constructor toString hasOwnProperty valueOf';
    const tokens = back.tokenize(text);
    const ids = back.encode(text);
    expect(Array.from(ids)).toEqual(tokens.map((t) => back.idOf(t)));
    expect(Array.from(ids)).toEqual(Array.from(lexicon.encode(text)));
    expect(ids.includes(back.oovId)).toBe(false);
    expect(back.decode(ids)).toEqual(tokens);
    for (const name of reserved) {
      const id = back.idOf(name);
      // Reserved tokens take the ids right after padding and OOV, in the order given (encoding contract, rule 4).
      expect(id).toBe(2 + reserved.indexOf(name));
      expect([back.has(name), back.tokenAt(id)]).toEqual([true, name]);
    }
    expect(Array.from(back.idsOf(['__proto__', 'isPrototypeOf', 'prototype']))).toEqual(reserved.length > 0 ? [2, back.oovId, back.oovId] : [back.oovId, back.oovId, back.oovId]);
    // Labels in JavaScript string order (encoding contract, rule 6): '_' (U+005F) comes before the lower-case letters.
    expect(back.labels).toEqual(['__proto__', 'constructor', 'hasOwnProperty', 'toString', 'valueOf']);
    back.labels.forEach((label, i) => expect([back.labelId(label), back.labelAt(i)]).toEqual([i, label]));
    expect(Array.from(back.encodeMany(reviews).labels ?? [])).toEqual(reviews.map((r) => back.labels.indexOf(r.label)));
    expect(() => back.labelId('isPrototypeOf')).toThrow(`label "isPrototypeOf" is not one of the lexicon's 5 labels; rebuild the lexicon with it or drop those documents`);
    expect(Object.getPrototypeOf(back.encoding)).toBe(Object.prototype);
  });

  // Every object of a lexicon document gets a "__proto__" member (an own member, as JSON.parse makes it).
  const objectPaths: Path[] = [[], ...pathsBySlot(baseDoc(0)).map((g) => g[0] as Path).filter((p) => kindOf(getAt(baseDoc(0), p)) === 'object')];
  it.each(objectPaths.map((p) => [pathName(p), p] as const))('a "__proto__" member in %s pollutes nothing and is refused', (name, path) => {
    const d = doc0();
    (getAt(d, path) as JsonObject)[PROTO_KEY] = { polluted: 1, toString: 1 };
    const text = textOf(d, 2);
    // JSON.parse makes "__proto__" an own member (ECMAScript's JSON.parse defines members as data properties).
    expect(Object.hasOwn(getAt(JSON.parse(text) as Json, path) as object, '__proto__')).toBe(true);
    for (const input of [text, utf8.encode(text), JSON.parse(text) as object]) {
      expect(refusal(input).message).toBe(schemaMessage(name, 'unknown member "__proto__"'));
      expect(({} as Record<string, unknown>).polluted).toBeUndefined();
      expect(Object.prototype.hasOwnProperty.call(Object.prototype, 'polluted')).toBe(false);
    }
  });

  it('a "__proto__" member as a value, or a "constructor.prototype" member, pollutes nothing', () => {
    const d = doc0();
    enc(d).labels = { [PROTO_KEY]: { polluted: 1 } };
    expect(refusal(textOf(d, 0)).message).toBe(schemaMessage('encoding.labels', 'expected an array, got an object'));
    const e = doc0();
    Object.assign(e.fit as JsonObject, { constructor: { prototype: { polluted: 1 } } });
    expect(refusal(textOf(e, 0)).message).toBe(schemaMessage('fit', 'unknown member "constructor"'));
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});
