import { inputError, isLexlockError, type Where } from '../LexlockError.js';
import { describeIssue, memberPath } from '../artifact/describeIssue.js';
import { withoutBom } from '../artifact/jsonFileLimit.js';
import { TALLY_FORMAT, TALLY_FORMAT_VERSION, tallyFileSchema, type TallyFileDocument } from '../artifact/tallySchema.js';
import { resolveRules } from '../rules/TextRules.js';
import { VERSION } from '../version.js';
import { Tally } from './Tally.js';
import { TALLY_SNIPPETS, type TallyFile } from './tallyFile.js';
import { badTally, TallyCountsCheck } from './TallyCountsCheck.js';

/** Options of {@link tallyFileParse}. */
export interface TallyFileParseOptions {
  /** Name used in error messages, e.g. the file name. */
  source?: string;
}

const AGAIN = 'count the part again with lexlock tally';

/**
 * Reads a tally file from its JSON text or parsed object: format and version, schema, then the
 * invariants a tally keeps (tokens distinct and in string order, figures that add up). Anything
 * wrong is a LexlockError (`NOT_JSON`, `NOT_A_TALLY`, `NEWER_FORMAT`, `BAD_TALLY`) naming the member.
 * A leading byte order mark is dropped. Browser-safe.
 * @example const { tally, snippets } = tallyFileParse(text, { source: 'part-1.tally' });
 */
export function tallyFileParse(input: string | object, options: TallyFileParseOptions = {}): TallyFile {
  const where: Where = options.source === undefined ? {} : { file: options.source };
  let raw: unknown = input;
  if (typeof input === 'string') {
    try {
      raw = JSON.parse(withoutBom(input));
    } catch (e) {
      throw inputError('NOT_JSON', where, `not JSON (${(e as Error).message}); pass a tally file written by lexlock tally or lexlock merge`);
    }
  }
  const { file, doc } = tallyHeaderParse(raw, where);
  if (doc.types !== doc.counts.length) throw badTally(where, 'types', `types is ${doc.types} but counts has ${doc.counts.length} entries`);
  const check = new TallyCountsCheck(doc, where);
  doc.counts.forEach(([token, n, df], i) => {
    check.entry(token, n, df, `counts[${i}]`);
    file.tally.addToken(token, n, df);
  });
  check.end();
  return file;
}

/** A tally file's members other than `counts`, checked, and the schema's view of the whole document. */
export interface TallyHeader {
  /** The tally with its documents, tokens, lengths and labels, but no token counted; snippets; fields. */
  file: TallyFile;
  doc: TallyFileDocument;
}

/**
 * Checks a parsed tally document as {@link tallyFileParse} does (format, version, schema, rules,
 * lengths, labels, snippets), except for its `counts` entries, which the caller checks with
 * {@link TallyCountsCheck}: the streaming merge parses the members before `counts` with an empty
 * `counts`, then reads the entries one line at a time. Browser-safe.
 */
export function tallyHeaderParse(raw: unknown, where: Where): TallyHeader {
  const bad = (field: string, detail: string) => badTally(where, field, detail);
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw) || (raw as { format?: unknown }).format !== TALLY_FORMAT) {
    throw inputError('NOT_A_TALLY', where, `not a lexlock tally (no "format": "${TALLY_FORMAT}" member); pass a file written by lexlock tally or lexlock merge`);
  }
  const version = (raw as { formatVersion?: unknown }).formatVersion;
  if (typeof version === 'number' && Number.isInteger(version) && version > TALLY_FORMAT_VERSION) {
    throw inputError(
      'NEWER_FORMAT',
      { ...where, field: 'formatVersion' },
      `tally format version ${version} needs a newer lexlock; this one (${VERSION}) reads versions up to ${TALLY_FORMAT_VERSION}; upgrade lexlock`,
    );
  }
  if (version === 1) {
    throw inputError(
      'OLD_FORMAT',
      { ...where, field: 'formatVersion' },
      `tally format version 1 was written by lexlock 0.1, whose character level dropped white space; this lexlock (${VERSION}) reads version ${TALLY_FORMAT_VERSION}; ${AGAIN}`,
    );
  }
  const parsed = tallyFileSchema.safeParse(raw);
  if (!parsed.success) {
    const issues = parsed.error.issues;
    const first = issues[0];
    const field = first === undefined ? '(top level)' : memberPath(first.path);
    const listed = issues.slice(0, 3).map((i) => describeIssue(i, raw)).join('; ');
    const more = issues.length > 3 ? ` (and ${issues.length - 3} more)` : '';
    throw inputError('BAD_TALLY', { ...where, field }, `not a valid tally: ${listed}${more}; ${AGAIN}`);
  }
  const doc = parsed.data;

  let rules;
  try {
    const { level, unicode, drop, collapse, spaces } = doc.rules;
    rules = resolveRules({ level, unicode, case: doc.rules.case, drop, collapse, ...(spaces === null ? {} : { spaces }) });
  } catch (e) {
    if (isLexlockError(e)) throw bad(`rules.${e.where.field ?? ''}`, `rules: ${e.message}`);
    throw e;
  }
  for (const member of ['drop', 'collapse'] as const) {
    if (rules[member].join(',') !== doc.rules[member].join(',')) {
      throw bad(`rules.${member}`, `rules.${member} must list distinct token types in string order (${JSON.stringify(rules[member])})`);
    }
  }
  if (rules.spaces !== doc.rules.spaces) {
    throw bad('rules.spaces', `rules.spaces is null, but the character level needs "keep" or "drop"`);
  }
  rules.tokenizer = doc.rules.tokenizer;
  const tally = new Tally(rules);
  tally.documents = doc.documents;
  tally.tokens = doc.tokens;

  let documents = 0;
  let tokens = 0;
  doc.lengths.forEach(([length, n], i) => {
    if (i > 0 && !((doc.lengths[i - 1] as [number, number])[0] < length)) {
      throw bad(`lengths[${i}]`, `length ${length} comes after ${(doc.lengths[i - 1] as [number, number])[0]}; lengths must be distinct and ascending`);
    }
    documents += n;
    tokens += length * n;
    tally.lengths.set(length, n);
  });
  if (documents !== doc.documents) throw bad('lengths', `the length histogram holds ${documents} documents but documents is ${doc.documents}`);
  if (tokens !== doc.tokens) throw bad('lengths', `the length histogram holds ${tokens} tokens but tokens is ${doc.tokens}`);

  doc.labels.forEach(([label, n, t], i) => {
    const before = i > 0 ? (doc.labels[i - 1] as [string, number, number])[0] : undefined;
    if (before !== undefined && !(before < label)) {
      throw bad(`labels[${i}]`, `label ${JSON.stringify(label)} comes after ${JSON.stringify(before)}; labels must be distinct and in JavaScript string order`);
    }
    if (n > doc.documents) throw bad(`labels[${i}]`, `label ${JSON.stringify(label)} has ${n} documents but the tally has ${doc.documents}`);
    tally.labels.set(label, { documents: n, tokens: t });
  });

  if (doc.snippets.length > TALLY_SNIPPETS) throw bad('snippets', `${doc.snippets.length} snippets; a tally keeps at most ${TALLY_SNIPPETS}`);
  return { file: { tally, snippets: [...doc.snippets], fields: { text: doc.fields.text, label: doc.fields.label } }, doc };
}
