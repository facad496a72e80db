import { LexlockError } from '../LexlockError.js';
import { fingerprintOf } from '../artifact/fingerprint.js';
import { DEFAULT_BAD_TEXT, type BadTextPolicy } from '../artifact/badTextPolicy.js';
import type { Canary, Encoding, Fit } from '../artifact/schema.js';
import { scanTokens } from '../rules/scanTokens.js';
import { scanWindow } from '../rules/scanWindow.js';
import { SpanIndex } from '../rules/SpanIndex.js';
import { tokenize } from '../rules/tokenize.js';
import type { TextRules } from '../rules/TextRules.js';
import { TokenSpans } from '../rules/TokenSpans.js';
import type { LabelledText } from '../tally/Tally.js';
import { decodeBytes } from './decodeBytes.js';
import { checkedItem, checkManyTexts } from './manyTexts.js';
import { firstKept, keptOf, paddingBefore, shapeInto, type Shape } from './Shape.js';

/** Id 0 is always padding. */
export const PADDING_ID = 0;

/**
 * Fixed-shape ids for many documents: `ids` is row-major (`rows` x `length`), ready to hand to a
 * tensor constructor as is; `lengths[r]` is how many ids of row r are tokens (the rest is padding);
 * `labels[r]` is row r's label id when the input had labels: -1 for a row without a label or with one
 * the lexicon does not know (as `lexlock encode` does; check with `labelId` to refuse those instead).
 */
export interface Batch {
  ids: Int32Array;
  lengths: Int32Array;
  rows: number;
  length: number;
  labels?: Int32Array;
}

/** Where encode scans each text (encode is synchronous, so one buffer serves every lexicon). */
const spans = new TokenSpans();
/** The options encodeMany encodes each row with before shaping the batch. */
const VARIABLE_LENGTH: EncodeOptions = Object.freeze({ shape: null });

/** Options of {@link Lexicon.encode}: a shape to apply, or `null` for variable length. */
export interface EncodeOptions {
  /** Default: the lexicon's own shape (variable length when it has none). */
  shape?: Shape | null;
}

/** Options of {@link Lexicon.encodeBytes}: those of encode, and a bad-text policy other than the lexicon's. */
export interface EncodeBytesOptions extends EncodeOptions {
  /** Default: the lexicon's own policy ({@link Lexicon.badText}). */
  badText?: BadTextPolicy;
}

/**
 * A frozen vocabulary with its rules: the one object that turns text into ids and back.
 * Build one with `freeze`, or load one with `parseLexicon` / `loadLexicon`.
 * @example
 * const ids = lexicon.encode('the ferry was late'); // Int32Array of ids
 * lexicon.decode(ids) // ['the', 'ferry', 'was', 'late']
 */
export class Lexicon {
  readonly encoding: Encoding;
  readonly fingerprint: string;
  readonly fit: Fit | null;
  readonly canaries: readonly Canary[];
  /** The id unknown tokens get. */
  readonly oovId: number;
  /** First id of the token list (`encoding.tokens[0]`). */
  private readonly firstTokenId: number;
  /** The tokens, numbered in order: id = number + firstTokenId. */
  private readonly index: SpanIndex;
  private readonly labelIds: Map<string, number>;

  /**
   * Wraps a checked encoding. `fingerprint` is computed when not given; callers that pass one
   * (parseLexicon) have already compared it with the computed one.
   */
  constructor(encoding: Encoding, fit: Fit | null = null, canaries: readonly Canary[] = [], fingerprint?: string) {
    this.encoding = encoding;
    this.fit = fit;
    this.canaries = canaries;
    this.fingerprint = fingerprint ?? fingerprintOf(encoding);
    const n = encoding.tokens.length;
    this.firstTokenId = encoding.layout.oov === 'first' ? 2 : 1;
    this.oovId = encoding.layout.oov === 'first' ? 1 : n + 1;
    this.index = new SpanIndex();
    for (let i = 0; i < n; i++) {
      const token = encoding.tokens[i] as string;
      // A token seen before keeps its first number.
      const number = this.index.add(token);
      if (number !== i) {
        const previous = number + this.firstTokenId;
        throw new LexlockError(
          'DUPLICATE_TOKEN',
          `"${token}" stands at ids ${previous} and ${i + this.firstTokenId}; every token must appear once in encoding.tokens`,
          { field: 'encoding.tokens' },
        );
      }
    }
    this.labelIds = new Map((encoding.labels ?? []).map((label, i) => [label, i]));
  }

  /** How many ids there are (padding + OOV + every token = largest id + 1): the rows an embedding needs. */
  get size(): number {
    return this.encoding.tokens.length + 2;
  }

