import type { PageData } from '../audit/explore/PageData.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { DEFAULT_RULES } from '../rules/TextRules.js';
import { valueOf, type ParsedArgs } from './parseArgs.js';

/** A word for a POSIX shell: as it is when it holds only safe characters, else in single quotes. */
export function shellWord(word: string): string {
  return /^[A-Za-z0-9_@%+=:,./-]+$/.test(word) ? word : `'${word.replace(/'/g, `'\\''`)}'`;
}

/**
 * The words of the `lexlock build` line the report page offers for another cap and length: the corpus
 * (with --lexicon, the one the lexicon was built from, as its fit record names it), `-o
 * <name>.lexicon.json`, then the text rules that differ from the defaults, the lexicon's layout
 * (--oov, --reserve), --min-count, and the text and label fields of this run.
 * @example buildWords({ corpus: 'data/ferry.csv', ... }).head // ['data/ferry.csv', '-o', 'ferry.lexicon.json']
 */
export function buildWords(run: { corpus: string; lexicon: Lexicon; fromLexicon: boolean; args: ParsedArgs; text: string | undefined; label: string | undefined }): PageData['build'] {
  const { lexicon, args } = run;
  const corpus = run.fromLexicon ? (lexicon.fit?.source ?? run.corpus) : run.corpus;
  const name = (corpus.split(/[\\/]/).filter((p) => p !== '').pop() ?? 'corpus').replace(/\.[^.]*$/, '') || 'corpus';
  const rules = lexicon.rules;
  const tail: string[] = [];
  if (rules.level !== DEFAULT_RULES.level) tail.push('--level', rules.level);
  if (rules.spaces !== null && rules.spaces !== 'keep') tail.push('--spaces', rules.spaces);
  if (rules.case !== DEFAULT_RULES.case) tail.push('--case', rules.case);
  if (rules.unicode !== DEFAULT_RULES.unicode) tail.push('--unicode', rules.unicode);
  if (rules.drop.length > 0) tail.push('--drop', rules.drop.join(','));
  if (rules.collapse.length > 0) tail.push('--collapse', rules.collapse.join(','));
  const layout = lexicon.encoding.layout;
  if (layout.oov !== 'first') tail.push('--oov', layout.oov);
  for (const token of lexicon.encoding.tokens.slice(0, layout.reserved)) tail.push('--reserve', token);
  const fitMinCount = run.fromLexicon ? (lexicon.fit?.minCount ?? 1) : 1;
  const minCount = valueOf(args, 'min-count') ?? (fitMinCount > 1 ? String(fitMinCount) : undefined);
  if (minCount !== undefined) tail.push('--min-count', minCount);
  if (run.text !== undefined && run.text !== 'text') tail.push('--text', run.text);
  if (run.label !== undefined) tail.push('--label', run.label);
  return { head: [corpus, '-o', `${name}.lexicon.json`].map(shellWord), tail: tail.map(shellWord) };
}
