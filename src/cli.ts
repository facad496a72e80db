import { isLexlockError } from './LexlockError.js';
import { audit, AUDIT_HELP } from './commands/audit.js';
import { build, BUILD_HELP } from './commands/build.js';
import { compare, COMPARE_HELP } from './commands/compare.js';
import { encode, ENCODE_HELP } from './commands/encode.js';
import { merge, MERGE_HELP } from './commands/merge.js';
import { peek, PEEK_HELP } from './commands/peek.js';
import { tally, TALLY_HELP } from './commands/tally.js';
import type { Io } from './commands/Io.js';
import { verify, VERIFY_HELP } from './commands/verify.js';
import { VERSION } from './version.js';

/** Exit codes of the CLI; `interrupted` (SIGINT) and `terminated` (SIGTERM) are 128 + the signal's number (common practice). */
export const EXIT = { ok: 0, badInput: 1, usage: 2, threshold: 3, interrupted: 130, terminated: 143 } as const;

/** The signals the executable stops on, removing its temporary files. */
export type StopSignal = 'SIGINT' | 'SIGTERM';

/**
 * The one line the executable prints on stderr when a signal stops a command: the outputs whose
 * temporary files it removed (none of them was written), or that no file was being written, and the
 * outputs it had already put in place whole before the signal came (`written`).
 * @example interruptedLine('SIGINT', ['lex.json'], []) // 'lexlock: interrupted (SIGINT); nothing was written to lex.json\n'
 */
export function interruptedLine(signal: StopSignal, untouched: readonly string[], notRemoved: readonly string[], written: readonly string[] = []): string {
  const what =
    untouched.length > 0
      ? `nothing was written to ${untouched.join(', ')}`
      : written.length > 0
        ? ''
        : 'no file was being written';
  const done = written.length === 0 ? '' : `${written.join(', ')} ${written.length === 1 ? 'was' : 'were'} written in full before it`;
  const left = notRemoved.length === 0 ? '' : `; could not remove ${notRemoved.join(', ')}: delete ${notRemoved.length === 1 ? 'it' : 'them'} by hand`;
  return `lexlock: interrupted (${signal}); ${[what, done].filter((t) => t !== '').join('; ')}${left}\n`;
}

const COMMANDS: Record<string, { run: (argv: readonly string[], io: Io) => Promise<number>; help: string }> = {
  build: { run: build, help: BUILD_HELP },
  encode: { run: encode, help: ENCODE_HELP },
  verify: { run: verify, help: VERIFY_HELP },
  peek: { run: peek, help: PEEK_HELP },
  audit: { run: audit, help: AUDIT_HELP },
  compare: { run: compare, help: COMPARE_HELP },
  tally: { run: tally, help: TALLY_HELP },
  merge: { run: merge, help: MERGE_HELP },
};

/** `lexlock --help`. */
export const MAIN_HELP = `lexlock ${VERSION}: one fingerprinted lexicon file for text -> ids, everywhere

  lexlock build <corpus> -o <lexicon.json>        count a corpus, write a lexicon
  lexlock encode <corpus> --lexicon <file> -o <out>  keyed ids as .jsonl or .npy files; --split train=0.8,...
  lexlock verify <lexicon.json>                   check schema, fingerprint and canaries
  lexlock peek <lexicon.json> [text...]           a text token by token: ids, OOV, cuts, zeros, the row
  lexlock audit <corpus> --lexicon <file> | --cap N  what a cap and a length cost; drift; --report page
  lexlock compare <a.json> <b.json>               two lexicons side by side
  lexlock tally <corpus part> -o <part.tally>     count one part of a corpus, anywhere
  lexlock merge <part.tally>... -o <all.tally>    add up tallies; then lexlock build all.tally

Corpora: .csv, .tsv, .jsonl/.ndjson, .txt (a document a line), or a folder (a document a file).
Run lexlock <command> --help for a command's flags.
`;

/**
 * Runs the CLI on `argv` (without the node and script names) and returns the exit code:
 * 0 ok, 1 bad input, 2 bad usage, 3 audit threshold crossed (130 and 143 come from the executable,
 * when a signal stops it: src/bin.ts). Errors are printed as one line; no command at all prints the
 * usage on stderr (exit 2).
 * @example const code = await run(['verify', 'lexicon.json'], { stdout: process.stdout, stderr: process.stderr, env: process.env });
 */
export async function run(argv: readonly string[], io: Io): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined) {
    // Called wrongly: the usage goes where errors go, so a pipe reading stdout gets nothing.
    io.stderr.write(MAIN_HELP);
    return EXIT.usage;
  }
  if (name === '--help' || name === '-h' || name === 'help') {
    io.stdout.write(MAIN_HELP);
    return EXIT.ok;
  }
  if (name === '--version' || name === '-V') {
    io.stdout.write(`${VERSION}\n`);
    return EXIT.ok;
  }
  const command = Object.hasOwn(COMMANDS, name) ? COMMANDS[name] : undefined;
  if (command === undefined) {
    io.stderr.write(`lexlock: unknown command "${name}"; the commands are ${Object.keys(COMMANDS).join(', ')} (lexlock --help)\n`);
    return EXIT.usage;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.stdout.write(command.help);
    return EXIT.ok;
  }
  try {
    return await command.run(rest, io);
  } catch (e) {
    if (isLexlockError(e)) {
      io.stderr.write(`lexlock ${name}: ${e.message}\n`);
      return e.isUsage ? EXIT.usage : EXIT.badInput;
    }
    const message = e instanceof Error ? e.message : String(e);
    io.stderr.write(`lexlock ${name}: unexpected error: ${message}\nThis is a bug in lexlock; please report it with the command you ran.\n`);
    return EXIT.badInput;
  }
}
