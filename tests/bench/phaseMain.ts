// Child-process entry of the benchmark: runs the one phase given as JSON in argv[2] and prints its
// PhaseResult as one JSON line, so each phase's peak memory is its own.
import type { PhaseSpec } from './PhaseSpec.js';
import { runPhase } from './runPhase.js';

const spec = JSON.parse(process.argv[2] ?? '{}') as PhaseSpec;
const result = await runPhase(spec);
process.stdout.write(`${JSON.stringify(result)}\n`);
