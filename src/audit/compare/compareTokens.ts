import type { Lexicon } from '../../lexicon/Lexicon.js';
import type { MovedTokens, TokenSample } from './LexiconComparison.js';

/** The token-list part of a comparison (see `LexiconComparison`). */
export interface TokenComparison {
  tokens: { a: number; b: number; shared: number };
  onlyInA: TokenSample;
  onlyInB: TokenSample;
  moved: MovedTokens;
}

/**
 * Compares two token lists: counts, tokens only in one (the first `sample` in that lexicon's id
 * order) and shared tokens whose id differs (the first `sample` in a's id order).
 */
export function compareTokens(a: Lexicon, b: Lexicon, sample: number): TokenComparison {
  const onlyInA: TokenSample = { count: 0, first: [] };
  const onlyInB: TokenSample = { count: 0, first: [] };
  const moved: MovedTokens = { count: 0, first: [] };
  let shared = 0;
  for (const token of a.encoding.tokens) {
    if (!b.has(token)) {
      onlyInA.count += 1;
      if (onlyInA.first.length < sample) onlyInA.first.push(token);
      continue;
    }
    shared += 1;
    const idA = a.idOf(token);
    const idB = b.idOf(token);
    if (idA !== idB) {
      moved.count += 1;
      if (moved.first.length < sample) moved.first.push({ token, a: idA, b: idB });
    }
  }
  for (const token of b.encoding.tokens) {
    if (a.has(token)) continue;
    onlyInB.count += 1;
    if (onlyInB.first.length < sample) onlyInB.first.push(token);
  }
  return { tokens: { a: a.encoding.tokens.length, b: b.encoding.tokens.length, shared }, onlyInA, onlyInB, moved };
}
