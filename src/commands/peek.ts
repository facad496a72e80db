import { describeShape, type Shape } from '../lexicon/Shape.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { peekText, type TextPeek } from '../lexicon/peekText.js';
import { LexlockError } from '../LexlockError.js';
import { decodeText } from '../corpus/decodeText.js';
import { readLines, stripCr } from '../corpus/lines.js';
import { RECORD_LIMIT_DEFAULT } from '../corpus/recordLimit.js';
import { loadLexicon } from '../files/loadLexicon.js';
import { counted } from './format.js';
import type { Io, StdinStream } from './Io.js';
import { parseArgs, type ParsedArgs } from './parseArgs.js';
import { SHAPE_FLAGS, corpusOptions, shapeFromFlags } from './sharedFlags.js';
import { visibleToken } from './visibleToken.js';

/** `lexlock peek --help`. */
export const PEEK_HELP = `lexlock peek <lexicon.json> [text...] [options]

Shows what a text becomes with a lexicon: every token with its id, the OOV ones, the ones the shape
cuts, where the padding zeros go, and the row of ids the model gets (what encode gives).

The text is the arguments after the lexicon, joined by one space (put -- before a text that starts
with -). Without any, each non-empty line of standard input is one text, read as a line of a .txt
corpus is (a trailing CR dropped, invalid UTF-8 under --bad-text).

  --json                one JSON object a text, one a line: {"line", "text", "badText", "fingerprint",
                        "shape", "tokens", "oovTokens", "cutTokens", "zeros", "row"}; line: the line of
                        standard input (null for arguments); text: as decoded (null when left out);
                        badText: null, "replaced" or "skipped" (the line had invalid UTF-8); shape:
                        {"length", "pad", "cut"} or null; tokens: [{"token", "id", "oov", "slot"}]
                        in text order, slot: the token's place in row (0-based), null when cut;
                        row: the ids (null when left out)
  --length L            a length for a lexicon without a shape (with --pad/--cut start|end, default end)
  --bad-text fail|replace|skip   invalid UTF-8 on standard input (default: the lexicon's, fail if none)
  --record-limit MiB    refuse a line of standard input larger than this (default 64, at most 256)

In the table, slot is where the token's id lands in the row; - marks a token the shape cuts.
`;

const STDIN = 'standard input';

/** `lexlock peek`: a text, or each line of standard input, token by token. */
export async function peek(argv: readonly string[], io: Io): Promise<number> {
  const args = parseArgs('peek', argv, {
    json: { kind: 'switch' },
    'bad-text': { kind: 'value' },
    'record-limit': { kind: 'value' },
    ...SHAPE_FLAGS,
  });
  const [lexiconPath, ...words] = args.positionals;
  if (lexiconPath === undefined) {
    throw new LexlockError('USAGE_MISSING', 'expected <lexicon.json> [text...], got none; see lexlock peek --help', {});
  }
  const flagShape = shapeFromFlags(args);
  const lexicon = await loadLexicon(lexiconPath);
  if (flagShape !== null && lexicon.shape !== null) {
    throw new LexlockError(
      'USAGE_BAD_VALUE',
      `--length: ${lexiconPath} already fixes the shape (${describeShape(lexicon.shape)}) as part of its fingerprint; drop --length`,
      { field: '--length' },
    );
  }
  const shape = flagShape ?? lexicon.shape;
  const json = args.switches.has('json');
  // The human output names the lexicon once, above the first text (so a run that shows none prints nothing).
  let header = json ? '' : headerLine(lexiconPath, lexicon, shape);
  const show = (seen: Seen) => {
    io.stdout.write(json ? jsonLine(seen, lexicon, shape) : `${header}${humanBlock(seen)}`);
    header = '';
  };
  if (words.length > 0) {
    const text = words.join(' ');
    show({ line: null, text, badText: null, peek: peekText(lexicon, text, { shape }) });
    return 0;
  }
  return peekLines(args, io, lexicon, shape, show);
}

/** One text as shown: where it came from, its text (null when left out), what bad UTF-8 did, and its peek. */
interface Seen {
  line: number | null;
  text: string | null;
  badText: 'replaced' | 'skipped' | null;
  peek: TextPeek | null;
}

/** Each non-empty line of standard input, read as a `.txt` corpus reads its lines, shown as it comes. */
async function peekLines(args: ParsedArgs, io: Io, lexicon: Lexicon, shape: Shape | null, show: (seen: Seen) => unknown): Promise<number> {
  const options = corpusOptions(args, { badText: lexicon.badText });
  const stdin: StdinStream = io.stdin ?? process.stdin;
  if (stdin.isTTY === true) io.stderr.write('lexlock peek: reading one text a line from standard input (Ctrl-D ends it)\n');
  const stats = { documents: 0, replaced: 0, skipped: 0, bytes: 0 };
  const setup = { badText: options.badText, stats, file: STDIN };
  const limit = { maxBytes: options.maxRecordBytes ?? RECORD_LIMIT_DEFAULT, file: STDIN };
  let texts = 0;
  for await (const lines of readLines(buffers(stdin), limit)) {
    for (const line of lines) {
      const bytes = stripCr(line.bytes);
      if (bytes.length === 0) continue;
      texts += 1;
      const [replaced, skipped] = [stats.replaced, stats.skipped];
      const text = decodeText(bytes, line, setup);
      const badText = stats.replaced > replaced ? 'replaced' : stats.skipped > skipped ? 'skipped' : null;
      show({ line: line.line, text, badText, peek: text === null ? null : peekText(lexicon, text, { shape }) });
    }
  }
  if (texts === 0) {
    throw new LexlockError('EMPTY_CORPUS', `${STDIN} held no text (no non-empty line); give the text as arguments after the lexicon, or one text a line on ${STDIN}`, { file: STDIN });
  }
  return 0;
}

