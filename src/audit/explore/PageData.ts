import type { ShapeEnd } from '../../lexicon/Shape.js';
import type { OovBand } from './oovBands.js';
import type { StopGrid } from './StopGrid.js';

/** One series of the page's figures (the whole corpus, or one label), summed between stops. */
export interface PageSeries {
  /** The label; null for the whole corpus. */
  name: string | null;
  documents: number;
  tokens: number;
  /** Token occurrences whose token is kept from the cap stop of this index on (index 0: always kept). */
  kept: number[];
  /** Documents, and their tokens, whose length is at most the length stop of this index and above the one before. */
  documentsUpTo: number[];
  tokensUpTo: number[];
}

/**
 * Everything the report page's script reads (embedded as JSON): the grids its controls stop at, the
 * figures between stops, and what the build command line needs. Made by {@link pageDataOf}.
 */
export interface PageData {
  /** `corpus`: the audit froze its own lexicon (ranks are this corpus's); `lexicon`: a lexicon file's own order. */
  ranking: 'corpus' | 'lexicon';
  cap: { chosen: number; grid: StopGrid };
  length: { chosen: number | null; grid: StopGrid };
  pad: ShapeEnd;
  cut: ShapeEnd;
  overall: PageSeries;
  /** The labels the controls update (at most LIVE_LABELS, those with the most documents), in string order. */
  labels: PageSeries[];
  /** Labels left out of the live figures (their table rows show the audited figures only). */
  labelsLeftOut: number;
  /**
   * The matching `lexlock build` line's words (each quoted for a POSIX shell where it needs it): `head`
   * before `--cap X --length Y --pad P --cut C` (the corpus and `-o`), `tail` after (text rules, fields).
   */
  build: { head: string[]; tail: string[] };
  /** OOV tokens by count band, when the most frequent OOV tokens all share one count; else null. */
  oovBands: OovBand[] | null;
}
