import { formatWhere, inputError } from '../LexlockError.js';
import { detached } from '../rules/detached.js';
import type { CorpusDocument } from './CorpusDocument.js';
import type { ReadContext } from './ReadContext.js';

/** How often progress is reported: every this many bytes read or documents handed out. */
const PROGRESS_BYTES = 1 << 20;
const PROGRESS_DOCUMENTS = 1000;

/** A progress callback as `CorpusOptions.onProgress` takes it. */
export type ProgressCallback = (p: { bytes: number; documents: number }) => void;

/**
 * Hands out the documents of a reader's batches one at a time: counts `stats.documents`, reports
 * progress now and then, and once the batches run out with no document handed out throws
 * `EMPTY_CORPUS` with the reader's reason, e.g. `reviews.csv: no documents (only a header row); ...`.
 * With a key field (`context.key`), it is the one place keys are checked: an empty key or one seen
 * before is refused (`BAD_FIELD_TYPE`, `DUPLICATE_KEY` naming both lines), so it keeps every key read
 * so far with the line of its document (see {@link KeyCheck}). Keys the readers number cannot collide
 * and are not kept. Cheaper per document than a generator over generators; `return()` closes the file early.
 */
export function documentIterator(
  batches: AsyncGenerator<CorpusDocument[], void, undefined>,
  context: ReadContext,
  onProgress: ProgressCallback | undefined,
): AsyncIterator<CorpusDocument> {
  const { stats } = context;
  const keys = context.key === undefined ? null : new KeyCheck(context.key);
  let batch: CorpusDocument[] = [];
  let next = 0;
  let finished = false;
  let reportAtBytes = PROGRESS_BYTES;
  let reportAtDocuments = PROGRESS_DOCUMENTS;
  const report = () => {
    reportAtBytes = stats.bytes + PROGRESS_BYTES;
    reportAtDocuments = stats.documents + PROGRESS_DOCUMENTS;
    onProgress?.({ bytes: stats.bytes, documents: stats.documents });
  };
  return {
    async next(): Promise<IteratorResult<CorpusDocument>> {
      while (next >= batch.length) {
        if (finished) return { done: true, value: undefined };
        let result: IteratorResult<CorpusDocument[], void>;
        try {
          result = await batches.next();
        } catch (e) {
          finished = true; // a reader that failed gives nothing more
          throw e;
        }
        if (result.done === true) {
          finished = true;
          batch = [];
          report();
          if (stats.documents === 0) throw emptyCorpusError(context);
          return { done: true, value: undefined };
        }
        batch = result.value;
        next = 0;
      }
      const document = batch[next]!;
      next += 1;
      if (keys !== null) {
        try {
          keys.check(document);
        } catch (e) {
          finished = true;
          batch = [];
          await batches.return(undefined);
          throw e;
        }
      }
      stats.documents += 1;
      if (onProgress !== undefined && (stats.documents >= reportAtDocuments || stats.bytes >= reportAtBytes)) report();
      return { done: false, value: document };
    },
    async return(): Promise<IteratorResult<CorpusDocument>> {
      finished = true;
      batch = [];
      await batches.return(undefined);
      return { done: true, value: undefined };
    },
  };
}

function emptyCorpusError(context: ReadContext) {
  const { stats, file } = context;
  if (stats.skipped > 0) {
    const all = stats.skipped === 1 ? 'its only document was' : `all ${stats.skipped} were`;
    return inputError(
      'EMPTY_CORPUS',
      { file },
      `no documents (${all} left out for invalid UTF-8); fix the file's encoding or pass --bad-text replace`,
    );
  }
  return inputError('EMPTY_CORPUS', { file }, `no documents (${context.empty.reason}); ${context.empty.advice}`);
}

/**
 * The keys of a corpus read with a key field, each with the line of the document that had it first.
 * Memory grows with the documents read (the one thing a corpus reader keeps per document): measured
 * in Node 20 for a million keys, 53 bytes a key of 8 characters, 61 of 12, 85 of 36 (README, Resource
 * limits and odd input).
 */
class KeyCheck {
  private readonly field: string;
  private readonly firstLine = new Map<string, number>();

  constructor(field: string) {
    this.field = field;
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
    this.firstLine.set(detached(key), where.line ?? 0);
  }
}
