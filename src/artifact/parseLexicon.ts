import { inputError, isLexlockError, type Where } from '../LexlockError.js';
import { Lexicon } from '../lexicon/Lexicon.js';
import { checkCanaries } from './canaries.js';
import { checkEncoding } from './checkEncoding.js';
import { decodeLexiconBytes } from './decodeLexiconBytes.js';
import { describeIssue, memberPath } from './describeIssue.js';
import { fingerprintOf } from './fingerprint.js';
import { withoutBom } from './jsonFileLimit.js';
import { migrate } from './migrate.js';
import { previewValue } from './previewValue.js';
import { lexiconFileSchema, type Encoding } from './schema.js';

/** Options of {@link parseLexicon}. */
export interface ParseLexiconOptions {
  /** Refuse the lexicon unless its fingerprint is this one (the one a model declares). */
  expectFingerprint?: string;
  /** Re-tokenize the canaries and refuse on any difference (default true). */
  checkCanaries?: boolean;
  /** Name used in error messages, e.g. the file name. */
  source?: string;
}

/** The JSON text's own value; any failure of the parser is `NOT_JSON`, a stack overflow included. */
function parseJson(text: string, where: Where): unknown {
  try {
    return JSON.parse(text);
  } catch (e) {
    // Some engines parse nested arrays and objects recursively and run out of stack on deep nesting
    // (V8 in Node 20 does not, even at a million levels); no lexicon member nests more than 4 levels.
    const why = e instanceof Error ? e.message : String(e);
    const what = e instanceof RangeError ? `nested too deeply or too large for this JavaScript engine to read (${why})` : `not JSON (${why})`;
    throw inputError('NOT_JSON', where, `${what}; pass a lexicon file written by lexlock build`);
  }
}

/**
 * The fingerprint of a checked encoding. Canonical JSON cannot carry a string with a lone surrogate
 * (which JSON text may spell as `"\ud800"`); such a string is refused as the member it is in.
 */
function fingerprintIn(encoding: Encoding, where: Where): string {
  try {
    return fingerprintOf(encoding);
  } catch (e) {
    const path = isLexlockError(e) ? e.where.field : undefined;
    if (path === undefined || !path.startsWith('$')) throw e;
    const field = `encoding${path.slice(1)}`;
    throw inputError('BAD_LEXICON', { ...where, field }, `not a valid lexicon: ${field}: a string holds a lone surrogate (half a UTF-16 pair), which no lexicon can hash; rebuild it with lexlock build`);
  }
}

/**
 * The `DUPLICATE_TOKEN` error for the first token that appears twice in `encoding.tokens`, with a
 * long token shortened so the message stays readable; null when every token is distinct.
 */
function duplicateToken(encoding: Encoding, where: Where) {
  const firstId = encoding.layout.oov === 'first' ? 2 : 1;
  const seen = new Map<string, number>();
  for (let i = 0; i < encoding.tokens.length; i++) {
    const token = encoding.tokens[i] as string;
    const before = seen.get(token);
    if (before !== undefined) {
      return inputError(
        'DUPLICATE_TOKEN',
        { ...where, field: 'encoding.tokens' },
        `${previewValue(token)} stands at ids ${before + firstId} and ${i + firstId}; every token must appear once in encoding.tokens`,
      );
    }
    seen.set(token, i);
  }
  return null;
}

/** The first 8 tokens of a canary, each shortened when long, as a JSON-like list. */
function listPreview(tokens: readonly string[]): string {
  return `[${tokens.slice(0, 8).map((t) => previewValue(t)).join(',')}]`;
}

/** A stored name as is when short, shortened otherwise. */
function shortName(name: string): string {
  return name.length <= 60 ? name : previewValue(name);
}

/**
 * Reads a lexicon from its JSON text, its UTF-8 bytes or its parsed object: UTF-8, format and
 * version, schema, fingerprint, duplicate tokens and canaries are all checked; anything wrong is a
 * LexlockError naming the member. A leading byte order mark is dropped (the fingerprint covers
 * `encoding`, not the file's bytes); bytes over `JSON_FILE_MOST_BYTES` are `FILE_TOO_LARGE`. Browser-safe.
 * @example const lexicon = parseLexicon(await (await fetch('/lexicon.json')).text(), { expectFingerprint: model.fingerprint });
 */
export function parseLexicon(input: string | Uint8Array | object, options: ParseLexiconOptions = {}): Lexicon {
  const where: Where = options.source === undefined ? {} : { file: options.source };
  let raw: unknown = input;
  if (input instanceof Uint8Array) raw = parseJson(withoutBom(decodeLexiconBytes(input, where)), where);
  else if (typeof input === 'string') raw = parseJson(withoutBom(input), where);
  const doc = migrate(raw, where);
  const parsed = lexiconFileSchema.safeParse(doc);
  if (!parsed.success) {
    const issues = parsed.error.issues;
    const first = issues[0];
    const field = first === undefined ? '(top level)' : memberPath(first.path);
    const listed = issues.slice(0, 3).map((i) => describeIssue(i, doc)).join('; ');
    const more = issues.length > 3 ? ` (and ${issues.length - 3} more)` : '';
    throw inputError('BAD_LEXICON', { ...where, field }, `not a valid lexicon: ${listed}${more}; rebuild it with lexlock build`);
  }
  const file = parsed.data;
  const { encoding } = file;
  checkEncoding(encoding, where);
  const computed = fingerprintIn(encoding, where);
  if (computed !== file.fingerprint) {
    throw inputError('FINGERPRINT_MISMATCH', { ...where, field: 'fingerprint' }, `fingerprint ${file.fingerprint} does not match the encoding, which hashes to ${computed}; the file was edited or damaged: restore it or rebuild it`);
  }
  if (options.expectFingerprint !== undefined && options.expectFingerprint !== computed) {
    throw inputError('FINGERPRINT_MISMATCH', { ...where, field: 'fingerprint' }, `lexicon fingerprint ${computed} is not the expected ${options.expectFingerprint}; load the lexicon the model was trained with`);
  }
  let lexicon: Lexicon;
  try {
    lexicon = new Lexicon(encoding, file.fit, file.canaries, computed);
  } catch (e) {
    // The Lexicon names a duplicate in full; the same message with a long token shortened.
    if (isLexlockError(e)) throw (e.code === 'DUPLICATE_TOKEN' ? duplicateToken(encoding, where) : null) ?? inputError(e.code, { ...where, ...e.where }, e.message);
    throw e;
  }
  if (options.checkCanaries ?? true) {
    const differences = checkCanaries(encoding.rules, file.canaries);
    const d = differences[0];
    if (d !== undefined) {
      throw inputError(
        'CANARY_MISMATCH',
        { ...where, field: `canaries[${d.index}]` },
        `canary ${JSON.stringify(d.text.slice(0, 40))} now gives ${listPreview(d.actual)} but gave ${listPreview(d.expected)} when the lexicon was built (${differences.length} of ${file.canaries.length} canaries differ); the tokenizer or Unicode data changed under it (built with ${shortName(encoding.rules.tokenizer)}): use the versions it was built with, or rebuild it`,
      );
    }
  }
  return lexicon;
}
