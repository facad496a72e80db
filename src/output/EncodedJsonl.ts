import type { CommitStep } from '../files/commitAll.js';
import type { Shape } from '../lexicon/Shape.js';
import { countRow, emptyEncodeStats, type EncodeStats } from '../pipeline/EncodeStats.js';
import type { SplitPlan } from '../split/Split.js';
import { splitChooser } from '../split/splitOf.js';
import type { EncodedOutput, EncodedPart } from './EncodedOutput.js';
import { rowsError, splitOutputPath } from './EncodedOutput.js';
import type { EncodedSource } from './encodedManifest.js';
import { JsonlWriter } from './JsonlWriter.js';

/** One JSON line a row: its ids, how many are tokens, its label id when it has one, and its key. */
interface Line {
  ids: number[];
  length: number;
  label?: number;
  key: string;
}

/**
 * Encoded rows as JSON Lines, `{"ids":[…],"length":n,"label":id,"key":"…"}` a document (no `label`
 * for an unlabelled one): one file, or with a split plan one file a split beside it, `<split>.jsonl`
 * (splitOutputPath). Each is written under a temporary name and put in place by commitAll.
 */
export async function openEncodedJsonl(output: string, shape: Shape | null, source: EncodedSource, split: SplitPlan | null): Promise<EncodedOutput> {
  const choose = split === null ? null : splitChooser(split.splits, split.seed);
  const names = split === null ? [null] : split.splits.map((s) => s.name);
  const parts: Array<{ name: string | null; output: string; writer: JsonlWriter; stats: EncodeStats }> = [];
  try {
    for (const name of names) {
      const path = name === null ? output : splitOutputPath(output, name);
      parts.push({ name, output: path, writer: await JsonlWriter.open(path), stats: emptyEncodeStats(source.lexicon.labels.length) });
    }
  } catch (e) {
    for (const part of parts) await part.writer.abort();
    throw e;
  }
  return {
    destinations: parts.map((p) => p.output),
    async row(ids, kept, labelId, key, facts) {
      const part = parts[choose === null ? 0 : choose(key)] as (typeof parts)[number];
      const line: Line = labelId === null ? { ids: Array.from(ids), length: kept, key } : { ids: Array.from(ids), length: kept, label: labelId, key };
      await part.writer.writeLine(line);
      countRow(part.stats, facts, shape, labelId);
    },
    async finish(stats) {
      const rows = parts.reduce((sum, p) => sum + p.writer.lines, 0);
      if (rows !== stats.documents) throw rowsError(output, rows, stats.documents);
      for (const part of parts) await part.writer.seal();
      return parts.map(({ name, output: path, stats: partStats }) => ({ name, output: path, stats: partStats }) satisfies EncodedPart);
    },
    commitSteps: async (): Promise<CommitStep[]> => Promise.all(parts.map((p) => p.writer.commitStep())),
    async abort() {
      for (const part of parts) await part.writer.abort();
    },
  };
}
