import { inputError, isLexlockError, type Where } from '../LexlockError.js';
import { Lexicon } from '../lexicon/Lexicon.js';
import { checkCanaries } from './canaries.js';
import { describeIssue, memberPath } from './describeIssue.js';
import { fingerprintOf } from './fingerprint.js';
import { migrate } from './migrate.js';
import { lexiconFileSchema } from './schema.js';

/** Options of {@link parseLexicon}. */
export interface ParseLexiconOptions {
  /** Refuse the lexicon unless its fingerprint is this one (the one a model declares). */
  expectFingerprint?: string;
  /** Re-tokenize the canaries and refuse on any difference (default true). */
  checkCanaries?: boolean;
  /** Name used in error messages, e.g. the file name. */
  source?: string;
}


/**
 * Reads a lexicon from its JSON text or parsed object: format and version, schema, fingerprint,
 * duplicate tokens and canaries are all checked; anything wrong is a LexlockError naming the member.
 * Browser-safe.
 * @example const lexicon = parseLexicon(await (await fetch('/lexicon.json')).text(), { expectFingerprint: model.fingerprint });
 */
export function parseLexicon(input: string | object, options: ParseLexiconOptions = {}): Lexicon {
  const where: Where = options.source === undefined ? {} : { file: options.source };
  let raw: unknown = input;
  if (typeof input === 'string') {
    try {
      raw = JSON.parse(input);
    } catch (e) {
      throw inputError('NOT_JSON', where, `not JSON (${(e as Error).message}); pass a lexicon file written by lexlock build`);
    }
  }
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
  if (encoding.layout.reserved > encoding.tokens.length) {
    throw inputError('BAD_LEXICON', { ...where, field: 'encoding.layout.reserved' }, `${encoding.layout.reserved} reserved tokens but only ${encoding.tokens.length} tokens; rebuild it with lexlock build`);
  }
  if (encoding.labels !== null) {
    for (let i = 1; i < encoding.labels.length; i++) {
      const a = encoding.labels[i - 1] as string;
      const b = encoding.labels[i] as string;
      if (!(a < b)) {
        throw inputError('BAD_LEXICON', { ...where, field: `encoding.labels[${i}]` }, `labels must be distinct and in JavaScript string order ("${a}" then "${b}"); rebuild it with lexlock build`);
      }
    }
  }
  const computed = fingerprintOf(encoding);
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
    if (isLexlockError(e)) throw inputError(e.code, { ...where, ...e.where }, e.message);
    throw e;
  }
  if (options.checkCanaries ?? true) {
    const differences = checkCanaries(encoding.rules, file.canaries);
    const d = differences[0];
    if (d !== undefined) {
      throw inputError(
        'CANARY_MISMATCH',
        { ...where, field: `canaries[${d.index}]` },
        `canary ${JSON.stringify(d.text.slice(0, 40))} now gives ${JSON.stringify(d.actual.slice(0, 8))} but gave ${JSON.stringify(d.expected.slice(0, 8))} when the lexicon was built (${differences.length} of ${file.canaries.length} canaries differ); the tokenizer or Unicode data changed under it (built with ${encoding.rules.tokenizer}): use the versions it was built with, or rebuild it`,
      );
    }
  }
  return lexicon;
}