  /** The text rules this lexicon tokenizes with. */
  get rules(): TextRules {
    return this.encoding.rules;
  }

  /** The stored shape, or null when encoding is variable-length by default. */
  get shape(): Shape | null {
    return this.encoding.shape;
  }

  /**
   * The bad-text policy its corpus was read with (`fit.badText`; `fail` when the fit names none): what
   * `lexlock encode` and `audit`, `readCorpusFor` and {@link encodeBytes} do with invalid UTF-8 by default.
   */
  get badText(): BadTextPolicy {
    return this.fit?.badText ?? DEFAULT_BAD_TEXT;
  }

  /** The label list (id = position), or an empty list when the lexicon has no labels. */
  get labels(): readonly string[] {
    return this.encoding.labels ?? [];
  }

  /** The id of a token, or {@link oovId} when it is not in the vocabulary. */
  idOf(token: string): number {
    const number = this.index.indexOf(token);
    return number < 0 ? this.oovId : number + this.firstTokenId;
  }

  /** True when the token has an id of its own. */
  has(token: string): boolean {
    return this.index.indexOf(token) >= 0;
  }

  /** The token with this id; null for padding and OOV. Throws `ID_OUT_OF_RANGE` for ids outside 0…size-1. */
  tokenAt(id: number): string | null {
    if (!Number.isInteger(id) || id < 0 || id >= this.size) {
      throw new LexlockError('ID_OUT_OF_RANGE', `id ${id} is outside 0…${this.size - 1}; was it made with another lexicon?`, {});
    }
    if (id === PADDING_ID || id === this.oovId) return null;
    return this.encoding.tokens[id - this.firstTokenId] ?? null;
  }

  /** The id of a label; throws `UNKNOWN_LABEL` when the lexicon does not know it. */
  labelId(label: string): number {
    const id = this.labelIds.get(label);
    if (id === undefined) {
      throw new LexlockError(
        'UNKNOWN_LABEL',
        `label "${label}" is not one of the lexicon's ${this.labels.length} labels; rebuild the lexicon with it or drop those documents`,
        {},
      );
    }
    return id;
  }

  /** The label with this id. */
  labelAt(id: number): string {
    const label = this.labels[id];
    if (label === undefined) throw new LexlockError('ID_OUT_OF_RANGE', `label id ${id} is outside 0…${this.labels.length - 1}`, {});
    return label;
  }

  /** Tokens of a text under this lexicon's rules. */
  tokenize(text: string): string[] {
    return tokenize(text, this.encoding.rules);
  }

  /** Ids of already-tokenized text, variable length. */
  idsOf(tokens: readonly string[]): Int32Array {
    const out = new Int32Array(tokens.length);
    for (let i = 0; i < tokens.length; i++) out[i] = this.idOf(tokens[i] as string);
    return out;
  }

  /**
   * Encodes one text: variable length, or shaped (the lexicon's shape by default, or `options.shape`).
   * Tokens are looked up where they lie in the text, so encoding ASCII text whose chunks are plain or
   * met before allocates only the returned ids (see {@link scanTokens}). Shaped, only the part of a long
   * text the row keeps is tokenized (see {@link scanWindow}): the same ids as the whole text's tokens
   * give, in about the time of a text of `length` tokens however long the text is.
   * @example lexicon.encode('late again', { shape: { length: 4, pad: 'start', cut: 'end' } }) // [0, 0, 17, 93]
   */
  encode(text: string, options?: EncodeOptions): Int32Array {
    const shape = options?.shape === undefined ? this.encoding.shape : options.shape;
    if (shape === null) {
      const count = scanTokens(text, this.encoding.rules, spans, true).count;
      const out = new Int32Array(count);
      for (let k = 0; k < count; k++) out[k] = this.idOfSpan(k);
      return out;
    }
    const out = new Int32Array(shape.length);
    // Only the kept tokens are looked up.
    const count = scanWindow(text, this.encoding.rules, spans, shape.length, shape.cut).count;
    const kept = keptOf(count, shape);
    const from = firstKept(count, shape);
    const to = paddingBefore(kept, shape);
    for (let i = 0; i < kept; i++) out[to + i] = this.idOfSpan(from + i);
    return out;
  }

  /**
   * Encodes one document given as UTF-8 bytes (a request body, an uploaded file) under the lexicon's
   * bad-text policy, or `options.badText`: the same ids as `encode` of the text a corpus reader decodes
   * from those bytes as a file of a folder corpus. A leading byte order mark is dropped; invalid UTF-8
   * is decoded with U+FFFD for each bad sequence under `replace` (the WHATWG Encoding Standard's UTF-8
   * decoder, as TextDecoder does), throws `BAD_UTF8` naming the first bad byte under `fail`, and
   * throws `SKIPPED_TEXT` under `skip`: the document is one the corpus reader would have left out.
   * @example lexicon.encodeBytes(new Uint8Array(await request.arrayBuffer())) // as lexicon.encode(text)
   */
  encodeBytes(bytes: Uint8Array, options?: EncodeBytesOptions): Int32Array {
    return this.encode(decodeBytes(bytes, options?.badText ?? this.badText), options);
  }

