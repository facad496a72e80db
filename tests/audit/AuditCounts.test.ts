// AuditCounts counts a known token by its id and only OOV tokens in its tally (issue 15, goal 2:
// auditing as fast as encoding). The figures must be exactly the definition's: every document's
// tokens as strings (`tokenize`) counted in a plain Tally, ids from `idOf`, OOV where the id is the
// OOV id; and counts made in parts and merged must equal the whole (threads rely on it).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { AuditCounts } from '../../src/audit/AuditCounts.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules, type TextRules } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';
import { Tally } from '../../src/tally/Tally.js';

const WORDS = ['the', 'The', 'FERRY', 'ferry', 'late', 'LATE', 'again', 'été', 'ÉTÉ', 'İzmir', 'pier@harbour.example', '10:30', 'disembarkationpoint', 'ﬁne', '😀', '__proto__', ',', '!', 'x'];
const text = fc.array(fc.tuple(fc.constantFrom(...WORDS), fc.constantFrom(' ', ', ', '\n', '')), { maxLength: 12 }).map((p) => p.map(([w, g]) => w + g).join(''));
const doc = fc.record({ text, label: fc.option(fc.constantFrom('delays', 'praise'), { nil: undefined }) });
type Doc = { text: string; label: string | undefined };

const RULES: readonly [string, TextRules][] = [
  ['default rules', resolveRules()],
  ['case keep, email collapsed', resolveRules({ case: 'keep', collapse: ['email'] })],
  ['character level', resolveRules({ level: 'char' })],
];

/** Entries sorted by token: the tally's figures without the order tokens were first met in. */
function sortedEntries(tally: Tally) {
  return [...tally.entries()].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
}

function figures(counts: AuditCounts) {
  const { tally } = counts;
  return {
    entries: sortedEntries(tally),
    documents: tally.documents,
    tokens: tally.tokens,
    lengths: [...tally.lengths].sort((a, b) => a[0] - b[0]),
    labels: [...tally.labels].sort(),
    oovTokens: counts.oovTokens,
    truncated: [counts.truncatedDocuments, counts.droppedTokens, counts.paddingTokens],
    labelAudits: [...counts.labels].sort(),
  };
}

describe('AuditCounts (property, against a plain tally of the tokens as strings)', () => {
  it.each(RULES)('%s', (_name, rules) => {
    fc.assert(
      fc.property(
        fc.array(doc, { minLength: 1, maxLength: 8 }),
        fc.array(doc, { maxLength: 10 }),
        fc.integer({ min: 0, max: 6 }),
        fc.integer({ min: 0, max: 10 }),
        fc.constantFrom('first' as const, 'last' as const),
        fc.subarray(['late', 'pier', '<sep>']),
        (fitted, audited, cap, split, oovPlace, reserved) => {
        // Both places of the OOV id and reserved tokens: the ids a known token is counted by must map back to it.
        const lexicon = freeze(Tally.fromTexts(fitted, rules), { cap, oov: oovPlace, reserved });
        const length = 4;
        const counts = new AuditCounts(lexicon, length);
        for (const d of audited) counts.add(d.text, d.label);

        const plain = new Tally(rules);
        let oov = 0;
        const labelAudits = new Map<string, { documents: number; tokens: number; oovTokens: number; truncatedDocuments: number }>();
        for (const d of audited as Doc[]) {
          const tokens = tokenize(d.text, rules);
          plain.addTokens(tokens, d.label);
          const oovHere = tokens.filter((t) => lexicon.idOf(t) === lexicon.oovId).length;
          oov += oovHere;
          if (d.label !== undefined) {
            const l = labelAudits.get(d.label) ?? { documents: 0, tokens: 0, oovTokens: 0, truncatedDocuments: 0 };
            labelAudits.set(d.label, { documents: l.documents + 1, tokens: l.tokens + tokens.length, oovTokens: l.oovTokens + oovHere, truncatedDocuments: l.truncatedDocuments + (tokens.length > length ? 1 : 0) });
          }
        }
        const got = figures(counts);
        expect(got.entries).toEqual(sortedEntries(plain));
        expect([got.documents, got.tokens, got.lengths, got.labels]).toEqual([plain.documents, plain.tokens, [...plain.lengths].sort((a, b) => a[0] - b[0]), [...plain.labels].sort()]);
        expect(got.oovTokens).toBe(oov);
        expect(got.labelAudits).toEqual([...labelAudits].sort());

        // In two parts, merged through parts() as a worker's counts are, and counted on after merging.
        const at = Math.min(split, audited.length);
        const first = new AuditCounts(lexicon, length);
        const second = new AuditCounts(lexicon, length);
        for (const d of audited.slice(0, at)) first.add(d.text, d.label);
        for (const d of audited.slice(at)) second.add(d.text, d.label);
        const merged = new AuditCounts(lexicon, length).merge(first.parts()).merge(second.parts());
        expect(figures(merged)).toEqual(got);
        const onwards = new AuditCounts(lexicon, length);
        for (const d of audited.slice(0, at)) onwards.add(d.text, d.label);
        onwards.merge(second.parts());
        expect(figures(onwards)).toEqual(got);
        },
      ),
      { numRuns: 120 },
    );
  });
});
