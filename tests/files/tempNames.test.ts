import { basename, join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { tempPathFor } from '../../src/files/AtomicFile.js';
import { asidePath, atomicTempPath, lockPathFor, spillDestination, spillPathFor, swapPaths, tempName, tempOwner } from '../../src/files/tempNames.js';

// The names are lexlock's own (the hidden-file dot is the POSIX convention for "not listed by ls",
// common practice); the check here is that the clean-up recognises exactly the names the writers make.
describe('tempNames', () => {
  it('recognises the names the writers make, with their process id', () => {
    const atomic = atomicTempPath(join('models', 'lex.json'));
    expect(atomic).toMatch(new RegExp(`^models[/\\\\]\\.lex\\.json\\.${process.pid}\\.[0-9a-f]{12}\\.tmp$`));
    expect(tempOwner(basename(atomic), 'lex.json')).toBe(process.pid);
    expect(tempOwner(basename(tempPathFor(join('out', 'ids.npy'))), 'ids.npy')).toBe(process.pid);
    const spill = spillPathFor(join('models', 'lex.json'));
    expect(spill).toBe(join('models', `.lex.json.${process.pid}.numbers.tmp`));
    expect(tempOwner(`.lex.json.${process.pid}.numbers.tmp`, 'lex.json')).toBe(process.pid);
  });

  it.each([
    ['an atomic write', '.lex.json.4711.0123456789ab.tmp', 'lex.json', 4711],
    ['a spill', '.lex.json.4711.numbers.tmp', 'lex.json', 4711],
    ['a hidden folder being written', '.out.4711.0123456789ab.new', 'out', 4711],
    ['an old output set aside', '.out.4711.0123456789ab.old', 'out', 4711],
    ['the lock (no process id in the name)', '.out.lock', 'out', null],
    ['another ending', '.out.4711.0123456789ab.bak', 'out', null],
    ['a base with dots and digits', '.v1.2.json.88.abcdefabcdef.tmp', 'v1.2.json', 88],
    ['another destination', '.other.json.4711.0123456789ab.tmp', 'lex.json', null],
    ['a longer destination sharing the start', '.lex.json.bak.4711.0123456789ab.tmp', 'lex.json', null],
    ['a not hidden name', 'lex.json.4711.0123456789ab.tmp', 'lex.json', null],
    ['upper-case hex', '.lex.json.4711.0123456789AB.tmp', 'lex.json', null],
    ['11 hex digits', '.lex.json.4711.0123456789a.tmp', 'lex.json', null],
    ['13 hex digits', '.lex.json.4711.0123456789abc.tmp', 'lex.json', null],
    ['something after .tmp', '.lex.json.4711.0123456789ab.tmp.bak', 'lex.json', null],
    ['no process id', '.lex.json.numbers.tmp', 'lex.json', null],
    ['process id 0 (kill(2) would mean the whole process group)', '.lex.json.0.numbers.tmp', 'lex.json', null],
    ['a process id with a leading zero', '.lex.json.04711.numbers.tmp', 'lex.json', null],
    ['an 11-digit process id', '.lex.json.12345678901.numbers.tmp', 'lex.json', null],
    ['an empty base', '..4711.numbers.tmp', '', null],
  ])('tempOwner: %s', (_what, name, base, pid) => {
    expect(tempOwner(name, base)).toBe(pid);
  });

  it.each([
    [join('models', '.lex.json.4711.numbers.tmp'), join('models', 'lex.json')],
    ['.v1.2.json.9.numbers.tmp', 'v1.2.json'],
    [join('models', 'train.numbers.tmp'), null],
    [join('models', '.lex.json.4711.0123456789ab.tmp'), null],
  ])('spillDestination(%s) is %s', (path, destination) => {
    expect(spillDestination(path)).toBe(destination);
  });
  it('makes twin names for a folder swap, a kept-aside name and the lock name, and tells their kinds', () => {
    const { staging, aside } = swapPaths(join('enc', 'out'));
    expect(staging).toMatch(new RegExp(`^enc[/\\\\]\\.out\\.${process.pid}\\.([0-9a-f]{12})\\.new$`));
    expect(aside).toBe(staging.replace(/new$/, 'old'));
    expect(tempName(basename(staging), 'out')).toEqual({ pid: process.pid, kind: 'new', tag: staging.slice(-16, -4) });
    expect(tempName(basename(asidePath('rows.jsonl')), 'rows.jsonl')?.kind).toBe('old');
    expect(tempName('.lex.json.4711.numbers.tmp', 'lex.json')).toEqual({ pid: 4711, kind: 'numbers', tag: null });
    expect(lockPathFor(join('models', 'lex.json'))).toBe(join('models', '.lex.json.lock'));
  });
});
