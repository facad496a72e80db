import type { EncodeOptions, Lexicon } from './Lexicon.js';
import { firstKept, keptOf, paddingBefore, type Shape } from './Shape.js';

/** One token of a text as {@link peekText} shows it. */
export interface PeekedToken {
  token: string;
  /** Its id: the lexicon's OOV id when the token has none of its own. */
  id: number;
  oov: boolean;
  /** Where its id lands in the row (0-based), or null when the shape cuts it. */
  slot: number | null;
}

/** What a text becomes under a lexicon, step by step: {@link peekText}'s result. */
export interface TextPeek {
  /** Every token of the text in order, the cut ones included. */
  tokens: PeekedToken[];
  /** The shape applied, or null for a variable-length row of every id. */
  shape: Shape | null;
  /** Tokens with the OOV id. */
  oovTokens: number;
  /** Tokens the shape cuts (from its `cut` end). */
  cutTokens: number;
  /** Padding zeros in the row (at the shape's `pad` end). */
  zeros: number;
  /** The row the model gets: exactly what `lexicon.encode(text, options)` returns. */
  row: Int32Array;
}

/**
 * What `lexicon.encode(text, options)` does to a text, laid open for debugging: each token (under the
 * lexicon's rules) with its id, whether it is OOV, and its slot in the row or null when the shape cuts
 * it; how many tokens are cut and zeros added; and the row itself, from `encode`, so what is shown is
 * what a model gets. The shape is `options.shape`, else the lexicon's. Browser-safe.
 * @example peekText(lexicon, 'late again', { shape: { length: 3, pad: 'start', cut: 'end' } }).tokens
 * // [{ token: 'late', id: 2, oov: false, slot: 1 }, { token: 'again', id: 6, oov: false, slot: 2 }]
 */
export function peekText(lexicon: Lexicon, text: string, options: EncodeOptions = {}): TextPeek {
  const shape = options.shape === undefined ? lexicon.shape : options.shape;
  const strings = lexicon.tokenize(text);
  const count = strings.length;
  const kept = shape === null ? count : keptOf(count, shape);
  const from = shape === null ? 0 : firstKept(count, shape);
  const before = shape === null ? 0 : paddingBefore(kept, shape);
  let oovTokens = 0;
  const tokens = strings.map((token, i): PeekedToken => {
    const id = lexicon.idOf(token);
    const oov = id === lexicon.oovId;
    if (oov) oovTokens += 1;
    const slot = i >= from && i < from + kept ? before + (i - from) : null;
    return { token, id, oov, slot };
  });
  return {
    tokens,
    shape,
    oovTokens,
    cutTokens: count - kept,
    zeros: shape === null ? 0 : shape.length - kept,
    row: lexicon.encode(text, { shape }),
  };
}
