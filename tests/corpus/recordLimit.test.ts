import { execFileSync } from 'node:child_process';
import { createWriteStream, existsSync, readFileSync } from 'node:fs';
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isLexlockError, type LexlockError } from '../../src/LexlockError.js';
import { CsvRecordScanner, type CsvRecord } from '../../src/corpus/csvRecords.js';
import { folderFiles } from '../../src/corpus/folderFiles.js';
import { LineSplitter, readLines, type Line } from '../../src/corpus/lines.js';
import { readCorpus, type CorpusOptions } from '../../src/corpus/readCorpus.js';
import { readFileWithin, readFileWithinSync } from '../../src/corpus/readFileWithin.js';
import { RECORD_LIMIT_DEFAULT, RECORD_LIMIT_MOST } from '../../src/corpus/recordLimit.js';
import { cli } from '../helpers/cli.js';
import { collect, failure, fixture, fixtureFile, tempFolder, texts, thrown } from './corpusFixtures.js';

// Specification: the issue's "a configurable limit with a clear error naming the line", the encoding
// contract's rule 7 (what a document of each corpus kind is), and the project's error model (what,
// where, what to do). The byte counts are worked out by hand from the fixtures.

const MIB = 2 ** 20;
const RAISE = 'raise the limit with --record-limit MiB (up to 256)';
const lineMessage = (place: string, limit = '1 MiB') =>
  `${place}: this line is longer than the record limit of ${limit}; split it into smaller documents, or ${RAISE}`;
const recordMessage = (place: string, quoteAt: number, limit = '1 MiB') =>
  `${place}: the record that starts here goes on past the record limit of ${limit} inside the quote opened at byte ${quoteAt}; close that quote (write each quote inside a field as ""), or ${RAISE}`;
const fileMessage = (file: string, limit = '1 MiB') =>
  `${file}: this file is larger than the record limit of ${limit} for one document; split it into smaller files, or ${RAISE}`;

/** `n` bytes of ASCII ferry-log text. */
function ascii(n: number): string {
  const unit = 'Glimmerholt deck log, calm crossing. ';
  return unit.repeat(Math.ceil(n / unit.length)).slice(0, n);
}

const limited: CorpusOptions = { maxRecordBytes: MIB };

describe('the record limit on .txt and .jsonl lines', () => {
  it.each([
    ['txt', (n: number) => ascii(n)],
    ['jsonl', (n: number) => `{"text":"${ascii(n - 11)}"}`], // {"text":" and "} are 11 bytes
  ] as const)('%s: a line of 1 MiB + 1 byte is refused naming its line, after the documents before it', async (kind, line) => {
    expect(Buffer.byteLength(line(MIB + 1))).toBe(MIB + 1);
    const first = kind === 'txt' ? 'Morning sailing on time' : '{"text":"Morning sailing on time"}';
    const path = await fixtureFile(`log.${kind}`, `${first}\n${line(MIB + 1)}\n${first}\n`);
    for (const chunkSize of [4096, 65536, MIB]) {
      const { error, before } = await failure(readCorpus(path, { ...limited, chunkSize }));
      expect(error.code).toBe('RECORD_TOO_LARGE');
      expect(error.message).toBe(lineMessage(`${path} line 2`));
      expect(error.where).toEqual({ file: path, line: 2, byteOffset: first.length + 1 });
      expect(texts(before)).toEqual([['Morning sailing on time', undefined]]);
    }
  });

  it.each([
    ['txt', (n: number) => ascii(n)],
    ['jsonl', (n: number) => `{"text":"${ascii(n - 11)}"}`],
  ] as const)('%s: lines of exactly 1 MiB pass, a BOM on line 1 and each CR of CRLF not counted', async (kind, line) => {
    const path = await fixtureFile(`log.${kind}`, `\uFEFF${line(MIB)}\r\n${line(MIB)}\r\n${line(MIB)}`);
    for (const chunkSize of [4096, MIB]) {
      const docs = await collect(readCorpus(path, { ...limited, chunkSize }));
      const text = kind === 'txt' ? ascii(MIB) : ascii(MIB - 11);
      expect(docs.map((d) => d.text === text)).toEqual([true, true, true]);
    }
  });

  it('a 1 MiB + 1 line refused at the end of a file without a final line feed', async () => {
    const path = await fixtureFile('log.txt', `ok\n${ascii(MIB + 1)}`);
    const { error, before } = await failure(readCorpus(path, limited));
    expect(error.message).toBe(lineMessage(`${path} line 2`));
    expect(before.map((d) => d.text)).toEqual(['ok']);
  });
});

