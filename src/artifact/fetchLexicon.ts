import { inputError } from '../LexlockError.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { parseLexicon, type ParseLexiconOptions } from './parseLexicon.js';

/**
 * Fetches a lexicon file over HTTP (the global `fetch` of browsers and Node) and reads it as
 * {@link parseLexicon} does: UTF-8, schema, fingerprint, canaries, and `expectFingerprint` when given. A
 * response other than 2xx is an `IO` error naming the URL and the status.
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
  // The bytes, not response.text(): that would replace ill-formed UTF-8 instead of refusing it.
  return parseLexicon(new Uint8Array(await response.arrayBuffer()), { ...options, source });
}
