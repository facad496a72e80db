// lexlock's browser-safe public API: nothing below this file imports node: modules.
export { VERSION } from './version.js';
export { LexlockError, isLexlockError, formatWhere, type Where, type LexlockErrorCode } from './LexlockError.js';
export {
  resolveRules,
  DEFAULT_RULES,
  TOKEN_TYPES,
  WORD_TOKENIZER,
  CHAR_TOKENIZER,
  type TextRules,
  type TextRulesInput,
  type TokenType,
} from './rules/TextRules.js';
export { tokenize } from './rules/tokenize.js';
export { Tally, type LabelledText, type LabelCounts } from './tally/Tally.js';
export { nearestRank, summarizeLengths, type LengthSummary } from './tally/nearestRank.js';
export { freeze, DEFAULT_CAP, type FreezeOptions } from './lexicon/freeze.js';
export { Lexicon, PADDING_ID, type Batch, type EncodeOptions, type EncodeBytesOptions } from './lexicon/Lexicon.js';
export { BAD_TEXT_POLICIES, type BadTextPolicy } from './artifact/badTextPolicy.js';
export { peekText, type TextPeek, type PeekedToken } from './lexicon/peekText.js';
export { checkShape, describeShape, SHAPE_ENDS, type Shape, type ShapeEnd } from './lexicon/Shape.js';
export { DEFAULT_SEED, type Split, type SplitPlan } from './split/Split.js';
export { splitOf, splitChooser, splitPoint } from './split/splitOf.js';
export { parseSplits } from './split/parseSplits.js';
export { checkSplits } from './split/checkSplits.js';
export { parseLexicon, type ParseLexiconOptions } from './artifact/parseLexicon.js';
export { fetchLexicon } from './artifact/fetchLexicon.js';
export { serializeLexicon } from './artifact/serializeLexicon.js';
export { canonicalJson } from './artifact/canonicalJson.js';
export { fingerprintOf } from './artifact/fingerprint.js';
export { PROBE_TEXTS } from './artifact/canaries.js';
export { FORMAT_VERSION, LEXICON_FORMAT, type Encoding, type Fit, type Canary, type LexiconFile } from './artifact/schema.js';
export { auditCorpus, type AuditOptions } from './audit/auditCorpus.js';
export type { CoverageReport, LabelAudit, TokenCount, Suggestions, Drift } from './audit/CoverageReport.js';
export {
  identifyingTokens,
  identifyingTokensOf,
  IDENTIFYING_KINDS,
  type IdentifyingTokens,
  type IdentifyingKind,
  type IdentifyingKindCount,
} from './audit/identifyingTokens.js';
export { JSON_FILE_MOST_BYTES } from './artifact/jsonFileLimit.js';
export { renderReport, type ReportContext } from './audit/report/renderReport.js';
export { compareLexicons, type CompareOptions } from './audit/compareLexicons.js';
export type { LexiconComparison } from './audit/compare/LexiconComparison.js';
export { tallyFileText } from './tally/tallyFileText.js';
export { tallyFileParse } from './tally/tallyFileParse.js';
export { tallyFileMerge, type NamedTallyFile } from './tally/tallyFileMerge.js';
export type { TallyFile } from './tally/tallyFile.js';
export { boundedTally, type BoundedTally, type BoundedTallyOptions } from './tally/boundedTally.js';
export { memoryPlan, limitFor, LEAST_LIMIT_MIB, type MemoryPlan, type MemoryNeeds } from './tally/memoryPlan.js';
export type { MeasuredFit } from './lexicon/measuredFit.js';
export {
  encodeBatches,
  type BatchDocument,
  type BatchOptions,
  type BatchCounts,
  type BatchStream,
  type ShuffleOptions,
  type KeyedBatch,
} from './training/encodeBatches.js';
export { labelWeights, labelWeightsOf } from './training/labelWeights.js';