describe('the record limit on .csv and .tsv records', () => {
  it('a one-line record of 1 MiB + 1 byte is refused naming its line', async () => {
    const record = `${ascii(MIB + 1 - ',calm'.length)},calm`;
    const path = await fixtureFile('log.csv', `text,sea\nBoarding smooth,calm\n${record}\n`);
    const { error, before } = await failure(readCorpus(path, { ...limited, label: 'sea' }));
    expect(error.code).toBe('RECORD_TOO_LARGE');
    expect(error.message).toBe(lineMessage(`${path} line 3`));
    expect(error.where).toEqual({ file: path, line: 3, byteOffset: 30 }); // 'text,sea\n' 9 + 'Boarding smooth,calm\n' 21
    expect(texts(before)).toEqual([['Boarding smooth', 'calm']]);
  });

  /** A quoted field of short lines that makes the record `bytes` long (line feeds and both quotes included). */
  function quotedRecord(bytes: number): { record: string; field: string } {
    let field = '';
    for (let i = 0; field.length + 2 < bytes; i++) field += `Crossing ${i}: wind light, harbour clear.\n`;
    field = field.slice(0, bytes - 2);
    return { record: `"${field}"`, field };
  }

  it.each(['csv', 'tsv'])('%s: a quoted field over many lines that passes 1 MiB is refused where the record starts, naming the open quote', async (kind) => {
    const { record } = quotedRecord(MIB + 1);
    expect(Buffer.byteLength(record)).toBe(MIB + 1);
    const path = await fixtureFile(`log.${kind}`, `text\nBoarding smooth\n${record}\nafter\n`);
    for (const chunkSize of [4096, MIB]) {
      const { error, before } = await failure(readCorpus(path, { ...limited, chunkSize }));
      expect(error.code).toBe('RECORD_TOO_LARGE');
      expect(error.message).toBe(recordMessage(`${path} line 3`, 21)); // 'text\n' 5 + 'Boarding smooth\n' 16
      expect(error.where).toEqual({ file: path, line: 3, byteOffset: 21 });
      expect(before.map((d) => d.text)).toEqual(['Boarding smooth']);
    }
  });

  it('a quoted field over many lines of exactly 1 MiB passes, whole', async () => {
    const { record, field } = quotedRecord(MIB);
    expect(Buffer.byteLength(record)).toBe(MIB);
    const path = await fixtureFile('log.csv', `text\n${record}\r\nafter\n`);
    const docs = await collect(readCorpus(path, { ...limited, chunkSize: 4096 }));
    expect(docs.map((d) => d.text === field)).toEqual([true, false]);
    expect(docs[1]!.text).toBe('after');
  });

  it('the open quote named is the one still open, on a later line than the record start', async () => {
    const { record } = quotedRecord(MIB + 1 - '"a\nb",'.length);
    const path = await fixtureFile('log.csv', `text,note\n"a\nb",${record}\n`);
    const { error } = await failure(readCorpus(path, limited));
    // the record starts at byte 10 (line 2); its first field closes on line 3, and the second field's
    // quote opens at byte 10 + 6 = 16
    expect(error.message).toBe(recordMessage(`${path} line 2`, 16));
  });

  it('CsvRecordScanner alone: a record of exactly the limit passes, one byte more is refused', () => {
    const records = (text: string, limit: number): CsvRecord[] | string => {
      const scanner = new CsvRecordScanner('t.csv', ',', limit);
      const splitter = new LineSplitter();
      const out: CsvRecord[] = [];
      try {
        for (const line of [...splitter.push(Buffer.from(text)), ...splitter.end()]) scanner.push(line, out);
        scanner.end();
      } catch (e) {
        if (!isLexlockError(e)) throw e;
        return e.message;
      }
      return out;
    };
    // '"ab\ncd"' is 7 bytes: two quotes, four letters, one line feed
    expect(records('x\n"ab\ncd"\n', 7)).toEqual([
      { bytes: Buffer.from('x'), line: 1, byteOffset: 0 },
      { bytes: Buffer.from('"ab\ncd"'), line: 2, byteOffset: 2 },
    ]);
    expect(records('x\n"ab\ncd"\n', 6)).toBe(recordMessage('t.csv line 2', 2, '6 bytes'));
    // refused while the record is still open, before the rest of the file comes
    expect(records('x\n"abcd\n\n', 5)).toBe(recordMessage('t.csv line 2', 2, '5 bytes'));
  });
});

