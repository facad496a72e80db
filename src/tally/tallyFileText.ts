import { TALLY_FORMAT, TALLY_FORMAT_VERSION } from '../artifact/tallySchema.js';
import { TALLY_SNIPPETS, tallyFileOrder, type TallyFile } from './tallyFile.js';

function entries(name: string, rows: readonly unknown[], last: boolean): string[] {
  const end = last ? '' : ',';
  if (rows.length === 0) return [`  ${JSON.stringify(name)}: []${end}\n`];
  return [`  ${JSON.stringify(name)}: [\n`, ...rows.map((r, i) => `    ${JSON.stringify(r)}${i < rows.length - 1 ? ',' : ''}\n`), `  ]${end}\n`];
}

/** The line that opens the `counts` member; {@link TALLY_COUNTS_CLOSE} ends it and the file. */
export const TALLY_COUNTS_OPEN = '  "counts": [\n';
/** The lines after the last count: the end of `counts` and of the file. */
export const TALLY_COUNTS_CLOSE = '  ]\n}\n';

/** One `counts` line without its comma and line feed: `    ["ferry",2,1]`. */
export function tallyCountLine(token: string, occurrences: number, documents: number): string {
  return `    ${JSON.stringify([token, occurrences, documents])}`;
}

/**
 * The tally file's lines before `counts` (each ends in `\n`), with `types` distinct tokens announced:
 * what {@link tallyFileLines} writes first, for a writer (the streaming merge) that adds the counts itself.
 */
export function* tallyHeaderLines(file: TallyFile, types: number): Generator<string> {
  const { tally } = file;
  const r = tally.rules;
  const rules = { level: r.level, unicode: r.unicode, case: r.case, drop: r.drop, collapse: r.collapse, spaces: r.spaces, tokenizer: r.tokenizer };
  yield '{\n';
  yield `  "format": ${JSON.stringify(TALLY_FORMAT)},\n`;
  yield `  "formatVersion": ${TALLY_FORMAT_VERSION},\n`;
  yield `  "rules": ${JSON.stringify(rules)},\n`;
  yield `  "fields": ${JSON.stringify({ text: file.fields.text, label: file.fields.label })},\n`;
  yield `  "documents": ${tally.documents},\n`;
  yield `  "tokens": ${tally.tokens},\n`;
  yield `  "types": ${types},\n`;
  yield* entries('lengths', [...tally.lengths].filter(([, n]) => n > 0).sort((a, b) => a[0] - b[0]), false);
  const labels = [...tally.labels].sort((a, b) => tallyFileOrder(a[0], b[0])).map(([label, c]) => [label, c.documents, c.tokens]);
  yield* entries('labels', labels, false);
  yield* entries('snippets', [...new Set(file.snippets)].sort(tallyFileOrder).slice(0, TALLY_SNIPPETS), false);
}

/**
 * The tally file's text, line by line (each line ends in `\n`), for writing as it is produced:
 * the small members first, then `counts` with one `[token, occurrences, documents]` a line.
 * Deterministic: tokens, labels and snippets in JavaScript string order, lengths ascending, so two
 * tallies of the same documents give the same bytes. Browser-safe.
 */
export function* tallyFileLines(file: TallyFile): Generator<string> {
  const { tally } = file;
  yield* tallyHeaderLines(file, tally.types);
  // The tokens alone are sorted (not a [token, count, documents] triple each: a tally may hold tens of
  // millions), their figures looked up as each line is written.
  const tokens = [...tally.tokenList()].sort(tallyFileOrder);
  yield TALLY_COUNTS_OPEN;
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i] as string;
    yield `${tallyCountLine(t, tally.countOf(t), tally.documentsOf(t))}${i < tokens.length - 1 ? ',' : ''}\n`;
  }
  yield TALLY_COUNTS_CLOSE;
}

/**
 * The whole tally file as one string (see {@link tallyFileLines}); `tallyFileParse` reads it back.
 * @example const text = tallyFileText({ tally, snippets: [], fields: { text: null, label: null } });
 */
export function tallyFileText(file: TallyFile): string {
  let out = '';
  for (const line of tallyFileLines(file)) out += line;
  return out;
}
