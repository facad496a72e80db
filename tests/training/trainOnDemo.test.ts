// A real model trains on lexlock's batches (issue 14): a lexicon built on the demo corpus, the corpus
// streamed by encodeBatches (shuffled, labels weighted by labelWeights), a small embedding + average
// pooling classifier trained with @tensorflow/tfjs on its pure-JS CPU backend (tensors and layers
// only). It must beat the majority class on the held-out demo messages, and predict the same from the
// ids a separate serving module makes of the raw text. Model, seeds and batches are the README's
// Training block's (94.7 % held out, against 24 % for the most common label).
//
// The model: ids -> id counts over the row length -> a dense layer without bias (the embedding table,
// lexicon.size x 16) -> a dense layer (one logit a label). Counts over the length times the table are
// the average of the rows' embedding vectors, so this is an embedding layer with average pooling (the
// test checks it against tf.layers.embedding + globalAveragePooling1d with the same table); written
// this way its gradient is a product, where tfjs's CPU kernel for an embedding layer's gradient makes
// a pass over the batch for every row of the table. Measured here on the 4,000 messages (CPU time of
// one epoch, batches of 64): an embedding layer, 62 rows x 8, length 16: 5.5 s; this model, 502 rows
// x 16, length 32: 0.7-1.2 s.
import { readFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import * as tf from '@tensorflow/tfjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { saveLexicon } from '../../src/files/saveLexicon.js';
import { freeze } from '../../src/lexicon/freeze.js';
import type { Lexicon } from '../../src/lexicon/Lexicon.js';
import { tallyCorpus } from '../../src/pipeline/tallyCorpus.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { encodeBatches } from '../../src/training/encodeBatches.js';
import { labelWeights } from '../../src/training/labelWeights.js';
import { tempFolder } from '../helpers/tempFolder.js';
import { openEncoder } from './serving.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const TRAIN = join(root, 'corpora-demo', 'ferry-messages.csv'); // 4,000 messages
const HELD_OUT = join(root, 'corpora-demo', 'ferry-messages.jsonl'); // 300 others, made with another seed
const LENGTH = 32;
const WIDTH = 16;
const EPOCHS = 2;

let folder: Awaited<ReturnType<typeof tempFolder>>;
beforeAll(async () => {
  await tf.setBackend('cpu');
  tf.enableProdMode(); // no checks for NaN after each op, and no notice to install the native backend
  folder = await tempFolder();
});
afterAll(async () => {
  await folder.remove();
  tf.disposeVariables();
});

/** How often each id occurs in each row: [rows, size] (oneHot, then a sum over the row). */
function idCounts(x: tf.Tensor2D, size: number): tf.Tensor2D {
  return tf.oneHot(x, size).sum(1);
}

function classifier(lexicon: Lexicon): tf.Sequential {
  return tf.sequential({
    layers: [
      tf.layers.rescaling({ inputShape: [lexicon.size], scale: 1 / LENGTH }),
      tf.layers.dense({ units: WIDTH, useBias: false, kernelInitializer: tf.initializers.glorotUniform({ seed: 1 }) }),
      tf.layers.dense({ units: lexicon.labels.length, kernelInitializer: tf.initializers.glorotUniform({ seed: 2 }) }),
    ],
  });
}

/** The label ids a model gives rows of ids. */
function predicted(model: tf.Sequential, ids: Int32Array, rows: number, size: number): Int32Array {
  return tf.tidy(() => (model.apply(idCounts(tf.tensor2d(ids, [rows, LENGTH], 'int32'), size)) as tf.Tensor).argMax(1).dataSync() as Int32Array);
}

describe('training a model on encodeBatches', () => {
  it('beats the majority class on held-out messages, and predicts the same from the serving side', async () => {
    const { tally } = await tallyCorpus(readCorpus(TRAIN, { label: 'topic' }), resolveRules());
    const lexicon = freeze(tally, { cap: 500, shape: { length: LENGTH, pad: 'end', cut: 'end' }, source: 'ferry-messages.csv' });
    const lexiconPath = folder.path('lexicon.json');
    await saveLexicon(lexiconPath, lexicon);
    const labels = lexicon.labels.length;
    expect(labels).toBe(8);

    const model = classifier(lexicon);
    const optimizer = tf.train.adam(0.02);
    const weights = tf.tensor1d(labelWeights(lexicon));
    for (let epoch = 0; epoch < EPOCHS; epoch++) {
      const batches = encodeBatches(readCorpus(TRAIN, { label: 'topic' }), lexicon, { rows: 64, shuffle: { seed: epoch, pool: 512 } });
      for await (const batch of batches) {
        tf.tidy(() => {
          const x = tf.tensor2d(batch.ids, [batch.rows, batch.length], 'int32');
          expect(x.dataSync()).toBe(batch.ids); // the tensor holds the batch's own array: no copy
          const y = tf.tensor1d(batch.labels, 'int32');
          optimizer.minimize(() => tf.losses.softmaxCrossEntropy(tf.oneHot(y, labels), model.apply(idCounts(x, lexicon.size)) as tf.Tensor, tf.gather(weights, y)));
        });
      }
      expect(batches.counts).toEqual({ documents: 4000, unknownLabels: 0, unlabelled: 0 });
    }

    // Held out: predictions from the batches, by key (the line number of the .jsonl file).
    const fromBatches = new Map<string, { ids: number[]; label: number; predicted: number }>();
    for await (const batch of encodeBatches(readCorpus(HELD_OUT, { label: 'topic' }), lexicon, { rows: 100 })) {
      const guesses = predicted(model, batch.ids, batch.rows, lexicon.size);
      batch.keys.forEach((key, r) => {
        fromBatches.set(key, { ids: Array.from(batch.ids.subarray(r * LENGTH, (r + 1) * LENGTH)), label: batch.labels[r] as number, predicted: guesses[r] as number });
      });
    }
    const rows = [...fromBatches.values()];
    expect(rows).toHaveLength(300);
    const perLabel = new Array<number>(labels).fill(0);
    for (const r of rows) perLabel[r.label] = (perLabel[r.label] as number) + 1;
    const majority = Math.max(...perLabel) / rows.length;
    const accuracy = rows.filter((r) => r.predicted === r.label).length / rows.length;
    expect(accuracy).toBeGreaterThan(majority);

    // Serving: the raw texts, read by a plain reader of the file (one JSON object a line), encoded by the
    // serving module from the saved lexicon, give the same ids and the same predictions.
    const encode = await openEncoder(lexiconPath, lexicon.fingerprint);
    const texts = (await readFile(HELD_OUT, 'utf8'))
      .split('\n')
      .filter((line) => line !== '')
      .map((line) => (JSON.parse(line) as { text: string }).text);
    const served = new Int32Array(texts.length * LENGTH);
    texts.forEach((text, i) => served.set(encode(text), i * LENGTH));
    const servedGuesses = predicted(model, served, texts.length, lexicon.size);
    texts.forEach((_, i) => {
      const trained = fromBatches.get(String(i + 1))!;
      expect(Array.from(served.subarray(i * LENGTH, (i + 1) * LENGTH))).toEqual(trained.ids);
      expect(servedGuesses[i]).toBe(trained.predicted);
    });

    // The same model as an embedding layer with average pooling, given the trained table: same logits.
    const [table, kernel, bias] = [model.layers[1]!.getWeights()[0]!, ...model.layers[2]!.getWeights()] as tf.Tensor[];
    const pooled = tf.sequential({
      layers: [
        tf.layers.embedding({ inputDim: lexicon.size, outputDim: WIDTH, inputLength: LENGTH, weights: [table!] }),
        tf.layers.globalAveragePooling1d(),
        tf.layers.dense({ units: labels, weights: [kernel!, bias!] }),
      ],
    });
    const [ours, theirs] = tf.tidy(() => {
      const x = tf.tensor2d(served, [texts.length, LENGTH], 'int32');
      return [(model.apply(idCounts(x, lexicon.size)) as tf.Tensor).arraySync() as number[][], (pooled.predict(x) as tf.Tensor).arraySync() as number[][]];
    });
    ours!.forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(theirs![i]![j]!, 4)));
  });
});
