import { inputError, type Where } from '../LexlockError.js';
import { withoutBom } from '../artifact/jsonFileLimit.js';
import { badTally, TallyCountsCheck } from './TallyCountsCheck.js';
import { tallyHeaderParse, type TallyHeader } from './tallyFileParse.js';

/** A tally file's text as groups of lines (without their line feeds), and the name messages give it. */
export interface TallyLines {
  name: string;
  lines: AsyncIterable<readonly string[]>;
}

/**
 * The most characters of lines before the `"counts": [` line. The members before it are small
 * (a length histogram, labels, at most 3 snippets); a file with more is not one lexlock wrote.
 */
export const TALLY_HEADER_MOST_CHARS = 64 * 1024 * 1024;

const COUNTS_OPEN = '"counts": [';
const LAYOUT = 'lexlock merge reads tally files laid out as lexlock tally and merge write them (one count a line)';

/** A line as a message shows it: quoted, its first 40 characters. */
function shown(line: string): string {
  return JSON.stringify(line.length > 40 ? `${line.slice(0, 40)}…` : line);
}

type Expecting = 'entry or end' | 'entry' | 'end' | 'closing brace' | 'nothing';

/**
 * Reads one tally file line by line, as lexlock lays it out: the members before `counts` (parsed and
 * checked as tallyFileParse checks them, see {@link tallyHeaderParse}), then one
 * `[token, occurrences, documents]` entry a line, each checked as it is read (JSON, shape, tokens in
 * string order, documents at most occurrences) and the totals at the end. Holds the current entry and
 * the group of lines it came in, never the file. Anything wrong is a `BAD_TALLY` (or `NOT_JSON`,
 * `NOT_A_TALLY`, ...) naming the file and line. Browser-safe.
 * @example const part = await TallyPartReader.open(source); while (await part.next()) use(part.token, part.occurrences);
 */
export class TallyPartReader {
  readonly name: string;
  readonly header: TallyHeader;
  /** The current entry, once {@link TallyPartReader.next} has returned true. */
  token = '';
  occurrences = 0;
  documents = 0;
  readonly #where: Where;
  readonly #lines: AsyncIterator<readonly string[]>;
  readonly #check: TallyCountsCheck;
  #group: readonly string[];
  #index: number;
  /** The 1-based number of the line last taken. */
  #line: number;
  #expecting: Expecting = 'entry or end';

  private constructor(name: string, header: TallyHeader, lines: AsyncIterator<readonly string[]>, group: readonly string[], index: number, line: number) {
    this.name = name;
    this.header = header;
    this.#where = { file: name };
    this.#lines = lines;
    this.#group = group;
    this.#index = index;
    this.#line = line;
    this.#check = new TallyCountsCheck(header.doc, this.#where);
  }

  /** Reads and checks the members before `counts`; the entries follow with {@link TallyPartReader.next}. */
  static async open(source: TallyLines): Promise<TallyPartReader> {
    const lines = source.lines[Symbol.asyncIterator]();
    try {
      return await TallyPartReader.#open(source.name, lines);
    } catch (e) {
      await lines.return?.();
      throw e;
    }
  }

