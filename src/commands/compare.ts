import { LexlockError } from '../LexlockError.js';
import { compareLexicons } from '../audit/compareLexicons.js';
import type { LexiconComparison } from '../audit/compare/LexiconComparison.js';
import { loadLexicon } from '../files/loadLexicon.js';
import { describeShape, type Shape } from '../lexicon/Shape.js';
import { count, pairs, percent } from './format.js';
import type { Io } from './Io.js';
import { listFlag, parseArgs, positionals } from './parseArgs.js';

/** `lexlock compare --help`. */
export const COMPARE_HELP = `lexlock compare <a.json> <b.json> [--json] [--top K,K,…]

Puts two lexicons side by side: fingerprints, text rules, id layout, shape, tokens only in one,
shared tokens whose id moved, how many of their top-K tokens they share, and labels. Lexicons with
the same fingerprint encode every text identically. Exits 0 whether or not they differ.

  --top K,K,…   top-K overlaps to report (default 100,1000,5000,20000 below the smaller
                vocabulary, plus its size); the top-K are the first K tokens after the reserved ones
  --json        print the comparison as one JSON object
`;

/** How many tokens or labels a line of the human summary names before "…". */
const SHOWN = 8;

function quoted(items: readonly string[], total: number): string {
  const shown = items.slice(0, SHOWN).map((t) => JSON.stringify(t));
  return shown.join(', ') + (total > shown.length ? ', …' : '');
}

function shapeText(shape: Shape | null): string {
  return shape === null ? 'none' : describeShape(shape);
}

type Value = string | number | readonly string[] | null;

function valueText(value: Value): string {
  if (value === null) return 'none';
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return value;
  return value.length === 0 ? 'none' : value.join(',');
}

function differencesText(list: ReadonlyArray<{ member: string; a: Value; b: Value }>): string {
  if (list.length === 0) return 'same';
  return list.map((d) => `${d.member} ${valueText(d.a)} -> ${valueText(d.b)}`).join('; ');
}

function labelsText(c: LexiconComparison['labels']): string {
  const { a, b, onlyInA, onlyInB, moved } = c;
  const differ = a !== b || onlyInA.length > 0 || onlyInB.length > 0 || moved.length > 0;
  if (!differ) return a === null ? 'none' : `same (${a})`;
  const parts = [`${a === null ? 'none' : a} -> ${b === null ? 'none' : b}`];
  if (onlyInA.length > 0) parts.push(`only in a ${quoted(onlyInA, onlyInA.length)}`);
  if (onlyInB.length > 0) parts.push(`only in b ${quoted(onlyInB, onlyInB.length)}`);
  if (moved.length > 0) {
    const shown = moved.slice(0, SHOWN).map((m) => `${JSON.stringify(m.label)} ${m.a}->${m.b}`);
    parts.push(`moved ${shown.join(', ')}${moved.length > shown.length ? ', …' : ''}`);
  }
  return parts.join('; ');
}

/** True when every text gets the same token ids from both (same rules, layout and token ids). */
function sameIds(c: LexiconComparison): boolean {
  return c.rules.length === 0 && c.layout.length === 0 && c.onlyInA.count === 0 && c.onlyInB.count === 0 && c.moved.count === 0;
}

/** The aligned human summary of a comparison of the lexicon files at `pathA` and `pathB`. */
export function comparisonText(c: LexiconComparison, pathA: string, pathB: string): string {
  const rows: Array<[string, string]> = [
    ['a', `${pathA}  ${c.fingerprints.a}`],
    ['b', `${pathB}  ${c.fingerprints.b}`],
  ];
  if (c.sameFingerprint) {
    rows.push(['verdict', 'same fingerprint: both encode every text identically']);
    rows.push(['tokens', count(c.tokens.a)]);
    return pairs(rows);
  }
  rows.push([
    'verdict',
    sameIds(c)
      ? 'different fingerprints, but every text gets the same token ids (before shape)'
      : 'different fingerprints: the same text can get other ids',
  ]);
  rows.push(['rules', differencesText(c.rules)]);
  rows.push(['layout', differencesText(c.layout)]);
  rows.push(['shape', c.shape === null ? 'same' : `${shapeText(c.shape.a)} -> ${shapeText(c.shape.b)}`]);
  rows.push(['tokens', `${count(c.tokens.a)} -> ${count(c.tokens.b)}, ${count(c.tokens.shared)} shared`]);
  for (const [name, sample] of [['only in a', c.onlyInA], ['only in b', c.onlyInB]] as const) {
    rows.push([name, sample.count === 0 ? '0' : `${count(sample.count)}: ${quoted(sample.first, sample.count)}`]);
  }
  const moved = c.moved.first.slice(0, SHOWN).map((m) => `${JSON.stringify(m.token)} ${m.a}->${m.b}`);
  rows.push([
    'moved',
    c.moved.count === 0 ? '0' : `${count(c.moved.count)}: ${moved.join(', ')}${c.moved.count > moved.length ? ', …' : ''}`,
  ]);
  for (const t of c.topOverlap) rows.push([`top ${count(t.k)}`, `${count(t.shared)} shared (${percent(t.share)})`]);
  rows.push(['labels', labelsText(c.labels)]);
  return pairs(rows);
}

function topsFlag(values: readonly string[] | undefined, list: readonly string[]): number[] | undefined {
  if (values === undefined) return undefined;
  if (list.length === 0) {
    throw new LexlockError('USAGE_BAD_VALUE', '--top: give at least one K, e.g. --top 100,1000', { field: '--top' });
  }
  return list.map((raw) => {
    const n = /^[0-9]+$/.test(raw) ? Number(raw) : Number.NaN;
    if (!Number.isSafeInteger(n) || n < 1) {
      throw new LexlockError('USAGE_BAD_VALUE', `--top: "${raw}" is not a whole number of at least 1`, { field: '--top' });
    }
    return n;
  });
}

/** `lexlock compare`: two lexicons side by side; exit 0 whether or not they differ (it is a report). */
export async function compare(argv: readonly string[], io: Io): Promise<number> {
  const args = parseArgs('compare', argv, { json: { kind: 'switch' }, top: { kind: 'value' } });
  const [pathA, pathB] = positionals('compare', args, ['a.json', 'b.json']) as [string, string];
  const tops = topsFlag(args.values.get('top'), listFlag(args, 'top'));
  const a = await loadLexicon(pathA);
  const b = await loadLexicon(pathB);
  const comparison = compareLexicons(a, b, tops === undefined ? {} : { tops });
  io.stdout.write(args.switches.has('json') ? `${JSON.stringify(comparison)}\n` : comparisonText(comparison, pathA, pathB));
  return 0;
}
