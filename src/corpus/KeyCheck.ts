import { formatWhere, inputError } from '../LexlockError.js';
import { detached } from '../rules/detached.js';
import { MAP_ENTRIES_MOST, TokenMap } from '../tally/TokenMap.js';
import type { CorpusDocument } from './CorpusDocument.js';

/**
 * The keys of a corpus read with a key field, each with the line of the document that had it first.
 * Memory grows with the documents read (the one thing a corpus reader keeps per document): measured
 * in Node 20 for a million keys, 53 bytes a key of 8 characters, 61 of 12, 85 of 36 (README, Resource
 * limits and odd input).
 */
export class KeyCheck {
  private readonly field: string;
  /** Several Maps one after another past 16 million keys (a Map holds at most 2^24 entries). */
  private readonly firstLine: TokenMap<number>;

  /** @param perMap keys a Map takes before the next one starts (tests set it low). */
  constructor(field: string, perMap = MAP_ENTRIES_MOST) {
    this.field = field;
    this.firstLine = new TokenMap<number>(perMap);
  }

  /** Refuses an empty key, or one an earlier document had (naming both places). */
  check(document: CorpusDocument): void {
    const { key, where } = document;
    const at = { ...where, field: this.field };
    if (key === '') {
      throw inputError('BAD_FIELD_TYPE', at, `field ${JSON.stringify(this.field)} is empty; every document needs a key of its own: fill it in, or leave out --key to number the rows`);
    }
    const first = this.firstLine.get(key);
    if (first !== undefined) {
      const firstPlace = formatWhere(where.file === undefined ? { line: first } : { file: where.file, line: first });
      throw inputError(
        'DUPLICATE_KEY',
        at,
        `key ${JSON.stringify(key)} (field ${JSON.stringify(this.field)}) is also the key of ${firstPlace}; keys must be unique, so that every row traces back to one document: fix one of the two, or leave out --key to number the rows`,
      );
    }
    // A key may be a view of its whole record (a CSV field, V8 slices from 13 characters): keep a copy.
    this.firstLine.add(detached(key), where.line ?? 0);
  }
}
