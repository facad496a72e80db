import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fetchLexicon } from '../../src/artifact/fetchLexicon.js';
import { serializeLexicon } from '../../src/artifact/serializeLexicon.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';

const lexicon = freeze(Tally.fromTexts(['the ferry is late', 'late again'], resolveRules()), { now: new Date(0) });
let server: Server;
let origin = '';

beforeAll(async () => {
  server = createServer((req, res) => {
    if (req.url === '/lexicon.json') {
      res.writeHead(200, { 'content-type': 'application/json' });
      res.end(serializeLexicon(lexicon));
    } else {
      res.writeHead(404, 'Not Found');
      res.end();
    }
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  origin = `http://127.0.0.1:${String((server.address() as AddressInfo).port)}`;
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise<void>((resolve) => server.close(() => resolve()));
});

// Common practice (HTTP): a 2xx response carries the file; anything else is an error to report.
describe('fetchLexicon', () => {
  it('fetches and checks a lexicon, honouring expectFingerprint', async () => {
    const got = await fetchLexicon(`${origin}/lexicon.json`, { expectFingerprint: lexicon.fingerprint });
    expect(got.fingerprint).toBe(lexicon.fingerprint);
    expect(Array.from(got.encode('late ferry'))).toEqual(Array.from(lexicon.encode('late ferry')));
  });

  it('is an IO error naming the URL on a 404', async () => {
    const url = `${origin}/missing.json`;
    await expect(fetchLexicon(url)).rejects.toMatchObject({ code: 'IO', message: `${url}: fetching the lexicon answered 404 Not Found; check the URL and that the server has the file` });
  });

  it('is an IO error naming the URL when nothing answers', async () => {
    const url = 'http://127.0.0.1:1/lexicon.json';
    await expect(fetchLexicon(url)).rejects.toMatchObject({ code: 'IO', message: `${url}: could not fetch the lexicon (fetch failed); check the URL and the network` });
  });

  it('is a FINGERPRINT_MISMATCH for another fingerprint, named by the URL', async () => {
    const url = `${origin}/lexicon.json`;
    const other = `sha256:${'1'.repeat(64)}`;
    await expect(fetchLexicon(url, { expectFingerprint: other })).rejects.toMatchObject({
      code: 'FINGERPRINT_MISMATCH',
      message: `${url} member fingerprint: lexicon fingerprint ${lexicon.fingerprint} is not the expected ${other}; load the lexicon the model was trained with`,
    });
  });
});
