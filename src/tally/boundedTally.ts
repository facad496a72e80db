import { formatWhere, LexlockError, type Where } from '../LexlockError.js';
import { capTie } from '../lexicon/capTie.js';
import { coveragePoints, type MeasuredFit } from '../lexicon/measuredFit.js';
import { SeenTokens } from '../lexicon/SeenTokens.js';
import { SpanIndex } from '../rules/SpanIndex.js';
import type { TextRules } from '../rules/TextRules.js';
import { TokenSpans } from '../rules/TokenSpans.js';
import { CandidateTable } from './CandidateTable.js';
import { DistinctEstimate } from './DistinctEstimate.js';
import { formatBytes, limitFor, memoryPlan, MOST_LIMIT_MIB, resultBytesFor, type MemoryNeeds, type MemoryPlan } from './memoryPlan.js';
import { scanPieces } from './scanPieces.js';
import { SpaceSaving } from './SpaceSaving.js';
import { spanHash, spanHashes } from './spanHashes.js';
import { Tally, type LabelledText } from './Tally.js';
import { TokenLengths } from './TokenLengths.js';

const times = (n: number) => (n === 1 ? 'once' : `${n.toLocaleString('en-US')} times`);
const count = (n: number) => n.toLocaleString('en-US');

/** Heap a label costs in the count (its string, map entry and figures), besides 2 bytes a character. */
const BYTES_PER_LABEL = 96;

/** What {@link boundedTally} needs to know. */
export interface BoundedTallyOptions {
  /** Ranked tokens the lexicon will keep (reserved ones not included). */
  cap: number;
  minCount: number;
  /** Reserved tokens: they leave the ranking, so one more ranked token each must be exact. */
  reserved?: readonly string[];
  /** The memory limit in MiB (see memoryPlan): counters, documents, labels and the lexicon all fit in it. */
  memoryLimitMiB: number;
  /** The plan to count with instead of the limit's own (tests pass small ones; a refusal still names a real limit). */
  plan?: MemoryPlan;
}

/** A tally whose counts are exact for every token the lexicon keeps, counted in bounded memory. */
export interface BoundedTally {
  /**
   * Documents, tokens, lengths and labels of the whole corpus; of the tokens, only those the lexicon
   * keeps (the top `cap`) and the reserved ones, with their exact counts (document frequency is not
   * counted: 0).
   */
  tally: Tally;
  /** The fit's figures of the whole corpus, for freeze (`measured`). */
  measured: MeasuredFit;
  /** Counters the limit paid for. */
  capacity: number;
  /** The most any token not counted exactly occurred. */
  floor: number;
  /** Passes over the corpus: 1 when every distinct token fit in the counters, else 2. */
  passes: number;
}

type Document = string | (LabelledText & { where?: Where });

/** What one pass saw of the corpus, beside the counts. */
interface PassFigures {
  documents: number;
  tokens: number;
  /** Bytes the longest uncut run too long for the limit would have needed to be tokenized (0: none). */
  runBytes: number;
  /** Characters of such runs, which were not counted (at most one token each). */
  skippedChars: number;
  /** The first document with such a run. */
  runWhere: string | null;
}

/**
 * Counts a corpus too large for an exact in-memory tally in bounded memory, and proves the result is the
 * exact top `cap`: pass 1 keeps a Space-Saving summary (Metwally, Agrawal, El Abbadi 2005) of as many
 * counters as the limit pays for, and, for the fit, a Bloom filter of every token and an estimate of
 * how many are distinct; when every distinct token had a counter of its own its counts are exact and
 * that is all. Otherwise pass 2 counts exactly the tokens that can still make the cap; every token
 * that could rank in it is then counted exactly, because the cap-th exact count exceeds the most any
 * other token can have. When that cannot be shown, or the lexicon, a document or the labels would not
 * fit, it throws `MEMORY_LIMIT` naming a limit that will do. `open` must give the same documents each
 * time it is called; documents are tokenized a piece at a time (see scanPieces).
 * @example
 * const { tally, measured } = await boundedTally(() => readCorpus('big.txt'), resolveRules(), { cap: 50000, minCount: 1, memoryLimitMiB: 256 });
 * const lexicon = freeze(tally, { cap: 50000, measured });
 */
