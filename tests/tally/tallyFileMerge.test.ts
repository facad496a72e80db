import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isLexlockError } from '../../src/LexlockError.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules, type TextRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import type { TallyFile } from '../../src/tally/tallyFile.js';
import { tallyFileMerge } from '../../src/tally/tallyFileMerge.js';
import { tallyFileParse } from '../../src/tally/tallyFileParse.js';
import { tallyFileText } from '../../src/tally/tallyFileText.js';

interface Doc {
  text: string;
  label: string | undefined;
}

function part(docs: readonly Doc[], rules: TextRules = resolveRules()): TallyFile {
  const tally = new Tally(rules);
  const snippets: string[] = [];
  for (const d of docs) {
    const before = tally.tokens;
    tally.add(d);
    if (snippets.length < 3 && tally.tokens > before && !snippets.includes(d.text)) snippets.push(d.text);
  }
  // Through the file text and back, as a part crossing machines would.
  return tallyFileParse(tallyFileText({ tally, snippets, fields: { text: 'text', label: 'topic' } }));
}

const merged = (...files: TallyFile[]) => tallyFileMerge(files.map((file, i) => ({ name: `p${i}.tally`, file })));
const bytes = (file: TallyFile) => tallyFileText(file);

const word = fc.constantFrom('the', 'ferry', 'late', 'Late', '__proto__', 'constructor', 'toString', 'ÉTÉ', '😀', '10', 'am', ',', '東京', 'x');
const doc = fc.record({
  text: fc.array(word, { maxLength: 8 }).map((w) => w.join(' ')),
  label: fc.option(fc.constantFrom('delays', 'praise', 'constructor'), { nil: undefined }),
});
const docs = fc.array(doc, { maxLength: 25 });

describe('tallyFileMerge', () => {
  it('adds counts, keeps the first snippets in string order, and drops fields the parts disagree on (hand-counted)', () => {
    const a = part([{ text: 'late late ferry', label: 'delays' }]);
    const b = part([{ text: 'ferry', label: 'praise' }, { text: 'a b', label: undefined }]);
    const c: TallyFile = { ...part([{ text: 'zed', label: undefined }]), fields: { text: 'body', label: 'topic' } };
    const all = merged(a, b, c);
    expect([all.tally.documents, all.tally.tokens]).toEqual([4, 7]);
    expect([...all.tally.counts].sort()).toEqual([['a', 1], ['b', 1], ['ferry', 2], ['late', 2], ['zed', 1]]);
    expect(all.tally.documentFrequency.get('ferry')).toBe(2);
    expect(all.snippets).toEqual(['a b', 'ferry', 'late late ferry']);
    expect(all.fields).toEqual({ text: null, label: 'topic' });
    expect(a.tally.documents).toBe(1);
  });

  it.each<[string, TextRules, string]>([
    ['level', resolveRules({ level: 'char' }), 'p0.tally and p1.tally were counted under different rules (level: "word" in p0.tally, "char" in p1.tally); count every part with the same --level'],
    ['case', resolveRules({ case: 'keep' }), 'p0.tally and p1.tally were counted under different rules (case: "lower" in p0.tally, "keep" in p1.tally); count every part with the same --case'],
    ['drop', resolveRules({ drop: ['punctuation', 'emoji'] }), 'p0.tally and p1.tally were counted under different rules (drop: none in p0.tally, emoji,punctuation in p1.tally); count every part with the same --drop'],
    ['tokenizer', { ...resolveRules(), tokenizer: 'wink-tokenizer@9.9.9' }, 'p0.tally and p1.tally were counted under different rules (tokenizer: "wink-tokenizer@5.3.0" in p0.tally, "wink-tokenizer@9.9.9" in p1.tally); count every part with the same lexlock version'],
  ])('refuses parts counted under another %s, naming both and the rule', (_rule, other, message) => {
    let caught: unknown;
    try {
      merged(part([{ text: 'a', label: undefined }]), { tally: new Tally(other), snippets: [], fields: { text: null, label: null } });
    } catch (e) {
      caught = e;
    }
    expect(isLexlockError(caught) && [caught.code, caught.message]).toEqual(['TALLY_RULES_DIFFER', message]);
  });

  // Invariant: merging is commutative and associative, down to the bytes of the file.
  it('merge(a, b) and merge(b, a) give the same bytes; so do merge(merge(a, b), c) and merge(a, merge(b, c)) (property)', () => {
    fc.assert(
      fc.property(docs, docs, docs, (x, y, z) => {
        const [a, b, c] = [part(x), part(y), part(z)];
        expect(bytes(merged(a, b))).toBe(bytes(merged(b, a)));
        expect(bytes(merged(merged(a, b), c))).toBe(bytes(merged(a, merged(b, c))));
      }),
      { numRuns: 60 },
    );
  });

  // Invariant: the lexicon frozen from merged shard tallies is the lexicon of the whole corpus.
  it('shards counted apart and merged freeze to the whole corpus lexicon: same fingerprint, encoding and fit figures (property)', () => {
    fc.assert(
      fc.property(docs, fc.array(fc.nat(), { maxLength: 4 }), fc.integer({ min: 1, max: 12 }), (all, cuts, cap) => {
        const points = [...new Set(cuts.map((c) => c % (all.length + 1)))].sort((p, q) => p - q);
        const shards: TallyFile[] = [];
        let from = 0;
        for (const p of [...points, all.length]) {
          shards.push(part(all.slice(from, p)));
          from = p;
        }
        const whole = part(all);
        const now = new Date(0);
        const a = freeze(whole.tally, { cap, shape: { length: 4, pad: 'start', cut: 'end' }, now });
        const b = freeze(merged(...shards).tally, { cap, shape: { length: 4, pad: 'start', cut: 'end' }, now });
        expect(b.fingerprint).toBe(a.fingerprint);
        expect(b.encoding).toEqual(a.encoding);
        expect(b.fit).toEqual(a.fit);
      }),
      { numRuns: 80 },
    );
  });
});
