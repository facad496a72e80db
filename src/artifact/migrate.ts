import { inputError, type Where } from '../LexlockError.js';
import { VERSION } from '../version.js';
import { previewValue } from './previewValue.js';
import { FORMAT_VERSION, LEXICON_FORMAT } from './schema.js';

/**
 * Checks a parsed lexicon document is a lexicon of the current format version: refuses newer versions
 * (saying which lexlock is needed) and older ones (saying which lexlock wrote them). No release carried
 * version 1, so it is not migrated: the message says how to rebuild it.
 */
export function migrate(raw: unknown, where: Where): Record<string, unknown> {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw) || (raw as { format?: unknown }).format !== LEXICON_FORMAT) {
    throw inputError('NOT_A_LEXICON', where, `not a lexlock lexicon (no "format": "${LEXICON_FORMAT}" member); pass a file written by lexlock build`);
  }
  const doc = raw as Record<string, unknown>;
  const version = doc.formatVersion;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) {
    const what = version === undefined ? 'formatVersion is missing' : `formatVersion is ${previewValue(version)}, not a format version`;
    throw inputError('BAD_LEXICON', { ...where, field: 'formatVersion' }, `${what} (a whole number from 1); rebuild it with lexlock build`);
  }
  if (version < FORMAT_VERSION) {
    const fit = doc.fit;
    const wrote = typeof fit === 'object' && fit !== null ? (fit as { lexlockVersion?: unknown }).lexlockVersion : undefined;
    const by = typeof wrote === 'string' && /^[0-9A-Za-z.+-]{1,40}$/.test(wrote) ? `lexlock ${wrote}` : 'lexlock 0.1';
    throw inputError(
      'OLD_FORMAT',
      { ...where, field: 'formatVersion' },
      `lexicon format version ${version} was written by ${by}; this lexlock (${VERSION}) reads version ${FORMAT_VERSION} only ` +
        `(the shape's ends are now start and end, and the character level keeps spaces); rebuild it with this lexlock's build ` +
        `from the same corpus and flags, giving --pad and --cut as start or end (at --level char, --spaces drop gives the old character tokens)`,
    );
  }
  if (version > FORMAT_VERSION) {
    throw inputError(
      'NEWER_FORMAT',
      { ...where, field: 'formatVersion' },
      `lexicon format version ${version} needs a newer lexlock; this one (${VERSION}) reads versions up to ${FORMAT_VERSION}; upgrade lexlock`,
    );
  }
  return doc;
}
