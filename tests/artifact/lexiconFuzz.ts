// Helpers of parseLexicon.fuzz.test.ts: real lexicons made by the library, what their documents look
// like (the oracle that says which mutations must be refused), and the mutations themselves.
import { fingerprintOf } from '../../src/artifact/fingerprint.js';
import { serializeLexicon } from '../../src/artifact/serializeLexicon.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { Lexicon } from '../../src/lexicon/Lexicon.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally, type LabelledText } from '../../src/tally/Tally.js';

/** A JSON value as JSON.parse gives it. */
export type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
/** A JSON object. */
export type JsonObject = { [key: string]: Json };
/** Where a member is: object member names and array indexes from the top. */
export type Path = readonly (string | number)[];

/** Invented reviews of an invented ferry operator (Glimmerholt Ferries). */
export const FERRY_REVIEWS: readonly LabelledText[] = [
  { text: 'The Glimmerholt ferry left the north pier 10 minutes late.', label: 'delays' },
  { text: 'Lovely crossing, friendly crew, and the coffee on deck 2 was great!', label: 'praise' },
  { text: 'Ferry to Skerrowick cancelled again; the refund took 3 weeks.', label: 'refunds' },
  { text: 'The evening ferry was late and the café was closed.', label: 'delays' },
  { text: 'Late again. The crew said the ramp at Skerrowick was stuck.', label: 'delays' },
  { text: 'Great views of the islands, the ferry was on time for once.', label: 'praise' },
];

/** Texts encoded with every accepted lexicon. */
export const SAMPLE_TEXTS: readonly string[] = [
  'the ferry was late again',
  'Café closed on deck 2; crew friendly, refund slow.',
  '__proto__ constructor toString hasOwnProperty valueOf',
  '',
];

const now = new Date(0);
const texts = FERRY_REVIEWS.map((r) => r.text);

/** A lexicon of every kind: with and without fit, canaries, labels, shape and reserved tokens; OOV first and last. */
export const BASES: readonly { name: string; lexicon: Lexicon }[] = (() => {
  const shaped = freeze(Tally.fromTexts(FERRY_REVIEWS, resolveRules()), {
    shape: { length: 8, pad: 'start', cut: 'end' },
    reserved: ['<start>', '__proto__'],
    snippets: [texts[0] as string],
    source: 'reviews.csv',
    fields: { text: 'text', label: 'label' },
    now,
  });
  return [
    { name: 'word level, labels, shape, reserved, OOV first', lexicon: shaped },
    {
      name: 'word level, dropped and collapsed types, cap, OOV last',
      lexicon: freeze(Tally.fromTexts(texts, resolveRules({ drop: ['punctuation'], collapse: ['number'] })), { oov: 'last', cap: 6, now }),
    },
    {
      name: 'char level, spaces dropped, no cap, labels left out, shape, OOV last',
      lexicon: freeze(Tally.fromTexts(FERRY_REVIEWS, resolveRules({ level: 'char', unicode: 'NFC', case: 'keep', spaces: 'drop' })), {
        cap: null,
        oov: 'last',
        labels: false,
        shape: { length: 30, pad: 'end', cut: 'start' },
        now,
      }),
    },
    { name: 'no fit and no canaries', lexicon: new Lexicon(shaped.encoding) },
    { name: 'only a reserved token (cap 0)', lexicon: freeze(Tally.fromTexts(texts, resolveRules()), { cap: 0, reserved: ['<start>'], now }) },
    { name: 'char level, spaces kept', lexicon: freeze(Tally.fromTexts(texts, resolveRules({ level: 'char' })), { cap: 12, now }) },
  ];
})();

/** Each base lexicon's file text, as serializeLexicon writes it. */
export const BASE_TEXTS: readonly string[] = BASES.map((b) => serializeLexicon(b.lexicon));

/** A fresh copy of base `i`'s document. */
export function baseDoc(i: number): JsonObject {
  return JSON.parse(BASE_TEXTS[i] as string) as JsonObject;
}

export function kindOf(value: unknown): string {
  if (value === null) return 'null';
  return Array.isArray(value) ? 'array' : typeof value;
}

/** A member path as parseLexicon's messages write it: `encoding.tokens[3]`. */
export function pathName(path: Path): string {
  let out = '';
  for (const p of path) out += typeof p === 'number' ? `[${p}]` : out === '' ? p : `.${p}`;
  return out === '' ? '(top level)' : out;
}

