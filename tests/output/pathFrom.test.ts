import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { pathFrom } from '../../src/output/pathFrom.js';

// Common practice: a path relative to the folder that names it (Node's path.relative is the reference).
describe('pathFrom', () => {
  it.each([
    ['out/encoded', 'lexicon.json', '../../lexicon.json'],
    ['out', 'out/lexicon.json', 'lexicon.json'],
    ['encoded', 'models/ferry/lexicon.json', '../models/ferry/lexicon.json'],
    [resolve('encoded'), resolve('models/lexicon.json'), '../models/lexicon.json'],
  ])('from the folder %s, the lexicon %s is %s', (folder, file, expected) => {
    expect(pathFrom(folder, file)).toBe(expected);
  });
});
