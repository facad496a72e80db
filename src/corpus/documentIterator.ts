import { inputError } from '../LexlockError.js';
import type { CorpusDocument } from './CorpusDocument.js';
import { KeyCheck } from './KeyCheck.js';
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