/** A path with every array index written `[]`: the member "kind" the oracle knows things about. */
function slot(path: Path): string {
  return pathName(path.map((p) => (typeof p === 'number' ? -1 : p))).replace(/\[-1\]/g, '[]');
}

/** What the real lexicons hold at one slot: the kinds of value, the member names, the names always there. */
interface Seen {
  kinds: Set<string>;
  keys: Set<string>;
  always: Set<string> | null;
}

const seenAt = new Map<string, Seen>();

function observe(value: Json, path: Path): void {
  const key = slot(path);
  let seen = seenAt.get(key);
  if (seen === undefined) seenAt.set(key, (seen = { kinds: new Set(), keys: new Set(), always: null }));
  seen.kinds.add(kindOf(value));
  if (Array.isArray(value)) value.forEach((v, i) => observe(v, [...path, i]));
  else if (value !== null && typeof value === 'object') {
    const names = Object.keys(value);
    for (const n of names) seen.keys.add(n);
    seen.always = seen.always === null ? new Set(names) : new Set([...seen.always].filter((n) => names.includes(n)));
    for (const n of names) observe(value[n] as Json, [...path, n]);
  }
}
BASES.forEach((_, i) => observe(baseDoc(i), []));
// A fit record has no Bloom filter for a vocabulary too big for one (src/lexicon/SeenTokens.ts, `of`);
// no base lexicon here is that big, so the null is added by hand.
seenAt.get('fit.seen')?.kinds.add('null');

/**
 * True when `value` at `path` looks like what real lexicons hold there: a kind seen there, only member
 * names seen there, every member always seen there present, and so on inside. Only such a value may
 * be accepted; anything else must be refused (values are checked to 50 levels: deeper is refused).
 */
export function fits(value: unknown, path: Path, depth = 0): boolean {
  const seen = seenAt.get(slot(path));
  if (seen === undefined || depth > 50 || !seen.kinds.has(kindOf(value))) return false;
  if (typeof value === 'number' && !Number.isFinite(value)) return false;
  if (Array.isArray(value)) return value.every((v, i) => fits(v, [...path, i], depth + 1));
  if (value !== null && typeof value === 'object') {
    const names = Object.keys(value);
    if (!names.every((n) => seen.keys.has(n))) return false;
    if (![...(seen.always ?? [])].every((n) => names.includes(n))) return false;
    return names.every((n) => fits((value as JsonObject)[n], [...path, n], depth + 1));
  }
  return true;
}

/**
 * Members a lexicon of this format may lack: `fit.badText` (read as `fail`) was first written after
 * format version 2 files existed. Deleting one must not make a file refused.
 */
export const OPTIONAL_MEMBERS: ReadonlySet<string> = new Set(['fit.badText']);

/** Every member path of a document (not the top level itself). */
export function pathsOf(value: Json, path: Path = []): Path[] {
  const out: Path[] = [];
  if (Array.isArray(value)) value.forEach((v, i) => out.push([...path, i], ...pathsOf(v, [...path, i])));
  else if (value !== null && typeof value === 'object') for (const n of Object.keys(value)) out.push([...path, n], ...pathsOf(value[n] as Json, [...path, n]));
  return out;
}

/** The paths of a document grouped by slot, so each kind of member is picked as often as any other. */
export function pathsBySlot(doc: Json): Path[][] {
  const groups = new Map<string, Path[]>();
  for (const p of pathsOf(doc)) {
    const key = slot(p);
    const group = groups.get(key);
    if (group === undefined) groups.set(key, [p]);
    else group.push(p);
  }
  return [...groups.values()];
}

export function getAt(doc: Json, path: Path): Json {
  let v: Json = doc;
  for (const p of path) v = (v as JsonObject)[p as string] as Json;
  return v;
}

/** The container of `path` and the last step of it. */
function parentOf(doc: Json, path: Path): [Json[] | JsonObject, string | number] {
  return [getAt(doc, path.slice(0, -1)) as Json[] | JsonObject, path[path.length - 1] as string | number];
}

export function setAt(doc: Json, path: Path, value: Json): void {
  const [parent, last] = parentOf(doc, path);
  (parent as JsonObject)[last as string] = value;
}

