import { previewValue } from './previewValue.js';

/** The parts of a schema issue lexlock reads (zod's issue objects have this shape). */
export interface SchemaIssue {
  code: string;
  origin?: string;
  path: ReadonlyArray<PropertyKey>;
  expected?: unknown;
  values?: readonly unknown[];
  keys?: readonly string[];
  minimum?: unknown;
  maximum?: unknown;
  pattern?: unknown;
}

/** A member path as written in messages: `encoding.tokens[3]`, or `(top level)`. */
export function memberPath(path: ReadonlyArray<PropertyKey>): string {
  let out = '';
  for (const p of path) out += typeof p === 'number' ? `[${p}]` : out === '' ? String(p) : `.${String(p)}`;
  return out === '' ? '(top level)' : out;
}

/** Unknown member names a message lists before saying how many more there are. */
const KEYS_LISTED = 3;

function kindOf(value: unknown): string {
  if (value === null) return 'null';
  if (typeof value === 'number' && !Number.isFinite(value)) return String(value);
  if (Array.isArray(value)) return 'an array';
  if (value === undefined) return 'nothing';
  return typeof value === 'object' ? 'an object' : `a ${typeof value}`;
}

function valueAt(doc: unknown, path: ReadonlyArray<PropertyKey>): unknown {
  let v: unknown = doc;
  for (const p of path) {
    if (typeof v !== 'object' || v === null || !Object.hasOwn(v, p)) return undefined;
    v = (v as Record<PropertyKey, unknown>)[p];
  }
  return v;
}

/**
 * One schema issue as a short sentence naming the member and what was wrong with it, e.g.
 * `encoding.tokens[3]: expected a string, got a number`. `doc` is the document checked.
 */
export function describeIssue(issue: SchemaIssue, doc: unknown): string {
  const where = memberPath(issue.path);
  const got = valueAt(doc, issue.path);
  switch (issue.code) {
    case 'invalid_type': {
      if (issue.expected === 'int') return `${where}: expected a whole number, got ${typeof got === 'number' ? previewValue(got) : kindOf(got)}`;
      return `${where}: expected ${issue.expected === 'array' || issue.expected === 'object' ? `an ${String(issue.expected)}` : `a ${String(issue.expected)}`}, got ${kindOf(got)}`;
    }
    case 'invalid_value':
      return `${where}: expected ${(issue.values ?? []).map((v) => previewValue(v)).join(' or ')}, got ${previewValue(got)}`;
    case 'unrecognized_keys': {
      const keys = issue.keys ?? [];
      const listed = keys.slice(0, KEYS_LISTED).map((k) => previewValue(k)).join(', ');
      const more = keys.length > KEYS_LISTED ? ` and ${keys.length - KEYS_LISTED} more` : '';
      return `${where}: unknown member${keys.length === 1 ? '' : 's'} ${listed}${more}`;
    }
    case 'too_small':
      if (issue.origin === 'string') {
        return `${where}: ${previewValue(got)} is shorter than ${String(issue.minimum)} character${issue.minimum === 1 ? '' : 's'}`;
      }
      return `${where}: ${previewValue(got)} is below the minimum ${String(issue.minimum)}`;
    case 'too_big':
      return `${where}: ${previewValue(got)} is above the maximum ${String(issue.maximum)}`;
    case 'invalid_format':
      return `${where}: ${previewValue(got)} does not match ${String(issue.pattern)}`;
    default:
      return `${where}: invalid (${issue.code})`;
  }
}