export async function boundedTally(
  open: () => AsyncIterable<Document> | Iterable<Document>,
  rules: TextRules,
  options: BoundedTallyOptions,
): Promise<BoundedTally> {
  const reserved = [...new Set(options.reserved ?? [])];
  const places = options.cap + reserved.length;
  const plan = options.plan ?? memoryPlan(options.memoryLimitMiB, places);
  const summary = reserve(() => new SpaceSaving(plan.counters, plan.arenaUnits), plan);
  const seen = SeenTokens.collecting();
  const distinct = new DistinctEstimate();
  const lengths = new TokenLengths();
  const reservedIndex = new SpanIndex(reserved);
  const reservedCounts = new Float64Array(reserved.length);
  const tally = new Tally(rules);
  const labels = { held: 0, extra: 0 };
  const hashes = new Int32Array(3);

  // Pass 1.
  const first = await pass(open(), rules, plan, (src, from, to, folded) => {
    spanHashes(src, from, to, folded, hashes);
    // A token monitored already was offered before, and both record a token once: nothing to add.
    if (!summary.offer(hashes[0] as number, src, from, to, folded)) {
      seen.addHashes(hashes[1] as number, hashes[2] as number);
      distinct.add(hashes[1] as number, hashes[2] as number);
    }
    lengths.add(to - from);
    if (reserved.length > 0) {
      const r = reservedIndex.indexOfSpan(src, from, to, folded);
      if (r >= 0) reservedCounts[r] = (reservedCounts[r] as number) + 1;
    }
  }, (tokens, label) => {
    tally.documents += 1;
    tally.tokens += tokens;
    tally.lengths.set(tokens, (tally.lengths.get(tokens) ?? 0) + 1);
    if (label === undefined) return;
    const known = tally.labels.get(label);
    if (known !== undefined) {
      known.documents += 1;
      known.tokens += tokens;
      return;
    }
    const bytes = BYTES_PER_LABEL + 2 * label.length;
    if (labels.held + bytes > plan.labelBytes) labels.extra += bytes;
    else {
      labels.held += bytes;
      tally.labels.set(label, { documents: 1, tokens });
    }
  });
  // Tokens in runs too long to tokenize within the limit were not counted: each character may have been one.
  const total = summary.total + first.skippedChars;
  if (first.skippedChars > 0) lengths.add(first.skippedChars);

  // Candidates: a monitored token's true count lies between count - error and count, so one whose count
  // is below the `places`-th largest count - error is beaten by `places` tokens for sure.
  const monitored = summary.monitored();
  const scratch = Float64Array.from(monitored, (c) => summary.countAt(c) - summary.errorAt(c)).sort().reverse();
  const bar = Math.max(options.minCount, places > 0 && monitored.length >= places ? (scratch[places - 1] as number) : 0);
  const floor = summary.floor;
  let passes = 1;
  // exact[c]: monitored counter c's exact count, or -1 when it is not counted exactly.
  const exact = reserve(() => new Float64Array(summary.capacity), plan);
  if (floor === 0 && first.skippedChars === 0) {
    for (const c of monitored) exact[c] = summary.countAt(c);
  } else {
    passes = 2;
    let candidates = 0;
    for (const c of monitored) {
      exact[c] = summary.countAt(c) >= bar ? 0 : -1;
      if ((exact[c] as number) >= 0) candidates += 1;
    }
    // Pass 2 looks tokens up among the candidates only, in a table of their own (see CandidateTable),
    // made in `scratch`, whose values are not needed again (it is refilled after this pass), when it
    // fits there: usually, candidates being a few per cent of the counters. Else in the summary's table.
    let table: CandidateTable | null = null;
    if (CandidateTable.bytesFor(candidates) <= scratch.byteLength) {
      table = new CandidateTable(summary, candidates, scratch.buffer);
      for (const c of monitored) if ((exact[c] as number) >= 0) table.add(c);
    }
    const lookup = table;
    const before = summary.total;
    const second = await pass(
      open(),
      rules,
      plan,
      lookup === null
        ? (src, from, to, folded) => {
            spanHashes(src, from, to, folded, hashes);
            summary.total += 1;
            const c = summary.find(hashes[0] as number, src, from, to, folded);
            if (c >= 0 && (exact[c] as number) >= 0) exact[c] = (exact[c] as number) + 1;
          }
        : (src, from, to, folded) => {
            summary.total += 1;
            const c = lookup.find(spanHash(src, from, to, folded), src, from, to, folded);
            if (c >= 0) exact[c] = (exact[c] as number) + 1;
          },
      () => {},
    );
    const again = summary.total - before;
    summary.total = before;
    if (second.documents !== first.documents || again !== before) {
      throw new LexlockError(
        'CORPUS_CHANGED',
        `the corpus changed while it was counted: the first pass read ${count(first.documents)} documents and ${count(before)} tokens, the second ${count(second.documents)} and ${count(again)}; count it again once nothing writes to it`,
        {},
      );
    }
  }

  // Every token not counted exactly occurred at most `unknown` times: below `bar` or never monitored.
  const unknown = passes === 1 ? 0 : Math.max(floor, bar - 1);
  const reservedCounters = new Set(reserved.map((r) => findToken(summary, r, hashes)));
  // The counts known exactly, most first, for coverage (`scratch` is free again), and the counters that
  // can be kept (at least the min count, not reserved) with their counts, most first, for the ranking.
  let knownCount = 0;
  let rankableCount = 0;
  const rankable = new Int32Array(monitored.length);
  for (const c of monitored) {
    const n = exact[c] as number;
    if (n <= unknown) continue;
    scratch[knownCount++] = n;
    if (n >= options.minCount && !reservedCounters.has(c)) rankable[rankableCount++] = c;
  }
  const coverageCounts = scratch.subarray(0, knownCount).sort().reverse();
  const coverage = coveragePoints(coverageCounts, total, options.cap, passes === 1);
  const ranked = rankable.subarray(0, rankableCount);
  const rankedCounts = Float64Array.from(ranked, (c) => exact[c] as number).sort().reverse();
  const last = rankedCounts[options.cap - 1];
  // A cap of 0 keeps no ranked token: nothing to prove.
  const proven = options.cap === 0 || (last === undefined ? unknown < options.minCount : last > unknown);

  // The kept tokens: those above the cap's count, then the first of its group in string order.
  let keptCount = 0;
  for (const c of ranked) if (last === undefined || (exact[c] as number) >= last) ranked[keptCount++] = c;
  const kept = ranked.subarray(0, keptCount).sort((a, b) => (exact[b] as number) - (exact[a] as number) || summary.compareTokens(a, b)).subarray(0, options.cap);
  let keptUnits = 0;
  for (const c of kept) keptUnits += summary.lengthAt(c);
  for (const r of reserved) keptUnits += r.length;
  // Unproven, the kept tokens are not known yet: as many as the cap, as long as its longest tokens can be.
  const resultBytes = proven ? resultBytesFor(kept.length + reserved.length, keptUnits) : resultBytesFor(places, lengths.longestUnits(options.cap) + reserved.reduce((n, r) => n + r.length, 0));

  const needs: MemoryNeeds = { counters: 0, arenaUnits: 0, runBytes: first.runBytes, labelBytes: labels.extra > 0 ? labels.held + labels.extra : 0, resultBytes };
  if (!proven || resultBytes > plan.resultBytes || first.skippedChars > 0 || labels.extra > 0) {
    // The cap's count: exact when the cap's tokens were all counted; else at least the cap-th largest
    // exact count of the tokens counted in pass 2 (`scratch` is free again), and at least `bar`.
    let counted = 0;
    for (const c of monitored) {
      const n = exact[c] as number;
      if (n >= options.minCount && !reservedCounters.has(c)) scratch[counted++] = n;
    }
    const surely = scratch.subarray(0, counted).sort().reverse()[options.cap - 1] ?? 0;
    const threshold = last ?? Math.max(bar, surely);
    // Sure to do: so many counters that no token of the cap's count can be given up (Space-Saving's
    // bound, floor <= total / counters). A counter for every distinct token does too, with no token
    // given up at all: the estimate of them, with a tenth to spare, when that is less. An estimate is
    // no proof: a count that had room for it and still fell short names the sure figure.
    const sure = Math.floor(total / Math.max(threshold, 1)) + 1;
    const estimated = Math.ceil(distinct.estimate() * 1.1) + 16;
    needs.counters = summary.capacity >= estimated ? sure : Math.min(sure, estimated);
    needs.arenaUnits = lengths.arenaFor(needs.counters);
    const reasons: string[] = [];
    const limit = `--memory-limit ${count(options.memoryLimitMiB)}`;
    if (!proven && floor !== Infinity && first.skippedChars === 0) {
      reasons.push(
        `${limit} holds ${count(summary.capacity)} counters, too few to prove the top ${count(options.cap)} tokens exact on this corpus: ` +
          `the last of them occurs ${last === undefined ? 'at least ' : ''}${times(threshold)}, but a token not followed may have occurred up to ${times(floor)}; about ${count(needs.counters)} counters would do`,
      );
    }
    if (floor === Infinity) reasons.push(`a token is longer than ${limit} leaves room for`);
    if (first.skippedChars > 0) {
      reasons.push(`${first.runWhere ?? 'a document'} holds text with no white space to cut it at that takes about ${formatBytes(first.runBytes)} to tokenize, more than the ${formatBytes(plan.runBytes)} ${limit} allows`);
    }
    if (labels.extra > 0) reasons.push(`the corpus has more labels than the ${formatBytes(plan.labelBytes)} ${limit} keeps for them`);
    if (resultBytes > plan.resultBytes) {
      const lexicon = proven ? `the lexicon of ${count(kept.length + reserved.length)} tokens takes` : `the lexicon, of up to ${count(places)} tokens, may take`;
      reasons.push(`${lexicon} about ${formatBytes(resultBytes)} while it is made, more than the ${formatBytes(plan.resultBytes)} ${limit} leaves for it`);
    }
    const enough = limitFor(needs, places);
    const todo = enough === null ? `no limit up to ${count(MOST_LIMIT_MIB)} MiB would do; build without --memory-limit, or with a smaller --cap` : `try --memory-limit ${enough}`;
    throw new LexlockError('MEMORY_LIMIT', `${reasons.join('; ')}; ${todo}`, { field: '--memory-limit' });
  }

  const result = new Tally(rules);
  result.documents = tally.documents;
  result.tokens = tally.tokens;
  for (const [length, n] of tally.lengths) result.lengths.set(length, n);
  for (const [label, c] of tally.labels) result.labels.set(label, c);
  for (const c of kept) result.addToken(summary.tokenAt(c), exact[c] as number, 0);
  reserved.forEach((r, i) => {
    if ((reservedCounts[i] as number) > 0) result.addToken(r, reservedCounts[i] as number, 0);
  });

  const exactTypes = passes === 1;
  const types = exactTypes ? summary.size : Math.max(distinct.estimate(), summary.size);
  const measured: MeasuredFit = {
    types,
    typesEstimated: !exactTypes,
    coverage,
    capTie: capTie(rankedCounts.length, (i) => rankedCounts[i] as number, options.cap),
    seen: seen.folded(types),
  };
  return { tally: result, measured, capacity: summary.capacity, floor, passes };
}

