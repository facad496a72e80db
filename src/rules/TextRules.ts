import { LexlockError } from '../LexlockError.js';

/** The token types wink-tokenizer tags tokens with; `drop` and `collapse` name them. */
export const TOKEN_TYPES = [
  'alien',
  'currency',
  'email',
  'emoji',
  'emoticon',
  'hashtag',
  'mention',
  'number',
  'ordinal',
  'punctuation',
  'quoted_phrase',
  'symbol',
  'time',
  'url',
  'word',
] as const;

/** One of {@link TOKEN_TYPES}. */
export type TokenType = (typeof TOKEN_TYPES)[number];

/** The word tokenizer the word level is defined by; stored in every lexicon so a change is seen. */
export const WORD_TOKENIZER = 'wink-tokenizer@5.3.0';
/** The character-level tokenizer (ours); its version changes if its definition ever does. */
export const CHAR_TOKENIZER = 'lexlock-chars@1';

/**
 * Everything that decides how text becomes tokens (encoding contract, rules 1 and 2).
 * `drop` and `collapse` apply to the word level only and are kept sorted.
 */
export interface TextRules {
  level: 'word' | 'char';
  unicode: 'NFKC' | 'NFC' | 'none';
  case: 'lower' | 'keep';
  /** Token types left out entirely. */
  drop: TokenType[];
  /** Token types replaced by one placeholder token each, `<number>`, `<url>`… */
  collapse: TokenType[];
  /**
   * Character level only (null at the word level): `keep` makes each run of white space one token, a
   * single space; `drop` leaves white space out.
   */
  spaces: 'keep' | 'drop' | null;
  /** `name@version` of the tokenizer the rules were fixed with. */
  tokenizer: string;
}

/**
 * What a caller may pass: any subset of the rules; the rest take their defaults (`spaces`: `keep` at
 * the character level).
 */
export type TextRulesInput = Partial<Omit<TextRules, 'tokenizer' | 'spaces'>> & { spaces?: 'keep' | 'drop' };

/** The default rules: word level, NFKC, lower-case, nothing dropped or collapsed. */
export const DEFAULT_RULES: Readonly<TextRules> = Object.freeze({
  level: 'word',
  unicode: 'NFKC',
  case: 'lower',
  drop: [],
  collapse: [],
  spaces: null,
  tokenizer: WORD_TOKENIZER,
});

/** The placeholder token a collapsed type becomes, e.g. `<number>`. */
export function placeholderOf(type: TokenType): string {
  return `<${type}>`;
}

function checkTypes(list: readonly string[], option: string): TokenType[] {
  const known = new Set<string>(TOKEN_TYPES);
  for (const t of list) {
    if (!known.has(t)) {
      throw new LexlockError(
        'BAD_OPTION',
        `${option}: unknown token type "${t}"; use one of ${TOKEN_TYPES.join(', ')}`,
        { field: option },
      );
    }
  }
  return [...new Set(list as TokenType[])].sort();
}

/**
 * Completes and checks rules: fills defaults, validates values, sorts `drop`/`collapse`,
 * and records the tokenizer. Throws `BAD_OPTION` naming the option.
 * @example resolveRules({ level: 'char' }) // { level: 'char', unicode: 'NFKC', case: 'lower', ... }
 */
export function resolveRules(input: TextRulesInput = {}): TextRules {
  const level = input.level ?? DEFAULT_RULES.level;
  const unicode = input.unicode ?? DEFAULT_RULES.unicode;
  const letterCase = input.case ?? DEFAULT_RULES.case;
  if (level !== 'word' && level !== 'char') {
    throw new LexlockError('BAD_OPTION', `level: "${String(level)}" is not a level; use word or char`, { field: 'level' });
  }
  if (unicode !== 'NFKC' && unicode !== 'NFC' && unicode !== 'none') {
    throw new LexlockError('BAD_OPTION', `unicode: "${String(unicode)}" is not a normalization; use NFKC, NFC or none`, {
      field: 'unicode',
    });
  }
  if (letterCase !== 'lower' && letterCase !== 'keep') {
    throw new LexlockError('BAD_OPTION', `case: "${String(letterCase)}" is not a case rule; use lower or keep`, { field: 'case' });
  }
  const drop = checkTypes(input.drop ?? [], 'drop');
  const collapse = checkTypes(input.collapse ?? [], 'collapse');
  if (level === 'char' && (drop.length > 0 || collapse.length > 0)) {
    throw new LexlockError('BAD_OPTION', 'drop/collapse: token types exist at the word level only; remove them or use level word', {
      field: drop.length > 0 ? 'drop' : 'collapse',
    });
  }
  const both = drop.filter((t) => collapse.includes(t));
  if (both.length > 0) {
    throw new LexlockError('BAD_OPTION', `drop/collapse: "${both[0]}" is both dropped and collapsed; choose one`, { field: 'collapse' });
  }
  const spaces = input.spaces;
  if (spaces !== undefined && spaces !== 'keep' && spaces !== 'drop') {
    throw new LexlockError('BAD_OPTION', `spaces: "${String(spaces)}" is not a space rule; use keep or drop`, { field: 'spaces' });
  }
  if (level === 'word' && spaces !== undefined) {
    throw new LexlockError('BAD_OPTION', 'spaces: white space is kept or dropped at the character level only (the word level never makes a token of it); remove it or use level char', {
      field: 'spaces',
    });
  }
  return {
    level,
    unicode,
    case: letterCase,
    drop,
    collapse,
    spaces: level === 'word' ? null : (spaces ?? 'keep'),
    tokenizer: level === 'word' ? WORD_TOKENIZER : CHAR_TOKENIZER,
  };
}
