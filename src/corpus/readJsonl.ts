import { inputError, type Where } from '../LexlockError.js';
import type { CorpusDocument } from './CorpusDocument.js';
import type { ReadContext } from './ReadContext.js';
import { quotedNames } from './quotedNames.js';
import { readLineCorpus } from './readLineCorpus.js';

/**
 * A `.jsonl`/`.ndjson` corpus: one JSON object a line, the text in field `context.text` and the label
 * in `context.label`, both JSON strings. Anything else is `BAD_FIELD_TYPE` naming the line, a number
 * label included: turned into a string, `1` and `"1"` would be one label and `1e400` would be
 * `"Infinity"`. A missing or null label is `MISSING_FIELD`. With `context.key`, the key is that
 * member: a JSON string, or a whole number JavaScript holds exactly (up to 2^53 - 1 either side), as
 * its decimal digits (`42` gives "42"; JSON.parse reads `42.0` and `4.2e1` as the same number);
 * anything else is `BAD_FIELD_TYPE`, a missing or null one `MISSING_FIELD`. Lines of white space only
 * are skipped.
 */
export function readJsonl(context: ReadContext): AsyncGenerator<CorpusDocument[], void, undefined> {
  return readLineCorpus(context, {
    blank: isBlank,
    document: (json, where, row) => documentOf(json, where, row, context),
    reason: 'the file has no JSON lines',
    advice: 'put one JSON object on each line',
  });
}

/** True for a line of JSON white space only (space, tab, CR). */
function isBlank(bytes: Buffer): boolean {
  for (let i = 0; i < bytes.length; i++) {
    const b = bytes[i];
    if (b !== 0x20 && b !== 0x09 && b !== 0x0d) return false;
  }
  return true;
}

function documentOf(json: string, where: Where, row: number, context: ReadContext): CorpusDocument {
  let value: unknown;
  try {
    value = JSON.parse(json);
  } catch (e) {
    const reason = e instanceof Error ? e.message : String(e);
    throw inputError('JSONL_NOT_JSON', where, `not JSON (${reason}); put one JSON object on each line`);
  }
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw inputError(
      'JSONL_NOT_OBJECT',
      where,
      `${jsonKind(value)} where an object was expected; put one JSON object on each line, like {"${context.text}": "..."}`,
    );
  }
  // JSON.parse makes every member an own data property, `__proto__` included, so Object.hasOwn and
  // indexing see exactly the members of the line, whatever their names.
  const record = value as Record<string, unknown>;
  const text = member(record, context.text, where, 'text');
  if (typeof text !== 'string') {
    throw inputError(
      'BAD_FIELD_TYPE',
      { ...where, field: context.text },
      `field ${JSON.stringify(context.text)} is ${jsonKind(text)}, not a string; store the text as a JSON string`,
    );
  }
  const key = context.key === undefined ? String(row) : keyOf(record, context.key, where);
  if (context.label === undefined) return { text, key, where };
  const raw = member(record, context.label, where, 'label');
  if (raw === null) {
    throw inputError(
      'MISSING_FIELD',
      { ...where, field: context.label },
      `field ${JSON.stringify(context.label)} is null; give every line a label, or leave out --label`,
    );
  }
  if (typeof raw === 'string') return { text, label: raw, key, where };
  const fix = typeof raw === 'number' || typeof raw === 'boolean' ? 'put the value in quotes in the file, as the label should read' : 'store the label as a JSON string';
  throw inputError('BAD_FIELD_TYPE', { ...where, field: context.label }, `field ${JSON.stringify(context.label)} is ${jsonKind(raw)}, not a string; labels are strings: ${fix}`);
}

/** The key member of a line: a JSON string, or a whole number JavaScript holds exactly, as its decimal digits. */
function keyOf(record: Record<string, unknown>, name: string, where: Where): string {
  const raw = member(record, name, where, 'key');
  if (typeof raw === 'string') return raw;
  if (typeof raw === 'number' && Number.isSafeInteger(raw)) return String(raw);
  if (raw === null) {
    throw inputError('MISSING_FIELD', { ...where, field: name }, `field ${JSON.stringify(name)} is null; give every line a key, or leave out --key to number the rows`);
  }
  const what = typeof raw === 'number' ? 'a JSON number that is not a whole number up to 2^53 - 1 (9007199254740991) either side' : jsonKind(raw);
  throw inputError(
    'BAD_FIELD_TYPE',
    { ...where, field: name },
    `field ${JSON.stringify(name)} is ${what}; a key is a JSON string or a whole number: store long or odd ids as strings, in quotes`,
  );
}

function member(record: Record<string, unknown>, name: string, where: Where, role: 'text' | 'label' | 'key'): unknown {
  if (Object.hasOwn(record, name)) return record[name];
  const names = Object.keys(record);
  const has = names.length === 0 ? 'this line has no fields' : `this line has ${quotedNames(names)}`;
  throw inputError('MISSING_FIELD', { ...where, field: name }, `no field ${JSON.stringify(name)}; ${has}; pass --${role} to name the ${role} field`);
}

/** `a JSON array`, `a JSON string`, ... for messages. */
function jsonKind(value: unknown): string {
  if (value === null) return 'JSON null';
  if (Array.isArray(value)) return 'a JSON array';
  if (typeof value === 'object') return 'a JSON object';
  return `a JSON ${typeof value}`;
}