/** Deletes an object member or removes an array item. */
export function deleteAt(doc: Json, path: Path): void {
  const [parent, last] = parentOf(doc, path);
  if (Array.isArray(parent)) parent.splice(last as number, 1);
  else delete parent[last as string];
}

/** Strings that stand for values built into the text after JSON.stringify: 10,000 levels of nesting. */
export const DEEP_ARRAY = 'DEEP-ARRAY-7f3c1e';
export const DEEP_OBJECT = 'DEEP-OBJECT-7f3c1e';
/** Stands for a member named `__proto__` (which an assignment cannot make: it sets the prototype). */
export const PROTO_KEY = 'PROTO-KEY-7f3c1e';
export const DEPTH = 10_000;
export const deepArrayText = (n: number) => `${'['.repeat(n)}${']'.repeat(n)}`;
export const deepObjectText = (n: number) => `${'{"a":'.repeat(n)}1${'}'.repeat(n)}`;

/** The JSON text of a document, with the stand-ins above replaced by what they stand for. */
export function textOf(doc: Json, indent: number): string {
  return JSON.stringify(doc, null, indent)
    .replaceAll(`"${DEEP_ARRAY}"`, deepArrayText(DEPTH))
    .replaceAll(`"${DEEP_OBJECT}"`, deepObjectText(DEPTH))
    .replaceAll(`"${PROTO_KEY}"`, '"__proto__"');
}

const LONG_STRING = 'ä'.repeat(100_000);
const HUGE_NUMBERS: Json[] = Array.from({ length: 100_000 }, (_, i) => i);
const HUGE_TOKENS: Json[] = Array.from({ length: 100_000 }, (_, i) => `t${i}`);
const HUGE_SAME: Json[] = new Array<Json>(100_000).fill('ferry');

/** Values of every JSON type, long, huge and deep, and names that are special in JavaScript. */
export const REPLACEMENTS: readonly (() => Json)[] = [
  () => null,
  () => true,
  () => false,
  () => 0,
  () => -1,
  () => 1.5,
  () => 2 ** 31,
  () => 2 ** 53 + 2,
  () => 1e300,
  () => '',
  () => 'x',
  () => '__proto__',
  () => 'constructor',
  () => '\ud800',
  () => LONG_STRING,
  () => [],
  () => [1],
  () => ['a', 'a'],
  () => HUGE_NUMBERS,
  () => HUGE_TOKENS,
  () => HUGE_SAME,
  () => ({}),
  () => ({ a: 1 }),
  () => ({ [PROTO_KEY]: { polluted: 1 } }),
  () => ({ constructor: { prototype: { polluted: 1 } } }),
  () => DEEP_ARRAY,
  () => DEEP_OBJECT,
];

/** Strings lexicons hold somewhere: swapping one in keeps the kind and may keep the file valid. */
const STRINGS = ['word', 'char', 'NFKC', 'NFC', 'none', 'lower', 'keep', 'first', 'last', 'start', 'end', 'url', 'number', 'punctuation', 'ferry', 'late', '<start>', 'delays', 'praise'];

/** A value of the same kind as `old`, near it: the kind of damage a hand edit does. */
export function nearValue(old: Json, pick: number): Json {
  if (typeof old === 'number') {
    const choices = [old + 1, old - 1, -old - 1, old + 0.5, 2 ** 20, 2 ** 20 + 1, 2 ** 31 - 1, old * 1000];
    return choices[pick % choices.length] as number;
  }
  if (typeof old === 'string') {
    const choices = [`${old}x`, '', old.toUpperCase(), old.slice(1), ...STRINGS];
    return choices[pick % choices.length] as string;
  }
  if (Array.isArray(old)) {
    const choices: Json[][] = [old.slice(0, -1), [...old].reverse(), old.length > 0 ? [old[0] as Json, ...old] : [], old.slice(1)];
    return choices[pick % choices.length] as Json[];
  }
  if (old === null) return pick % 2 === 0 ? 'x' : 0;
  return old;
}

/** Sets the fingerprint to the one of the (edited) encoding, when it can be computed; true if it could. */
export function resign(doc: JsonObject): boolean {
  try {
    doc.fingerprint = fingerprintOf(doc.encoding);
    return true;
  } catch {
    // No encoding, or a lone surrogate, which cannot be hashed: the old fingerprint stays.
    return false;
  }
}