/** The chunks of standard input as Buffers (a stream may hand out other Uint8Arrays). */
async function* buffers(stdin: StdinStream): AsyncGenerator<Buffer> {
  for await (const chunk of stdin) yield Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk.buffer, chunk.byteOffset, chunk.byteLength);
}

/** The first line of the human output: the lexicon, its fingerprint, the shape and the OOV id. */
function headerLine(path: string, lexicon: Lexicon, shape: Shape | null): string {
  const form = shape === null ? 'no fixed length' : describeShape(shape);
  return `lexicon ${path} (${lexicon.fingerprint}): ${form}; OOV id ${lexicon.oovId}\n`;
}

/** The most characters of a text its heading quotes; a longer one is shortened with an ellipsis. */
const HEADING_TEXT = 72;

/** One text in words, a table of its tokens and its row. */
function humanBlock(seen: Seen): string {
  const from = seen.line === null ? '' : `line ${seen.line}: `;
  if (seen.peek === null || seen.text === null) return `\n${from}left out: invalid UTF-8 (--bad-text skip)\n`;
  const { peek } = seen;
  const quoted = visibleToken(seen.text.length > HEADING_TEXT ? `${seen.text.slice(0, HEADING_TEXT)}…` : seen.text);
  let out = `\n${from}${quoted}${seen.badText === 'replaced' ? ' (invalid UTF-8 replaced by U+FFFD)' : ''}\n${summary(peek)}\n`;
  if (peek.tokens.length > 0) {
    const rows = peek.tokens.map((t, i) => {
      const notes = [t.oov ? 'OOV' : '', t.slot === null ? 'cut' : ''].filter((n) => n !== '').join(', ');
      return [String(i + 1), String(t.id), t.slot === null ? '-' : String(t.slot), visibleToken(t.token), notes];
    });
    const header = ['#', 'id', 'slot', 'token', ''];
    const widths = header.map((h, c) => Math.max(h.length, ...rows.map((r) => (r[c] as string).length)));
    const format = (cells: string[]) =>
      cells
        .map((cell, c) => (c < 3 ? cell.padStart(widths[c] as number) : c === 3 && cells[4] !== '' ? cell.padEnd(widths[c] as number) : cell))
        .join('  ')
        .trimEnd();
    out += `${[header, ...rows].map((r) => `  ${format(r)}`).join('\n')}\n`;
  }
  return `${out}row ${JSON.stringify(Array.from(peek.row))}\n`;
}

/**
 * The text's fate in one sentence:
 * `7 tokens, 2 OOV; the row keeps tokens 1-4 and cuts 3 from the end`,
 * `2 tokens, 1 OOV; the row keeps both, with 2 zeros at the start`.
 */
function summary(peek: TextPeek): string {
  const n = peek.tokens.length;
  const head = `${counted(n, 'token')}${n === 0 ? '' : `, ${peek.oovTokens} OOV`}`;
  const { shape } = peek;
  if (shape === null) return `${head}; no fixed length: the row is ${n === 0 ? 'empty' : n === 1 ? 'its id' : `its ${n} ids`}`;
  if (n === 0) return `${head}; the row is ${counted(shape.length, 'zero')}`;
  if (peek.cutTokens > 0) {
    const kept = n - peek.cutTokens;
    const [first, last] = shape.cut === 'end' ? [1, kept] : [peek.cutTokens + 1, n];
    return `${head}; the row keeps tokens ${first}-${last} and cuts ${peek.cutTokens} from the ${shape.cut}`;
  }
  const all = n === 1 ? 'it' : n === 2 ? 'both' : `all ${n}`;
  return `${head}; the row keeps ${all}, ${peek.zeros === 0 ? 'with no zeros' : `with ${counted(peek.zeros, 'zero')} at the ${shape.pad}`}`;
}

/** One text as one JSON line (the shape `lexlock peek --help` documents). */
function jsonLine(seen: Seen, lexicon: Lexicon, shape: Shape | null): string {
  const peek = seen.peek;
  return `${JSON.stringify({
    line: seen.line,
    text: seen.text,
    badText: seen.badText,
    fingerprint: lexicon.fingerprint,
    shape,
    tokens: peek?.tokens ?? [],
    oovTokens: peek?.oovTokens ?? 0,
    cutTokens: peek?.cutTokens ?? 0,
    zeros: peek?.zeros ?? 0,
    row: peek === null ? null : Array.from(peek.row),
  })}\n`;
}
