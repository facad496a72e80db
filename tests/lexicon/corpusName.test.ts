import { describe, expect, it } from 'vitest';
import { corpusName } from '../../src/lexicon/corpusName.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';

describe('corpusName', () => {
  it.each([
    ['/home/build/data/reviews.csv', 'reviews.csv'],
    ['data/mail/', 'mail'],
    ['C:\\Users\\build\\tickets.jsonl', 'tickets.jsonl'],
    ['reviews.csv', 'reviews.csv'],
    ['https://data.example/ferry/live.jsonl', 'live.jsonl'],
    ['/', '/'],
  ])('%s keeps %s', (path, name) => {
    expect(corpusName(path)).toBe(name);
  });

  it("is what freeze records as the fit's source", () => {
    const tally = Tally.fromTexts(['late ferry'], resolveRules());
    expect(freeze(tally, { source: '/srv/corpora/ferry/messages.csv' }).fit?.source).toBe('messages.csv');
    expect(freeze(tally).fit?.source).toBeNull();
  });
});
