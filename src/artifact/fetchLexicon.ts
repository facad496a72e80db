import { inputError, type Where } from '../LexlockError.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { JSON_FILE_MOST_BYTES, checkJsonFileSize, jsonFileTooLarge } from './jsonFileLimit.js';
import { parseLexicon, type ParseLexiconOptions } from './parseLexicon.js';

/**
 * The response's body as bytes, refused (`FILE_TOO_LARGE`) once past what a lexicon may have: from
 * its Content-Length before reading, or while reading a body of undeclared (or compressed) length.
 */
async function bodyWithin(response: Response, where: Where): Promise<Uint8Array> {
  const declared = response.headers.get('content-length');
  if (declared !== null && /^\d+$/.test(declared.trim())) {
    try {
      checkJsonFileSize('lexicon', Number(declared), where);
    } catch (e) {
      await response.body?.cancel().catch(() => {});
      throw e;
    }
  }
  // The bytes, not response.text(): that would replace ill-formed UTF-8 instead of refusing it.
  if (response.body === null) return new Uint8Array(await response.arrayBuffer());
  const reader = response.body.getReader();
  const pieces: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.length;
    if (total > JSON_FILE_MOST_BYTES) {
      await reader.cancel().catch(() => {});
      throw jsonFileTooLarge('lexicon', null, where);
    }
    pieces.push(value);
  }
  if (pieces.length === 1) return pieces[0] as Uint8Array;
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const piece of pieces) {
    bytes.set(piece, at);
    at += piece.length;
  }
  return bytes;
}

/**
 * Fetches a lexicon file over HTTP (the global `fetch` of browsers and Node) and reads it as
 * {@link parseLexicon} does: UTF-8, schema, fingerprint, canaries, and `expectFingerprint` when given. A
 * response other than 2xx is an `IO` error naming the URL and the status; a body larger than a lexicon
 * may be (`JSON_FILE_MOST_BYTES`) is `FILE_TOO_LARGE`, refused from its Content-Length when it has one.
 * @example const lexicon = await fetchLexicon('/models/reviews/lexicon.json', { expectFingerprint: model.fingerprint });
 */
export async function fetchLexicon(url: string | URL, options: ParseLexiconOptions = {}, init?: RequestInit): Promise<Lexicon> {
  const source = options.source ?? String(url);
  let response: Response;
  try {
    response = await fetch(url, init);
  } catch (e) {
    throw inputError('IO', { file: source }, `could not fetch the lexicon (${e instanceof Error ? e.message : String(e)}); check the URL and the network`);
  }
  if (!response.ok) {
    throw inputError('IO', { file: source }, `fetching the lexicon answered ${`${response.status} ${response.statusText}`.trim()}; check the URL and that the server has the file`);
  }
  return parseLexicon(await bodyWithin(response, { file: source }), { ...options, source });
}
