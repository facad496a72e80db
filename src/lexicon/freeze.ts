import { LexlockError } from '../LexlockError.js';
import { makeCanaries } from '../artifact/canaries.js';
import { BAD_TEXT_POLICIES, DEFAULT_BAD_TEXT, type BadTextPolicy } from '../artifact/badTextPolicy.js';
import type { Encoding, Fit } from '../artifact/schema.js';
import { summarizeLengths } from '../tally/nearestRank.js';
import type { Tally } from '../tally/Tally.js';
import { VERSION } from '../version.js';
import { DEFAULT_CAP } from './defaultCap.js';
import { Lexicon } from './Lexicon.js';
import { capTie, type CapTie } from './capTie.js';
import { corpusName } from './corpusName.js';
import { topRanked } from './topRanked.js';
import { SeenTokens } from './SeenTokens.js';
import { coveragePoints, type MeasuredFit } from './measuredFit.js';
import { checkShape, type Shape } from './Shape.js';

/** How a tally becomes a lexicon. Every member is optional. */
export interface FreezeOptions {
  /** Keep at most this many ranked tokens (default {@link DEFAULT_CAP}); null keeps all. */
  cap?: number | null;
  /** Drop tokens counted fewer times (default 1). */
  minCount?: number;
  /** `first`: OOV is id 1 (default); `last`: OOV is the last id. */
  oov?: 'first' | 'last';
  /** Tokens that take the ids right after the specials, whether or not the corpus has them. */
  reserved?: readonly string[];
  /** The fixed shape encodings get by default. */
  shape?: Shape | null;
  /** Store the tally's labels (default true; false builds a lexicon without labels). */
  labels?: boolean;
  /**
   * Texts to keep as canaries beside the fixed probes (default none). They ship inside the lexicon to
   * whoever loads it, so pass no corpus document that may hold personal data; `lexlock build` passes none.
   */
  snippets?: readonly string[];
  /** The corpus, for the fit record: only its last segment is kept (`reviews.csv`, not its folders). */
  source?: string | null;
  /** The corpus fields the text and labels came from, recorded so `encode` can default to them. */
  fields?: { text: string | null; label: string | null };
  /**
   * The bad-text policy the corpus was read with (default `fail`), recorded so every reader of the
   * lexicon defaults to it (see {@link Lexicon.badText}).
   */
  badText?: BadTextPolicy;
  /** Time of the build, for the fit record (default now). */
  now?: Date;
  /**
   * The fit's figures of the whole corpus when the tally holds only the tokens to keep (a bounded
   * build, see boundedTally): distinct tokens, coverage, the cap's group of equal counts, the filter.
   */
  measured?: MeasuredFit;
}

export { DEFAULT_CAP } from './defaultCap.js';


/**
 * The ranked counts (at least `minCount`, one count of each reserved token taken out: they rank
 * nowhere) of `all`, every count most first, as the number of them and a reader of the i-th, without
 * copying `all`.
 */
function rankedCounts(all: Float64Array, minCount: number, reservedCounts: readonly number[]): [number, (i: number) => number] {
  /** The first index whose count is below `c`. */
  const below = (c: number) => {
    let lo = 0;
    let hi = all.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((all[mid] as number) >= c) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  };
  const n = below(minCount);
  // Each reserved token's count leaves the ranking at one of the places that hold it.
  const removed: number[] = [];
  for (const c of reservedCounts) {
    if (c < minCount) continue;
    let at = below(c) - 1;
    while (removed.includes(at)) at--;
    removed.push(at);
  }
  removed.sort((a, b) => a - b);
  const countAt = (i: number) => {
    let p = i;
    for (const r of removed) {
      if (r > p) break;
      p++;
    }
    return all[p] as number;
  };
  return [n - removed.length, countAt];
}

function wholeNumber(value: number, name: string, min: number): number {
  if (!Number.isSafeInteger(value) || value < min) {
    throw new LexlockError('BAD_OPTION', `${name}: ${String(value)} is not a whole number of at least ${min}`, { field: name });
  }
  return value;
}

/**
 * Freezes a tally into a lexicon (encoding contract, rule 4): drop tokens under `minCount`, rank by
 * count then string order, keep the first `cap`; id 0 is padding, OOV first (1) or last.
 * @example const lexicon = freeze(tally, { cap: 12000, shape: { length: 96, pad: 'end', cut: 'start' } });
 */
