import { execFile } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { PhaseResult, PhaseSpec } from './PhaseSpec.js';

const here = dirname(fileURLToPath(import.meta.url));

/**
 * Runs one phase in a fresh Node process (through tsx, importing the built `lexlock/node`) and returns
 * what it reported, so phases never share a heap and each peak RSS is the phase's own.
 */
export function spawnPhase(spec: PhaseSpec): Promise<PhaseResult> {
  return new Promise((resolve, reject) => {
    execFile(
      process.execPath,
      ['--import', 'tsx', join(here, 'phaseMain.ts'), JSON.stringify(spec)],
      { cwd: join(here, '..', '..'), maxBuffer: 16 << 20 },
      (error, stdout, stderr) => {
        if (error) {
          reject(new Error(`phase ${spec.phase} on ${spec.corpus} failed: ${error.message}\n${stderr}`));
          return;
        }
        const last = stdout.trim().split('\n').pop() ?? '';
        resolve(JSON.parse(last) as PhaseResult);
      },
    );
  });
}
