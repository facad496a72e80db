import * as z from 'zod/mini';
import { rulesSchema } from './schema.js';

/** The `format` member every tally file carries. */
export const TALLY_FORMAT = 'lexlock.tally';
/**
 * The tally file format version this lexlock writes; bumped on any incompatible change. Version 2: the
 * rules carry `spaces` (what the character level does with white space).
 */
export const TALLY_FORMAT_VERSION = 2;

const count = z.number().check(z.int(), z.minimum(0));
const positive = z.number().check(z.int(), z.minimum(1));

/**
 * A tally file, format version 2: the counts of one corpus part, mergeable by addition.
 * Tokens and labels are array entries, never object keys, so `__proto__` is a token like any other.
 */
export const tallyFileSchema = z.strictObject({
  format: z.literal(TALLY_FORMAT),
  formatVersion: z.literal(TALLY_FORMAT_VERSION),
  rules: rulesSchema,
  /** The corpus fields text and labels came from (null: none, or parts that disagreed). */
  fields: z.strictObject({ text: z.nullable(z.string()), label: z.nullable(z.string()) }),
  documents: count,
  tokens: count,
  /** Distinct tokens: the number of `counts` entries. */
  types: count,
  /** `[tokens in a document, documents]`, by length ascending. */
  lengths: z.array(z.tuple([count, positive])),
  /** `[label, documents, tokens]`, in JavaScript string order of the label. */
  labels: z.array(z.tuple([z.string(), positive, count])),
  /** A few short documents of the corpus, in JavaScript string order, kept as canaries. */
  snippets: z.array(z.string()),
  /** `[token, occurrences, documents]`, in JavaScript string order of the token. */
  counts: z.array(z.tuple([z.string().check(z.minLength(1)), positive, positive])),
});

/** The parsed tally file document. */
export type TallyFileDocument = z.infer<typeof tallyFileSchema>;
