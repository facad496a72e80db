/** Running counts of a corpus read: documents handed out, documents replaced or skipped for invalid UTF-8, bytes read. */
export interface CorpusStats {
  documents: number;
  replaced: number;
  skipped: number;
  bytes: number;
}
