import { rm, type FileHandle } from 'node:fs/promises';
import { dirname } from 'node:path';
import { LexlockError } from '../LexlockError.js';
import { fileSystem } from './fileSystem.js';
import { ioError } from './ioError.js';
import { trackTemp, untrackTemp } from './openTemps.js';
import { removeStaleTemps } from './removeStaleTemps.js';
import { spillDestination } from './tempNames.js';
import { readFully, writeFully } from './writeFully.js';

/** Numbers a block holds before it is written (4 MiB). */
const BLOCK_INTS = 1 << 20;
/** Numbers before a document's own: label, group, length, the key's UTF-16 code units. */
const HEAD = 4;
/** Code units turned into a string at a time when a key is read back (String.fromCharCode takes them as arguments). */
const UNITS_A_CALL = 8192;

/** One document read back from a spill: its label's index (-1: none), its numbers' group, its token numbers and its key. */
export interface SpilledDocument {
  label: number;
  group: number;
  numbers: Int32Array;
  key: string;
}

/**
 * A temporary file of documents as token numbers, written once in corpus order and read back once in
 * the same order: a build that also encodes keeps its corpus here instead of reading and tokenizing it
 * again. Blocks of int32 in this machine's byte order (the file never leaves it): a block is its
 * length in numbers, then its documents, each `label, group, length, key units`, the key's UTF-16
 * code units two to a number (the last one padded with 0), then the numbers (the group says which
 * numbering the numbers are in, for a caller that has more than one).
 */
export class NumberSpill {
  readonly path: string;
  /** The path errors name: the lexicon a spill of spillPathFor stands for, else the spill itself. */
  private readonly report: string;
  /** ' beside it' when errors name the lexicon. */
  private readonly beside: string;
  private readonly handle: FileHandle;
  private block = new Int32Array(BLOCK_INTS);
  /** The block's bytes as UTF-16 code units, for keys. */
  private units = new Uint16Array(this.block.buffer);
  private used = 0;
  private written = 0;
  /** Documents added, to check against the documents read back. */
  private added = 0;
  /** The write error that made this spill useless, thrown again by every later call. */
  private failure: Error | null = null;

  private constructor(path: string, handle: FileHandle) {
    this.path = path;
    this.handle = handle;
    const destination = spillDestination(path);
    this.report = destination ?? path;
    this.beside = destination === null ? '' : ' beside it';
  }

  /**
   * Creates the file at `path`, and its folder if need be (refused if something is there already,
   * a symbolic link included). Kept in this process's list of open temporary files until
   * {@link NumberSpill.remove}. A path named by spillPathFor stands for its lexicon: the spills and
   * temporary files that dead runs left for that lexicon are removed first.
   */
  static async create(path: string): Promise<NumberSpill> {
    const destination = spillDestination(path);
    if (destination !== null) await removeStaleTemps(destination);
    trackTemp(path, destination);
    try {
      await fileSystem.mkdir(dirname(path));
      return new NumberSpill(path, await fileSystem.open(path, 'wx+'));
    } catch (e) {
      untrackTemp(path);
      throw ioError(destination ?? path, `creating a temporary file of token numbers${destination === null ? '' : ' beside it'}`, e);
    }
  }

  /** Appends one document: its label's index (-1 for none), its group, the first `length` of `numbers`, and its key. */
  async add(label: number, group: number, numbers: Int32Array, length: number, key: string): Promise<void> {
    if (this.failure !== null) throw this.failure;
    this.added += 1;
    const keyInts = (key.length + 1) >> 1;
    const size = HEAD + keyInts + length;
    if (this.used + size > this.block.length) {
      await this.writeBlock();
      if (size > this.block.length) {
        this.block = new Int32Array(size);
        this.units = new Uint16Array(this.block.buffer);
      }
    }
    const block = this.block;
    block[this.used] = label;
    block[this.used + 1] = group;
    block[this.used + 2] = length;
    block[this.used + 3] = key.length;
    if (keyInts > 0) block[this.used + HEAD + keyInts - 1] = 0; // the padding of an odd number of code units
    const units = this.units;
    const from = (this.used + HEAD) * 2;
    for (let i = 0; i < key.length; i++) units[from + i] = key.charCodeAt(i);
    block.set(numbers.subarray(0, length), this.used + HEAD + keyInts);
    this.used += size;
  }