  /**
   * The ids of the tokens a row of `shape` keeps, in order and without padding (the lexicon's shape by
   * default; every token's id without one): `encode`'s row with its zeros left out, found the same way.
   * @example lexicon.keptIds('the ferry was late again', { shape: { length: 2, pad: 'end', cut: 'start' } }) // [12, 93]
   */
  keptIds(text: string, options?: EncodeOptions): Int32Array {
    const shape = options?.shape === undefined ? this.encoding.shape : options.shape;
    if (shape === null) return this.encode(text, VARIABLE_LENGTH);
    const count = scanWindow(text, this.encoding.rules, spans, shape.length, shape.cut).count;
    const kept = keptOf(count, shape);
    const from = firstKept(count, shape);
    const out = new Int32Array(kept);
    for (let i = 0; i < kept; i++) out[i] = this.idOfSpan(from + i);
    return out;
  }

  /**
   * The ids of the tokens a scan under this lexicon's rules left in `scanned` (see scanTokens), in
   * order, variable length: what `encode` gives without a shape, for a caller that also needs the tokens.
   * Written into `into` when it has room (the ids are then its first `scanned.count` places).
   */
  idsOfScanned(scanned: TokenSpans, into?: Int32Array): Int32Array {
    const count = scanned.count;
    const out = into !== undefined && into.length >= count ? into : new Int32Array(count);
    for (let k = 0; k < count; k++) out[k] = this.#idOfToken(scanned, k);
    return out;
  }

  /** The id of token `k` of the text encode scanned last. */
  private idOfSpan(k: number): number {
    return this.#idOfToken(spans, k);
  }

  /** The id of token `k` of `scanned`, looked up where it lies in the scanned text. */
  #idOfToken(scanned: TokenSpans, k: number): number {
    const number = this.index.indexOfToken(scanned, k);
    return number < 0 ? this.oovId : number + this.firstTokenId;
  }

  /**
   * Encodes many texts into one row-major batch. Without a shape (given or stored) every row is as
   * long as the longest text, padded at the end. Takes any synchronous iterable (an array, a Set, a
   * generator) of texts or `{ text, label }` objects; an async iterable such as `readCorpus(...)` is
   * refused with `BAD_OPTION` (read it in batches with `encodeBatches`), and so is one string.
   * @example const { ids, rows, length } = lexicon.encodeMany(texts); // a rows x length int32 tensor
   */
  encodeMany(texts: Iterable<string | LabelledText>, options: EncodeOptions = {}): Batch {
    checkManyTexts(texts);
    const given = options.shape === undefined ? this.encoding.shape : options.shape;
    const rowsIds: Int32Array[] = [];
    const labels: number[] = [];
    let labelled = false;
    for (const item of texts) {
      const { text, label } = checkedItem(item, rowsIds.length + 1);
      // With a shape, only what each row keeps is tokenized.
      rowsIds.push(given === null ? this.encode(text, VARIABLE_LENGTH) : this.keptIds(text, { shape: given }));
      if (label !== undefined) labelled = true;
      labels.push(label === undefined ? -1 : (this.labelIds.get(label) ?? -1));
    }
    let longest = 1;
    for (const row of rowsIds) if (row.length > longest) longest = row.length;
    const shape: Shape = given ?? { length: longest, pad: 'end', cut: 'end' };
    const rows = rowsIds.length;
    const ids = new Int32Array(rows * shape.length);
    const lengths = new Int32Array(rows);
    rowsIds.forEach((row, r) => {
      lengths[r] = shapeInto(row, shape, ids, r * shape.length);
    });
    const batch: Batch = { ids, lengths, rows, length: shape.length };
    if (labelled) batch.labels = Int32Array.from(labels);
    return batch;
  }

  /**
   * Tokens for ids, padding left out, OOV shown as `oov` (default `<oov>`).
   * @example lexicon.decode([0, 0, 17, 1]) // ['late', '<oov>']
   */
  decode(ids: ArrayLike<number>, oov = '<oov>'): string[] {
    const out: string[] = [];
    for (let i = 0; i < ids.length; i++) {
      const id = ids[i] as number;
      if (id === PADDING_ID) continue;
      out.push(this.tokenAt(id) ?? oov);
    }
    return out;
  }
}
