import { describe, expect, it } from 'vitest';
import { isLexlockError } from '../../src/LexlockError.js';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import { serializeLexicon } from '../../src/artifact/serializeLexicon.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';

// fit.badText: the bad-text policy a lexicon's corpus was read with. A fit member, so not part of the
// fingerprint (it decides which documents are read, never the ids of a text).
const tally = Tally.fromTexts(['the ferry was late', 'lovely ferry'], resolveRules());

describe('fit.badText', () => {
  it('is written by freeze (fail unless told) and read back by parseLexicon', () => {
    expect(freeze(tally).fit?.badText).toBe('fail');
    for (const badText of ['fail', 'replace', 'skip'] as const) {
      const text = serializeLexicon(freeze(tally, { badText }));
      expect(text).toContain(`"badText":"${badText}"`);
      expect(parseLexicon(text).badText).toBe(badText);
    }
  });

  it('leaves the fingerprint alone', () => {
    const fingerprints = new Set((['fail', 'replace', 'skip'] as const).map((badText) => freeze(tally, { badText }).fingerprint));
    expect(fingerprints.size).toBe(1);
  });

  it('may be missing from a format-2 file written before it was recorded: read as fail', () => {
    const doc = JSON.parse(serializeLexicon(freeze(tally, { badText: 'skip' }))) as { fit: Record<string, unknown> };
    delete doc.fit.badText;
    const lexicon = parseLexicon(doc);
    expect([lexicon.fit?.badText, lexicon.badText]).toEqual([undefined, 'fail']);
    // A lexicon without a fit at all has the same default.
    expect(parseLexicon({ ...doc, fit: null }).badText).toBe('fail');
  });

  it('refuses a value that is no policy, naming the member', () => {
    const doc = JSON.parse(serializeLexicon(freeze(tally))) as { fit: Record<string, unknown> };
    doc.fit.badText = 'ignore';
    let error: unknown;
    try {
      parseLexicon(doc, { source: 'lex.json' });
    } catch (e) {
      error = e;
    }
    expect(isLexlockError(error) && [error.code, error.where.field]).toEqual(['BAD_LEXICON', 'fit.badText']);
    expect((error as Error).message).toBe('lex.json member fit.badText: not a valid lexicon: fit.badText: expected "fail" or "replace" or "skip", got "ignore"; rebuild it with lexlock build');
  });

  it('refuses a policy freeze does not know (BAD_OPTION)', () => {
    expect(() => freeze(tally, { badText: 'ignore' as 'fail' })).toThrow('badText: "ignore" is not one of fail, replace, skip');
  });
});
