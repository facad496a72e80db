import { describe, expect, it } from 'vitest';
import { createProgress } from '../../src/commands/progress.js';

function io(isTTY: boolean) {
  const out: string[] = [];
  return { out, io: { stdout: { write: () => true }, stderr: { write: (t: string) => out.push(t), isTTY }, env: {} } };
}

describe('createProgress', () => {
  it('draws documents, MB and rate on a terminal, at most every 250 ms, and clears the line', () => {
    const { out, io: terminal } = io(true);
    let t = 0;
    const p = createProgress(terminal, 'build', { now: () => t });
    t = 1000;
    p.update({ bytes: 5_000_000, documents: 12345 });
    t = 1100;
    p.update({ bytes: 6_000_000, documents: 13000 }); // within 250 ms: not drawn
    t = 2000;
    p.update({ bytes: 8_000_000, documents: 20000 });
    p.done();
    expect(out).toEqual([
      '\rbuild  12,345 documents  5.0 MB  5.0 MB/s\x1b[K',
      '\rbuild  20,000 documents  8.0 MB  4.0 MB/s\x1b[K',
      '\r\x1b[K',
    ]);
  });

  it('draws a bar when the corpus size is known', () => {
    const { out, io: terminal } = io(true);
    let t = 0;
    const p = createProgress(terminal, 'audit', { totalBytes: 10_000_000, now: () => t });
    t = 1000;
    p.update({ bytes: 4_500_000, documents: 10 });
    expect(out).toEqual(['\raudit  [#########-----------]  45 %  10 documents  4.5 MB  4.5 MB/s\x1b[K']);
  });

  it.each([
    ['not a terminal', false, false],
    ['--quiet', true, true],
  ])('is silent when stderr is %s', (_what, isTTY, quiet) => {
    const { out, io: s } = io(isTTY);
    const p = createProgress(s, 'build', { quiet, now: () => 10_000 });
    p.update({ bytes: 1, documents: 1 });
    p.done();
    expect(out).toEqual([]);
  });
});
