import type { Io } from './Io.js';

/** Paints text for a terminal: red for a crossed threshold, green for a met one, dim for context. */
export interface Paint {
  red(text: string): string;
  green(text: string): string;
  dim(text: string): string;
  bold(text: string): string;
}

const plain = (text: string) => text;
const PLAIN: Paint = { red: plain, green: plain, dim: plain, bold: plain };
const sgr = (code: string) => (text: string) => `\x1b[${code}m${text}\x1b[0m`;
const ANSI: Paint = { red: sgr('31'), green: sgr('32'), dim: sgr('2'), bold: sgr('1') };

/** Colour only when stdout is a terminal and NO_COLOR (no-color.org) is unset or empty. */
export function paintFor(io: Io): Paint {
  const noColor = io.env.NO_COLOR;
  return io.stdout.isTTY === true && (noColor === undefined || noColor === '') ? ANSI : PLAIN;
}
