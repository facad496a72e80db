import { inputError, type Where } from '../LexlockError.js';
import { firstInvalidUtf8 } from './firstInvalidUtf8.js';
import { checkJsonFileSize } from './jsonFileLimit.js';

/**
 * The WHATWG UTF-8 decoder that refuses ill-formed input instead of replacing it. `ignoreBOM` keeps a
 * leading U+FEFF, so bytes read exactly as the same text passed as a string does (parseLexicon drops
 * a leading one from either).
 */
const strict = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });
const LF = 0x0a;

/**
 * A lexicon file's bytes as text: UTF-8 only (RFC 8259 §8.1: JSON exchanged between systems is UTF-8).
 * Ill-formed bytes are a `BAD_UTF8` error naming the line and byte offset of the first one, never
 * replaced: a replaced character could change a member without anything noticing. More bytes than
 * a lexicon may have are `FILE_TOO_LARGE`, before any is decoded.
 * @example decodeLexiconBytes(await readFile('lexicon.json'), { file: 'lexicon.json' })
 */
export function decodeLexiconBytes(bytes: Uint8Array, where: Where): string {
  checkJsonFileSize('lexicon', bytes.length, where);
  try {
    return strict.decode(bytes);
  } catch (e) {
    const bad = firstInvalidUtf8(bytes);
    if (bad === -1) throw e; // well-formed: the decoder failed for another reason, which is not the bytes' fault
    let line = 1;
    for (let i = bytes.indexOf(LF); i !== -1 && i < bad; i = bytes.indexOf(LF, i + 1)) line += 1;
    throw inputError(
      'BAD_UTF8',
      { ...where, line, byteOffset: bad },
      `invalid UTF-8 at byte ${bad}; a lexicon file is UTF-8 JSON as lexlock build writes it: restore the file or rebuild it`,
    );
  }
}
