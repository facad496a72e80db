import { resolveRules, TOKEN_TYPES, type TextRules } from '../rules/TextRules.js';
import { SHAPE_ENDS, type Shape, type ShapeEnd } from '../lexicon/Shape.js';
import { LexlockError } from '../LexlockError.js';
import { hasFields, type CorpusKind } from '../corpus/corpusKind.js';
import { RECORD_LIMIT_MOST } from '../corpus/recordLimit.js';
import { lexiconReadDefaults, type LexiconReadDefaults } from '../corpus/readCorpusFor.js';
import { BAD_TEXT_POLICIES, DEFAULT_BAD_TEXT, type BadTextPolicy } from '../artifact/badTextPolicy.js';
import type { CorpusStats } from '../corpus/CorpusStats.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { defaultThreads } from '../workers/WorkerPool.js';
import { choiceFlag, listFlag, valueOf, wholeNumberFlag, type FlagSpec, type ParsedArgs } from './parseArgs.js';

/** Flags every command that reads a corpus takes. */
export const CORPUS_FLAGS: Record<string, FlagSpec> = {
  text: { kind: 'value' },
  label: { kind: 'value' },
  'bad-text': { kind: 'value' },
  'record-limit': { kind: 'value' },
  quiet: { kind: 'switch', short: 'q' },
  threads: { kind: 'value' },
};

/** Below this corpus size, starting worker threads costs more than it saves. */
const THREADS_FROM_BYTES = 8 * 2 ** 20;

/**
 * --threads N; without it, the machine's available parallelism for corpora of 8 MiB and more (or of
 * unknown size, such as folders) and one thread for smaller files. Output is the same either way.
 */
export function threadsFlag(args: ParsedArgs, corpusBytes: number | null): number {
  const given = wholeNumberFlag(args, 'threads', 1);
  if (given !== undefined) return given;
  return corpusBytes !== null && corpusBytes < THREADS_FROM_BYTES ? 1 : defaultThreads();
}

/** Flags that fix the text rules. */
export const RULE_FLAGS: Record<string, FlagSpec> = {
  level: { kind: 'value' },
  case: { kind: 'value' },
  unicode: { kind: 'value' },
  spaces: { kind: 'value' },
  drop: { kind: 'value', repeat: true },
  collapse: { kind: 'value', repeat: true },
};

/** Flags that fix a shape. */
export const SHAPE_FLAGS: Record<string, FlagSpec> = {
  length: { kind: 'value' },
  pad: { kind: 'value' },
  cut: { kind: 'value' },
};

/** The corpus-reading options from the flags (text/label fields and the bad-text policy fall back to `defaults`, then to text and fail). */
export function corpusOptions(args: ParsedArgs, defaults: { text?: string | undefined; label?: string | undefined; badText?: BadTextPolicy | undefined } = {}) {
  const badText = choiceFlag(args, 'bad-text', BAD_TEXT_POLICIES) ?? defaults.badText ?? DEFAULT_BAD_TEXT;
  const text = valueOf(args, 'text') ?? defaults.text;
  const label = valueOf(args, 'label') ?? defaults.label;
  const key = valueOf(args, 'key');
  const recordLimit = recordLimitFlag(args);
  return {
    badText,
    ...(text === undefined ? {} : { text }),
    ...(label === undefined ? {} : { label }),
    ...(key === undefined ? {} : { key }),
    ...(recordLimit === undefined ? {} : { maxRecordBytes: recordLimit }),
  };
}

const MIB = 2 ** 20;

/** --record-limit MiB as bytes (1 to 256 MiB), or undefined for the reader's default (64 MiB). */
function recordLimitFlag(args: ParsedArgs): number | undefined {
  const mib = wholeNumberFlag(args, 'record-limit', 1);
  if (mib === undefined) return undefined;
  if (mib * MIB > RECORD_LIMIT_MOST) {
    throw new LexlockError('USAGE_BAD_VALUE', `--record-limit: ${mib} MiB is more than the ${RECORD_LIMIT_MOST / MIB} MiB a record may have; give at most ${RECORD_LIMIT_MOST / MIB}`, { field: '--record-limit' });
  }
  return mib * MIB;
}

