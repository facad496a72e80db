import { readFile, writeFile } from 'node:fs/promises';
import { basename } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { PROBE_TEXTS } from '../../src/artifact/canaries.js';
import { cli, tempFolder } from '../helpers/cli.js';

// What a lexicon gives away: it ships to services and browsers, so it must not carry the machine's
// paths or whole corpus documents, and build, verify and audit say which tokens may identify people.
// The people, addresses and numbers are invented (RFC 2606 .example names, a 555-01xx number).
let tmp: Awaited<ReturnType<typeof tempFolder>>;
const CORPUS = [
  'text,topic',
  'please mail tamsin.skerrit@mail.example about my refund,refunds',
  'tamsin.skerrit@mail.example again: no refund yet,refunds',
  'call 555-0134 or see https://ferries.example.org/help,delays',
  'ok,praise',
  'thanks,praise',
].join('\n');

beforeEach(async () => {
  tmp = await tempFolder();
  await writeFile(tmp.path('support.csv'), `${CORPUS}\n`);
});
afterEach(async () => {
  await tmp.remove();
});

const IDENTIFYING = {
  tokens: 3,
  email: { tokens: 1, examples: ['ta…@mail.example'] },
  url: { tokens: 1, examples: ['ferries.example.org/help'] },
  mention: { tokens: 0, examples: [] },
  phone: { tokens: 1, examples: ['555-01…'] },
  ip: { tokens: 0, examples: [] },
};
const ROWS =
  'identifying      3 tokens may identify people: 1 e-mail address (ta…@mail.example), 1 URL (ferries.example.org/help), 1 phone-like number (555-01…)\n' +
  '                 anyone who loads the lexicon can read its tokens: --collapse email,url,number folds these into placeholders\n';

describe('what a lexicon gives away', () => {
  it('build and verify count the tokens that may identify people and say how to fold them', async () => {
    const built = await cli('build', tmp.path('support.csv'), '-o', tmp.path('lex.json'), '--label', 'topic');
    expect(built.code).toBe(0);
    expect(built.stdout).toContain(`labels           3: delays, praise, refunds\n${ROWS}corpus `);
    const verified = await cli('verify', tmp.path('lex.json'));
    expect(verified.stdout).toContain(`\n${ROWS}`);
    const json = JSON.parse((await cli('verify', tmp.path('lex.json'), '--json')).stdout);
    expect(json.identifyingTokens).toEqual(IDENTIFYING);
  });

  it('says there are none once they are collapsed', async () => {
    const built = await cli('build', tmp.path('support.csv'), '-o', tmp.path('lex.json'), '--collapse', 'email,url,number');
    expect(built.stdout).toContain('\nidentifying      no token looks like an e-mail address, URL, @mention, phone number or IP address\n');
    const json = JSON.parse((await cli('verify', tmp.path('lex.json'), '--json')).stdout);
    expect(json.identifyingTokens.tokens).toBe(0);
  });

  it('audit reports them in --json, the summary and the HTML report', async () => {
    await cli('build', tmp.path('support.csv'), '-o', tmp.path('lex.json'), '--label', 'topic');
    const json = JSON.parse((await cli('audit', tmp.path('support.csv'), '--lexicon', tmp.path('lex.json'), '--json')).stdout);
    expect(json.identifyingTokens).toEqual(IDENTIFYING);
    const summary = await cli('audit', tmp.path('support.csv'), '--lexicon', tmp.path('lex.json'), '--report', tmp.path('audit.html'));
    expect(summary.stdout).toContain(ROWS.replaceAll('identifying      ', 'identifying       ').replaceAll('                 any', '                  any'));
    expect(await readFile(tmp.path('audit.html'), 'utf8')).toContain('3 tokens may identify people: 1 e-mail address (ta…@mail.example)');
  });

  it('records the corpus by its name only, never the folder it is in', async () => {
    await cli('build', tmp.path('support.csv'), '-o', tmp.path('lex.json'));
    const lexicon = JSON.parse(await readFile(tmp.path('lex.json'), 'utf8'));
    expect(lexicon.fit.source).toBe('support.csv');
    expect(await readFile(tmp.path('lex.json'), 'utf8')).not.toContain(tmp.dir);
  });

  it('keeps no corpus document as a canary: only the fixed probe texts', async () => {
    await cli('build', tmp.path('support.csv'), '-o', tmp.path('lex.json'));
    const lexicon = JSON.parse(await readFile(tmp.path('lex.json'), 'utf8'));
    expect(lexicon.canaries.map((c: { text: string }) => c.text)).toEqual([...PROBE_TEXTS]);
    // Nor does a tally keep any, so a lexicon built from tallies has none either.
    await cli('tally', tmp.path('support.csv'), '-o', tmp.path('part.tally'));
    expect(JSON.parse(await readFile(tmp.path('part.tally'), 'utf8')).snippets).toEqual([]);
  });

  it('verify says when an older lexicon carries corpus documents as canaries', async () => {
    await cli('build', tmp.path('support.csv'), '-o', tmp.path('lex.json'));
    const lexicon = JSON.parse(await readFile(tmp.path('lex.json'), 'utf8'));
    lexicon.canaries.push({ text: 'ok', tokens: ['ok'] }, { text: 'thanks', tokens: ['thanks'] });
    await writeFile(tmp.path('old.json'), JSON.stringify(lexicon));
    const verified = await cli('verify', tmp.path('old.json'));
    expect(verified.stdout).toContain('\ncorpus text      2 canaries are documents of the corpus, shipped with the lexicon; build it again with lexlock build to leave them out\n');
  });

  it("the encode manifest names the corpus by its name and the lexicon relative to the manifest's folder", async () => {
    await cli('build', tmp.path('support.csv'), '-o', tmp.path('lex.json'), '--length', '8');
    const encoded = await cli('encode', tmp.path('support.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out/encoded'));
    expect(encoded.code).toBe(0);
    const manifest = JSON.parse(await readFile(tmp.path('out/encoded/manifest.json'), 'utf8'));
    expect([manifest.source, manifest.lexicon.file]).toEqual(['support.csv', '../../lex.json']);
    expect(basename(tmp.dir)).not.toBe('');
    expect(await readFile(tmp.path('out/encoded/manifest.json'), 'utf8')).not.toContain(tmp.dir);
  });
});
