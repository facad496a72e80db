import { describe, expect, it } from 'vitest';
import { choiceFlag, listFlag, parseArgs, wholeNumberFlag } from '../../src/commands/parseArgs.js';

const flags = { output: { kind: 'value', short: 'o' }, reserve: { kind: 'value', repeat: true }, force: { kind: 'switch' }, cap: { kind: 'value' } } as const;

describe('parseArgs', () => {
  it.each([
    [['a.csv', '-o', 'x.json'], ['a.csv'], { output: ['x.json'] }],
    [['-ox.json', 'a.csv'], ['a.csv'], { output: ['x.json'] }],
    [['--output=x.json', 'a.csv'], ['a.csv'], { output: ['x.json'] }],
    [['--reserve', '<s>', '--reserve=</s>'], [], { reserve: ['<s>', '</s>'] }],
    [['--cap', '-3'], [], { cap: ['-3'] }],
    [['--', '--force'], ['--force'], {}],
    [['-'], ['-'], {}],
  ])('%j', (argv, positionals, values) => {
    const r = parseArgs('build', argv, flags);
    expect(r.positionals).toEqual(positionals);
    expect(Object.fromEntries(r.values)).toEqual(values);
  });

  it.each([
    [['--nope'], 'unknown flag --nope; see lexlock build --help'],
    [['-z'], 'unknown flag -z; see lexlock build --help'],
    [['--output'], '--output needs a value'],
    [['--force=yes'], '--force takes no value (got "yes")'],
    [['--cap', '1', '--cap', '2'], '--cap is given twice; give it once'],
    [['--constructor'], 'unknown flag --constructor; see lexlock build --help'],
  ])('refuses %j', (argv, message) => {
    expect(() => parseArgs('build', argv, flags)).toThrow(message);
  });

  it('checks values by kind', () => {
    const r = parseArgs('build', ['--cap', '12', '--output', 'north', '--reserve', 'a,b', '--reserve', 'c'], flags);
    expect(wholeNumberFlag(r, 'cap', 1)).toBe(12);
    expect(choiceFlag(r, 'output', ['north', 'south'])).toBe('north');
    expect(listFlag(r, 'reserve')).toEqual(['a', 'b', 'c']);
    expect(() => wholeNumberFlag(parseArgs('build', ['--cap', '1.5'], flags), 'cap', 1)).toThrow('--cap: "1.5" is not a whole number of at least 1');
  });
});
