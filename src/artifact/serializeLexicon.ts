import type { Lexicon } from '../lexicon/Lexicon.js';
import { FORMAT_VERSION, LEXICON_FORMAT, type LexiconFile } from './schema.js';

/** The lexicon file document for a lexicon (members in the order they are written). */
export function lexiconDocument(lexicon: Lexicon): LexiconFile {
  return {
    format: LEXICON_FORMAT,
    formatVersion: FORMAT_VERSION,
    fingerprint: lexicon.fingerprint,
    fit: lexicon.fit,
    canaries: [...lexicon.canaries],
    encoding: lexicon.encoding,
  };
}

/**
 * The lexicon file's text: JSON, two-space indented, one token a line so diffs stay readable.
 * Browser-safe; `parseLexicon(serializeLexicon(x))` encodes exactly as `x`.
 */
export function serializeLexicon(lexicon: Lexicon): string {
  return `${JSON.stringify(lexiconDocument(lexicon), null, 2)}\n`;
}
