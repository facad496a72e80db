import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isLexlockError } from '../../src/LexlockError.js';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import { serializeLexicon } from '../../src/artifact/serializeLexicon.js';
import { fingerprintOf } from '../../src/artifact/fingerprint.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';

const lex = freeze(Tally.fromTexts([{ text: 'the ferry was late', label: 'delays' }, { text: 'lovely ferry', label: 'praise' }], resolveRules()), {
  shape: { length: 6, pad: 'start', cut: 'end' },
  snippets: ['the ferry was late'],
});
const text = serializeLexicon(lex);
// `any` because these tests edit parsed lexicon documents freely, member by member, to make them wrong.
type Doc = Record<string, any>;
const doc = () => JSON.parse(text) as Doc;

/** Re-signs an edited document so only the intended defect remains. */
function resigned(d: Doc): Doc {
  d.fingerprint = fingerprintOf(d.encoding);
  return d;
}

function errorOf(input: string | object) {
  try {
    parseLexicon(input, { source: 'lex.json' });
  } catch (e) {
    if (isLexlockError(e)) return { code: e.code, message: e.message, field: e.where.field };
    throw e;
  }
  throw new Error('expected a LexlockError');
}

describe('parseLexicon', () => {
  it('reads back what serializeLexicon wrote', () => {
    const back = parseLexicon(text);
    expect(back.fingerprint).toBe(lex.fingerprint);
    expect(back.encoding).toEqual(lex.encoding);
    expect(back.fit).toEqual(lex.fit);
    expect(Array.from(back.encode('the ferry was very late'))).toEqual(Array.from(lex.encode('the ferry was very late')));
  });

  // The Unicode Standard (§23.8) allows a byte order mark at the start of UTF-8 text; RFC 8259 §8.1
  // lets a JSON parser ignore it. Only a leading one: anywhere else U+FEFF is not JSON white space.
  it('reads a lexicon whose text or bytes start with a byte order mark', () => {
    const bytes = new TextEncoder().encode(`\ufeff${text}`);
    expect(Array.from(bytes.subarray(0, 3))).toEqual([0xef, 0xbb, 0xbf]);
    for (const input of [`\ufeff${text}`, bytes]) {
      expect(parseLexicon(input, { expectFingerprint: lex.fingerprint }).encoding).toEqual(lex.encoding);
    }
    expect(errorOf(`\ufeff\ufeff${text}`).code).toBe('NOT_JSON');
  });

  // A member is written `"name":value` with no space, as in the one-line objects, so a member reads the
  // same wherever it sits: a search for `"shape":{"length":6,…}` finds it in the file as written.
  it('writes one token a line, each small object of plain values on one line, members as "name":value', () => {
    const lines = text.split('\n');
    expect(lines).toContain('    "shape":{"length":6,"pad":"start","cut":"end"}');
    expect(lines).toContain('    "rules":{"level":"word","unicode":"NFKC","case":"lower","drop":[],"collapse":[],"spaces":null,"tokenizer":"wink-tokenizer@5.3.0"},');
    expect(lines).toContain('    "layout":{"oov":"first","reserved":0},');
    expect(lines).toContain('  "formatVersion":2,');
    expect(text).not.toContain('": ');
    expect(lines).toContain('      "ferry",');
    expect(text.endsWith('\n}\n')).toBe(true);
    // The same document as JSON.stringify gives, only laid out differently.
    expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify({ format: 'lexlock.lexicon', formatVersion: 2, fingerprint: lex.fingerprint, fit: lex.fit, canaries: lex.canaries, encoding: lex.encoding })));
  });

  const sameTokensElsewhere = (): Doc => {
    const d = doc();
    d.encoding.tokens[1] = d.encoding.tokens[0];
    return resigned(d);
  };
  const otherCanary = (): Doc => {
    const d = doc();
    d.canaries[2].tokens = ['changed'];
    return d;
  };

  it.each<[string, () => string | object, string, string]>([
    ['not JSON', () => '{"format": ', 'NOT_JSON', 'lex.json: not JSON ('],
    ['not a lexicon', () => ({ hello: 1 }), 'NOT_A_LEXICON', 'lex.json: not a lexlock lexicon (no "format": "lexlock.lexicon" member); pass a file written by lexlock build'],
    [
      'a newer format',
      () => ({ ...doc(), formatVersion: 7 }),
      'NEWER_FORMAT',
      'lex.json member formatVersion: lexicon format version 7 needs a newer lexlock; this one (0.2.0) reads versions up to 2; upgrade lexlock',
    ],
    [
      'format version 1, naming the lexlock that wrote it',
      () => {
        const d = doc();
        d.formatVersion = 1;
        d.fit.lexlockVersion = '0.1.0';
        return d;
      },
      'OLD_FORMAT',
      "lex.json member formatVersion: lexicon format version 1 was written by lexlock 0.1.0; this lexlock (0.2.0) reads version 2 only (the shape's ends are now start and end, and the character level keeps spaces); " +
        "rebuild it with this lexlock's build from the same corpus and flags, giving --pad and --cut as start or end (at --level char, --spaces drop gives the old character tokens)",
    ],
    [
      'format version 1 without a fit',
      () => ({ ...doc(), formatVersion: 1, fit: null }),
      'OLD_FORMAT',
      "lex.json member formatVersion: lexicon format version 1 was written by lexlock 0.1; this lexlock (0.2.0) reads version 2 only (the shape's ends are now start and end, and the character level keeps spaces); " +
        "rebuild it with this lexlock's build from the same corpus and flags, giving --pad and --cut as start or end (at --level char, --spaces drop gives the old character tokens)",
    ],
    [
      'a char-level rule without spaces',
      () => {
        const d = doc();
        d.encoding.rules = { ...d.encoding.rules, level: 'char', spaces: null };
        return d;
      },
      'BAD_LEXICON',
      'lex.json member encoding.rules.spaces: encoding.rules.spaces is null, but the character level needs "keep" or "drop"; rebuild it with lexlock build',
    ],
    [
      'a word-level rule with spaces',
      () => {
        const d = doc();
        d.encoding.rules = { ...d.encoding.rules, spaces: 'drop' };
        return d;
      },
      'BAD_LEXICON',
      'lex.json member encoding.rules.spaces: encoding.rules.spaces is "drop", but white space is kept or dropped at the character level only (null at the word level); rebuild it with lexlock build',
    ],
    ['a wrong fingerprint', () => ({ ...doc(), fingerprint: `sha256:${'0'.repeat(64)}` }), 'FINGERPRINT_MISMATCH', `lex.json member fingerprint: fingerprint sha256:${'0'.repeat(64)} does not match the encoding, which hashes to ${lex.fingerprint}; the file was edited or damaged: restore it or rebuild it`],
    ['duplicate tokens', sameTokensElsewhere, 'DUPLICATE_TOKEN', 'lex.json member encoding.tokens: "ferry" stands at ids 2 and 3; every token must appear once in encoding.tokens'],
    ['a changed canary', otherCanary, 'CANARY_MISMATCH', 'lex.json member canaries[2]: canary "Timetable at https://ferries.example.org" now gives ["timetable","at","https://ferries.example.org/routes?id=7#north","or","mail","help.desk@harbour.example"] but gave ["changed"] when the lexicon was built (1 of 9 canaries differ); the tokenizer or Unicode data changed under it (built with wink-tokenizer@5.3.0): use the versions it was built with, or rebuild it'],
    [
      'a wrong member type',
      () => {
        const d = doc();
        d.encoding.tokens[3] = 42;
        return d;
      },
      'BAD_LEXICON',
      'lex.json member encoding.tokens[3]: not a valid lexicon: encoding.tokens[3]: expected a string, got a number; rebuild it with lexlock build',
    ],
    [
      'unsorted labels',
      () => {
        const d = doc();
        d.encoding.labels = ['praise', 'delays'];
        return resigned(d);
      },
      'BAD_LEXICON',
      'lex.json member encoding.labels[1]: labels must be distinct and in JavaScript string order ("praise" then "delays"); rebuild it with lexlock build',
    ],
  ])('refuses %s', (_what, make, code, message) => {
    const err = errorOf(make());
    expect(err.code).toBe(code);
    if (code === 'NOT_JSON') expect(err.message.startsWith(message)).toBe(true);
    else expect(err.message).toBe(message);
  });

  it('checks the fingerprint a model declares', () => {
    expect(parseLexicon(text, { expectFingerprint: lex.fingerprint }).fingerprint).toBe(lex.fingerprint);
    expect(() => parseLexicon(text, { expectFingerprint: 'sha256:abc' })).toThrow(`lexicon fingerprint ${lex.fingerprint} is not the expected sha256:abc; load the lexicon the model was trained with`);
  });

  it('can skip the canary check when asked', () => {
    const d = otherCanary();
    expect(parseLexicon(d, { checkCanaries: false }).fingerprint).toBe(lex.fingerprint);
  });

  // Property: serialize -> parse keeps every encoding (same ids for every text, same fingerprint).
  it('keeps every encoding through serialize and parse (property)', () => {
    const token = fc.string({ unit: fc.constantFrom('a', 'b', 'é', '東', '😀', '_', 'constructor'), minLength: 1, maxLength: 3 });
    fc.assert(
      fc.property(
        fc.array(fc.array(token, { maxLength: 8 }), { minLength: 1, maxLength: 10 }),
        fc.record({
          cap: fc.integer({ min: 1, max: 30 }),
          oov: fc.constantFrom('first' as const, 'last' as const),
          reserved: fc.uniqueArray(fc.constantFrom('<s>', '__proto__', 'toString'), { maxLength: 3 }),
          level: fc.constantFrom('word' as const, 'char' as const),
        }),
        (docs, o) => {
          const t = Tally.fromTexts(docs.map((d) => d.join(' ')), resolveRules({ level: o.level }));
          const l = freeze(t, { cap: o.cap, oov: o.oov, reserved: o.reserved });
          const back = parseLexicon(serializeLexicon(l));
          expect(back.fingerprint).toBe(l.fingerprint);
          expect(back.encoding).toEqual(l.encoding);
          for (const d of docs) expect(Array.from(back.encode(d.join(' ')))).toEqual(Array.from(l.encode(d.join(' '))));
        },
      ),
      { numRuns: 100 },
    );
  });
});

describe('schema messages name the member', () => {
  it.each<[(d: Doc) => void, string]>([
    [(d) => (d.encoding.rules.level = 'sentence'), 'encoding.rules.level: expected "word" or "char", got "sentence"'],
    [(d) => (d.encoding.extra = 1), 'encoding: unknown member "extra"'],
    [(d) => (d.encoding.layout.reserved = -1), 'encoding.layout.reserved: -1 is below the minimum 0'],
    [(d) => (d.fingerprint = 'md5:1'), 'fingerprint: "md5:1" does not match /^sha256:[0-9a-f]{64}$/'],
    [(d) => delete d.encoding.shape, 'encoding.shape: expected an object, got nothing'],
  ])('%#: %s', (edit, detail) => {
    const d = doc();
    edit(d);
    expect(errorOf(d).message).toBe(`lex.json member ${detail.slice(0, detail.indexOf(':'))}: not a valid lexicon: ${detail}; rebuild it with lexlock build`);
  });
});
