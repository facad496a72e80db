import { LexlockError } from '../LexlockError.js';

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

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

function writeString(s: string, parts: string[], path: string): void {
  if (LONE_SURROGATE.test(s)) {
    throw new LexlockError('BAD_OPTION', `${path}: a string holds a lone surrogate, which canonical JSON cannot carry`, { field: path });
  }
  parts.push(JSON.stringify(s));
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
