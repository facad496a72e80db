import { defineConfig } from 'tsup';

// No source maps: dist/ is what the package ships, and maps would point users' tools at sources it
// does not ship (the tests and the benchmark run the TypeScript sources or the built files as they are).
export default defineConfig([
  {
    entry: { index: 'src/index.ts', node: 'src/node.ts' },
    format: ['esm', 'cjs'],
    dts: true,
    sourcemap: false,
    // No clean here: the configs build at the same time, and one cleaning dist/ could delete another's
    // output (the browser entry's types went missing that way). `npm run build` empties dist/ first.
    // import.meta.url in the CommonJS build, so worker threads find dist/worker.js from either build.
    shims: true,
    target: 'node20',
  },
  {
    // The serving entry for browsers: load a lexicon and encode, dependencies inlined, minified, in one
    // file (dist/browser.js, `lexlock/browser`), for pages that load it directly.
    entry: { browser: 'src/browser.ts' },
    format: ['esm'],
    dts: true,
    platform: 'browser',
    noExternal: [/.*/],
    minify: true,
    sourcemap: false,
    target: 'es2020',
  },
  {
    // The executable and the worker-thread entries it (and dist/node.*) start: dist/bin.js, dist/worker.js,
    // and dist/cappedWorker.js (the thread a command runs on under --memory-limit).
    entry: { bin: 'src/bin.ts', worker: 'src/workers/worker.ts', cappedWorker: 'src/cappedWorker.ts' },
    format: ['esm'],
    sourcemap: false,
    target: 'node20',
  },
]);
