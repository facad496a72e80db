import * as z from 'zod/mini';
import { TOKEN_TYPES } from '../rules/TextRules.js';
import { BAD_TEXT_POLICIES } from './badTextPolicy.js';
import { MAX_SHAPE_LENGTH } from './maxShapeLength.js';

/** The `format` member every lexicon file carries. */
export const LEXICON_FORMAT = 'lexlock.lexicon';
/**
 * The lexicon file format version this lexlock writes; bumped on any incompatible change. Version 2:
 * the shape's ends are `start`/`end` and the rules say what the character level does with white space
 * (`spaces`). Version 1 files are refused with a request to rebuild.
 */
export const FORMAT_VERSION = 2;

const count = z.number().check(z.int(), z.minimum(0));
const share = z.number().check(z.minimum(0), z.maximum(1));
const end = z.enum(['start', 'end']);

/** Text rules as stored in a lexicon. */
export const rulesSchema = z.strictObject({
  level: z.enum(['word', 'char']),
  unicode: z.enum(['NFKC', 'NFC', 'none']),
  case: z.enum(['lower', 'keep']),
  drop: z.array(z.enum(TOKEN_TYPES)),
  collapse: z.array(z.enum(TOKEN_TYPES)),
  spaces: z.nullable(z.enum(['keep', 'drop'])),
  tokenizer: z.string().check(z.minLength(1)),
});

/** The longest shape a lexicon may store (maxShapeLength.ts). */
export { MAX_SHAPE_LENGTH };

/** Shape as stored in a lexicon. */
export const shapeSchema = z.strictObject({
  length: z.number().check(z.int(), z.minimum(1), z.maximum(MAX_SHAPE_LENGTH)),
  pad: end,
  cut: end,
});

/** Everything that decides an id, and nothing else: the part the fingerprint covers. */
export const encodingSchema = z.strictObject({
  rules: rulesSchema,
  layout: z.strictObject({
    oov: z.enum(['first', 'last']),
    reserved: count,
  }),
  tokens: z.array(z.string().check(z.minLength(1))),
  labels: z.nullable(z.array(z.string())),
  shape: z.nullable(shapeSchema),
});

const lengthSummary = z.strictObject({ min: count, p50: count, p90: count, p95: count, p99: count, max: count });

/** What the corpus looked like when the lexicon was built: the baseline for drift checks. */
export const fitSchema = z.strictObject({
  createdAt: z.string(),
  lexlockVersion: z.string(),
  source: z.nullable(z.string()),
  textField: z.nullable(z.string()),
  labelField: z.nullable(z.string()),
  /**
   * The bad-text policy the corpus was read with, the default of every reader of this lexicon (encode,
   * audit, readCorpusFor, encodeBytes). Not part of the fingerprint: it decides which documents are
   * read, never the ids of a text. Absent in files written before it was recorded: read as `fail`.
   */
  badText: z.optional(z.enum(BAD_TEXT_POLICIES)),
  cap: z.nullable(count),
  minCount: count,
  documents: count,
  tokens: count,
  types: count,
  /** Present (true) when `types` is an estimate: a bounded build that could not hold every distinct token. */
  typesEstimated: z.optional(z.literal(true)),
  oovTokens: count,
  oovRate: share,
  length: lengthSummary,
  labels: z.array(z.strictObject({ label: z.string(), documents: count, tokens: count })),
  coverage: z.array(z.strictObject({ cap: count, share })),
  truncation: z.nullable(z.strictObject({ length: count, truncatedDocuments: count, droppedTokens: count })),
  /** The group of equal counts the cap cut through (kept in part by string order), or null. */
  capTie: z.nullable(z.strictObject({ cap: count, count: count, tokens: count, kept: count, left: count, below: count, above: count })),
  /** A Bloom filter of every token the corpus had (see SeenTokens), or null for very large vocabularies. */
  seen: z.nullable(z.strictObject({ bits: z.string().check(z.regex(/^[A-Za-z0-9+/]+={0,2}$/)), hashes: z.number().check(z.int(), z.minimum(1), z.maximum(16)), types: count })),
});

/** A probe text and the tokens it gave when the lexicon was built. */
export const canarySchema = z.strictObject({ text: z.string(), tokens: z.array(z.string()) });

/** The whole lexicon file, format version 2. */
export const lexiconFileSchema = z.strictObject({
  format: z.literal(LEXICON_FORMAT),
  formatVersion: z.literal(FORMAT_VERSION),
  fingerprint: z.string().check(z.regex(/^sha256:[0-9a-f]{64}$/)),
  fit: z.nullable(fitSchema),
  canaries: z.array(canarySchema),
  encoding: encodingSchema,
});

/** Everything that decides an id (see {@link encodingSchema}). */
export type Encoding = z.infer<typeof encodingSchema>;
/** The corpus baseline stored beside the encoding. */
export type Fit = z.infer<typeof fitSchema>;
/** One canary: probe text and expected tokens. */
export type Canary = z.infer<typeof canarySchema>;
/** The parsed lexicon file. */
export type LexiconFile = z.infer<typeof lexiconFileSchema>;
