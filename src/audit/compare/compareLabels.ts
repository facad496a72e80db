import type { Lexicon } from '../../lexicon/Lexicon.js';
import type { LabelComparison, MovedLabel } from './LexiconComparison.js';

/** Labels of two lexicons: how many each has, those only in one, and those under another id. */
export function compareLabels(a: Lexicon, b: Lexicon): LabelComparison {
  const idsInB = new Map(b.labels.map((label, id) => [label, id]));
  const idsInA = new Map(a.labels.map((label, id) => [label, id]));
  const moved: MovedLabel[] = [];
  a.labels.forEach((label, id) => {
    const other = idsInB.get(label);
    if (other !== undefined && other !== id) moved.push({ label, a: id, b: other });
  });
  return {
    a: a.encoding.labels === null ? null : a.encoding.labels.length,
    b: b.encoding.labels === null ? null : b.encoding.labels.length,
    onlyInA: a.labels.filter((label) => !idsInB.has(label)),
    onlyInB: b.labels.filter((label) => !idsInA.has(label)),
    moved,
  };
}
