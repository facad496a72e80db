import { inputError, type Where } from '../LexlockError.js';
import { VERSION } from '../version.js';
import { previewValue } from './previewValue.js';
import { FORMAT_VERSION, LEXICON_FORMAT } from './schema.js';

/**
 * Brings a parsed lexicon document to the current format version: checks it is a lexicon at all,
 * refuses newer versions (saying which lexlock is needed) and migrates older ones. Version 1 is the
 * first, so nothing older exists yet; a migration step goes here when version 2 does.
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
  if (version > FORMAT_VERSION) {
    throw inputError(
      'NEWER_FORMAT',
      { ...where, field: 'formatVersion' },
      `lexicon format version ${version} needs a newer lexlock; this one (${VERSION}) reads versions up to ${FORMAT_VERSION}; upgrade lexlock`,
    );
  }
  return doc;
}
