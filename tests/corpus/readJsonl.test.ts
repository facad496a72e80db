import { readFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { readCorpus, type CorpusOptions } from '../../src/corpus/readCorpus.js';
import { collect, failure, fixtureFile, texts } from './corpusFixtures.js';

// Specification: the encoding contract, rule 7 (corpora), in the project's design notes.
describe('readCorpus on .jsonl and .ndjson', () => {
  it.each([
    ['text only', 'a.jsonl', '{"text":"hi"}\n{"text":"yo","x":1}\n', {}, [['hi', undefined], ['yo', undefined]]],
    ['string labels, kept as written', 'a.jsonl', '{"text":"a","y":"pos"}\n{"text":"b","y":"5"}\n{"text":"c","y":"2.50"}\n{"text":"d","y":""}\n', { label: 'y' }, [['a', 'pos'], ['b', '5'], ['c', '2.50'], ['d', '']]],
    ['blank and white-space lines are skipped', 'a.ndjson', '\n{"text":"a"}\r\n  \t\r\n\n{"text":"b"}', {}, [['a', undefined], ['b', undefined]]],
    ['a BOM is dropped', 'a.jsonl', '\uFEFF{"text":"a"}\n', {}, [['a', undefined]]],
    ['escapes and unicode', 'a.jsonl', '{"text":"line\\nbreak \\u00e9 🎉 \\"q\\""}\n', {}, [['line\nbreak é 🎉 "q"', undefined]]],
    ['other text field', 'a.jsonl', '{"body":"hi","stars":"4"}\n', { text: 'body', label: 'stars' }, [['hi', '4']]],
  ])('%s', async (_, name, content, options: CorpusOptions, expected) => {
    const path = await fixtureFile(name, content);
    expect(texts(await collect(readCorpus(path, options)))).toEqual(expected);
  });

  it('places: line and byte offset of each document', async () => {
    const content = '\uFEFF{"text":"a"}\n\n{"text":"b"}\r\n{"text":"c"}';
    const path = await fixtureFile('a.jsonl', content);
    const docs = await collect(readCorpus(path));
    expect(docs.map((d) => d.where)).toEqual([
      { file: path, line: 1, byteOffset: 3 },
      { file: path, line: 3, byteOffset: Buffer.byteLength(content.slice(0, content.indexOf('{"text":"b"'))) },
      { file: path, line: 4, byteOffset: Buffer.byteLength(content.slice(0, content.indexOf('{"text":"c"'))) },
    ]);
  });

  it.each(['__proto__', 'constructor', 'toString', 'hasOwnProperty'])('a member named %s is an ordinary field', async (name) => {
    const path = await fixtureFile('a.jsonl', `${JSON.stringify({ [name]: 'the text', other: 'x' })}\n`);
    // a computed "__proto__" key is an own member, so JSON.stringify writes it
    await expect(readFile(path, 'utf8')).resolves.toContain(`"${name}"`);
    expect(texts(await collect(readCorpus(path, { text: name, label: 'other' })))).toEqual([['the text', 'x']]);
    expect(texts(await collect(readCorpus(path, { text: 'other', label: name })))).toEqual([['x', 'the text']]);
    const missing = await fixtureFile('b.jsonl', '{"text":"hi"}\n');
    const { error } = await failure(readCorpus(missing, { label: name }));
    expect(error.message).toBe(`${missing} line 1: no field ${JSON.stringify(name)}; this line has "text"; pass --label to name the label field`);
  });

  // The parser's own words, taken from the JSON.parse of this Node (ECMA-404 JSON is the reference
  // grammar; the wording is V8's).
  const parserMessage = (json: string) => {
    try {
      JSON.parse(json);
    } catch (e) {
      return (e as Error).message;
    }
    throw new Error('valid JSON');
  };

  const STRING_LABELS = 'labels are strings: store the label as a JSON string';
  const QUOTE_IT = 'labels are strings: put the value in quotes in the file, as the label should read';

  it.each([
    ['not JSON', '{"text":"a"}\n{text: "b"}\n', {}, 'JSONL_NOT_JSON', `line 2: not JSON (${parserMessage('{text: "b"}')}); put one JSON object on each line`, 1],
    ['a truncated line', '{"text":"a"\n', {}, 'JSONL_NOT_JSON', `line 1: not JSON (${parserMessage('{"text":"a"')}); put one JSON object on each line`, 0],
    ['an array', '[1,2]\n', {}, 'JSONL_NOT_OBJECT', 'line 1: a JSON array where an object was expected; put one JSON object on each line, like {"text": "..."}', 0],
    ['a string', '"hi"\n', {}, 'JSONL_NOT_OBJECT', 'line 1: a JSON string where an object was expected; put one JSON object on each line, like {"text": "..."}', 0],
    ['a number', '\n42\n', { text: 'body' }, 'JSONL_NOT_OBJECT', 'line 2: a JSON number where an object was expected; put one JSON object on each line, like {"body": "..."}', 0],
    ['null', 'null\n', {}, 'JSONL_NOT_OBJECT', 'line 1: JSON null where an object was expected; put one JSON object on each line, like {"text": "..."}', 0],
    ['a boolean', 'true\n', {}, 'JSONL_NOT_OBJECT', 'line 1: a JSON boolean where an object was expected; put one JSON object on each line, like {"text": "..."}', 0],
    ['no text field', '{"text":"a"}\n{"text":"b"}\n{"body":"c","stars":3}\n', {}, 'MISSING_FIELD', 'line 3: no field "text"; this line has "body", "stars"; pass --text to name the text field', 2],
    ['an object without members', '{}\n', {}, 'MISSING_FIELD', 'line 1: no field "text"; this line has no fields; pass --text to name the text field', 0],
    ['no label field', '{"text":"a","y":"1"}\n{"text":"b"}\n', { label: 'y' }, 'MISSING_FIELD', 'line 2: no field "y"; this line has "text"; pass --label to name the label field', 1],
    ['a null label', '{"text":"a","y":null}\n', { label: 'y' }, 'MISSING_FIELD', 'line 1: field "y" is null; give every line a label, or leave out --label', 0],
    ['a number as text', '{"text":5}\n', {}, 'BAD_FIELD_TYPE', 'line 1: field "text" is a JSON number, not a string; store the text as a JSON string', 0],
    ['null as text', '{"text":null}\n', {}, 'BAD_FIELD_TYPE', 'line 1: field "text" is JSON null, not a string; store the text as a JSON string', 0],
    ['an object as label', '{"text":"a","y":{"v":1}}\n', { label: 'y' }, 'BAD_FIELD_TYPE', `line 1: field "y" is a JSON object, not a string; ${STRING_LABELS}`, 0],
    ['an array as label', '{"text":"a","y":[1]}\n', { label: 'y' }, 'BAD_FIELD_TYPE', `line 1: field "y" is a JSON array, not a string; ${STRING_LABELS}`, 0],
    // A number label would make 1 and "1" one label, and 1e400 the label "Infinity": labels are strings.
    ['a number as label', '{"text":"a","y":"1"}\n{"text":"b","y":1}\n', { label: 'y' }, 'BAD_FIELD_TYPE', `line 2: field "y" is a JSON number, not a string; ${QUOTE_IT}`, 1],
    ['a number too large for a double as label', '{"text":"a","y":1e400}\n', { label: 'y' }, 'BAD_FIELD_TYPE', `line 1: field "y" is a JSON number, not a string; ${QUOTE_IT}`, 0],
    ['a boolean as label', '{"text":"a","y":false}\n', { label: 'y' }, 'BAD_FIELD_TYPE', `line 1: field "y" is a JSON boolean, not a string; ${QUOTE_IT}`, 0],
    ['an object as text', '{"text":{"body":"a"}}\n', {}, 'BAD_FIELD_TYPE', 'line 1: field "text" is a JSON object, not a string; store the text as a JSON string', 0],
    ['a boolean as text', '{"text":true}\n', {}, 'BAD_FIELD_TYPE', 'line 1: field "text" is a JSON boolean, not a string; store the text as a JSON string', 0],
    ['an empty file', '', {}, 'EMPTY_CORPUS', ': no documents (the file is empty); put one JSON object on each line', 0],
    ['blank lines only', '\n  \n', {}, 'EMPTY_CORPUS', ': no documents (the file has no JSON lines); put one JSON object on each line', 0],
  ])('%s', async (_, content, options: CorpusOptions, code, detail, before) => {
    const path = await fixtureFile('data.jsonl', content);
    const result = await failure(readCorpus(path, options));
    expect(result.error.code).toBe(code);
    expect(result.error.message).toBe(detail.startsWith(':') ? `${path}${detail}` : `${path} ${detail}`);
    expect(result.before.length).toBe(before);
  });

  it('lists at most twelve member names', async () => {
    const members = Object.fromEntries(Array.from({ length: 15 }, (_, i) => [`f${i}`, i]));
    const path = await fixtureFile('data.jsonl', `${JSON.stringify(members)}\n`);
    const { error } = await failure(readCorpus(path));
    const listed = Array.from({ length: 12 }, (_, i) => `"f${i}"`).join(', ');
    expect(error.message).toBe(`${path} line 1: no field "text"; this line has ${listed}, and 3 more; pass --text to name the text field`);
  });

  it('bad UTF-8: fail names line and byte; replace and skip count', async () => {
    const content = Buffer.concat([Buffer.from('{"text":"ok"}\n{"text":"b'), Buffer.from([0xc0, 0xaf]), Buffer.from('d"}\n{"text":"end"}\n')]);
    const path = await fixtureFile('data.jsonl', content);
    const { error } = await failure(readCorpus(path));
    expect(error.message).toBe(`${path} line 2: invalid UTF-8 at byte 24; fix the file's encoding or pass --bad-text replace or --bad-text skip`);
    const replacing = readCorpus(path, { badText: 'replace' });
    // C0 AF is two maximal subparts, so two U+FFFD (WHATWG Encoding Standard, UTF-8 decoder)
    expect((await collect(replacing)).map((d) => d.text)).toEqual(['ok', 'b\uFFFD\uFFFDd', 'end']);
    expect(replacing.stats.replaced).toBe(1);
    const skipping = readCorpus(path, { badText: 'skip' });
    expect((await collect(skipping)).map((d) => d.text)).toEqual(['ok', 'end']);
    expect(skipping.stats.skipped).toBe(1);
  });
});
