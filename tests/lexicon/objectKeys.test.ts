// Tokens and labels that are also names of Object.prototype members must behave like any other string
// (issue 6). The names below are the members every JavaScript object inherits (ECMA-262, "Properties of
// the Object Prototype Object"), plus `__proto__` (Annex B), the classic source of prototype pollution.
import { describe, expect, it } from 'vitest';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import { serializeLexicon } from '../../src/artifact/serializeLexicon.js';
import { auditCorpus } from '../../src/audit/auditCorpus.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { tallyFileParse } from '../../src/tally/tallyFileParse.js';
import { tallyFileText } from '../../src/tally/tallyFileText.js';

// At the word level wink-tokenizer cuts `_` off (`__proto__` is `_ _ proto _ _`), so the words are the
// names without underscores; `__proto__` itself comes in as a counted token (addTokens), a reserved
// token and a label.
const NAMES = ['constructor', 'toString', 'hasOwnProperty', 'valueOf', 'isPrototypeOf', 'propertyIsEnumerable', 'toLocaleString'];
const texts = [
  { text: `${NAMES.join(' ')} ferry`, label: '__proto__' },
  { text: 'constructor', label: 'constructor' },
  { text: 'the ferry was late', label: 'toString' },
];
const rules = resolveRules({ case: 'keep' });

describe('names of Object.prototype members as tokens, reserved tokens and labels', () => {
  const tally = Tally.fromTexts(texts, rules).addTokens(['__proto__', '__proto__', '__proto__', 'constructor']);
  const lexicon = freeze(tally, { reserved: ['__proto__', 'valueOf'] });

  it('are counted like any other token', () => {
    expect(tally.counts.get('__proto__')).toBe(3);
    expect(tally.counts.get('constructor')).toBe(3);
    expect(tally.counts.get('toString')).toBe(1);
    expect(tally.types).toBe(NAMES.length + 5);
  });

  it('get ids of their own, reserved ones right after padding and OOV, and decode back', () => {
    expect([lexicon.idOf('__proto__'), lexicon.idOf('valueOf')]).toEqual([2, 3]);
    expect(lexicon.tokenAt(2)).toBe('__proto__');
    expect([...lexicon.idsOf(['__proto__', 'constructor'])]).toEqual([2, lexicon.idOf('constructor')]);
    const ids = lexicon.encode(NAMES.join(' '), { shape: null });
    expect(ids.length).toBe(NAMES.length);
    expect([...ids].includes(lexicon.oovId)).toBe(false);
    expect(new Set(ids).size).toBe(NAMES.length);
    expect(lexicon.decode(ids)).toEqual(NAMES);
    expect(lexicon.has('hasOwnProperty')).toBe(true);
    expect(lexicon.idOf('prototype')).toBe(lexicon.oovId);
  });

  it('are labels like any other, in batches and audits', async () => {
    expect(lexicon.labels).toEqual(['__proto__', 'constructor', 'toString']);
    expect(lexicon.labelId('__proto__')).toBe(0);
    expect([...(lexicon.encodeMany(texts).labels ?? [])]).toEqual([0, 1, 2]);
    const report = await auditCorpus(texts, lexicon);
    expect(Object.keys(report.labels)).toEqual(['__proto__', 'constructor', 'toString']);
    expect(Object.hasOwn(report.labels, '__proto__')).toBe(true);
    expect(report.labels['__proto__']?.documents).toBe(1);
    expect(Object.getPrototypeOf(report.labels)).toBe(Object.prototype);
  });

  it('survive the lexicon file and the tally file, and pollute nothing', () => {
    const again = parseLexicon(serializeLexicon(lexicon));
    expect(again.fingerprint).toBe(lexicon.fingerprint);
    expect(again.idOf('__proto__')).toBe(2);
    expect([...again.encode('constructor toString', { shape: null })]).toEqual([...lexicon.encode('constructor toString', { shape: null })]);
    const file = tallyFileParse(tallyFileText({ tally, snippets: [], fields: { text: null, label: null } }));
    expect(new Map(file.tally.counts)).toEqual(new Map(tally.counts));
    expect(file.tally.counts.get('__proto__')).toBe(3);
    expect(({} as Record<string, unknown>)['polluted']).toBeUndefined();
    expect(Object.getPrototypeOf({})).toBe(Object.prototype);
  });
});
