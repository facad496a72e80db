/**
 * What the report page says about where its figures came from: the corpus, the lexicon file
 * (null when the lexicon was frozen for this audit), the settings used, when and by which lexlock.
 */
export interface ReportContext {
  corpus: string;
  lexiconFile: string | null;
  settings: Record<string, string>;
  generatedAt: string;
  lexlockVersion: string;
}