export function freeze(tally: Tally, options: FreezeOptions = {}): Lexicon {
  const cap = options.cap === null ? null : wholeNumber(options.cap ?? DEFAULT_CAP, 'cap', 0);
  const minCount = wholeNumber(options.minCount ?? 1, 'minCount', 1);
  const oov = options.oov ?? 'first';
  if (oov !== 'first' && oov !== 'last') {
    throw new LexlockError('BAD_OPTION', `oov: "${String(oov)}" is not a place; use first or last`, { field: 'oov' });
  }
  const reserved = [...(options.reserved ?? [])];
  const reservedSet = new Set<string>();
  for (const r of reserved) {
    if (r === '') throw new LexlockError('BAD_OPTION', 'reserved: a reserved token cannot be empty', { field: 'reserved' });
    if (reservedSet.has(r)) throw new LexlockError('BAD_OPTION', `reserved: "${r}" is listed twice`, { field: 'reserved' });
    reservedSet.add(r);
  }
  const shape = options.shape ? checkShape({ ...options.shape }) : null;
  const badText = options.badText ?? DEFAULT_BAD_TEXT;
  if (!BAD_TEXT_POLICIES.includes(badText)) {
    throw new LexlockError('BAD_OPTION', `badText: "${String(badText)}" is not one of ${BAD_TEXT_POLICIES.join(', ')}`, { field: 'badText' });
  }

  // The kept tokens, in rank order, without ranking every token; then every count, most first, for
  // coverage and the cap's group of equal counts (one typed array, however many tokens there are).
  const kept = topRanked((visit) => tally.forEachCount(visit), cap ?? Infinity, (t, n) => n >= minCount && !reservedSet.has(t));
  const measured = options.measured;
  let coverage: Fit['coverage'];
  let tie: CapTie | null;
  if (measured !== undefined) {
    coverage = measured.coverage;
    tie = cap === null ? null : measured.capTie;
  } else {
    const all = tally.countList().sort().reverse();
    coverage = coveragePoints(all, tally.tokens, cap, true);
    tie = cap === null ? null : capTie(...rankedCounts(all, minCount, reserved.map((r) => tally.countOf(r))), cap);
  }
  const withLabels = options.labels ?? true;
  const labels = withLabels && tally.labels.size > 0 ? [...tally.labels.keys()].sort() : null;

  const encoding: Encoding = {
    rules: tally.rules,
    layout: { oov, reserved: reserved.length },
    tokens: [...reserved, ...kept.map(([t]) => t)],
    labels,
    shape,
  };

  let inVocabulary = 0;
  for (const [, n] of kept) inVocabulary += n;
  for (const r of reserved) inVocabulary += tally.countOf(r);
  const oovTokens = tally.tokens - inVocabulary;


  let truncation: Fit['truncation'] = null;
  if (shape !== null) {
    let truncatedDocuments = 0;
    let droppedTokens = 0;
    for (const [len, docs] of tally.lengths) {
      if (len > shape.length) {
        truncatedDocuments += docs;
        droppedTokens += (len - shape.length) * docs;
      }
    }
    truncation = { length: shape.length, truncatedDocuments, droppedTokens };
  }

  const fit: Fit = {
    createdAt: (options.now ?? new Date()).toISOString(),
    lexlockVersion: VERSION,
    source: options.source == null ? null : corpusName(options.source),
    textField: options.fields?.text ?? null,
    labelField: options.fields?.label ?? null,
    badText,
    cap,
    minCount,
    documents: tally.documents,
    tokens: tally.tokens,
    types: measured?.types ?? tally.types,
    ...(measured?.typesEstimated === true ? { typesEstimated: true } : {}),
    oovTokens,
    oovRate: tally.tokens === 0 ? 0 : oovTokens / tally.tokens,
    length: summarizeLengths(tally.lengths),
    labels: [...tally.labels.entries()]
      .sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0))
      .map(([label, c]) => ({ label, documents: c.documents, tokens: c.tokens })),
    coverage,
    truncation,
    capTie: tie,
    seen: (measured === undefined ? SeenTokens.of(tally.tokenList(), tally.types) : measured.seen)?.toJSON() ?? null,
  };

  return new Lexicon(encoding, fit, makeCanaries(tally.rules, options.snippets ?? []));
}
