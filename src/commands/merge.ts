import { mergeTallyFiles } from '../files/mergeTallyFiles.js';
import { withLocks } from '../files/outputLock.js';
import { assertWritable } from '../files/refuseOverwrite.js';
import { LexlockError } from '../LexlockError.js';
import type { Io } from './Io.js';
import { parseArgs, valueOf } from './parseArgs.js';
import { assertTallyName, describeTallyFile } from './tally.js';

/** `lexlock merge --help`. */
export const MERGE_HELP = `lexlock merge <part.tally>... -o <all.tally> [--force]

Adds up tally files counted under the same rules into one; the order and grouping do not matter.
Reads the parts line by line, one count of each at a time, so they may be of any size.

  -o, --output FILE     where to write the merged tally; must end in .tally (refused if it exists, unless --force)
  --force               overwrite an existing tally file
  -q, --quiet           accepted for symmetry with tally; merge prints no progress
`;

/** `lexlock merge`: tally files -> one tally file. */
export async function merge(argv: readonly string[], io: Io): Promise<number> {
  const args = parseArgs('merge', argv, {
    output: { kind: 'value', short: 'o' },
    force: { kind: 'switch' },
    quiet: { kind: 'switch', short: 'q' },
  });
  const inputs = args.positionals;
  if (inputs.length === 0) throw new LexlockError('USAGE_MISSING', 'expected <part.tally>..., got none; see lexlock merge --help', {});
  const output = valueOf(args, 'output');
  if (output === undefined) throw new LexlockError('USAGE_MISSING', '-o/--output is required: where should the merged tally go?', { field: '--output' });
  assertTallyName(output);
  const twice = inputs.find((p, i) => inputs.indexOf(p) !== i);
  if (twice !== undefined) throw new LexlockError('USAGE_BAD_VALUE', `${twice} is named twice; name each part once, or its counts would be added twice`, { file: twice });
  const force = args.switches.has('force');
  return withLocks([output], async () => {
    await assertWritable(output, force);
    // Streamed: one count line a part in memory, so parts of any size merge (mergeTallyFiles).
    const merged = await mergeTallyFiles(inputs, output);
    io.stdout.write(describeTallyFile(output, merged.file, merged.types));
    return 0;
  });
}
