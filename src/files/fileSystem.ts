import { fsyncSync, linkSync, openSync, closeSync, renameSync } from 'node:fs';
import { mkdir, open, type FileHandle } from 'node:fs/promises';

/**
 * The file-system calls lexlock's writers make, in one replaceable place: tests swap single calls
 * (see {@link replaceFileSystem}) to make a disk that takes only part of a write, fills up, or
 * refuses a rename, which a real disk does only now and then. Everything that writes output or
 * temporary files (NewFile, AtomicFile, NumberSpill, StagedFolder, commitAll) goes through it.
 */
export interface FileSystem {
  /** open(2) through Node: `flags` as Node takes them ('wx', 'wx+', 'r'). */
  open(path: string, flags: string): Promise<FileHandle>;
  /** One write(2) at `position`: how many bytes the system took (possibly fewer than `length`). */
  write(handle: FileHandle, bytes: Uint8Array, offset: number, length: number, position: number): Promise<number>;
  /** One read(2) at `position`: how many bytes came back (0 at the end of the file). */
  read(handle: FileHandle, bytes: Uint8Array, offset: number, length: number, position: number): Promise<number>;
  /** fsync(2). */
  sync(handle: FileHandle): Promise<void>;
  /** The file's size as the system sees it now (fstat(2)). */
  size(handle: FileHandle): Promise<number>;
  /** mkdir -p. */
  mkdir(path: string): Promise<void>;
  /** rename(2), synchronously: a commit must not let a signal handler run halfway. */
  renameSync(from: string, to: string): void;
  /** link(2), synchronously (keeps an old file under a second name so a commit can be undone). */
  linkSync(existing: string, newPath: string): void;
  /** Opens a folder and fsyncs it, synchronously, so the renames inside it survive a crash. */
  syncFolderSync(path: string): void;
}

/** The real calls. */
const NODE: FileSystem = {
  open: (path, flags) => open(path, flags),
  write: async (handle, bytes, offset, length, position) => (await handle.write(bytes, offset, length, position)).bytesWritten,
  read: async (handle, bytes, offset, length, position) => (await handle.read(bytes, offset, length, position)).bytesRead,
  sync: (handle) => handle.sync(),
  size: async (handle) => (await handle.stat()).size,
  mkdir: async (path) => {
    await mkdir(path, { recursive: true });
  },
  renameSync: (from, to) => renameSync(from, to),
  linkSync: (existing, newPath) => linkSync(existing, newPath),
  syncFolderSync: (path) => {
    const fd = openSync(path, 'r');
    try {
      fsyncSync(fd);
    } finally {
      closeSync(fd);
    }
  },
};

/** The calls in use: the real ones unless a test replaced some. Read it at each call, never keep a copy. */
export let fileSystem: FileSystem = NODE;

/**
 * For tests: uses `replacement`'s calls instead of the real ones (the rest stay real) until the
 * returned function is called. @example const restore = replaceFileSystem({ write: async () => 0 }); try { ... } finally { restore(); }
 */
export function replaceFileSystem(replacement: Partial<FileSystem>): () => void {
  const before = fileSystem;
  fileSystem = { ...before, ...replacement };
  return () => {
    fileSystem = before;
  };
}

/** The real calls, for a replacement that wraps them. */
export const realFileSystem: Readonly<FileSystem> = NODE;
