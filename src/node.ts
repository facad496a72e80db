// lexlock's Node-only API: corpus readers, lexicon files, atomic writes. Re-exports the browser-safe API too.
export * from './index.js';
export { readCorpus, type CorpusDocument, type CorpusOptions, type CorpusReader, type CorpusStats } from './corpus/readCorpus.js';
export { readCorpusFor, lexiconReadDefaults, type LexiconReadDefaults } from './corpus/readCorpusFor.js';
export { saveLexicon, type SaveLexiconOptions } from './files/saveLexicon.js';
export { loadLexicon } from './files/loadLexicon.js';
export { writeWhole } from './files/writeWhole.js';
export { tallyCorpus, type CorpusTally, type TallyCorpusOptions } from './pipeline/tallyCorpus.js';
export { tallyAndRecord, type RecordedTally } from './pipeline/tallyAndRecord.js';
export { encodeCorpus, type EncodeStats, type RowSink, type RowFacts, type EncodeCorpusOptions, type EncodableDocument } from './pipeline/encodeCorpus.js';
export { writeEncodedFolder, type WriteEncodedFolderOptions, type EncodedFolderResult } from './pipeline/writeEncoded.js';
export { MANIFEST_FORMAT_VERSION, type EncodedPart } from './output/EncodedOutput.js';
export { auditOnThreads } from './pipeline/auditOnThreads.js';
export { boundedCorpusTally, type BoundedCorpusOptions, type BoundedCorpusTally } from './pipeline/boundedCorpusTally.js';
export { saveTally } from './files/saveTally.js';
export { loadTally } from './files/loadTally.js';
export { run } from './cli.js';
