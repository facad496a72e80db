import type { Lexicon } from '../lexicon/Lexicon.js';
import { FORMAT_VERSION, LEXICON_FORMAT, type LexiconFile } from './schema.js';

/** The lexicon file document for a lexicon (members in the order they are written). */
export function lexiconDocument(lexicon: Lexicon): LexiconFile {
  return {
    format: LEXICON_FORMAT,
    formatVersion: FORMAT_VERSION,
    fingerprint: lexicon.fingerprint,
    fit: lexicon.fit,
    canaries: [...lexicon.canaries],
    encoding: lexicon.encoding,
  };
}

/** Objects of plain values up to this long are written on one line: rules, layout, shape, figures. */
const ONE_LINE = 160;

function isFlat(value: object): boolean {
  return Object.values(value).every((v) => v === null || typeof v !== 'object' || (Array.isArray(v) && v.every((x) => x === null || typeof x !== 'object')));
}

function write(value: unknown, indent: string, out: string[]): void {
  if (value === null || typeof value !== 'object') {
    out.push(JSON.stringify(value));
    return;
  }
  const inner = `${indent}  `;
  if (Array.isArray(value)) {
    if (value.length === 0) {
      out.push('[]');
      return;
    }
    out.push('[');
    value.forEach((item, i) => {
      out.push(`\n${inner}`);
      write(item, inner, out);
      if (i < value.length - 1) out.push(',');
    });
    out.push(`\n${indent}]`);
    return;
  }
  const compact = JSON.stringify(value);
  if (isFlat(value) && compact.length <= ONE_LINE) {
    out.push(compact);
    return;
  }
  const entries = Object.entries(value).filter(([, v]) => v !== undefined);
  if (entries.length === 0) {
    out.push('{}');
    return;
  }
  out.push('{');
  entries.forEach(([key, v], i) => {
    out.push(`\n${inner}${JSON.stringify(key)}:`);
    write(v, inner, out);
    if (i < entries.length - 1) out.push(',');
  });
  out.push(`\n${indent}}`);
}

/**
 * The lexicon file's text: JSON, two-space indented, one token a line so diffs stay readable, each
 * small object of plain values (rules, layout, shape, figures) on one line, and every member written
 * `"name":value` with no space, so a member reads the same inside a one-line object and out of it:
 * `"shape":{"length":96,"pad":"start","cut":"end"}`.
 * Browser-safe; `parseLexicon(serializeLexicon(x))` encodes exactly as `x`.
 */
export function serializeLexicon(lexicon: Lexicon): string {
  const out: string[] = [];
  write(lexiconDocument(lexicon), '', out);
  out.push('\n');
  return out.join('');
}
