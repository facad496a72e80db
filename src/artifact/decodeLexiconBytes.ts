import { inputError, type Where } from '../LexlockError.js';
import { firstInvalidUtf8 } from './firstInvalidUtf8.js';

/**
 * The WHATWG UTF-8 decoder that refuses ill-formed input instead of replacing it. `ignoreBOM` keeps a
 * leading U+FEFF, so bytes read exactly as the same text passed as a string does.
 */
const strict = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });
const LF = 0x0a;

/**
 * A lexicon file's bytes as text: UTF-8 only (RFC 8259 §8.1: JSON exchanged between systems is UTF-8).
 * Ill-formed bytes are a `BAD_UTF8` error naming the line and byte offset of the first one, never
 * replaced: a replaced character could change a member without anything noticing.
 * @example decodeLexiconBytes(await readFile('lexicon.json'), { file: 'lexicon.json' })
 */
export function decodeLexiconBytes(bytes: Uint8Array, where: Where): string {
  try {
    return strict.decode(bytes);
  } catch {
    const bad = Math.max(firstInvalidUtf8(bytes), 0);
    let line = 1;
    for (let i = bytes.indexOf(LF); i !== -1 && i < bad; i = bytes.indexOf(LF, i + 1)) line += 1;
    throw inputError(
      'BAD_UTF8',
      { ...where, line, byteOffset: bad },
      `invalid UTF-8 at byte ${bad}; a lexicon file is UTF-8 JSON as lexlock build writes it: restore the file or rebuild it`,
    );
  }
}
