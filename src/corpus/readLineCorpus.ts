import type { Where } from '../LexlockError.js';
import type { CorpusDocument } from './CorpusDocument.js';
import type { ReadContext } from './ReadContext.js';
import { decodeText } from './decodeText.js';
import { fileChunks } from './fileChunks.js';
import { readLines, stripCr } from './lines.js';

/** What makes a one-document-a-line corpus of a kind: which lines to pass over, and how a line becomes a document. */
export interface LineCorpus {
  /** True for a line (without its CR) that is no document. */
  blank(bytes: Buffer): boolean;
  /**
   * The document of a decoded line that starts at `where`; `row` is the line's number among the lines
   * that are not blank (those left out for bad text count). Throws a LexlockError for a line that is wrong.
   */
  document(text: string, where: Where & { line: number }, row: number): CorpusDocument;
  /** What the `EMPTY_CORPUS` message advises. */
  advice: string;
  /** Why it is empty when the file has bytes but no document. */
  reason: string;
}

/**
 * Reads a corpus of one document a line (`.txt`, `.jsonl`): drops each line's CR, passes over blank
 * lines, decodes under the bad-text policy and yields one batch per group of lines (about 64 KiB).
 * When a line is wrong (or longer than `context.maxRecordBytes`), the documents before it come first.
 */
export async function* readLineCorpus(context: ReadContext, kind: LineCorpus): AsyncGenerator<CorpusDocument[], void, undefined> {
  const { file } = context;
  context.empty = { reason: kind.reason, advice: kind.advice };
  const limit = { maxBytes: context.maxRecordBytes, file };
  let rows = 0;
  for await (const lines of readLines(fileChunks(file, context.chunkSize, context.stats), limit)) {
    const batch: CorpusDocument[] = [];
    try {
      for (const line of lines) {
        const bytes = stripCr(line.bytes);
        if (kind.blank(bytes)) continue;
        rows += 1;
        const text = decodeText(bytes, line, context);
        if (text !== null) batch.push(kind.document(text, { file, line: line.line, byteOffset: line.byteOffset }, rows));
      }
    } catch (e) {
      if (batch.length > 0) yield batch;
      throw e;
    }
    if (batch.length > 0) yield batch;
  }
  if (context.stats.bytes === 0) context.empty = { reason: 'the file is empty', advice: kind.advice };
}