describe('the record limit on folder files', () => {
  it('a file of 1 MiB + 1 byte is refused naming the file; one of exactly 1 MiB passes', async () => {
    const root = await fixture({ 'calm/a.txt': ascii(MIB), 'calm/b.txt': ascii(MIB + 1), 'rough/c.txt': 'Swell at the harbour mouth' });
    const { error, before } = await failure(readCorpus(root, limited));
    expect(error.code).toBe('RECORD_TOO_LARGE');
    expect(error.message).toBe(fileMessage(`${root}/calm/b.txt`));
    expect(error.where).toEqual({ file: `${root}/calm/b.txt` });
    expect(before.map((d) => [d.text.length, d.label])).toEqual([[MIB, 'calm']]);
  });

  it.each([
    ['synchronously', Infinity],
    ['in the background', -1],
  ])('folderFiles refuses a file over the limit, read %s', async (_how, slowReadMs) => {
    const root = await fixture({ 'a.txt': 'first', 'b.txt': 'x'.repeat(101), 'c.txt': 'x'.repeat(100) });
    const seen: string[] = [];
    let error: unknown;
    try {
      for await (const f of folderFiles(root, ['a.txt', 'c.txt', 'b.txt'], slowReadMs, 100)) seen.push(f.bytes.toString());
    } catch (e) {
      error = e;
    }
    expect(seen).toEqual(['first', 'x'.repeat(100)]);
    expect(isLexlockError(error) && error.message).toBe(fileMessage(`${root}/b.txt`, '100 bytes'));
  });

  // /proc files report a size of 0 and are read until their end (Linux only).
  it.skipIf(!existsSync('/proc/self/status'))('reads a file that reports no size until the limit is passed', async () => {
    const whole = readFileSync('/proc/self/cmdline');
    expect(readFileWithinSync('/proc/self/cmdline', 1 << 20)).toEqual(whole);
    expect(await readFileWithin('/proc/self/cmdline', 1 << 20)).toEqual(whole);
    expect(readFileWithinSync('/proc/self/cmdline', whole.length - 1)).toBeNull();
    expect(await readFileWithin('/proc/self/cmdline', whole.length - 1)).toBeNull();
  });
});

