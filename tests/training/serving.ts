// The serving side of tests/training/trainOnDemo.test.ts, kept apart on purpose: it knows nothing of
// the corpus, the batches or the training. It loads the lexicon file the trainer saved, refuses any
// other (by fingerprint), and turns raw text into the ids a model takes, as a service would.
import { loadLexicon } from '../../src/node.js';

/** Opens the lexicon a model was trained with; returns what turns one raw text into its row of ids. */
export async function openEncoder(lexiconPath: string, fingerprint: string): Promise<(text: string) => Int32Array> {
  const lexicon = await loadLexicon(lexiconPath, { expectFingerprint: fingerprint });
  return (text) => lexicon.encode(text);
}
