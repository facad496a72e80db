import { run } from '../../src/cli.js';

/** What one CLI call printed and returned. */
export interface CliResult {
  code: number;
  stdout: string;
  stderr: string;
}

/** Runs the CLI in-process with collecting streams (stderr not a TTY, so no progress). */
export async function cli(...argv: string[]): Promise<CliResult> {
  let stdout = '';
  let stderr = '';
  const code = await run(argv, {
    stdout: { write: (t: string) => (stdout += t) },
    stderr: { write: (t: string) => (stderr += t), isTTY: false },
    env: {},
  });
  return { code, stdout, stderr };
}

export { freshFolderEachTest, tempFolder } from './tempFolder.js';