describe('memory does not climb on an enormous line', () => {
  const CHUNK = 1 << 16;

  /** 200 MiB of `fill` in 64 KiB chunks (a fresh buffer each), with a count of the bytes taken so far. */
  function endless(fill: (i: number) => Buffer) {
    const source = { taken: 0 };
    async function* chunks(): AsyncGenerator<Buffer> {
      for (let i = 0; i < (200 * MIB) / CHUNK; i++) {
        const chunk = fill(i);
        source.taken += chunk.length;
        yield chunk;
      }
    }
    return { source, chunks: chunks() };
  }

  async function refusal(lines: AsyncGenerator<Line[]>, onLine: (line: Line) => void = () => {}): Promise<LexlockError> {
    try {
      for await (const group of lines) for (const line of group) onLine(line);
    } catch (e) {
      if (isLexlockError(e)) return e;
      throw e;
    }
    throw new Error('the 200 MiB line was not refused');
  }

  it('a 200 MiB line is refused once the default limit (64 MiB) is passed, before the rest is read', async () => {
    const { source, chunks } = endless(() => Buffer.alloc(CHUNK, 0x78));
    const error = await refusal(readLines(chunks, { maxBytes: RECORD_LIMIT_DEFAULT, file: 'stream.txt' }));
    expect(error.message).toBe(lineMessage('stream.txt line 1', '64 MiB'));
    // Held at most the limit, a CR and a BOM (4 bytes) and one chunk: refused with 136 MiB unread.
    expect(source.taken).toBeGreaterThan(RECORD_LIMIT_DEFAULT);
    expect(source.taken).toBeLessThanOrEqual(RECORD_LIMIT_DEFAULT + 4 + CHUNK);
  });

  it('a 200 MiB quoted CSV field of short lines is refused once 1 MiB of it is held', async () => {
    const line = Buffer.from(`${ascii(CHUNK - 1)}\n`);
    const { source, chunks } = endless((i) => (i === 0 ? Buffer.concat([Buffer.from('text\n"'), line.subarray(6)]) : line));
    const scanner = new CsvRecordScanner('stream.csv', ',', MIB);
    const records: CsvRecord[] = [];
    const error = await refusal(readLines(chunks, { maxBytes: MIB, file: 'stream.csv' }), (l) => scanner.push(l, records));
    expect(error.message).toBe(recordMessage('stream.csv line 2', 5));
    expect(records.map((r) => r.bytes.toString())).toEqual(['text']);
    expect(source.taken).toBeGreaterThan(MIB);
    expect(source.taken).toBeLessThanOrEqual(MIB + 2 * CHUNK);
  });

  // End to end through readCorpus: a named pipe fed 200 MiB without a line break (never on disk).
  it.each([
    ['endless.txt', () => Buffer.alloc(CHUNK, 0x78), (fifo: string) => lineMessage(`${fifo} line 1`)],
    ['endless.jsonl', (i: number) => (i === 0 ? Buffer.concat([Buffer.from('{"text":"'), Buffer.alloc(CHUNK - 9, 0x78)]) : Buffer.alloc(CHUNK, 0x78)), (fifo: string) => lineMessage(`${fifo} line 1`)],
    ['endless.csv', (i: number) => Buffer.from(i === 0 ? `text\n"${ascii(CHUNK - 7)}\n` : `${ascii(CHUNK - 1)}\n`), (fifo: string) => recordMessage(`${fifo} line 2`, 5)],
  ])('readCorpus on a named pipe %s stops reading it after about 1 MiB', async (name, fill, message) => {
    const fifo = join(await tempFolder(), name);
    execFileSync('mkfifo', [fifo]);
    const { source, chunks } = endless(fill);
    const writing = pipeline(Readable.from(chunks), createWriteStream(fifo)).catch((e: NodeJS.ErrnoException) => e.code);
    const reader = readCorpus(fifo, { maxRecordBytes: MIB, chunkSize: CHUNK });
    const { error } = await failure(reader);
    expect(error.message).toBe(message(fifo));
    // Refused within one line (at most 64 KiB here) and one read (at most 64 KiB) past the limit.
    expect(reader.stats.bytes).toBeGreaterThan(MIB);
    expect(reader.stats.bytes).toBeLessThanOrEqual(MIB + 2 * CHUNK);
    expect(await writing).toBe('EPIPE'); // the reader closed the pipe: the writer could not go on
    expect(source.taken).toBeLessThan(200 * MIB);
  });
});

