import { inputError, type Where } from '../LexlockError.js';
import { quotedNames } from './quotedNames.js';

/** Which fields of a CSV/TSV row hold the text, the label and the key, and how many fields a row has. */
export interface CsvColumns {
  text: number;
  label: number | undefined;
  key: number | undefined;
  count: number;
}

/**
 * Reads a header row: every column needs a name of its own (`CSV_BAD_HEADER`), and the text, label
 * and key columns named must be there (`MISSING_FIELD`, listing the columns that are). Names are
 * looked up in a Map, so `constructor` or `__proto__` are ordinary names.
 */
export function csvColumns(
  names: readonly string[],
  fields: { readonly text: string; readonly label: string | undefined; readonly key: string | undefined },
  where: Where,
): CsvColumns {
  const { text, label, key } = fields;
  const index = new Map<string, number>();
  for (let i = 0; i < names.length; i++) {
    const name = names[i]!;
    if (name === '') throw inputError('CSV_BAD_HEADER', where, `column ${i + 1} has no name; name every column in the header row`);
    const first = index.get(name);
    if (first !== undefined) {
      throw inputError(
        'CSV_BAD_HEADER',
        { ...where, field: name },
        `column ${JSON.stringify(name)} appears twice (columns ${first + 1} and ${i + 1}); give each column its own name`,
      );
    }
    index.set(name, i);
  }
  const find = (name: string, role: 'text' | 'label' | 'key'): number => {
    const at = index.get(name);
    if (at !== undefined) return at;
    throw inputError(
      'MISSING_FIELD',
      { ...where, field: name },
      `no column ${JSON.stringify(name)}; the columns are ${quotedNames(names)}; pass --${role} to name the ${role} column`,
    );
  };
  return {
    text: find(text, 'text'),
    label: label === undefined ? undefined : find(label, 'label'),
    key: key === undefined ? undefined : find(key, 'key'),
    count: names.length,
  };
}
