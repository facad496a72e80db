import type { Io } from './Io.js';

/** What a long run reports as it goes. */
export interface ProgressReport {
  bytes: number;
  documents: number;
}

/** A progress line on stderr, redrawn at most every 250 ms, only when stderr is a terminal. */
export interface Progress {
  update(report: ProgressReport): void;
  /** Clears the line. */
  done(): void;
}

const SILENT: Progress = { update() {}, done() {} };

/**
 * Progress for a long run: `label  12,345 documents  48.2 MB  9.6 MB/s`. Silent unless stderr is a
 * TTY and `quiet` is false, so logs and pipes stay clean.
 */
export function createProgress(io: Io, label: string, quiet: boolean, now: () => number = () => Date.now()): Progress {
  if (quiet || io.stderr.isTTY !== true) return SILENT;
  const start = now();
  let last = 0;
  let shown = false;
  return {
    update({ bytes, documents }) {
      const t = now();
      if (t - last < 250) return;
      last = t;
      const seconds = Math.max((t - start) / 1000, 0.001);
      const mb = bytes / 1e6;
      io.stderr.write(`\r${label}  ${documents.toLocaleString('en-US')} documents  ${mb.toFixed(1)} MB  ${(mb / seconds).toFixed(1)} MB/s\x1b[K`);
      shown = true;
    },
    done() {
      if (shown) io.stderr.write('\r\x1b[K');
    },
  };
}
