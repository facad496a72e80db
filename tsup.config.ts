import { defineConfig } from 'tsup';

export default defineConfig([
  {
    entry: { index: 'src/index.ts', node: 'src/node.ts' },
    format: ['esm', 'cjs'],
    dts: true,
    sourcemap: true,
    clean: true,
    // import.meta.url in the CommonJS build, so worker threads find dist/worker.js from either build.
    shims: true,
    target: 'node20',
  },
  {
    // The executable and the worker-thread entry it (and dist/node.*) start: dist/bin.js, dist/worker.js.
    entry: { bin: 'src/bin.ts', worker: 'src/workers/worker.ts' },
    format: ['esm'],
    sourcemap: true,
    target: 'node20',
  },
]);