describe('LineSplitter with a limit', () => {
  it.each([
    // [input, limit, lines, failure]
    ['abc\ndef\n', 3, ['abc', 'def'], null],
    ['abc\r\n\xef\xbb\xbfx\n', 4, ['abc\r', '\xef\xbb\xbfx'], null], // a CR is not counted; a BOM past line 1 is
    ['abc\r\n\xef\xbb\xbfx\n', 3, ['abc\r'], 'f.txt line 2'],
    ['\xef\xbb\xbfabc\r\n', 3, ['abc\r'], null], // neither is the BOM of line 1
    ['ab\nabcd\nzz\n', 3, ['ab'], 'f.txt line 2'],
    ['abc\r\r\n', 3, [], 'f.txt line 1'], // only the last CR goes uncounted
    ['x\n\xef\xbb\xbfab', 3, ['x'], 'f.txt line 2'],
  ])('%j with limit %i', (input, limit, lines, place) => {
    const splitter = new LineSplitter({ maxBytes: limit, file: 'f.txt' });
    const got: string[] = [];
    let message: string | null = null;
    try {
      for (const byte of Buffer.from(input, 'latin1')) got.push(...splitter.push(Buffer.from([byte])).map((l) => l.bytes.toString('latin1')));
      got.push(...splitter.end().map((l) => l.bytes.toString('latin1')));
    } catch (e) {
      if (!isLexlockError(e)) throw e;
      message = e.message;
    }
    expect(got).toEqual(lines);
    expect(message).toBe(place === null ? null : lineMessage(place, `${limit} bytes`));
  });

  it('push hands out the lines before a refused one and throws at the next call', () => {
    const splitter = new LineSplitter({ maxBytes: 2, file: 'f.txt' });
    expect(splitter.push(Buffer.from('ab\ncd\nefg\nh')).map((l) => l.bytes.toString())).toEqual(['ab', 'cd']);
    expect(splitter.failure?.where).toEqual({ file: 'f.txt', line: 3, byteOffset: 6 });
    expect(thrown(() => splitter.push(Buffer.from('\n'))).message).toBe(lineMessage('f.txt line 3', '2 bytes'));
    expect(thrown(() => splitter.end()).code).toBe('RECORD_TOO_LARGE');
  });

  // Oracle: split the whole input on LF (String.prototype.split), drop line 1's BOM, count each line
  // without one trailing CR; the first line over the limit is refused and the lines before it come out.
  it('refuses exactly the first line over the limit, however the bytes are cut into chunks', () => {
    const bytes = fc.array(fc.constantFrom(0x0a, 0x0d, 0x61, 0xef, 0xbb, 0xbf), { maxLength: 40 }).map((a) => Buffer.from(a));
    fc.assert(
      fc.property(bytes, fc.integer({ min: 1, max: 6 }), fc.array(fc.nat(), { maxLength: 8 }), (b, limit, cuts) => {
        const pieces = b.toString('latin1').split('\n');
        if (pieces[pieces.length - 1] === '') pieces.pop();
        const expected: string[] = [];
        let refused: number | null = null;
        for (let i = 0; i < pieces.length; i++) {
          let piece = pieces[i]!;
          if (i === 0 && piece.startsWith('\xef\xbb\xbf')) piece = piece.slice(3);
          if ((piece.endsWith('\r') ? piece.length - 1 : piece.length) > limit) {
            refused = i + 1;
            break;
          }
          expected.push(piece);
        }
        const splitter = new LineSplitter({ maxBytes: limit, file: 'f.txt' });
        const points = [...new Set(cuts.map((c) => c % (b.length + 1)))].sort((x, y) => x - y);
        const got: string[] = [];
        let line: number | null = null;
        try {
          let from = 0;
          for (const p of [...points, b.length]) {
            got.push(...splitter.push(b.subarray(from, p)).map((l) => l.bytes.toString('latin1')));
            from = p;
          }
          got.push(...splitter.end().map((l) => l.bytes.toString('latin1')));
        } catch (e) {
          if (!isLexlockError(e)) throw e;
          line = e.where.line ?? -1;
        }
        expect(got).toEqual(expected);
        expect(line).toBe(refused);
      }),
      { numRuns: 300 },
    );
  });
});

