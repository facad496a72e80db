import { mkdtemp, mkdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll } from 'vitest';
import { isLexlockError, type LexlockError } from '../../src/LexlockError.js';
import type { CorpusDocument, CorpusReader } from '../../src/corpus/readCorpus.js';

const made: string[] = [];
afterAll(async () => {
  await Promise.all(made.map((d) => rm(d, { recursive: true, force: true })));
});

/** A fresh temporary folder, removed after the test file. */
export async function tempFolder(): Promise<string> {
  const dir = await mkdtemp(join(tmpdir(), 'lexlock-corpus-'));
  made.push(dir);
  return dir;
}

/** Writes `files` (relative path -> content) below a fresh temporary folder; returns the folder. */
export async function fixture(files: Record<string, string | Uint8Array>): Promise<string> {
  const dir = await tempFolder();
  for (const [name, content] of Object.entries(files)) {
    const path = join(dir, name);
    await mkdir(dirname(path), { recursive: true });
    await writeFile(path, content);
  }
  return dir;
}

/** Writes one file in a fresh temporary folder; returns its path. */
export async function fixtureFile(name: string, content: string | Uint8Array): Promise<string> {
  return join(await fixture({ [name]: content }), name);
}

/** Every document of a reader. */
export async function collect(reader: AsyncIterable<CorpusDocument>): Promise<CorpusDocument[]> {
  const out: CorpusDocument[] = [];
  for await (const d of reader) out.push(d);
  return out;
}

/** The LexlockError a reader stops with, and the documents it gave before it; fails when it does not stop. */
export async function failure(reader: CorpusReader): Promise<{ error: LexlockError; before: CorpusDocument[] }> {
  const before: CorpusDocument[] = [];
  try {
    for await (const d of reader) before.push(d);
  } catch (e) {
    if (!isLexlockError(e)) throw e;
    return { error: e, before };
  }
  throw new Error(`expected ${reader.path} to fail, but it gave ${before.length} documents`);
}

/** What a LexlockError thrown by `f` says. */
export function thrown(f: () => unknown): { code: string; message: string } {
  try {
    f();
  } catch (e) {
    if (!isLexlockError(e)) throw e;
    return { code: e.code, message: e.message };
  }
  throw new Error('expected a LexlockError');
}

/** Texts (and labels) only, for compact comparisons. */
export function texts(docs: readonly CorpusDocument[]): Array<[string, string | undefined]> {
  return docs.map((d) => [d.text, d.label]);
}
