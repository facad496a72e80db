// lexlock's Node-only API: corpus readers, lexicon files, atomic writes. Re-exports the browser-safe API too.
export * from './index.js';
export { readCorpus, type CorpusDocument, type CorpusOptions, type CorpusReader, type CorpusStats } from './corpus/readCorpus.js';
export { saveLexicon, type SaveLexiconOptions } from './files/saveLexicon.js';
export { loadLexicon } from './files/loadLexicon.js';
export { writeFileAtomic } from './files/atomicWrite.js';
export { tallyCorpus, type CorpusTally } from './pipeline/tallyCorpus.js';
export { encodeCorpus, type EncodeStats, type RowSink } from './pipeline/encodeCorpus.js';
export { run } from './cli.js';
