import { inputError, type Where } from '../LexlockError.js';
import { previewValue } from './previewValue.js';
import type { Encoding } from './schema.js';

const REBUILD = 'rebuild it with lexlock build';

/** The first place where `list` is not strictly ascending in JavaScript string order, or -1. */
function firstOutOfOrder(list: readonly string[]): number {
  for (let i = 1; i < list.length; i++) if (!((list[i - 1] as string) < (list[i] as string))) return i;
  return -1;
}

/**
 * What the schema cannot say about an encoding: no more reserved tokens than tokens, labels distinct
 * and in string order, and rules as lexlock writes them (`drop` and `collapse` distinct and sorted,
 * at the word level only, no type in both; `spaces` at the character level only). Throws `BAD_LEXICON` naming the member.
 */
export function checkEncoding(encoding: Encoding, where: Where): void {
  const bad = (field: string, detail: string) => inputError('BAD_LEXICON', { ...where, field }, `${detail}; ${REBUILD}`);
  if (encoding.layout.reserved > encoding.tokens.length) {
    throw bad('encoding.layout.reserved', `${encoding.layout.reserved} reserved tokens but only ${encoding.tokens.length} tokens`);
  }
  if (encoding.labels !== null) {
    const i = firstOutOfOrder(encoding.labels);
    if (i >= 0) {
      const a = previewValue(encoding.labels[i - 1]);
      const b = previewValue(encoding.labels[i]);
      throw bad(`encoding.labels[${i}]`, `labels must be distinct and in JavaScript string order (${a} then ${b})`);
    }
  }
  const { rules } = encoding;
  for (const member of ['drop', 'collapse'] as const) {
    const list = rules[member];
    const i = firstOutOfOrder(list);
    if (i >= 0) {
      throw bad(`encoding.rules.${member}[${i}]`, `encoding.rules.${member} must list distinct token types in string order (${previewValue(list[i - 1])} then ${previewValue(list[i])})`);
    }
    if (rules.level === 'char' && list.length > 0) {
      throw bad(`encoding.rules.${member}`, `encoding.rules.${member}: token types are dropped or collapsed at the word level only, but encoding.rules.level is "char"`);
    }
  }
  if ((rules.level === 'char') !== (rules.spaces !== null)) {
    throw bad(
      'encoding.rules.spaces',
      rules.level === 'char'
        ? 'encoding.rules.spaces is null, but the character level needs "keep" or "drop"'
        : `encoding.rules.spaces is ${previewValue(rules.spaces)}, but white space is kept or dropped at the character level only (null at the word level)`,
    );
  }
  const both = rules.collapse.find((t) => rules.drop.includes(t));
  if (both !== undefined) throw bad('encoding.rules.collapse', `encoding.rules.collapse: "${both}" is also in encoding.rules.drop; a token type is either dropped or collapsed`);
}
