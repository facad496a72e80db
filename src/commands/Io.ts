/** Where a command writes: the CLI passes process streams, tests pass collectors. */
export interface Io {
  stdout: { write(text: string): unknown; isTTY?: boolean };
  stderr: { write(text: string): unknown; isTTY?: boolean };
  /** Environment variables (for NO_COLOR and the like). */
  env: Readonly<Record<string, string | undefined>>;
}
