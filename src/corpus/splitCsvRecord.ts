const QUOTE = 0x22;
const LF = 0x0a;
const CR = 0x0d;

/**
 * True for the characters JavaScript's `\s` matches (tab, LF, VT, FF, CR, space, U+00A0, U+1680,
 * U+2000–U+200A, U+2028, U+2029, U+202F, U+205F, U+3000, U+FEFF): what fast-csv skips before an
 * opening quote and after a closing one.
 */
export function isJsSpace(c: number): boolean {
  if (c <= 0x20) return c === 0x20 || (c >= 0x09 && c <= 0x0d);
  if (c < 0xa0) return false;
  return (
    c === 0xa0 || c === 0x1680 || (c >= 0x2000 && c <= 0x200a) || c === 0x2028 || c === 0x2029 || c === 0x202f || c === 0x205f || c === 0x3000 || c === 0xfeff
  );
}

/** The first index at or after `i` that is not white space before a field's opening quote (the delimiter, CR and LF end it). */
function skipSpace(record: string, i: number, n: number, delimiter: number): number {
  while (i < n) {
    const c = record.charCodeAt(i);
    if (c === delimiter || c === LF || c === CR || !isJsSpace(c)) return i;
    i += 1;
  }
  return i;
}

/**
 * The fields of one decoded CSV/TSV record (without its line end), as fast-csv splits it with RFC 4180
 * quoting (`""` inside quotes is a quote), no trimming, and a first field of white space only kept as
 * it is: a field whose first character other than white space is a quote is quoted (the white space
 * before the quote and after the closing one is dropped; between the quotes, the delimiter, CR and LF
 * are text); any other field is every character up to the next delimiter, spaces and quotes
 * included. A record of white space only (or empty) has no fields.
 *
 * Returns null for a record fast-csv reads oddly or refuses, which the caller hands to fast-csv: text
 * after a closing quote other than white space before the delimiter, a quote never closed (fast-csv
 * would read on into the next record), or a CR or LF outside quotes (fast-csv ends a row there).
 * {@link CsvRecordScanner} never gives such a record. `delimiter` is the char code of `,` or a tab.
 */
export function splitCsvRecord(record: string, delimiter: number): string[] | null {
  const n = record.length;
  const fields: string[] = [];
  let i = 0;
  for (;;) {
    const j = skipSpace(record, i, n, delimiter);
    if (j < n && record.charCodeAt(j) === QUOTE) {
      let value = '';
      let from = j + 1;
      let q = record.indexOf('"', from);
      for (;;) {
        if (q === -1) return null; // never closed
        if (record.charCodeAt(q + 1) !== QUOTE) break;
        value += record.slice(from, q + 1); // "" is one quote
        from = q + 2;
        q = record.indexOf('"', from);
      }
      fields.push(from === j + 1 ? record.slice(from, q) : value + record.slice(from, q));
      i = skipSpace(record, q + 1, n, delimiter);
      if (i === n) return fields;
      if (record.charCodeAt(i) !== delimiter) return null; // text, CR or LF after the closing quote
      i += 1;
      continue;
    }
    if (j === n && i === 0) return []; // empty, or white space only
    let k = j;
    while (k < n) {
      const c = record.charCodeAt(k);
      if (c === delimiter) break;
      if (c === LF || c === CR) return null; // a row end outside quotes
      k += 1;
    }
    fields.push(record.slice(i, k));
    if (k === n) return fields;
    i = k + 1;
  }
}
