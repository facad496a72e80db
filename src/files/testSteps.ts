import { writeSync } from 'node:fs';

// Test hooks for the steps of writing and committing outputs, so a test can stop a run at each one
// (tests/files/commitSteps.test.ts). Off unless the environment variable LEXLOCK_TEST_STEPS is set:
//   LEXLOCK_TEST_STEPS=announce   prints `lexlock step <n> (async|sync): <name>` on stderr at every step
//   LEXLOCK_TEST_STEPS=pause:<n>  does the same and stops at step n after printing `lexlock paused at step <n> (...): <name>`
// A step inside a commit's synchronous part stops the whole thread (only SIGKILL ends it then, as a
// signal handler cannot run inside that part either); any other step waits with the event loop
// running, so SIGINT and SIGTERM are handled as usual.

let count = 0;

/** Which step to pause at (0: none), or null when the hooks are off. */
function setting(): number | null {
  const value = process.env.LEXLOCK_TEST_STEPS;
  if (value === undefined || value === '') return null;
  const pause = /^pause:([1-9][0-9]*)$/.exec(value);
  return pause === null ? 0 : Number(pause[1]);
}

/** Announces a step; true when the run must pause here. */
function announce(name: string, kind: 'async' | 'sync'): boolean {
  const pauseAt = setting();
  if (pauseAt === null) return false;
  count += 1;
  const pause = count === pauseAt;
  writeSync(2, `lexlock ${pause ? 'paused at ' : ''}step ${count} (${kind}): ${name}\n`);
  return pause;
}

/** A step outside a commit's synchronous part. */
export async function step(name: string): Promise<void> {
  if (!announce(name, 'async')) return;
  await new Promise<never>(() => {
    setInterval(() => undefined, 1 << 30);
  });
}

/** A step inside a commit's synchronous part: no signal handler can run until it ends. */
export function stepSync(name: string): void {
  if (!announce(name, 'sync')) return;
  Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0);
}
