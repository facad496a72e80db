/** Standard input as a command reads it: chunks of bytes, and whether it is a terminal. */
export type StdinStream = AsyncIterable<Uint8Array> & { isTTY?: boolean };

/** Where a command writes (and `peek` reads): the CLI passes process streams, tests pass collectors. */
export interface Io {
  stdout: { write(text: string): unknown; isTTY?: boolean };
  stderr: { write(text: string): unknown; isTTY?: boolean };
  /** Standard input (`lexlock peek` without a text); process.stdin when absent. */
  stdin?: StdinStream;
  /** Environment variables (for NO_COLOR and the like). */
  env: Readonly<Record<string, string | undefined>>;
}
