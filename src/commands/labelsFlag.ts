import { inputError, LexlockError } from '../LexlockError.js';
import type { CorpusDocument } from '../corpus/CorpusDocument.js';
import { hasFields, type CorpusKind } from '../corpus/corpusKind.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import type { ParsedArgs } from './parseArgs.js';
import { valueOf } from './parseArgs.js';

/** `--no-labels`: read the corpus without labels on purpose (encode, audit). */
export const NO_LABELS_FLAG = { 'no-labels': { kind: 'switch' } } as const;

/** Labels named in the message at most. */
const NAMED = 5;

/** What a command does without labels, for the advice: `write rows without labels`, `audit without labels`. */
export type WithoutLabels = 'write rows without labels' | 'audit without labels';

/** True with --no-labels; refuses it beside --label (usage error). */
export function noLabelsFlag(args: ParsedArgs): boolean {
  const no = args.switches.has('no-labels');
  if (no && valueOf(args, 'label') !== undefined) {
    throw new LexlockError('USAGE_BAD_VALUE', '--no-labels and --label exclude each other: --label names the labels to keep, --no-labels leaves them out', { field: '--no-labels' });
  }
  return no;
}

function labelsOf(lexicon: Lexicon): string {
  const named = lexicon.labels.slice(0, NAMED).join(', ');
  return lexicon.labels.length > NAMED ? `${named} and ${lexicon.labels.length - NAMED} more` : named;
}

/**
 * Labels are never dropped silently (issue 14): refuses (`MISSING_LABELS`, exit 1) to read a corpus
 * without labels for a lexicon that has them, unless --no-labels said so. Called before reading: a
 * .csv/.tsv/.jsonl corpus read without a label field, or a .txt corpus. A folder's labels are known
 * only once read: see {@link assertFolderLabelled}.
 */
export function assertLabelsRead(corpus: string, kind: CorpusKind, labelField: string | undefined, lexicon: Lexicon, lexiconPath: string, noLabels: boolean, without: WithoutLabels): void {
  if (noLabels || lexicon.labels.length === 0) return;
  const has = `${lexiconPath} has labels (${labelsOf(lexicon)}) but`;
  const verb = without === 'audit without labels' ? 'audit' : 'encode';
  if (hasFields(kind) && labelField === undefined) {
    throw inputError('MISSING_LABELS', { file: corpus }, `${has} this corpus is read without them; name the label column with --label FIELD, or pass --no-labels to ${without}`);
  }
  if (kind === 'txt') {
    throw inputError('MISSING_LABELS', { file: corpus }, `${has} a .txt corpus has no labels; ${verb} a .csv, .tsv or .jsonl corpus with --label FIELD, or pass --no-labels to ${without}`);
  }
}

/** After reading a folder corpus: refuses (`MISSING_LABELS`) when the lexicon has labels and no document had one. */
export function assertFolderLabelled(corpus: string, kind: CorpusKind, labelledDocuments: number, lexicon: Lexicon, lexiconPath: string, noLabels: boolean, without: WithoutLabels): void {
  if (noLabels || kind !== 'folder' || lexicon.labels.length === 0 || labelledDocuments > 0) return;
  const verb = without === 'audit without labels' ? 'audit' : 'encode';
  throw inputError(
    'MISSING_LABELS',
    { file: corpus },
    `${lexiconPath} has labels (${labelsOf(lexicon)}) but no document of this corpus has one (a folder corpus takes its labels from its subfolders); ` +
      `put the documents in folders named after their labels, or ${verb} a .csv, .tsv or .jsonl corpus with --label FIELD, or pass --no-labels to ${without}`,
  );
}

/** A folder corpus's documents without the labels its subfolders give (--no-labels). */
export async function* withoutLabels(documents: AsyncIterable<CorpusDocument>): AsyncGenerator<CorpusDocument> {
  for await (const { text, key, where } of documents) yield { text, key, where };
}