function typesFlag(args: ParsedArgs, name: string): Array<(typeof TOKEN_TYPES)[number]> {
  const list = listFlag(args, name);
  for (const t of list) {
    if (!(TOKEN_TYPES as readonly string[]).includes(t)) {
      throw new LexlockError('USAGE_BAD_VALUE', `--${name}: "${t}" is not a token type; use ${TOKEN_TYPES.join(', ')}`, { field: `--${name}` });
    }
  }
  return list as Array<(typeof TOKEN_TYPES)[number]>;
}

/** The text rules from the flags. */
export function rulesFromFlags(args: ParsedArgs): TextRules {
  const level = choiceFlag(args, 'level', ['word', 'char'] as const);
  const letterCase = choiceFlag(args, 'case', ['lower', 'keep'] as const);
  const unicode = choiceFlag(args, 'unicode', ['NFKC', 'NFC', 'none'] as const);
  const spaces = choiceFlag(args, 'spaces', ['keep', 'drop'] as const);
  if (spaces !== undefined && level !== 'char') {
    throw new LexlockError('USAGE_BAD_VALUE', '--spaces: white space is kept or dropped at --level char only (words never hold it); remove --spaces or add --level char', {
      field: '--spaces',
    });
  }
  return resolveRules({
    ...(spaces === undefined ? {} : { spaces }),
    ...(level === undefined ? {} : { level }),
    ...(letterCase === undefined ? {} : { case: letterCase }),
    ...(unicode === undefined ? {} : { unicode }),
    drop: typesFlag(args, 'drop'),
    collapse: typesFlag(args, 'collapse'),
  });
}

/** What each end means for --pad and --cut, for the message that refuses any other value. */
const END_MEANING = {
  pad: 'start puts the padding zeros before the tokens, end after them',
  cut: 'start makes a long document lose its first tokens, end its last',
} as const;

function endFlag(args: ParsedArgs, name: 'pad' | 'cut'): ShapeEnd | undefined {
  const raw = valueOf(args, name);
  if (raw === undefined || (SHAPE_ENDS as readonly string[]).includes(raw)) return raw as ShapeEnd | undefined;
  throw new LexlockError('USAGE_BAD_VALUE', `--${name}: "${raw}" is not an end of a row; use start or end (${END_MEANING[name]})`, { field: `--${name}` });
}

/** The shape from --length/--pad/--cut (pad and cut default to end), or null without --length. */
export function shapeFromFlags(args: ParsedArgs): Shape | null {
  const length = wholeNumberFlag(args, 'length', 1);
  const pad = endFlag(args, 'pad');
  const cut = endFlag(args, 'cut');
  if (length === undefined) {
    if (pad !== undefined || cut !== undefined) {
      const flag = pad !== undefined ? '--pad' : '--cut';
      throw new LexlockError('USAGE_MISSING', `${flag} needs --length: padding and cutting apply to a fixed length`, { field: flag });
    }
    return null;
  }
  return { length, pad: pad ?? 'end', cut: cut ?? 'end' };
}

/** The corpus fields a lexicon or tally records: the text field for kinds with fields, and the label field. */
export function corpusFields(kind: CorpusKind, options: { text?: string; label?: string }): { text: string | null; label: string | null } {
  return { text: hasFields(kind) ? (options.text ?? 'text') : null, label: options.label ?? null };
}

/**
 * Defaults for reading a corpus with a lexicon: the text and label fields it was built from, where the
 * corpus kind has fields at all (a .txt or folder corpus gets none), and its bad-text policy (see
 * {@link lexiconReadDefaults}, which readCorpusFor applies too).
 */
export function lexiconFieldDefaults(corpus: string, lexicon: Lexicon): LexiconReadDefaults {
  return lexiconReadDefaults(corpus, lexicon);
}

/** The lines build and tally print after their summary about documents with invalid UTF-8. */
export function badTextNotes(stats: Pick<CorpusStats, 'replaced' | 'skipped'>): string {
  let out = '';
  if (stats.replaced > 0) out += `note: ${stats.replaced} documents had invalid UTF-8 replaced\n`;
  if (stats.skipped > 0) out += `note: ${stats.skipped} documents with invalid UTF-8 were skipped\n`;
  return out;
}
