import { LexlockError } from '../LexlockError.js';
import type { CorpusKind } from '../corpus/corpusKind.js';
import { describeShape, type Shape } from '../lexicon/Shape.js';
import { outputNameProblem, type EncodedPart, type EncodedSource } from '../output/EncodedOutput.js';
import type { EncodeStats } from '../pipeline/EncodeStats.js';
import type { SplitPlan } from '../split/Split.js';
import { count, percent } from './format.js';

/** Refuses (usage error) an output name that cannot be an encoded output (see outputNameProblem); `flag` named it. */
export function assertOutputName(output: string, flag: string): void {
  const problem = outputNameProblem(output);
  if (problem !== null) throw new LexlockError('USAGE_BAD_VALUE', `${flag}: ${problem}`, { field: flag });
}

/** How the rows of a corpus of this kind are keyed without --key, for the summary. */
const NUMBERED: Record<CorpusKind, string> = {
  csv: 'data-row numbers (the header is row 0)',
  tsv: 'data-row numbers (the header is row 0)',
  jsonl: 'data-row numbers (blank lines are no rows)',
  txt: 'line numbers',
  folder: 'paths below the folder',
};

/** Labels named in a summary line at most; --json gives them all. */
const LABELS_SHOWN = 12;

/** `delays 1,002, praise 803, …`: rows per label, in label id order. */
function labelCounts(labels: readonly string[], rows: readonly number[]): string {
  const shown = labels.slice(0, LABELS_SHOWN).map((l, i) => `${l} ${count(rows[i] ?? 0)}`);
  if (labels.length > LABELS_SHOWN) shown.push(`and ${count(labels.length - LABELS_SHOWN)} more (see --json)`);
  return shown.join(', ');
}

/** The summary lines of an encode run, as `lexlock encode` and `build --encode` print them. */
export function encodedSummary(
  stats: EncodeStats,
  parts: readonly EncodedPart[],
  shape: Shape | null,
  source: EncodedSource,
  kind: CorpusKind,
  split: SplitPlan | null,
): Array<[string, string]> {
  const { lexicon, lexiconPath, readStats } = source;
  const rows: Array<[string, string]> = [
    ['lexicon', `${lexiconPath ?? '(no file)'} (${lexicon.fingerprint})`],
    ['rows', `${count(stats.documents)}${shape === null ? ', variable length' : ` x ${shape.length} (${describeShape(shape)})`}`],
    ['keys', source.keyField === null ? NUMBERED[kind] : `field ${JSON.stringify(source.keyField)}`],
    ['OOV', `${percent(stats.tokens === 0 ? 0 : stats.oovTokens / stats.tokens)} of ${count(stats.tokens)} tokens`],
  ];
  if (shape !== null) {
    rows.push(['cut', `${count(stats.truncatedDocuments)} documents (${percent(stats.documents === 0 ? 0 : stats.truncatedDocuments / stats.documents)}), ${count(stats.droppedTokens)} tokens dropped`]);
  }
  const perLabel = stats.labelled > 0 && lexicon.labels.length > 0;
  if (stats.labelled > 0) {
    const each = perLabel ? `; rows per label: ${labelCounts(lexicon.labels, stats.labelRows)}` : '';
    rows.push(['labels', `${count(stats.labelled)} labelled documents, ${count(stats.unknownLabels)} with a label the lexicon lacks (id -1)${each}`]);
  }
  if (split !== null) {
    const shares = parts.map((p) => `${p.name ?? ''} ${count(p.stats.documents)} (${percent(stats.documents === 0 ? 0 : p.stats.documents / stats.documents)})`);
    rows.push(['split', `seed ${split.seed}: ${shares.join(', ')}`]);
    // One line a split, under the first: its rows per label.
    if (perLabel) for (const p of parts) rows.push(['', `${p.name ?? ''}: ${labelCounts(lexicon.labels, p.stats.labelRows)}`]);
  }
  if (readStats.replaced > 0) rows.push(['replaced', `${count(readStats.replaced)} documents had invalid UTF-8 replaced`]);
  if (readStats.skipped > 0) rows.push(['skipped', `${count(readStats.skipped)} documents with invalid UTF-8 left out`]);
  return rows;
}

/** The same as one JSON object, for `lexlock encode --json`. */
export function encodedJson(stats: EncodeStats, parts: readonly EncodedPart[], shape: Shape | null, source: EncodedSource, split: SplitPlan | null): object {
  const { lexicon, lexiconPath, readStats } = source;
  const labelled = stats.labelled > 0 && lexicon.labels.length > 0;
  return {
    outputs: parts.map((p) => p.output),
    lexicon: { file: lexiconPath, fingerprint: lexicon.fingerprint },
    corpus: source.corpus,
    keyField: source.keyField,
    badText: source.badText,
    rows: stats.documents,
    shape,
    labels: labelled ? lexicon.labels : null,
    labelRows: labelled ? stats.labelRows : null,
    labelled: stats.labelled,
    unknownLabels: stats.unknownLabels,
    tokens: stats.tokens,
    oovTokens: stats.oovTokens,
    truncatedDocuments: stats.truncatedDocuments,
    droppedTokens: stats.droppedTokens,
    replacedDocuments: readStats.replaced,
    skippedDocuments: readStats.skipped,
    split:
      split === null
        ? null
        : {
            seed: split.seed,
            hash: 'sha256',
            parts: parts.map((p, i) => ({
              name: p.name,
              share: split.splits[i]?.share ?? null,
              output: p.output,
              rows: p.stats.documents,
              labelRows: labelled ? p.stats.labelRows : null,
              unknownLabels: p.stats.unknownLabels,
              tokens: p.stats.tokens,
              oovTokens: p.stats.oovTokens,
              truncatedDocuments: p.stats.truncatedDocuments,
              droppedTokens: p.stats.droppedTokens,
            })),
          },
  };
}
