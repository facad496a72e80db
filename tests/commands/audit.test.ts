import { createHash } from 'node:crypto';
import { readFile, writeFile } from 'node:fs/promises';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { run } from '../../src/cli.js';
import { cli, tempFolder } from '../helpers/cli.js';

let tmp: Awaited<ReturnType<typeof tempFolder>>;
beforeEach(async () => {
  tmp = await tempFolder();
  await writeFile(tmp.path('train.csv'), 'text,topic\nthe ferry was late again,delays\nthe ferry was lovely,praise\nlate late late,delays\n');
  await writeFile(tmp.path('live.csv'), 'text,topic\nlate late ferry,delays\nthe crossing was rough and late,delays\nlovely,praise\nrough rough sea,refunds\n');
  await cli('build', tmp.path('train.csv'), '-o', tmp.path('lex.json'), '--label', 'topic', '--cap', '3', '--length', '4');
});
afterEach(async () => {
  await tmp.remove();
});

describe('lexlock audit', () => {
  it('prints the JSON report with the contract member names', async () => {
    const r = await cli('audit', tmp.path('live.csv'), '--lexicon', tmp.path('lex.json'), '--json');
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const report = JSON.parse(r.stdout);
    for (const member of ['documents', 'tokens', 'oovTokens', 'oovRate', 'truncatedDocuments', 'droppedTokens', 'paddingTokens', 'length', 'labels', 'topOov', 'suggest', 'drift']) {
      expect(report).toHaveProperty(member);
    }
    expect(Object.keys(report.length)).toEqual(['min', 'p50', 'p90', 'p95', 'p99', 'max']);
    expect(Object.keys(report.suggest)).toEqual(['capFor90', 'capFor95', 'capFor99', 'wholeCapsFor90', 'wholeCapsFor95', 'wholeCapsFor99', 'lengthFor90', 'lengthFor95', 'lengthFor99', 'cut']);
    // What the model sees at p50 (3), the lexicon's length (4) and p90-p99 (6); see tests/audit/windowFigures.test.ts.
    expect(report.windows.map((w: { length: number; candidates: string[] }) => [w.length, w.candidates])).toEqual([
      [3, ['p50']],
      [4, ['chosen']],
      [6, ['p90', 'p95', 'p99']],
    ]);
    expect(Object.keys(report.windows[0])).toEqual(['length', 'candidates', 'truncatedDocuments', 'droppedTokens', 'keptTokens', 'paddingTokens', 'paddingShare', 'keptOov', 'keptOovRate']);
    expect(report.suggest.cut).toEqual({ length: 4, knownKept: { cutStart: 4, cutEnd: 4 }, cut: null });
    expect(report.suggest.wholeCapsFor90).toEqual({ below: 2, above: 9 });
    // The lexicon (cap 3) cut through ferry, the, was (2 each) of its training corpus: ferry and the kept.
    expect(report.capTie).toEqual({ cap: 3, count: 2, tokens: 3, kept: 2, left: 1, below: 1, above: 4 });
    expect(report.shape).toEqual({ length: 4, pad: 'end', cut: 'end' });
    expect(Object.keys(report.labels.delays)).toEqual(['documents', 'tokens', 'oovTokens', 'truncatedDocuments']);
    expect(Object.keys(report.topOov[0])).toEqual(['token', 'count']);
    // Hand-counted (see tests/audit/auditCorpus.test.ts for the same corpus): 13 tokens, 8 OOV; at the
    // lexicon's length 4 one document of 6 tokens is cut, dropping 2.
    expect([report.documents, report.tokens, report.oovTokens, report.truncatedDocuments, report.droppedTokens, report.paddingTokens]).toEqual([4, 13, 8, 1, 2, 5]);
    expect(report.drift.oovRate).toEqual({ fit: 4 / 12, now: 8 / 13 });
  });

  it.each([
    [['--max-oov', '0.7'], 0, ''],
    [['--max-oov', '0.5'], 3, 'lexlock audit: OOV rate 61.54 % is above --max-oov 50.00 %\n'],
    [['--max-oov', '50%'], 3, 'lexlock audit: OOV rate 61.54 % is above --max-oov 50.00 %\n'],
    [['--max-truncated', '0.25'], 0, ''],
    [['--max-truncated', '0.2'], 3, 'lexlock audit: 25.00 % of documents are truncated, above --max-truncated 20.00 %\n'],
    // 8 of 13 tokens are OOV: 61.538461…%. The messages show the digits that tell rate and gate apart.
    [['--max-oov', '0.61536'], 3, 'lexlock audit: OOV rate 61.538 % is above --max-oov 61.536 %\n'],
    [['--max-oov', '61.538%'], 3, 'lexlock audit: OOV rate 61.5385 % is above --max-oov 61.5380 %\n'],
    [['--max-oov', '0.1', '--max-truncated', '0.1'], 3, 'lexlock audit: OOV rate 61.54 % is above --max-oov 10.00 %; 25.00 % of documents are truncated, above --max-truncated 10.00 %\n'],
  ])('gates on %j: exit %d', async (flags, code, stderr) => {
    const r = await cli('audit', tmp.path('live.csv'), '--lexicon', tmp.path('lex.json'), ...flags);
    expect([r.code, r.stderr]).toEqual([code, stderr]);
  });

  // 7 OOV tokens of 125 is 5.6 % exactly (the share 0.056). A percentage is read as the decimal it
  // spells: 5.6 / 100 in binary is 0.055999999999999994, which a rate of exactly 5.6 % would be above.
  it.each([
    [['--max-oov', '5.6%'], 0, ''],
    [['--max-oov', '0.056'], 0, ''],
    [['--max-oov', '5.59%'], 3, 'lexlock audit: OOV rate 5.60 % is above --max-oov 5.59 %\n'],
    [['--max-oov', '5.5999%'], 3, 'lexlock audit: OOV rate 5.6000 % is above --max-oov 5.5999 %\n'],
  ])('a rate of exactly the gate is not above it: %j, exit %d', async (flags, code, stderr) => {
    await writeFile(tmp.path('exact.csv'), `text,topic\n${'late '.repeat(118)}${'zzz '.repeat(7)},delays\n`);
    const r = await cli('audit', tmp.path('exact.csv'), '--lexicon', tmp.path('lex.json'), ...flags);
    expect([r.code, r.stderr]).toEqual([code, stderr]);
  });

  it('audits a corpus against itself with --cap', async () => {
    const r = await cli('audit', tmp.path('train.csv'), '--cap', '3', '--label', 'topic', '--json');
    expect(r.code).toBe(0);
    const report = JSON.parse(r.stdout);
    expect([report.tokens, report.oovTokens, report.truncatedDocuments]).toEqual([12, 4, 0]);
    expect(report.drift).toBeUndefined();
    expect(report.labels.praise).toEqual({ documents: 1, tokens: 4, oovTokens: 2, truncatedDocuments: 0 });
    expect(report.capTie).toEqual({ cap: 3, count: 2, tokens: 3, kept: 2, left: 1, below: 1, above: 4 });
    const summary = await cli('audit', tmp.path('train.csv'), '--cap', '4', '--label', 'topic');
    expect(summary.stdout).not.toContain('lexicon cap');
  });

  it.each([
    [[], 'lexlock audit: pass --lexicon FILE to audit against a lexicon, or --cap N to audit the corpus against itself\n'],
    [['--cap', '3', '--lexicon', 'x.json'], 'lexlock audit: --lexicon and --cap exclude each other: the lexicon already fixes its vocabulary\n'],
    [['--cap', '3', '--max-oov', '7'], 'lexlock audit: --max-oov: "7" is not a share from 0 to 1 (such as 0.05) or a percentage (such as 5%)\n'],
    [['--cap', '0'], 'lexlock audit: --cap: "0" is not a whole number of at least 1\n'],
  ])('exits 2 for %j', async (flags, stderr) => {
    const r = await cli('audit', tmp.path('live.csv'), ...flags);
    expect([r.code, r.stderr]).toEqual([2, stderr]);
  });

  it('refuses rule flags with --lexicon', async () => {
    const r = await cli('audit', tmp.path('live.csv'), '--lexicon', tmp.path('lex.json'), '--case', 'keep');
    expect([r.code, r.stderr]).toEqual([2, 'lexlock audit: --case goes with --cap; with --lexicon the lexicon fixes the text rules\n']);
  });

  it('exits 1 naming the place of bad input', async () => {
    await writeFile(tmp.path('bad.jsonl'), '{"text": "ok"}\n[1, 2]\n');
    const r = await cli('audit', tmp.path('bad.jsonl'), '--cap', '3');
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(new RegExp(`^lexlock audit: ${tmp.path('bad.jsonl').replace(/[.]/g, '\\.')} line 2: `));
  });

  it('prints an aligned summary, coloured only on a terminal without NO_COLOR', async () => {
    const plain = await cli('audit', tmp.path('live.csv'), '--lexicon', tmp.path('lex.json'), '--max-oov', '0.5');
    expect(plain.stdout).not.toContain('\x1b[');
    expect(plain.stdout).toContain('\nOOV               61.54 % of tokens (8)  above --max-oov 50.00 %\n');
    expect(plain.stdout).toContain('\nat length 4       1 document cut (25.00 %), 2 tokens dropped, 5 padding tokens\n');
    expect(plain.stdout).toContain('\ncaps that cover   90 % of tokens: 8 (whole counts: 2 or 9), 95 %: 9, 99 %: 9 (lexicon has 3)\n');
    expect(plain.stdout).toContain('\nlexicon cap       cap 3 cuts through the 3 tokens seen twice: 2 kept by string order, 1 left out; caps 1 or 4 keep whole counts\n');
    expect(plain.stdout).toContain(
      ['label    documents  tokens       OOV  truncated', 'delays           2       9   44.44 %    50.00 %', 'praise           1       1  100.00 %     0.00 %', 'refunds          1       3  100.00 %     0.00 %'].join('\n'),
    );
    expect(plain.stdout).toContain('\nnew tokens       rough (3), and (1), crossing (1), sea (1)\n');
    // Lengths 3, 6, 1, 3 tokens; the 6-token document is K O O O O K (K known, O OOV). At length 3 its
    // first 3 and its last 3 hold 2 OOV each, the others are kept whole: 6 OOV of 10 kept, 2 zeros of 12 ids.
    expect(plain.stdout).toContain('\ncut end           at length 4 rows keep 4 known tokens whichever end long documents lose\n');
    expect(plain.stdout).toContain(
      [
        'rows of each length (what the model sees)',
        'length as    tokens  documents cut  tokens dropped  padding of ids  OOV kept, cut start  OOV kept, cut end',
        'p50               3    1 (25.00 %)               3         16.67 %              60.00 %            60.00 %',
        'chosen            4    1 (25.00 %)               2         31.25 %              63.64 %            63.64 %',
        'p90 p95 p99       6     0 (0.00 %)               0         45.83 %              61.54 %            61.54 %',
      ].join('\n'),
    );
    const runOn = async (env: Record<string, string>) => {
      let out = '';
      await run(['audit', tmp.path('live.csv'), '--lexicon', tmp.path('lex.json')], { stdout: { write: (t: string) => (out += t), isTTY: true }, stderr: { write: () => true }, env });
      return out;
    };
    expect(await runOn({})).toContain('\x1b[');
    expect(await runOn({ NO_COLOR: '1' })).not.toContain('\x1b[');
  });

  it('writes the HTML report, refusing to overwrite without --force', async () => {
    const r = await cli('audit', tmp.path('live.csv'), '--lexicon', tmp.path('lex.json'), '--report', tmp.path('r.html'));
    expect(r.code).toBe(0);
    const html = await readFile(tmp.path('r.html'), 'utf8');
    expect(html).toContain(JSON.parse(await readFile(tmp.path('lex.json'), 'utf8')).fingerprint);
    // One script runs: the page's own, allowed by its SHA-256 in the policy (hashed here by node:crypto),
    // beside one JSON data block; nothing else is allowed to run or be fetched.
    const scripts = [...html.matchAll(/<script([^>]*)>([\s\S]*?)<\/script>/gi)];
    expect(scripts.map((m) => m[1])).toEqual([' type="application/json" id="page-data"', '']);
    const hash = createHash('sha256').update(scripts[1]?.[2] ?? '', 'utf8').digest('base64');
    expect(html).toContain(`content="default-src 'none'; script-src 'sha256-${hash}'; style-src 'unsafe-inline';`);
    expect(html).toContain("<p class=\"cap-tie\"><strong>The lexicon's cap cuts through a tie.</strong> cap 3 cuts through the 3 tokens seen twice: 2 kept by string order, 1 left out; caps 1 or 4 keep whole counts (in the corpus the lexicon was built from).</p>");
    expect(html).toContain('<td class="num">2 or 9</td>');
    const again = await cli('audit', tmp.path('live.csv'), '--lexicon', tmp.path('lex.json'), '--report', tmp.path('r.html'));
    expect([again.code, again.stderr]).toEqual([1, `lexlock audit: ${tmp.path('r.html')} already exists; pass --force to overwrite it\n`]);
  });
});

