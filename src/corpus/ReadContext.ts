import type { BadTextPolicy } from './decodeText.js';
import type { CorpusStats } from './CorpusStats.js';

/** What every kind of corpus reader is given: the path, the options resolved, and the counters to keep. */
export interface ReadContext {
  /** The corpus path as the user gave it. */
  readonly file: string;
  /** Text field (csv/tsv/jsonl). */
  readonly text: string;
  /** Label field (csv/tsv/jsonl); undefined for no labels. */
  readonly label: string | undefined;
  /** Key field (csv/tsv/jsonl); undefined for keys numbered by the reader (see CorpusDocument.key). */
  readonly key: string | undefined;
  readonly badText: BadTextPolicy;
  /** Bytes per read. */
  readonly chunkSize: number;
  /** Most bytes of one record: a line (.txt/.jsonl), a record (.csv/.tsv), a file (folder). */
  readonly maxRecordBytes: number;
  /** Counters, updated as the reader goes. */
  readonly stats: CorpusStats;
  /**
   * Why the corpus gave no documents and what to do, for the `EMPTY_CORPUS` message; readers set it
   * as they learn (e.g. `only a header row`).
   */
  empty: { reason: string; advice: string };
}
