// The `lexlock build` line the report page offers: words quoted for a POSIX shell (single quotes,
// a quote inside written '\'' as POSIX sh's quoting rules allow) and the run's rules as build flags.
import { describe, expect, it } from 'vitest';
import { buildWords, shellWord } from '../../src/commands/buildWords.js';
import { parseArgs } from '../../src/commands/parseArgs.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { RULE_FLAGS } from '../../src/commands/sharedFlags.js';

describe('shellWord', () => {
  it.each([
    ['reviews.csv', 'reviews.csv'],
    ['data/2031-q2/tickets.jsonl', 'data/2031-q2/tickets.jsonl'],
    ['my corpus.csv', "'my corpus.csv'"],
    ["o'clock.csv", "'o'\\''clock.csv'"],
    ['$HOME', "'$HOME'"],
    ['<oov>', "'<oov>'"],
    ['', "''"],
  ])('%j -> %s', (word, quoted) => {
    expect(shellWord(word)).toBe(quoted);
  });
});

describe('buildWords', () => {
  const tally = new Tally(resolveRules({ case: 'keep', collapse: ['email', 'url'] }));
  tally.add({ text: 'The ferry was late', label: 'delays' });

  it('gives the corpus, the output, the rules that differ from the defaults and the fields', () => {
    const lexicon = freeze(tally, { cap: 3, reserved: ['<ship>'], oov: 'last' });
    const args = parseArgs('audit', ['--min-count', '2'], { 'min-count': { kind: 'value' }, ...RULE_FLAGS });
    expect(buildWords({ corpus: 'data/my tickets.csv', lexicon, fromLexicon: false, args, text: 'body', label: 'desk' })).toEqual({
      head: ["'data/my tickets.csv'", '-o', "'my tickets.lexicon.json'"],
      tail: ['--case', 'keep', '--collapse', 'email,url', '--oov', 'last', '--reserve', "'<ship>'", '--min-count', '2', '--text', 'body', '--label', 'desk'],
    });
  });

  it('with --lexicon, builds from the corpus its fit record names', () => {
    const lexicon = freeze(tally, { cap: 3, source: 'archive/ferry-2030.csv' });
    const args = parseArgs('audit', [], {});
    expect(buildWords({ corpus: 'live.jsonl', lexicon, fromLexicon: true, args, text: undefined, label: undefined }).head).toEqual(['ferry-2030.csv', '-o', 'ferry-2030.lexicon.json']);
  });
});