  /** The documents in the order added (everything added is written first). */
  async *documents(): AsyncGenerator<SpilledDocument, void, undefined> {
    if (this.failure !== null) throw this.failure;
    await this.writeBlock();
    let position = 0;
    let count = 0;
    const header = new Int32Array(1);
    while (position < this.written) {
      await this.readInto(header, position);
      const size = header[0] as number;
      if (!(Number.isInteger(size) && size > 0 && position + 4 + size * 4 <= this.written)) this.damaged(`the block at byte ${position} claims ${size} numbers`);
      const block = new Int32Array(size);
      const units = new Uint16Array(block.buffer);
      await this.readInto(block, position + 4);
      const start = position + 4;
      position += 4 + block.byteLength;
      for (let at = 0; at < block.length; ) {
        const length = at + HEAD <= block.length ? (block[at + 2] as number) : -1;
        const keyUnits = at + HEAD <= block.length ? (block[at + 3] as number) : -1;
        const numbersAt = at + HEAD + ((keyUnits + 1) >> 1);
        if (!(length >= 0 && keyUnits >= 0 && numbersAt + length <= block.length)) this.damaged(`the document at byte ${start + at * 4} does not fit its block`);
        count += 1;
        const key = stringOf(units, (at + HEAD) * 2, keyUnits);
        yield { label: block[at] as number, group: block[at + 1] as number, numbers: block.subarray(numbersAt, numbersAt + length), key };
        at = numbersAt + length;
      }
    }
    if (position !== this.written || count !== this.added) this.damaged(`${count} documents in ${position} bytes came back, but ${this.added} in ${this.written} were written`);
  }

  /** Closes and deletes the file. Never throws: a file that cannot be removed is left for the next run's clean-up. */
  async remove(): Promise<void> {
    await this.handle.close().catch(() => undefined);
    await rm(this.path, { force: true }).catch(() => undefined);
    untrackTemp(this.path);
  }

  private async writeBlock(): Promise<void> {
    if (this.used === 0) return;
    const bytes = new Uint8Array(this.block.buffer, 0, this.used * 4);
    try {
      // Every byte or an error: a short write left unfinished would read back as empty documents.
      await writeFully(this.handle, new Uint8Array(Int32Array.of(this.used).buffer), this.written);
      await writeFully(this.handle, bytes, this.written + 4);
    } catch (e) {
      this.failure = ioError(this.report, `writing token numbers to a temporary file${this.beside}`, e);
      throw this.failure;
    }
    this.written += 4 + bytes.length;
    this.used = 0;
  }

  private async readInto(into: Int32Array, position: number): Promise<void> {
    const bytes = new Uint8Array(into.buffer, into.byteOffset, into.byteLength);
    let bytesRead: number;
    try {
      bytesRead = await readFully(this.handle, bytes, position);
    } catch (e) {
      throw ioError(this.report, `reading back the temporary file of token numbers${this.beside}`, e);
    }
    if (bytesRead !== bytes.length) this.damaged(`it ended early (${bytesRead} of ${bytes.length} bytes at ${position})`);
  }

  /** Throws `IO` for a spill that does not hold what was written to it. */
  private damaged(what: string): never {
    throw new LexlockError('IO', `${this.path}: the temporary file of token numbers does not hold what was written to it: ${what}; is the disk failing, or did something else write to it?`, { file: this.path });
  }
}

/** `count` UTF-16 code units from `from` as a string, lone surrogates and all. */
function stringOf(units: Uint16Array, from: number, count: number): string {
  if (count <= UNITS_A_CALL) return String.fromCharCode(...units.subarray(from, from + count));
  let out = '';
  for (let at = 0; at < count; at += UNITS_A_CALL) out += String.fromCharCode(...units.subarray(from + at, from + Math.min(count, at + UNITS_A_CALL)));
  return out;
}
