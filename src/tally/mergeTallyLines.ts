import { LexlockError } from '../LexlockError.js';
import type { TallyFile } from './tallyFile.js';
import { tallyFileMerge } from './tallyFileMerge.js';
import { tallyCountLine } from './tallyFileText.js';
import { TallyPartReader, type TallyLines } from './TallyPartReader.js';

/** What a streaming merge gives besides its count lines: the merged members before `counts`, and how many tokens it wrote. */
export interface MergedTallyHeader {
  /** The merged tally file without its tokens: documents, tokens, lengths, labels, snippets, fields. */
  file: TallyFile;
  /** Distinct tokens: the count lines written. */
  types: number;
}

/** Characters of count lines gathered before each call of `write`. */
const CHUNK_CHARS = 1 << 16;

/**
 * Merges tally files read as lines (see {@link TallyPartReader}) without holding any of them: reads
 * and checks each part's members before `counts` (refusing parts counted under other rules, as
 * tallyFileMerge does), then merges the parts' entries, which are in JavaScript string order, in one
 * pass: a heap of the parts keyed by their current token, so each part holds one entry at a time.
 * Equal tokens' occurrences and documents are added. `write` gets the merged `counts` lines (from
 * `    [...],\n` to the last, without a comma) in chunks, exactly as tallyFileLines writes them for the
 * in-memory merge; the members before `counts` come back at the end, with the number of tokens,
 * since the file names that number before its counts. Browser-safe.
 * @example const { file, types } = await mergeTallyLines([{ name: 'a.tally', lines }, ...], (text) => spill.write(text));
 */
export async function mergeTallyLines(sources: readonly TallyLines[], write: (text: string) => void | Promise<void>): Promise<MergedTallyHeader> {
  if (sources.length === 0) throw new LexlockError('BAD_OPTION', 'no tally files to merge; pass at least one', {});
  const parts: TallyPartReader[] = [];
  try {
    for (const source of sources) parts.push(await TallyPartReader.open(source));
    return await mergeParts(parts, write);
  } finally {
    // After a failure the other parts' files are still open: close them (a no-op for finished ones).
    await Promise.all(parts.map((p) => p.close()));
  }
}

async function mergeParts(parts: readonly TallyPartReader[], write: (text: string) => void | Promise<void>): Promise<MergedTallyHeader> {
  const merged = tallyFileMerge(parts.map((p) => ({ name: p.name, file: p.header.file })));

  const heap: TallyPartReader[] = [];
  for (const part of parts) {
    if (await part.next()) {
      heap.push(part);
      siftUp(heap, heap.length - 1);
    }
  }
  let types = 0;
  let pending = '';
  let line: string | null = null;
  while (heap.length > 0) {
    const token = (heap[0] as TallyPartReader).token;
    let occurrences = 0;
    let documents = 0;
    while (heap.length > 0 && (heap[0] as TallyPartReader).token === token) {
      const top = heap[0] as TallyPartReader;
      occurrences += top.occurrences;
      documents += top.documents;
      if (!(await top.next())) {
        const last = heap.pop() as TallyPartReader;
        if (heap.length === 0) break;
        heap[0] = last;
      }
      siftDown(heap, 0);
    }
    if (line !== null) {
      pending += `${line},\n`;
      if (pending.length >= CHUNK_CHARS) {
        await write(pending);
        pending = '';
      }
    }
    line = tallyCountLine(token, occurrences, documents);
    types += 1;
  }
  if (line !== null) pending += `${line}\n`;
  if (pending !== '') await write(pending);
  return { file: merged, types };
}

function siftUp(heap: TallyPartReader[], i: number): void {
  const item = heap[i] as TallyPartReader;
  while (i > 0) {
    const parent = (i - 1) >> 1;
    const p = heap[parent] as TallyPartReader;
    if (!(item.token < p.token)) break;
    heap[i] = p;
    i = parent;
  }
  heap[i] = item;
}

function siftDown(heap: TallyPartReader[], i: number): void {
  const n = heap.length;
  const item = heap[i] as TallyPartReader;
  for (;;) {
    let child = 2 * i + 1;
    if (child >= n) break;
    const right = child + 1;
    if (right < n && (heap[right] as TallyPartReader).token < (heap[child] as TallyPartReader).token) child = right;
    const c = heap[child] as TallyPartReader;
    if (!(c.token < item.token)) break;
    heap[i] = c;
    i = child;
  }
  heap[i] = item;
}
