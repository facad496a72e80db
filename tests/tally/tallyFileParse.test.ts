import { describe, expect, it } from 'vitest';
import { isLexlockError } from '../../src/LexlockError.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { tallyFileParse } from '../../src/tally/tallyFileParse.js';
import { tallyFileText } from '../../src/tally/tallyFileText.js';

/** A valid tally document: 2 documents, 'b b' and 'a', labels none. */
function valid(): Record<string, unknown> {
  const tally = new Tally(resolveRules());
  tally.addTokens(['b', 'b']);
  tally.addTokens(['a']);
  return JSON.parse(tallyFileText({ tally, snippets: ['a'], fields: { text: null, label: null } })) as Record<string, unknown>;
}

const AGAIN = 'count the part again with lexlock tally';

function failure(input: string | object): [string, string, string | undefined] {
  try {
    tallyFileParse(input, { source: 'p.tally' });
  } catch (e) {
    if (isLexlockError(e)) return [e.code, e.message, e.where.field];
    throw e;
  }
  throw new Error('parsed');
}

describe('tallyFileParse', () => {
  it('reads what tallyFileText wrote (hand-counted)', () => {
    const { tally, snippets, fields } = tallyFileParse(valid());
    expect([tally.documents, tally.tokens, tally.types]).toEqual([2, 3, 2]);
    expect([...tally.counts]).toEqual([['a', 1], ['b', 2]]);
    expect([...tally.documentFrequency]).toEqual([['a', 1], ['b', 1]]);
    expect([...tally.lengths]).toEqual([[1, 1], [2, 1]]);
    expect(snippets).toEqual(['a']);
    expect(fields).toEqual({ text: null, label: null });
  });

  it('refuses text that is not JSON (the parser\'s own words in the middle vary by Node version)', () => {
    const [code, message] = failure('{');
    expect(code).toBe('NOT_JSON');
    expect(message.startsWith('p.tally: not JSON (')).toBe(true);
    expect(message.endsWith('); pass a tally file written by lexlock tally or lexlock merge')).toBe(true);
  });

  it.each<[string, (d: Record<string, unknown>) => unknown, string, string, string | undefined]>([
    ['a lexicon', () => ({ format: 'lexlock.lexicon' }), 'NOT_A_TALLY', 'p.tally: not a lexlock tally (no "format": "lexlock.tally" member); pass a file written by lexlock tally or lexlock merge', undefined],
    ['a newer version', (d) => ({ ...d, formatVersion: 3 }), 'NEWER_FORMAT', 'p.tally member formatVersion: tally format version 3 needs a newer lexlock; this one (0.2.0) reads versions up to 2; upgrade lexlock', 'formatVersion'],
    ['version 1', (d) => ({ ...d, formatVersion: 1 }), 'OLD_FORMAT', `p.tally member formatVersion: tally format version 1 was written by lexlock 0.1, whose character level dropped white space; this lexlock (0.2.0) reads version 2; ${AGAIN}`, 'formatVersion'],
    ['a char-level tally without spaces', (d) => ({ ...d, rules: { ...(d.rules as object), level: 'char', spaces: null } }), 'BAD_TALLY', `p.tally member rules.spaces: rules.spaces is null, but the character level needs "keep" or "drop"; ${AGAIN}`, 'rules.spaces'],
    ['a word-level tally with spaces', (d) => ({ ...d, rules: { ...(d.rules as object), spaces: 'keep' } }), 'BAD_TALLY', `p.tally member rules.spaces: rules: spaces: white space is kept or dropped at the character level only (the word level never makes a token of it); remove it or use level char; ${AGAIN}`, 'rules.spaces'],
    ['a count that is text', (d) => ({ ...d, counts: [['a', '1', 1], ['b', 2, 1]] }), 'BAD_TALLY', `p.tally member counts[0][1]: not a valid tally: counts[0][1]: expected a number, got a string; ${AGAIN}`, 'counts[0][1]'],
    ['an entry of two', (d) => ({ ...d, counts: [['a', 1], ['b', 2, 1]] }), 'BAD_TALLY', `p.tally member counts[0]: not a valid tally: counts[0]: ["a",1] is below the minimum 3; ${AGAIN}`, 'counts[0]'],
    ['an unknown member', (d) => ({ ...d, extra: 1 }), 'BAD_TALLY', `p.tally member (top level): not a valid tally: (top level): unknown member "extra"; ${AGAIN}`, '(top level)'],
    ['tokens out of order', (d) => ({ ...d, counts: [['b', 2, 1], ['a', 1, 1]] }), 'BAD_TALLY', `p.tally member counts[1]: token "a" comes after "b"; tokens must be distinct and in JavaScript string order; ${AGAIN}`, 'counts[1]'],
    ['a token twice', (d) => ({ ...d, counts: [['a', 1, 1], ['a', 2, 1]] }), 'BAD_TALLY', `p.tally member counts[1]: token "a" comes after "a"; tokens must be distinct and in JavaScript string order; ${AGAIN}`, 'counts[1]'],
    ['more documents than occurrences', (d) => ({ ...d, counts: [['a', 1, 1], ['b', 2, 3]] }), 'BAD_TALLY', `p.tally member counts[1]: token "b" occurs 2 times but in 3 documents; ${AGAIN}`, 'counts[1]'],
    ['counts that do not add up', (d) => ({ ...d, counts: [['a', 1, 1], ['b', 3, 1]] }), 'BAD_TALLY', `p.tally member counts: the counts add up to 4 tokens but tokens is 3; ${AGAIN}`, 'counts'],
    ['a wrong types', (d) => ({ ...d, types: 3 }), 'BAD_TALLY', `p.tally member types: types is 3 but counts has 2 entries; ${AGAIN}`, 'types'],
    ['a histogram that does not add up', (d) => ({ ...d, lengths: [[1, 1], [2, 2]] }), 'BAD_TALLY', `p.tally member lengths: the length histogram holds 3 documents but documents is 2; ${AGAIN}`, 'lengths'],
    ['unsorted drop', (d) => ({ ...d, rules: { ...(d.rules as object), drop: ['url', 'emoji'] } }), 'BAD_TALLY', `p.tally member rules.drop: rules.drop must list distinct token types in string order (["emoji","url"]); ${AGAIN}`, 'rules.drop'],
    ['drop at the char level', (d) => ({ ...d, rules: { ...(d.rules as object), level: 'char', drop: ['url'] } }), 'BAD_TALLY', `p.tally member rules.drop: rules: drop/collapse: token types exist at the word level only; remove them or use level word; ${AGAIN}`, 'rules.drop'],
    ['labels out of order', (d) => ({ ...d, labels: [['y', 1, 1], ['x', 1, 2]] }), 'BAD_TALLY', `p.tally member labels[1]: label "x" comes after "y"; labels must be distinct and in JavaScript string order; ${AGAIN}`, 'labels[1]'],
    ['too many snippets', (d) => ({ ...d, snippets: ['a', 'b', 'c', 'd'] }), 'BAD_TALLY', `p.tally member snippets: 4 snippets; a tally keeps at most 3; ${AGAIN}`, 'snippets'],
  ])('refuses %s, naming the member', (_what, edit, code, message, field) => {
    expect(failure(edit(valid()) as string | object)).toEqual([code, message, field]);
  });
});