  static async #open(name: string, lines: AsyncIterator<readonly string[]>): Promise<TallyPartReader> {
    const where: Where = { file: name };
    const head: string[] = [];
    let chars = 0;
    let line = 0;
    for (;;) {
      const next = await lines.next();
      if (next.done === true) break;
      const group = next.value;
      for (let i = 0; i < group.length; i++) {
        const text = line === 0 ? withoutBom(group[i] as string) : (group[i] as string);
        line += 1;
        if (text.trim() === COUNTS_OPEN) {
          const header = tallyHeaderParse(parseHead(head, where), where);
          return new TallyPartReader(name, header, lines, group, i + 1, line);
        }
        head.push(text);
        chars += text.length + 1;
        if (chars > TALLY_HEADER_MOST_CHARS) {
          throw badTally(where, 'counts', `no ${COUNTS_OPEN} line in its first ${TALLY_HEADER_MOST_CHARS / 1024 / 1024} MiB; ${LAYOUT}`);
        }
      }
    }
    // No line opens the counts: not a tally at all (say what it is), or one laid out otherwise.
    let raw: unknown;
    try {
      raw = JSON.parse(head.join('\n'));
    } catch (e) {
      throw inputError('NOT_JSON', where, `not JSON (${(e as Error).message}); pass a tally file written by lexlock tally or lexlock merge`);
    }
    tallyHeaderParse(raw, where);
    throw badTally(where, 'counts', `"counts" does not open on a line of its own; ${LAYOUT}`);
  }

  /** Stops reading the lines before their end (their source closes its file), as after a failure elsewhere. */
  async close(): Promise<void> {
    await this.#lines.return?.();
  }

  /**
   * Moves to the next entry (true), or checks the end of the file and the totals (false). A broken
   * line stops the reading there: the lines' source is closed (its file with it), then the error thrown.
   */
  async next(): Promise<boolean> {
    try {
      return await this.#next();
    } catch (e) {
      await this.close();
      throw e;
    }
  }

  async #next(): Promise<boolean> {
    for (;;) {
      const line = await this.#nextLine();
      if (line === null) {
        if (this.#expecting === 'nothing') return false;
        throw this.#bad(`the file ends after this line, before "counts" and the file are closed (was it cut short?)`);
      }
      const text = line.trim();
      switch (this.#expecting) {
        case 'entry or end':
        case 'entry':
          if (text === ']' && this.#expecting === 'entry or end') {
            this.#closed();
            continue;
          }
          this.#entry(text);
          return true;
        case 'end':
          if (text !== ']') throw this.#bad(`expected "]" after the last entry (the one without a comma), got ${shown(line)}`);
          this.#closed();
          continue;
        case 'closing brace':
          if (text !== '}') throw this.#bad(`expected the closing "}" after "counts", got ${shown(line)}`);
          this.#expecting = 'nothing';
          continue;
        case 'nothing':
          if (text !== '') throw this.#bad(`expected nothing after the closing "}", got ${shown(line)}`);
          continue;
      }
    }
  }

  #entry(text: string): void {
    const comma = text.endsWith(',');
    let value: unknown;
    try {
      value = JSON.parse(comma ? text.slice(0, -1) : text);
    } catch {
      value = undefined;
    }
    if (!isEntry(value)) {
      const after = this.#expecting === 'entry' ? ' after the comma on the line before' : '';
      throw this.#bad(`expected one [token, occurrences, documents] entry${after} (a token that is not empty, two whole numbers from 1 up), got ${shown(text)}; ${LAYOUT}`);
    }
    const [token, occurrences, documents] = value;
    this.#check.entry(token, occurrences, documents, 'counts', this.#line);
    this.token = token;
    this.occurrences = occurrences;
    this.documents = documents;
    this.#expecting = comma ? 'entry' : 'end';
  }

  #closed(): void {
    this.#check.end();
    this.#expecting = 'closing brace';
  }

  #bad(detail: string) {
    return badTally({ ...this.#where, line: this.#line }, 'counts', detail);
  }

  async #nextLine(): Promise<string | null> {
    while (this.#index >= this.#group.length) {
      const next = await this.#lines.next();
      if (next.done === true) return null;
      this.#group = next.value;
      this.#index = 0;
    }
    this.#line += 1;
    return this.#group[this.#index++] as string;
  }
}

/** The lines before `counts`, with an empty `counts` in its place, as a JSON value. */
function parseHead(head: readonly string[], where: Where): unknown {
  try {
    return JSON.parse(`${head.join('\n')}\n"counts": []}`);
  } catch (e) {
    throw inputError('NOT_JSON', where, `not JSON before "counts" (${(e as Error).message}); pass a tally file written by lexlock tally or lexlock merge`);
  }
}

function isEntry(value: unknown): value is [string, number, number] {
  if (!Array.isArray(value) || value.length !== 3) return false;
  const [token, occurrences, documents] = value as unknown[];
  return typeof token === 'string' && token !== '' && isPositive(occurrences) && isPositive(documents);
}

function isPositive(n: unknown): n is number {
  return typeof n === 'number' && Number.isSafeInteger(n) && n >= 1;
}