describe('lexlock audit: long documents in the summary', () => {
  // Lengths are counts like the others in the summary, so they are grouped by thousands too.
  it('writes lengths of a thousand tokens and more with thousands separators', async () => {
    await writeFile(tmp.path('long.txt'), ['a '.repeat(1000), 'b '.repeat(1200), 'c '.repeat(15000)].join('\n') + '\n');
    const r = await cli('audit', tmp.path('long.txt'), '--cap', '2');
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('tokens/document   min 1,000  p50 1,200  p90 15,000  p95 15,000  p99 15,000  max 15,000\n');
    expect(r.stdout).toContain('lengths that fit  90 % of documents: 15,000, 95 %: 15,000, 99 %: 15,000\n');
  });
});

describe('lexlock audit: the report page controls', () => {
  // The note under the controls names the range they take: its first cap and length are the number
  // boxes' least values (a cap of 0 is no cap lexlock build takes).
  it('says its caps and lengths run from the least value its controls take', async () => {
    const r = await cli('audit', tmp.path('live.csv'), '--cap', '3', '--length', '4', '--report', tmp.path('r.html'));
    expect(r.code).toBe(0);
    const html = await readFile(tmp.path('r.html'), 'utf8');
    expect(html).toContain('<input type="number" id="cap-number" aria-label="Vocabulary cap (tokens kept), exact value" min="1" max="9"');
    expect(html).toContain('Every cap from 1 to 9 is exact.');
    expect(html).toContain('<input type="number" id="length-number" aria-label="Sequence length (tokens per row), exact value" min="1" max="6"');
    expect(html).toContain('Every length from 1 to 6 is exact.');
  });
});

describe('lexlock audit: which end to cut', () => {
  it('says which cut end keeps more known tokens', async () => {
    // Known (cap 3): late, ferry, the. Each live document starts with OOV tokens and ends with known ones.
    await writeFile(tmp.path('openers.csv'), 'text,topic\nrough sea late ferry,delays\nsea late,delays\n');
    const summary = await cli('audit', tmp.path('openers.csv'), '--lexicon', tmp.path('lex.json'), '--length', '2');
    expect(summary.code).toBe(0);
    // At length 2 the first two tokens hold 3 OOV (rough sea | sea late), the last two 1 (late ferry | sea late).
    expect(summary.stdout).toContain('\ncut end           at length 2 rows keep 3 known tokens when long documents lose their start, 1 when they lose their end: cut the start (--cut start)\n');
  });
});
