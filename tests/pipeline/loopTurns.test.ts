// The pipeline's loops give the event loop a turn every 100 ms or so (issue 13: SIGINT and SIGTERM are
// handled only when it turns), a very long document included: its tokens are found ahead in steps with
// turns between them, and the consumer takes them. Turns are counted against a clock of the test's own,
// never timed; results with long documents must be exactly those without the pipeline.
import { describe, expect, it } from 'vitest';
import { AuditCounts } from '../../src/audit/AuditCounts.js';
import { auditReport } from '../../src/audit/auditCorpus.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { boundedCorpusTally } from '../../src/pipeline/boundedCorpusTally.js';
import { auditOnThreads } from '../../src/pipeline/auditOnThreads.js';
import { encodeCorpus } from '../../src/pipeline/encodeCorpus.js';
import { LONG_DOCUMENT, LoopTurns, TURN_EVERY_MS, withTurns } from '../../src/pipeline/loopTurns.js';
import { tallyAndRecord } from '../../src/pipeline/tallyAndRecord.js';
import { tallyCorpus } from '../../src/pipeline/tallyCorpus.js';
import { scanWork } from '../../src/rules/fast/scanWork.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';
import { Tally } from '../../src/tally/Tally.js';
import { freshFolderEachTest } from '../helpers/cli.js';
import { HOSTILE_FAMILIES, hostileText } from '../rules/fast/hostileText.js';

const rules = resolveRules();
const tmp = freshFolderEachTest();

/** Turns of the event loop that happen while `work` runs: a chain of setImmediate callbacks. */
async function turnsDuring(work: () => Promise<unknown>): Promise<number> {
  let turns = 0;
  let running = true;
  const tick = () => {
    if (!running) return;
    turns += 1;
    setImmediate(tick);
  };
  setImmediate(tick);
  // Started after the chain, so a turn of its own counts only if the loop really turns.
  await work();
  running = false;
  return turns;
}

/** A clock that moves on by `step` ms each time it is read. */
function steppingClock(step: number): () => number {
  let now = 0;
  return () => (now += step);
}

const LONG = [`Depart 10 am ${hostileText(HOSTILE_FAMILIES[0] as (typeof HOSTILE_FAMILIES)[number], LONG_DOCUMENT + 5_000)} Ärø`, `${hostileText(HOSTILE_FAMILIES[4] as (typeof HOSTILE_FAMILIES)[number], 2 * LONG_DOCUMENT)} ferry`];
const DOCUMENTS = [{ text: 'the late ferry', label: 'delays' }, { text: LONG[0] as string, label: 'delays' }, { text: 'lovely crew', label: 'praise' }, { text: LONG[1] as string, label: 'praise' }];

describe('LoopTurns', () => {
  it('turns the loop only when due, and never for a short document when not due', async () => {
    const still = new LoopTurns(null, () => 0);
    expect(still.before('short')).toBeNull();
    const moving = new LoopTurns(null, steppingClock(TURN_EVERY_MS));
    expect(await turnsDuring(async () => await moving.before('short'))).toBeGreaterThan(0);
  });

  it('finds a long document\'s tokens in steps, turning the loop between them, and the consumer takes them', async () => {
    const text = LONG[0] as string;
    const turns = new LoopTurns({ rules, strings: true }, steppingClock(TURN_EVERY_MS));
    // One step is 2^18 units of work: a document of this size takes several, each followed by a turn
    // (the clock says one is due at every look).
    expect(await turnsDuring(async () => await turns.before(text))).toBeGreaterThanOrEqual(3);
    const before = scanWork.units;
    const tokens = tokenize(text, rules);
    expect(scanWork.units).toBe(before);
    expect(tokens).toEqual(tokenize(text, rules));
    expect(tokens.length).toBeGreaterThan(LONG_DOCUMENT / 2);
  });

  it('turns the loop for a reader that never waits on it (withTurns)', async () => {
    const many = Array.from({ length: 50 }, (_, i) => `document ${i}`);
    const seen: string[] = [];
    const turns = await turnsDuring(async () => {
      for await (const doc of withTurns(many, null, new LoopTurns(null, steppingClock(TURN_EVERY_MS)))) seen.push(doc);
    });
    expect(seen).toEqual(many);
    expect(turns).toBeGreaterThanOrEqual(50);
  });
});

describe('the pipeline with very long documents gives what it gives without turns', () => {
  const expected = Tally.fromTexts(DOCUMENTS, rules);

  it('tallyCorpus and boundedCorpusTally', async () => {
    const { tally } = await tallyCorpus(DOCUMENTS, rules);
    expect(tally.toCounts()).toEqual(expected.toCounts());
  });

  it('boundedCorpusTally: long documents with white space in them, and a refusal for one without', async () => {
    // A bounded build tokenizes no document ahead (that would hold all its tokens past the memory
    // plan): a long document is taken a piece at a time, between turns, if its runs without white
    // space fit the plan, and refused by name otherwise.
    const spaced = [{ text: 'the late ferry', label: 'delays' }, { text: `${'late ferry again '.repeat(LONG_DOCUMENT / 8)}Ärø`, label: 'delays' }, { text: 'lovely crew', label: 'praise' }];
    const options = { cap: 10, minCount: 1, reserved: [], memoryLimitMiB: 64 };
    const bounded = await boundedCorpusTally(() => withTurns(spaced, null), rules, options);
    // Occurrences per token (a bounded tally ranks its tokens and keeps no document frequency).
    const occurrences = (t: Tally) => new Map([...t.entries()].map(([token, n]) => [token, n] as const));
    expect(occurrences(bounded.tally)).toEqual(occurrences(Tally.fromTexts(spaced, rules)));
    await expect(boundedCorpusTally(() => withTurns(DOCUMENTS, null), rules, options)).rejects.toThrow(
      'document 2 holds text with no white space to cut it at that takes about 60 MiB to tokenize, more than the 2 MiB --memory-limit 64 allows; try --memory-limit 1920',
    );
  });

  it('encodeCorpus, tallyAndRecord and auditOnThreads', async () => {
    const lexicon = freeze(expected, { cap: 20 });
    const rows: number[][] = [];
    await encodeCorpus(DOCUMENTS, lexicon, null, { row: (ids) => void rows.push(Array.from(ids)) });
    expect(rows).toEqual(DOCUMENTS.map((d) => Array.from(lexicon.encode(d.text, { shape: null }))));
    const recorded = await tallyAndRecord(DOCUMENTS, rules, tmp.path('spill'));
    expect(recorded.tally.toCounts()).toEqual(expected.toCounts());
    await recorded.discard();
    const counts = new AuditCounts(lexicon, 8);
    for (const d of DOCUMENTS) counts.add(d.text, d.label);
    expect(await auditOnThreads(DOCUMENTS, lexicon, { shape: { length: 8, pad: 'end', cut: 'end' } })).toEqual(auditReport(counts, lexicon, { shape: { length: 8, pad: 'end', cut: 'end' } }));
  });
});
