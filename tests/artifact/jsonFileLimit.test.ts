import { constants } from 'node:buffer';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { fetchLexicon } from '../../src/artifact/fetchLexicon.js';
import { JSON_FILE_MOST_BYTES, checkJsonFileSize } from '../../src/artifact/jsonFileLimit.js';
import { parseLexicon } from '../../src/artifact/parseLexicon.js';
import { caughtError } from '../helpers/caughtError.js';

const LIMIT = '536,870,888';
/** The message for a lexicon file of `has` bytes, or of an unknown size past the limit (null). */
const tooLarge = (file: string, has: string | null) =>
  `${file}: this file has ${has === null ? '' : `${has} bytes, `}more than the ${LIMIT} bytes a lexicon file may have (the longest string V8 makes); ` +
  'check that it is a lexicon file written by lexlock build';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('the size limit of lexicon and tally files', () => {
  // Node's own constant (buffer.constants.MAX_STRING_LENGTH, 2^29 - 24 UTF-16 units in V8 on 64-bit
  // systems): a UTF-8 file of N bytes decodes to at most N units, so no larger limit could be read.
  it('is the longest string V8 makes', () => {
    expect(JSON_FILE_MOST_BYTES).toBe(constants.MAX_STRING_LENGTH);
    expect(JSON_FILE_MOST_BYTES).toBe(2 ** 29 - 24);
  });

  it.each<[string, 'lexicon' | 'tally', number, string | null]>([
    ['a lexicon of exactly the limit', 'lexicon', JSON_FILE_MOST_BYTES, null],
    ['a lexicon one byte over', 'lexicon', JSON_FILE_MOST_BYTES + 1, tooLarge('lex.json', '536,870,889')],
    ['a lexicon of 1 GiB', 'lexicon', 2 ** 30, tooLarge('lex.json', '1,073,741,824')],
    ['a tally of exactly the limit', 'tally', JSON_FILE_MOST_BYTES, null],
    [
      'a tally one byte over',
      'tally',
      JSON_FILE_MOST_BYTES + 1,
      `lex.json: this file has 536,870,889 bytes, more than the ${LIMIT} bytes a tally file may have (the longest string V8 makes); ` +
        'build from the corpus itself (with --memory-limit if memory is short), or count the parts with --collapse number,url so they hold fewer distinct tokens',
    ],
  ])('%s', async (_what, kind, size, message) => {
    if (message === null) {
      expect(() => checkJsonFileSize(kind, size, { file: 'lex.json' })).not.toThrow();
      return;
    }
    const error = await caughtError(async () => checkJsonFileSize(kind, size, { file: 'lex.json' }));
    expect([error.code, error.message, error.where]).toEqual(['FILE_TOO_LARGE', message, { file: 'lex.json' }]);
  });

  it('parseLexicon refuses bytes over the limit as too large, not as invalid UTF-8 at byte 0', async () => {
    // Zero bytes are valid UTF-8 (NUL): only their number is wrong. The pages are never touched.
    const bytes = new Uint8Array(JSON_FILE_MOST_BYTES + 1);
    const error = await caughtError(async () => parseLexicon(bytes, { source: 'lex.json' }));
    expect([error.code, error.message]).toEqual(['FILE_TOO_LARGE', tooLarge('lex.json', '536,870,889')]);
  });

  it('fetchLexicon refuses a response whose Content-Length is over the limit without reading its body', async () => {
    let pulled = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulled += 1;
        controller.enqueue(new Uint8Array(16));
      },
    });
    vi.stubGlobal('fetch', async () => new Response(body, { headers: { 'content-length': String(2 ** 30) } }));
    const error = await caughtError(() => fetchLexicon('https://models.example/ferry/lexicon.json'));
    expect([error.code, error.message]).toEqual(['FILE_TOO_LARGE', tooLarge('https://models.example/ferry/lexicon.json', '1,073,741,824')]);
    expect(pulled).toBeLessThanOrEqual(1); // a stream may pull once to fill its queue
  });

  it('fetchLexicon stops reading a body without Content-Length once it runs past the limit', async () => {
    const chunk = new Uint8Array(64 * 2 ** 20); // one buffer handed out again and again: no memory grows
    let handed = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        handed += chunk.length;
        controller.enqueue(chunk);
      },
    });
    vi.stubGlobal('fetch', async () => new Response(body));
    const error = await caughtError(() => fetchLexicon('https://models.example/ferry/lexicon.json'));
    expect([error.code, error.message]).toEqual(['FILE_TOO_LARGE', tooLarge('https://models.example/ferry/lexicon.json', null)]);
    expect(handed).toBeLessThan(JSON_FILE_MOST_BYTES + 3 * chunk.length);
  });
});
