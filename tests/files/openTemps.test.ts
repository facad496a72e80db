import { mkdir, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { openAtomic } from '../../src/files/writeWhole.js';
import { NumberSpill } from '../../src/files/NumberSpill.js';
import { removeOpenTemps } from '../../src/files/openTemps.js';
import { spillPathFor } from '../../src/files/tempNames.js';
import { JsonlWriter } from '../../src/output/JsonlWriter.js';
import { NpyWriter } from '../../src/output/NpyWriter.js';
import { caseFolders } from '../helpers/caseFolders.js';

const folder = caseFolders('open-temps');

// What a signal handler relies on (src/bin.ts): every temporary file open at that moment is listed,
// removed in one synchronous call, and reported by the destination it stood for. Common practice
// for command-line tools that write through temporary files: an interrupt leaves no debris.
describe('removeOpenTemps', () => {
  it('removes the temporary files of open atomic writes and names their destinations; the old files stay', async () => {
    const dir = await folder();
    await writeFile(join(dir, 'lex.json'), 'old');
    const lexicon = await openAtomic(join(dir, 'lex.json'));
    await lexicon.write(new TextEncoder().encode('half a new lexi'));
    const ids = await NpyWriter.open(join(dir, 'ids.npy'), 4);
    await ids.appendRows(Int32Array.of(1, 2, 3, 4));
    const rows = await JsonlWriter.open(join(dir, 'rows.jsonl'));
    expect((await readdir(dir)).length).toBe(4);
    expect(removeOpenTemps()).toEqual({ destinations: [join(dir, 'lex.json'), join(dir, 'ids.npy'), join(dir, 'rows.jsonl')], failed: [], written: [] });
    expect(await readdir(dir)).toEqual(['lex.json']);
    expect(await readFile(join(dir, 'lex.json'), 'utf8')).toBe('old');
    expect(removeOpenTemps()).toEqual({ destinations: [], failed: [], written: [] });
    await Promise.all([lexicon.abort(), ids.abort(), rows.abort()]); // harmless afterwards
    expect(await readdir(dir)).toEqual(['lex.json']);
  });

  it('forgets a file once it is committed or aborted, and names the committed one as written', async () => {
    const dir = await folder();
    const kept = await openAtomic(join(dir, 'kept.txt'));
    const dropped = await openAtomic(join(dir, 'dropped.txt'));
    await kept.write(new TextEncoder().encode('whole'));
    await kept.commit();
    await dropped.abort();
    // The committed one is named as written: a signal now must not say it was left as it was.
    expect(removeOpenTemps()).toEqual({ destinations: [], failed: [], written: [join(dir, 'kept.txt')] });
    expect(await readFile(join(dir, 'kept.txt'), 'utf8')).toBe('whole');
  });

  it('names the lexicon a spill of build --encode stands for, and forgets the spill once removed', async () => {
    const dir = await folder();
    const spill = await NumberSpill.create(spillPathFor(join(dir, 'lex.json')));
    await spill.add(0, 0, Int32Array.of(5, 6), 2, '1');
    expect(removeOpenTemps()).toEqual({ destinations: [join(dir, 'lex.json')], failed: [], written: [] });
    expect(await readdir(dir)).toEqual([]);
    const again = await NumberSpill.create(spillPathFor(join(dir, 'lex.json')));
    await again.remove();
    expect(removeOpenTemps()).toEqual({ destinations: [], failed: [], written: [] });
  });

  it('lists a file it could not remove, with the reason, and still names the destination', async () => {
    const dir = await folder();
    const file = await openAtomic(join(dir, 'lex.json'));
    // Swapped for a folder behind lexlock's back: unlink(2) then fails with EISDIR (Linux man-pages).
    await rm(file.tempPath);
    await mkdir(file.tempPath);
    expect(removeOpenTemps()).toEqual({
      destinations: [join(dir, 'lex.json')],
      failed: [{ path: file.tempPath, reason: 'EISDIR: illegal operation on a directory' }],
      written: [],
    });
    await file.abort();
  });
});
