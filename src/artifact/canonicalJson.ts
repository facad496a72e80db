import { LexlockError } from '../LexlockError.js';
import { isWellFormed } from '../rules/wellFormed.js';

/**
 * The RFC 8785 (JSON Canonicalization Scheme) form of a JSON value: no white space, object members
 * sorted by the UTF-16 code units of their names, numbers in ECMAScript's shortest round-trip form,
 * strings escaped as `JSON.stringify` does. Throws on values JSON cannot carry (NaN, Infinity,
 * undefined, functions, lone surrogates).
 * @example canonicalJson({ b: 1, a: [true, 1e30] }) // '{"a":[true,1e+30],"b":1}'
 */
export function canonicalJson(value: unknown): string {
  const parts: string[] = [];
  write(value, parts, '$');
  return parts.join('');
}

function loneSurrogate(path: string): LexlockError {
  return new LexlockError('BAD_OPTION', `${path}: a string holds a lone surrogate, which canonical JSON cannot carry`, { field: path });
}

function writeString(s: string, parts: string[], path: string): void {
  if (!isWellFormed(s)) throw loneSurrogate(path);
  parts.push(JSON.stringify(s));
}

/**
 * An array of strings only (a lexicon's token list) in one `JSON.stringify` call, which gives the same
 * text as item by item (RFC 8785 strings are ECMAScript's); false when an item is not a string.
 */
function writeStrings(items: readonly unknown[], parts: string[], path: string): boolean {
  for (let i = 0; i < items.length; i++) {
    const item = items[i];
    if (typeof item !== 'string') return false;
    if (!isWellFormed(item)) throw loneSurrogate(`${path}[${i}]`);
  }
  parts.push(JSON.stringify(items));
  return true;
}

function write(value: unknown, parts: string[], path: string): void {
  if (value === null) {
    parts.push('null');
  } else if (typeof value === 'boolean') {
    parts.push(value ? 'true' : 'false');
  } else if (typeof value === 'number') {
    if (!Number.isFinite(value)) {
      throw new LexlockError('BAD_OPTION', `${path}: ${String(value)} is not a JSON number`, { field: path });
    }
    // ECMAScript Number::toString is the number form RFC 8785 prescribes; -0 serializes as 0.
    parts.push(Object.is(value, -0) ? '0' : String(value));
  } else if (typeof value === 'string') {
    writeString(value, parts, path);
  } else if (Array.isArray(value)) {
    if (value.length > 0 && writeStrings(value, parts, path)) return;
    parts.push('[');
    value.forEach((item: unknown, i) => {
      if (i > 0) parts.push(',');
      write(item, parts, `${path}[${i}]`);
    });
    parts.push(']');
  } else if (typeof value === 'object') {
    const obj = value as Record<string, unknown>;
    // Default sort compares UTF-16 code units, the order RFC 8785 section 3.2.3 requires.
    const keys = Object.keys(obj)
      .filter((k) => obj[k] !== undefined)
      .sort();
    parts.push('{');
    keys.forEach((k, i) => {
      if (i > 0) parts.push(',');
      writeString(k, parts, path);
      parts.push(':');
      write(obj[k], parts, `${path}.${k}`);
    });
    parts.push('}');
  } else {
    throw new LexlockError('BAD_OPTION', `${path}: a ${typeof value} is not a JSON value`, { field: path });
  }
}
