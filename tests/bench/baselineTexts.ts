import { createReadStream } from 'node:fs';
import { readdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { createInterface } from 'node:readline';

async function filesBelow(folder: string, prefix = ''): Promise<string[]> {
  const out: string[] = [];
  for (const entry of await readdir(join(folder, prefix), { withFileTypes: true })) {
    if (entry.name.startsWith('.')) continue;
    const rel = prefix === '' ? entry.name : `${prefix}/${entry.name}`;
    if (entry.isDirectory()) out.push(...(await filesBelow(folder, rel)));
    else if (entry.isFile()) out.push(rel);
  }
  return out.sort();
}

/** The fields of a whole CSV text, quote-aware (RFC 4180), one array a record. */
function* csvRecords(text: string): Generator<string[]> {
  let fields: string[] = [];
  let field = '';
  let i = 0;
  while (i < text.length) {
    const c = text[i];
    if (c === '"') {
      let j = i + 1;
      for (;;) {
        const q = text.indexOf('"', j);
        if (q < 0) throw new Error('baseline CSV: unclosed quote');
        field += text.slice(j, q);
        if (text[q + 1] === '"') {
          field += '"';
          j = q + 2;
        } else {
          i = q + 1;
          break;
        }
      }
    } else if (c === ',') {
      fields.push(field);
      field = '';
      i += 1;
    } else if (c === '\n' || c === '\r') {
      fields.push(field);
      yield fields;
      fields = [];
      field = '';
      i += c === '\r' && text[i + 1] === '\n' ? 2 : 1;
    } else {
      const next = text.slice(i).search(/[",\r\n]/);
      const end = next < 0 ? text.length : i + next;
      field += text.slice(i, end);
      i = end;
    }
  }
  if (field !== '' || fields.length > 0) {
    fields.push(field);
    yield fields;
  }
}

/**
 * The hand-written baseline's reader: the texts of a folder (one file each, sorted paths), a `.csv`
 * (field `text`, the whole file read at once) or a `.txt` (non-empty lines), without any of lexlock's
 * checks (BOM, invalid UTF-8, places for errors).
 */
export async function* baselineTexts(path: string, textField = 'text'): AsyncGenerator<string> {
  if (path.endsWith('.csv')) {
    let column = -1;
    for (const record of csvRecords(await readFile(path, 'utf8'))) {
      if (column < 0) column = record.indexOf(textField);
      else yield record[column] ?? '';
    }
  } else if (path.endsWith('.txt')) {
    for await (const line of createInterface({ input: createReadStream(path, 'utf8'), crlfDelay: Infinity })) if (line.trim() !== '') yield line;
  } else {
    for (const file of await filesBelow(path)) yield await readFile(join(path, file), 'utf8');
  }
}
