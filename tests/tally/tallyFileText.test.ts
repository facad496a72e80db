import { describe, expect, it } from 'vitest';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { tallyFileParse } from '../../src/tally/tallyFileParse.js';
import { tallyFileText } from '../../src/tally/tallyFileText.js';

const NO_FIELDS = { text: null, label: null };

describe('tallyFileText', () => {
  it('writes the members in a fixed order, tokens in string order, one entry a line (hand-written)', () => {
    const tally = new Tally(resolveRules());
    tally.addTokens(['late', 'ferry', 'late'], 'delays');
    tally.addTokens(['Zed', 'ferry'], 'praise');
    tally.addTokens([]);
    const text = tallyFileText({ tally, snippets: ['zz', 'late ferry'], fields: { text: 'text', label: 'topic' } });
    expect(text).toBe(
      [
        '{',
        '  "format": "lexlock.tally",',
        '  "formatVersion": 2,',
        '  "rules": {"level":"word","unicode":"NFKC","case":"lower","drop":[],"collapse":[],"spaces":null,"tokenizer":"wink-tokenizer@5.3.0"},',
        '  "fields": {"text":"text","label":"topic"},',
        '  "documents": 3,',
        '  "tokens": 5,',
        '  "types": 3,',
        '  "lengths": [',
        '    [0,1],',
        '    [2,1],',
        '    [3,1]',
        '  ],',
        '  "labels": [',
        '    ["delays",1,3],',
        '    ["praise",1,2]',
        '  ],',
        '  "snippets": [',
        '    "late ferry",',
        '    "zz"',
        '  ],',
        '  "counts": [',
        // 'Z' (U+005A) sorts before the lower-case letters in UTF-16 order.
        '    ["Zed",1,1],',
        '    ["ferry",2,2],',
        '    ["late",2,1]',
        '  ]',
        '}',
        '',
      ].join('\n'),
    );
  });

  it('writes an empty tally with empty arrays, and reads it back', () => {
    const tally = new Tally(resolveRules({ level: 'char' }));
    const text = tallyFileText({ tally, snippets: [], fields: NO_FIELDS });
    expect(text).toContain('  "lengths": [],\n  "labels": [],\n  "snippets": [],\n  "counts": [\n  ]\n}\n');
    const back = tallyFileParse(text);
    expect([back.tally.documents, back.tally.tokens, back.tally.types, back.tally.rules.tokenizer]).toEqual([0, 0, 0, 'lexlock-chars@1']);
  });

  it('gives the same bytes whatever order the documents were counted in', () => {
    const docs: Array<[string[], string]> = [
      [['a', 'b'], 'x'],
      [['b', 'c', 'c'], 'y'],
      [['constructor'], 'x'],
    ];
    const forward = new Tally(resolveRules());
    for (const [t, l] of docs) forward.addTokens(t, l);
    const backward = new Tally(resolveRules());
    for (const [t, l] of [...docs].reverse()) backward.addTokens(t, l);
    expect(tallyFileText({ tally: forward, snippets: ['q', 'p'], fields: NO_FIELDS })).toBe(tallyFileText({ tally: backward, snippets: ['p', 'q'], fields: NO_FIELDS }));
  });

  it('round-trips tokens and labels that are object keys: __proto__, constructor, toString', () => {
    const tally = new Tally(resolveRules({ case: 'keep' }));
    tally.addTokens(['__proto__', 'constructor', '__proto__', 'toString', 'hasOwnProperty'], '__proto__');
    tally.addTokens(['valueOf', 'constructor'], 'constructor');
    const back = tallyFileParse(tallyFileText({ tally, snippets: [], fields: NO_FIELDS })).tally;
    expect([...back.counts].sort()).toEqual([
      ['__proto__', 2],
      ['constructor', 2],
      ['hasOwnProperty', 1],
      ['toString', 1],
      ['valueOf', 1],
    ]);
    expect(back.documentFrequency.get('__proto__')).toBe(1);
    expect(back.documentFrequency.get('constructor')).toBe(2);
    expect([...back.labels]).toEqual([
      ['__proto__', { documents: 1, tokens: 5 }],
      ['constructor', { documents: 1, tokens: 2 }],
    ]);
    expect(Object.getPrototypeOf(back.counts)).toBe(Map.prototype);
  });
});
