import { readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { cli } from '../helpers/cli.js';
import { collect, failure, fixture, fixtureFile, tempFolder, texts } from './corpusFixtures.js';

// The issue: tokens such as `constructor`, `toString`, `__proto__` in a CSV header or a JSONL member
// name are handled like any others. Names of Object.prototype members are the ones a plain-object
// lookup would find without the file having them (ECMA-262, section 20.1.3: the properties of the
// Object prototype object; `__proto__` is its accessor, section 20.1.3.8).
const NAMES = ['__proto__', 'constructor', 'toString', 'hasOwnProperty', 'valueOf', '__defineGetter__'] as const;

// No reading may add anything to Object.prototype (prototype pollution).
let prototypeBefore: string[] = [];
beforeEach(() => {
  prototypeBefore = Object.getOwnPropertyNames(Object.prototype).sort();
});
afterEach(() => {
  expect(Object.getOwnPropertyNames(Object.prototype).sort()).toEqual(prototypeBefore);
  expect(({} as Record<string, unknown>).polluted).toBeUndefined();
});

describe('CSV/TSV: names of Object.prototype members as column names and values', () => {
  it.each([',', '\t'])('every name as the text and as the label column, every name as a value (delimiter %j)', async (d) => {
    const header = NAMES.join(d);
    const rows = NAMES.map((_, r) => NAMES.map((_, c) => NAMES[(r + c) % NAMES.length]).join(d));
    const path = await fixtureFile(d === ',' ? 'names.csv' : 'names.tsv', `${header}\n${rows.join('\n')}\n`);
    for (let t = 0; t < NAMES.length; t++) {
      for (let l = 0; l < NAMES.length; l++) {
        if (t === l) continue;
        const docs = await collect(readCorpus(path, { text: NAMES[t]!, label: NAMES[l]! }));
        expect(texts(docs)).toEqual(NAMES.map((_, r) => [NAMES[(r + t) % NAMES.length], NAMES[(r + l) % NAMES.length]]));
      }
    }
  });

  it.each(NAMES)('a header without %s: MISSING_FIELD, not a prototype member', async (name) => {
    const path = await fixtureFile('plain.csv', 'text,route\nMorning sailing,north\n');
    const { error } = await failure(readCorpus(path, { text: name }));
    expect([error.code, error.message]).toEqual([
      'MISSING_FIELD',
      `${path} line 1: no column ${JSON.stringify(name)}; the columns are "text", "route"; pass --text to name the text column`,
    ]);
  });

  it('a header naming __proto__ twice is CSV_BAD_HEADER, like any repeated name', async () => {
    const path = await fixtureFile('twice.csv', '__proto__,text,__proto__\na,b,c\n');
    const { error } = await failure(readCorpus(path));
    expect(error.message).toBe(`${path} line 1: column "__proto__" appears twice (columns 1 and 3); give each column its own name`);
  });
});

describe('JSONL: names of Object.prototype members as member names', () => {
  it('JSON.parse keeps "__proto__" as an own member (ECMA-262 section 25.5.1, JSON.parse: an ordinary own data property)', () => {
    const value = JSON.parse('{"__proto__":"x","text":"y"}') as Record<string, unknown>;
    expect(Object.hasOwn(value, '__proto__')).toBe(true);
    expect(Object.getPrototypeOf(value)).toBe(Object.prototype);
  });

  it('a {"__proto__": "x", "text": ...} line: text and label read from either member', async () => {
    const path = await fixtureFile('a.jsonl', '{"__proto__":"rough","text":"Swell at the harbour mouth"}\n');
    expect(texts(await collect(readCorpus(path)))).toEqual([['Swell at the harbour mouth', undefined]]);
    expect(texts(await collect(readCorpus(path, { label: '__proto__' })))).toEqual([['Swell at the harbour mouth', 'rough']]);
    expect(texts(await collect(readCorpus(path, { text: '__proto__', label: 'text' })))).toEqual([['rough', 'Swell at the harbour mouth']]);
  });

  it('a "__proto__" member holding an object is read as a member (no pollution): an object, not a string', async () => {
    const path = await fixtureFile('a.jsonl', '{"__proto__":{"polluted":"yes"},"text":"Morning sailing"}\n');
    expect(texts(await collect(readCorpus(path)))).toEqual([['Morning sailing', undefined]]);
    const { error } = await failure(readCorpus(path, { text: '__proto__' }));
    expect([error.code, error.message]).toEqual([
      'BAD_FIELD_TYPE',
      `${path} line 1: field "__proto__" is a JSON object, not a string; store the text as a JSON string`,
    ]);
  });

  it.each(NAMES)('--text %s on a line without it: MISSING_FIELD, not the prototype member', async (name) => {
    const path = await fixtureFile('a.jsonl', '{"text":"Morning sailing"}\n');
    const { error } = await failure(readCorpus(path, { text: name }));
    expect([error.code, error.message]).toEqual([
      'MISSING_FIELD',
      `${path} line 1: no field ${JSON.stringify(name)}; this line has "text"; pass --text to name the text field`,
    ]);
  });

  it.each(NAMES)('%s as a member holding the text, a label, and as a value', async (name) => {
    const path = await fixtureFile('a.jsonl', `${JSON.stringify({ [name]: name, stars: '4' })}\n${JSON.stringify({ stars: name, [name]: 'toString' })}\n`);
    expect(texts(await collect(readCorpus(path, { text: name, label: 'stars' })))).toEqual([
      [name, '4'],
      ['toString', name],
    ]);
  });
});

describe('names of Object.prototype members as document text and folder names', () => {
  it('.txt lines', async () => {
    const path = await fixtureFile('a.txt', `${NAMES.join('\n')}\n`);
    expect((await collect(readCorpus(path))).map((d) => d.text)).toEqual([...NAMES]);
  });

  it('folders and files named after them are labels and documents like any other', async () => {
    const root = await fixture({ '__proto__/constructor.txt': 'toString', 'constructor/__proto__': 'hasOwnProperty', 'toString.txt': '__proto__' });
    expect((await collect(readCorpus(root))).map((d) => [d.where.file, d.text, d.label])).toEqual([
      [`${root}/__proto__/constructor.txt`, 'toString', '__proto__'],
      [`${root}/constructor/__proto__`, 'hasOwnProperty', 'constructor'],
      [`${root}/toString.txt`, '__proto__', undefined],
    ]);
  });

  it('lexlock tally --text __proto__ --label constructor counts them like any other (hand-counted)', async () => {
    const dir = await tempFolder();
    await writeFile(join(dir, 'm.csv'), '__proto__,constructor\nconstructor toString constructor,__proto__\nhasOwnProperty,toString\n');
    const r = await cli('tally', join(dir, 'm.csv'), '-o', join(dir, 'm.tally'), '--text', '__proto__', '--label', 'constructor');
    expect([r.code, r.stderr]).toEqual([0, '']);
    const tally = JSON.parse(await readFile(join(dir, 'm.tally'), 'utf8')) as Record<string, unknown>;
    expect(tally.fields).toEqual({ text: '__proto__', label: 'constructor' });
    // [token, count, documents]; lower-cased; JavaScript string order
    expect(tally.counts).toEqual([['constructor', 2, 1], ['hasownproperty', 1, 1], ['tostring', 1, 1]]);
    // [label, documents, tokens]; '_' (0x5F) sorts before 't'
    expect(tally.labels).toEqual([['__proto__', 1, 3], ['toString', 1, 1]]);
  });
});
