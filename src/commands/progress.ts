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

/** Options of {@link createProgress}. */
export interface ProgressOptions {
  /** Draw nothing (`--quiet`). */
  quiet?: boolean;
  /** The corpus size in bytes, when known: then a bar shows the share read. */
  totalBytes?: number | null;
  /** Clock in milliseconds (tests pass a fake one). */
  now?: () => number;
}

const SILENT: Progress = { update() {}, done() {} };

/** A 20-cell bar and percentage for a share done: `[#########-----------]  45 %`. */
export function progressBar(share: number): string {
  const done = Math.max(0, Math.min(1, share));
  const cells = Math.round(done * 20);
  return `[${'#'.repeat(cells)}${'-'.repeat(20 - cells)}] ${String(Math.floor(done * 100)).padStart(3)} %`;
}

/**
 * Progress for a long run: `label  12,345 documents  48.2 MB  9.6 MB/s`. Silent unless stderr is a
 * TTY and `quiet` is false, so logs and pipes stay clean. With `totalBytes` (a file's size) it draws a bar.
 */
export function createProgress(io: Io, label: string, options: ProgressOptions = {}): Progress {
  const { quiet = false, totalBytes = null, now = () => Date.now() } = options;
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
      const bar = totalBytes !== null && totalBytes > 0 ? `${progressBar(bytes / totalBytes)}  ` : '';
      io.stderr.write(`\r${label}  ${bar}${documents.toLocaleString('en-US')} documents  ${mb.toFixed(1)} MB  ${(mb / seconds).toFixed(1)} MB/s\x1b[K`);
      shown = true;
    },
    done() {
      if (shown) io.stderr.write('\r\x1b[K');
    },
  };
}
