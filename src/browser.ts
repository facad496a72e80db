// lexlock for serving in browsers (dist/browser.js, one self-contained file): load the lexicon a
// model was trained with and encode text exactly as training did. Nothing below imports node: modules;
// corpus tools (tallies, builds, audits) are in the main entry.
export { VERSION } from './version.js';
export { LexlockError, isLexlockError, formatWhere, type Where, type LexlockErrorCode } from './LexlockError.js';
export { resolveRules, DEFAULT_RULES, TOKEN_TYPES, WORD_TOKENIZER, CHAR_TOKENIZER, type TextRules, type TextRulesInput, type TokenType } from './rules/TextRules.js';
export { tokenize } from './rules/tokenize.js';
export { Lexicon, PADDING_ID, type Batch, type EncodeOptions, type EncodeBytesOptions } from './lexicon/Lexicon.js';
export { BAD_TEXT_POLICIES, type BadTextPolicy } from './artifact/badTextPolicy.js';
export { peekText, type TextPeek, type PeekedToken } from './lexicon/peekText.js';
export { checkShape, describeShape, SHAPE_ENDS, type Shape, type ShapeEnd } from './lexicon/Shape.js';
export { parseLexicon, type ParseLexiconOptions } from './artifact/parseLexicon.js';
export { fetchLexicon } from './artifact/fetchLexicon.js';
export { canonicalJson } from './artifact/canonicalJson.js';
export { fingerprintOf } from './artifact/fingerprint.js';
export { PROBE_TEXTS } from './artifact/canaries.js';
export { FORMAT_VERSION, LEXICON_FORMAT, type Encoding, type Fit, type Canary, type LexiconFile } from './artifact/schema.js';
