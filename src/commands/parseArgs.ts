import { LexlockError } from '../LexlockError.js';

/** One flag a command accepts. */
export interface FlagSpec {
  /** `value` flags take the next argument (or `--flag=value`); `switch` flags take none. */
  kind: 'value' | 'switch';
  /** One-letter alias, e.g. `o` for `--output`. */
  short?: string;
  /** May be given more than once (values collect in order). */
  repeat?: boolean;
}

/** The parsed command line of one command. */
export interface ParsedArgs {
  positionals: string[];
  values: Map<string, string[]>;
  switches: Set<string>;
}

/**
 * Parses a command's arguments by its flag table. Unknown flags and missing values are usage
 * errors (CLI exit 2) naming the flag. Values may start with `-` (so `--cap -3` reaches the
 * value check and is refused there, naming --cap).
 */
export function parseArgs(command: string, argv: readonly string[], flags: Readonly<Record<string, FlagSpec>>): ParsedArgs {
  const byShort = new Map<string, string>();
  for (const [name, spec] of Object.entries(flags)) if (spec.short !== undefined) byShort.set(spec.short, name);
  const out: ParsedArgs = { positionals: [], values: new Map(), switches: new Set() };
  let onlyPositionals = false;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i] as string;
    if (onlyPositionals || arg === '-' || !arg.startsWith('-')) {
      out.positionals.push(arg);
      continue;
    }
    if (arg === '--') {
      onlyPositionals = true;
      continue;
    }
    let name: string;
    let inline: string | undefined;
    if (arg.startsWith('--')) {
      const eq = arg.indexOf('=');
      name = eq === -1 ? arg.slice(2) : arg.slice(2, eq);
      inline = eq === -1 ? undefined : arg.slice(eq + 1);
    } else {
      const long = byShort.get(arg.slice(1, 2));
      if (long === undefined || (arg.length > 2 && flags[long]?.kind === 'switch')) {
        throw new LexlockError('USAGE_UNKNOWN_FLAG', `unknown flag ${arg}; see lexlock ${command} --help`, { field: arg });
      }
      name = long;
      inline = arg.length > 2 ? arg.slice(2) : undefined;
    }
    const spec = Object.hasOwn(flags, name) ? flags[name] : undefined;
    if (spec === undefined) {
      throw new LexlockError('USAGE_UNKNOWN_FLAG', `unknown flag --${name}; see lexlock ${command} --help`, { field: `--${name}` });
    }
    if (spec.kind === 'switch') {
      if (inline !== undefined) {
        throw new LexlockError('USAGE_BAD_VALUE', `--${name} takes no value (got "${inline}")`, { field: `--${name}` });
      }
      out.switches.add(name);
      continue;
    }
    let value = inline;
    if (value === undefined) {
      const next = argv[i + 1];
      if (next === undefined) throw new LexlockError('USAGE_MISSING', `--${name} needs a value`, { field: `--${name}` });
      value = next;
      i++;
    }
    const list = out.values.get(name) ?? [];
    if (list.length > 0 && spec.repeat !== true) {
      throw new LexlockError('USAGE_BAD_VALUE', `--${name} is given twice; give it once`, { field: `--${name}` });
    }
    list.push(value);
    out.values.set(name, list);
  }
  return out;
}

/** The single value of a flag, or undefined. */
export function valueOf(args: ParsedArgs, name: string): string | undefined {
  return args.values.get(name)?.[0];
}

/** A flag's value as a whole number >= min, or undefined when absent; a usage error naming the flag otherwise. */
export function wholeNumberFlag(args: ParsedArgs, name: string, min: number): number | undefined {
  const raw = valueOf(args, name);
  if (raw === undefined) return undefined;
  const n = /^[0-9]+$/.test(raw) ? Number(raw) : Number.NaN;
  if (!Number.isSafeInteger(n) || n < min) {
    throw new LexlockError('USAGE_BAD_VALUE', `--${name}: "${raw}" is not a whole number of at least ${min}`, { field: `--${name}` });
  }
  return n;
}

/** A flag's value from a fixed list, or undefined when absent; a usage error naming the flag otherwise. */
export function choiceFlag<T extends string>(args: ParsedArgs, name: string, choices: readonly T[]): T | undefined {
  const raw = valueOf(args, name);
  if (raw === undefined) return undefined;
  if (!(choices as readonly string[]).includes(raw)) {
    throw new LexlockError('USAGE_BAD_VALUE', `--${name}: "${raw}" is not one of ${choices.join(', ')}`, { field: `--${name}` });
  }
  return raw as T;
}

/** A comma-separated list flag (may also repeat), or an empty list. */
export function listFlag(args: ParsedArgs, name: string): string[] {
  return (args.values.get(name) ?? []).flatMap((v) => v.split(',')).filter((v) => v !== '');
}

/** Exactly `n` positionals, or a usage error saying what is expected. */
export function positionals(command: string, args: ParsedArgs, names: readonly string[]): string[] {
  if (args.positionals.length !== names.length) {
    const want = names.map((n) => `<${n}>`).join(' ');
    const got = args.positionals.length === 0 ? 'none' : args.positionals.map((p) => `"${p}"`).join(' ');
    throw new LexlockError('USAGE_MISSING', `expected ${want}, got ${got}; see lexlock ${command} --help`, {});
  }
  return [...args.positionals];
}