/** Makes what the plan sizes, or says that the machine has not the memory the limit asks for. */
function reserve<T>(make: () => T, plan: MemoryPlan): T {
  try {
    return make();
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    throw new LexlockError(
      'MEMORY_LIMIT',
      `could not reserve the ${formatBytes(plan.poolBytes)} --memory-limit ${count(plan.limitMiB)} counts in (${e.message}): this machine has less memory to give than that; try a smaller --memory-limit`,
      { field: '--memory-limit' },
    );
  }
}

/** The counter of a token given as a string, or -1. */
function findToken(summary: SpaceSaving, token: string, hashes: Int32Array): number {
  spanHashes(token, 0, token.length, false, hashes);
  return summary.find(hashes[0] as number, token, 0, token.length, false);
}

/**
 * One pass over the documents: each token is handed to `token` as a span of a text (A-Z read as a-z
 * when folded), each document's token count and label to `document`.
 */
async function pass(
  documents: AsyncIterable<Document> | Iterable<Document>,
  rules: TextRules,
  plan: MemoryPlan,
  token: (src: string, from: number, to: number, folded: boolean) => void,
  document: (tokens: number, label: string | undefined) => void,
): Promise<PassFigures> {
  const spans = new TokenSpans(false);
  const figures: PassFigures = { documents: 0, tokens: 0, runBytes: 0, skippedChars: 0, runWhere: null };
  let n = 0;
  const each = (s: TokenSpans) => {
    const { starts, ends, strings, text, folded } = s;
    for (let k = 0; k < s.count; k++) {
      const start = starts[k] as number;
      if (start >= 0) token(text, start, ends[k] as number, folded);
      else {
        const t = strings[k] as string;
        token(t, 0, t.length, false);
      }
    }
    n += s.count;
  };
  for await (const doc of documents) {
    const text = typeof doc === 'string' ? doc : doc.text;
    n = 0;
    const skipped = scanPieces(text, rules, spans, each, plan.runBytes);
    if (skipped !== null) {
      figures.runWhere ??= typeof doc !== 'string' && doc.where !== undefined ? formatWhere(doc.where) : `document ${count(figures.documents + 1)}`;
      figures.runBytes = Math.max(figures.runBytes, skipped.bytes);
      figures.skippedChars += skipped.chars;
    }
    figures.documents += 1;
    figures.tokens += n;
    document(n, typeof doc === 'string' ? undefined : doc.label);
  }
  return figures;
}
