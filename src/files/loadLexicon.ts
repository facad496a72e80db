import { readFile, stat } from 'node:fs/promises';
import { LexlockError } from '../LexlockError.js';
import { checkJsonFileSize } from '../artifact/jsonFileLimit.js';
import { parseLexicon, type ParseLexiconOptions } from '../artifact/parseLexicon.js';
import type { Lexicon } from '../lexicon/Lexicon.js';

/**
 * Reads and checks a lexicon file (schema, fingerprint, canaries; see parseLexicon). A file larger
 * than a lexicon may be (`JSON_FILE_MOST_BYTES`) is refused from its size, before it is read.
 * @example const lexicon = await loadLexicon('model/lexicon.json', { expectFingerprint: 'sha256:…' });
 */
export async function loadLexicon(path: string, options: Omit<ParseLexiconOptions, 'source'> = {}): Promise<Lexicon> {
  let bytes: Uint8Array;
  try {
    // A pipe or a /proc file reports no size; decodeLexiconBytes counts the bytes read from it.
    checkJsonFileSize('lexicon', (await stat(path)).size, { file: path });
    // Bytes, not text: parseLexicon refuses invalid UTF-8 (naming the byte) instead of replacing it.
    bytes = await readFile(path);
  } catch (e) {
    if (e instanceof LexlockError) throw e;
    const err = e as NodeJS.ErrnoException;
    const what = err.code === 'ENOENT' ? 'no such file' : err.code === 'EISDIR' ? 'is a folder, not a lexicon file' : err.message;
    throw new LexlockError('IO', `${path}: cannot read the lexicon (${what}); pass the path of a file written by lexlock build`, { file: path });
  }
  return parseLexicon(bytes, { ...options, source: path });
}
