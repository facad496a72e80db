import { execFile } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { PhaseResult, PhaseSpec } from './PhaseSpec.js';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..', '..');

/** The lexicon file a command-line build phase writes (null for the other phases). */
export function cliLexiconOf(spec: PhaseSpec): string | null {
  if (spec.phase === 'build-cli') return `${spec.lexicon}.cli.json`;
  if (spec.phase === 'build-cli-one-thread') return `${spec.lexicon}.cli-one-thread.json`;
  if (spec.phase === 'build-cli-bounded') return `${spec.lexicon}.bounded.json`;
  if (spec.phase === 'build-encode-cli') return `${spec.lexicon}.one-pass.json`;
  return null;
}

/** The `lexlock` arguments of the phases that run the command-line tool as users do. */
function cliArguments(spec: PhaseSpec): string[] | null {
  const build = (more: string[]) => {
    const args = ['build', spec.corpus, '-o', cliLexiconOf(spec) as string, '--cap', String(spec.cap), '--length', String(spec.length), ...more, '--quiet', '--force'];
    return spec.label === undefined ? args : [...args, '--label', spec.label];
  };
  if (spec.phase === 'build-cli') return build([]);
  if (spec.phase === 'build-cli-one-thread') return build(['--threads', '1']);
  if (spec.phase === 'build-cli-bounded') {
    if (spec.memoryLimitMiB === undefined) throw new Error('build-cli-bounded needs memoryLimitMiB');
    return build(['--memory-limit', String(spec.memoryLimitMiB)]);
  }
  if (spec.phase === 'build-encode-cli') return build(['--encode', `${spec.out}-one-pass`]);
  if (spec.phase === 'encode-npy') {
    // A lexicon with labels needs its corpus read with them (encode stops with MISSING_LABELS otherwise).
    const args = ['encode', spec.corpus, '--lexicon', spec.lexicon, '-o', spec.out, '--quiet', '--force'];
    return spec.label === undefined ? args : [...args, '--label', spec.label];
  }
  return null;
}

function lastLine(stdout: string): string {
  return stdout.trim().split('\n').pop() ?? '';
}

/**
 * Runs one phase in a fresh Node process and returns what it reported, so phases never share a heap
 * and each peak RSS is the phase's own. Library phases run through tsx (importing the built
 * `lexlock/node`); command-line phases run `dist/bin.js` itself, with no loader (binPhase.mjs).
 */
export function spawnPhase(spec: PhaseSpec): Promise<PhaseResult> {
  const cli = cliArguments(spec);
  const argv = cli === null ? ['--import', 'tsx', join(here, 'phaseMain.ts'), JSON.stringify(spec)] : [join(here, 'binPhase.mjs'), join(root, 'dist', 'bin.js'), ...cli];
  return new Promise((resolve, reject) => {
    execFile(process.execPath, argv, { cwd: root, maxBuffer: 16 << 20 }, (error, stdout, stderr) => {
      if (error) {
        reject(new Error(`phase ${spec.phase} on ${spec.corpus} failed: ${error.message}\n${stderr}`));
        return;
      }
      if (cli === null) {
        resolve(JSON.parse(lastLine(stdout)) as PhaseResult);
        return;
      }
      const ran = JSON.parse(lastLine(stdout)) as { seconds: number; maxRssKiB: number; code: number };
      if (ran.code !== 0) reject(new Error(`lexlock ${cli.join(' ')} exited ${ran.code}\n${stderr}`));
      else resolve({ phase: spec.phase, seconds: ran.seconds, maxRssKiB: ran.maxRssKiB, figures: {} });
    });
  });
}
