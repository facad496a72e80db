// OOV tokens by count band (issue 16): shown when the most frequent OOV tokens all share one count.
// Checked against a plain count of the same tally (every OOV token, sorted) and a worked example.
import fc from 'fast-check';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { oovBands } from '../../../src/audit/explore/oovBands.js';
import { freeze } from '../../../src/lexicon/freeze.js';
import { resolveRules } from '../../../src/rules/TextRules.js';
import { Tally } from '../../../src/tally/Tally.js';
import { cli, tempFolder } from '../../helpers/cli.js';

const DEMO = join(import.meta.dirname, '../../../corpora-demo/ferry-messages.csv');

function tallyOf(texts: readonly string[]): Tally {
  const tally = new Tally(resolveRules());
  for (const text of texts) tally.add({ text });
  return tally;
}

describe('oovBands', () => {
  it('a worked example: once, twice, 3-9 and 10+ times, with the first tokens of each in string order', () => {
    const tally = tallyOf(['ferry ferry ferry quay', 'zeta alpha beta beta gamma gamma', 'delta '.repeat(12), 'omega omega omega']);
    const lexicon = freeze(tallyOf(['ferry quay']), { cap: null });
    expect(oovBands(tally, lexicon, 2)).toEqual([
      { name: 'once', from: 1, to: 1, types: 2, occurrences: 2, sample: ['alpha', 'zeta'] },
      { name: 'twice', from: 2, to: 2, types: 2, occurrences: 4, sample: ['beta', 'gamma'] },
      { name: '3-9 times', from: 3, to: 9, types: 1, occurrences: 3, sample: ['omega'] },
      { name: '10+ times', from: 10, to: Infinity, types: 1, occurrences: 12, sample: ['delta'] },
    ]);
  });

  it('adds up to every OOV token, each band sampled with its smallest tokens (fast-check against a sort)', () => {
    const word = fc.constantFrom('a', 'b', 'c', 'd', 'e', 'f', 'g', 'h', 'quay', 'ferry', 'zz');
    fc.assert(
      fc.property(fc.array(fc.array(word, { maxLength: 30 }).map((w) => w.join(' ')), { maxLength: 12 }), fc.array(word, { maxLength: 4 }), (texts, known) => {
        const tally = tallyOf(texts);
        const lexicon = freeze(tallyOf([known.join(' ')]), { cap: null });
        const bands = oovBands(tally, lexicon, 3);
        const oov = [...tally.counts].filter(([t]) => !lexicon.has(t));
        expect(bands.reduce((s, b) => s + b.types, 0)).toBe(oov.length);
        for (const b of bands) {
          const mine = oov.filter(([, c]) => c >= b.from && c <= b.to);
          expect(b.occurrences).toBe(mine.reduce((s, [, c]) => s + c, 0));
          expect(b.sample).toEqual(mine.map(([t]) => t).sort().slice(0, 3));
        }
      }),
    );
  });
});

describe('the report page', () => {
  it('shows the bands when the top OOV tokens all occur once, and the list when their counts differ (demo corpus)', async () => {
    const tmp = await tempFolder();
    try {
      const page = async (cap: string) => {
        const r = await cli('audit', DEMO, '--label', 'topic', '--cap', cap, '--report', tmp.path(`${cap}.html`), '-q');
        expect(r.code, r.stderr).toBe(0);
        return readFile(tmp.path(`${cap}.html`), 'utf8');
      };
      const flat = await page('3900');
      expect(flat).toContain('most frequent OOV tokens all occur once, so a list of them in string order would say little');
      expect(flat).toMatch(/<th scope="row">once<\/th><td class="num">133<\/td><td class="num">100\u00a0%<\/td>/);
      const varied = await page('800');
      expect(varied).not.toContain('OOV tokens by count');
      expect(varied).toContain('most frequent of the corpus');
    } finally {
      await tmp.remove();
    }
  });
});
