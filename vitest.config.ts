import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    testTimeout: 60_000,
    // Two test files at a time on a 2-core machine (vitest's default is one fewer than the cores: one
    // here, and the suite took 4 min 42 s). No test depends on the machine being idle: timings are CPU
    // time ratios, memory is peak RSS, and the load runs (two busy processes alongside) pass.
    maxWorkers: 2,
    hookTimeout: 120_000,
  },
});