describe('the record limit as an option and a flag', () => {
  it.each([0, -1, 1.5, Number.NaN, RECORD_LIMIT_MOST + 1])('readCorpus refuses maxRecordBytes %d', async (maxRecordBytes) => {
    const path = await fixtureFile('a.txt', 'x\n');
    expect(thrown(() => readCorpus(path, { maxRecordBytes }))).toEqual({
      code: 'BAD_OPTION',
      message: `${path}: record limit ${maxRecordBytes} is not a whole number of bytes from 1 to 268435456 (256 MiB)`,
    });
  });

  it('accepts 256 MiB, the most', async () => {
    const path = await fixtureFile('a.txt', 'x\n');
    expect(texts(await collect(readCorpus(path, { maxRecordBytes: 256 * MIB })))).toEqual([['x', undefined]]);
    expect(RECORD_LIMIT_MOST).toBe(256 * MIB);
  });

  async function corpora() {
    const dir = await tempFolder();
    await writeFile(join(dir, 'small.txt'), 'Morning sailing on time\nEvening sailing late\n');
    await writeFile(join(dir, 'big.txt'), `Morning sailing on time\n${ascii(MIB + 1)}\n`);
    await mkdir(join(dir, 'out'));
    return dir;
  }

  it.each([
    ['tally', (d: string) => ['tally', join(d, 'big.txt'), '-o', join(d, 'out/b.tally')]],
    ['build', (d: string) => ['build', join(d, 'big.txt'), '-o', join(d, 'out/b.json')]],
    ['audit', (d: string) => ['audit', join(d, 'big.txt'), '--cap', '10']],
    ['encode', (d: string) => ['encode', join(d, 'big.txt'), '--lexicon', join(d, 'out/small.json'), '-o', join(d, 'out/b.jsonl')]],
  ])('lexlock %s --record-limit 1 refuses the 1 MiB + 1 line (exit 1); without it the line is read', async (command, argv) => {
    const dir = await corpora();
    expect((await cli('build', join(dir, 'small.txt'), '-o', join(dir, 'out/small.json'))).code).toBe(0);
    const refused = await cli(...argv(dir), '--record-limit', '1');
    expect([refused.code, refused.stderr]).toEqual([1, `lexlock ${command}: ${lineMessage(`${join(dir, 'big.txt')} line 2`)}\n`]);
    const read = await cli(...argv(dir), '--force', '--quiet');
    expect([read.code, read.stderr]).toEqual([0, '']);
  });

  it.each([
    ['0', 'lexlock tally: --record-limit: "0" is not a whole number of at least 1\n'],
    ['1.5', 'lexlock tally: --record-limit: "1.5" is not a whole number of at least 1\n'],
    ['257', 'lexlock tally: --record-limit: 257 MiB is more than the 256 MiB a record may have; give at most 256\n'],
  ])('--record-limit %s is a usage error (exit 2)', async (value, message) => {
    const dir = await corpora();
    const r = await cli('tally', join(dir, 'small.txt'), '-o', join(dir, 'out/s.tally'), '--record-limit', value);
    expect([r.code, r.stderr]).toEqual([2, message]);
  });

  it('build from a tally refuses --record-limit: the corpus was read when it was counted', async () => {
    const dir = await corpora();
    expect((await cli('tally', join(dir, 'small.txt'), '-o', join(dir, 'out/s.tally'))).code).toBe(0);
    const r = await cli('build', join(dir, 'out/s.tally'), '-o', join(dir, 'out/s.json'), '--record-limit', '2');
    expect([r.code, r.stderr]).toEqual([
      2,
      'lexlock build: --record-limit cannot be used with a tally: its corpus was read when it was counted; leave it out, or pass it to lexlock tally\n',
    ]);
  });
});
