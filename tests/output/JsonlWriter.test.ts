import { readdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { caseFolders } from '../helpers/caseFolders.js';
import { JsonlWriter } from '../../src/output/JsonlWriter.js';

// JSON Lines (jsonlines.org, from memory): UTF-8, each line a valid JSON value, lines separated by
// "\n", a "\n" after the last line allowed. JSON.parse (ECMA-262 / RFC 8259) is the reference reader.

/** A fresh empty folder per test. */
const folder = caseFolders('jsonl');

/** Lines of a JSON Lines file: decoded strictly as UTF-8 (WHATWG Encoding, fatal), split on "\n". */
async function linesOf(path: string): Promise<string[]> {
  const text = new TextDecoder('utf-8', { fatal: true }).decode(await readFile(path));
  expect(text.endsWith('\n') || text === '').toBe(true);
  return text === '' ? [] : text.slice(0, -1).split('\n');
}

describe('JsonlWriter', () => {
  it('writes encode output lines exactly', async () => {
    const dir = await folder();
    const path = join(dir, 'encoded.jsonl');
    const out = await JsonlWriter.open(path);
    await out.writeLine({ ids: [5, 9, 1, 0], length: 3, label: 'late' });
    await out.writeLine({ ids: [], length: 0 });
    expect(out.lines).toBe(2);
    await out.finish();
    expect(await readFile(path, 'utf8')).toBe('{"ids":[5,9,1,0],"length":3,"label":"late"}\n{"ids":[],"length":0}\n');
  });

  it('round-trips any JSON values through JSON.parse, one a line, whatever the buffer size (property)', async () => {
    const dir = await folder();
    const path = join(dir, 'values.jsonl');
    await fc.assert(
      fc.asyncProperty(fc.array(fc.jsonValue(), { maxLength: 30 }), fc.integer({ min: 1, max: 200 }), async (values, bufferBytes) => {
        const out = new JsonlWriter(path, { bufferBytes });
        for (const value of values) await out.writeLine(value);
        await out.finish();
        const lines = await linesOf(path);
        expect(lines).toHaveLength(values.length);
        // What JSON.parse gives back is the reference (it turns -0 into 0, as JSON has no -0).
        expect(lines.map((line) => JSON.parse(line) as unknown)).toEqual(values.map((v) => JSON.parse(JSON.stringify(v)) as unknown));
      }),
      { numRuns: 60 },
    );
  });

  it('keeps newlines, U+2028 and lone surrogates inside strings off the line structure and valid UTF-8', async () => {
    // ES2019 "well-formed JSON.stringify" escapes lone surrogates as \udXXX; "\n" is always escaped (RFC 8259 §7).
    const dir = await folder();
    const path = join(dir, 'odd.jsonl');
    const values = [{ text: 'two\nlines\r\n' }, { text: 'sep\u2028arator' }, { text: 'half \ud800 pair' }, { text: 'pier 🚢' }];
    const out = await JsonlWriter.open(path);
    for (const value of values) await out.writeLine(value);
    await out.finish();
    const lines = await linesOf(path);
    expect(lines).toHaveLength(4);
    expect(lines[2]).toBe('{"text":"half \\ud800 pair"}');
    expect(lines.map((line) => JSON.parse(line) as unknown)).toEqual(values);
  });

  it('is atomic: the old file stays until finish, and abort keeps it', async () => {
    const dir = await folder();
    const path = join(dir, 'encoded.jsonl');
    await writeFile(path, 'old\n');
    const first = await JsonlWriter.open(path, { bufferBytes: 16 });
    for (let i = 0; i < 50; i++) await first.writeLine({ ids: [i], length: 1 });
    expect(await readFile(path, 'utf8')).toBe('old\n');
    expect((await readdir(dir)).length).toBe(2); // the destination and one temporary file
    await first.abort();
    expect(await readFile(path, 'utf8')).toBe('old\n');
    expect(await readdir(dir)).toEqual(['encoded.jsonl']);

    const second = await JsonlWriter.open(path);
    await second.writeLine({ ids: [1], length: 1 });
    expect(await readFile(path, 'utf8')).toBe('old\n');
    await second.finish();
    expect(await readFile(path, 'utf8')).toBe('{"ids":[1],"length":1}\n');
    expect(await readdir(dir)).toEqual(['encoded.jsonl']);
  });

  it('writes an empty file for no lines', async () => {
    const dir = await folder();
    const path = join(dir, 'none.jsonl');
    const out = await JsonlWriter.open(path);
    await out.finish();
    expect(await readFile(path, 'utf8')).toBe('');
  });

  it.each([
    ['undefined', undefined],
    ['function', () => 1],
    ['symbol', Symbol('x')],
  ])('refuses a %s with BAD_FIELD_TYPE naming the line', async (kind, value) => {
    const dir = await folder();
    const path = join(dir, 'bad.jsonl');
    const out = await JsonlWriter.open(path);
    await out.writeLine({ ok: true });
    await expect(out.writeLine(value)).rejects.toMatchObject({
      code: 'BAD_FIELD_TYPE',
      message: `${path} line 2: a ${kind} cannot be written as JSON; pass an object, array, string, number, boolean or null`,
      where: { file: path, line: 2 },
    });
    await out.finish();
    expect(await readFile(path, 'utf8')).toBe('{"ok":true}\n');
  });

  it('refuses use after finish with WRITER_CLOSED', async () => {
    const dir = await folder();
    const path = join(dir, 'done.jsonl');
    const out = await JsonlWriter.open(path);
    await out.finish();
    const message = `${path}: the writer is already finished or aborted; open a new one to write again`;
    await expect(out.writeLine({})).rejects.toMatchObject({ code: 'WRITER_CLOSED', message });
    await expect(out.finish()).rejects.toMatchObject({ code: 'WRITER_CLOSED', message });
  });

  it('fails to open with IO when the folder does not exist', async () => {
    const dir = await folder();
    const path = join(dir, 'nope', 'out.jsonl');
    await expect(JsonlWriter.open(path)).rejects.toMatchObject({
      code: 'IO',
      message: `${path}: not written: a folder on the way does not exist (ENOENT while creating a temporary file beside it); check the path`,
    });
  });
});
