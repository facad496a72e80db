// A CSV reader written for the tests, independent of lexlock's own (RFC 4180 quoting).

/** A plain RFC 4180 reader: records of fields; quotes may hold commas, line breaks and doubled quotes. */
export function plainCsv(text: string): string[][] {
  const records: string[][] = [];
  let field = '';
  let fields: string[] = [];
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      fields.push(field);
      field = '';
    } else if (c === '\n') {
      fields.push(field);
      records.push(fields);
      fields = [];
      field = '';
    } else field += c;
  }
  if (field !== '' || fields.length > 0) records.push([...fields, field]);
  return records;
}
