import type { CapTie } from '../lexicon/capTie.js';
import { formatCount } from './report/formatCount.js';

function seen(count: number): string {
  if (count === 1) return 'seen once';
  if (count === 2) return 'seen twice';
  return `seen ${formatCount(count)} times`;
}

/**
 * A cap that cuts through a group of equal counts, in words, for summaries and the report.
 * @example describeCapTie({ cap: 30000, count: 1, tokens: 14780, kept: 3224, left: 11556, below: 26776, above: 41556 })
 * // 'cap 30,000 cuts through the 14,780 tokens seen once: 3,224 kept by string order, 11,556 left out; caps 26,776 or 41,556 keep whole counts'
 */
export function describeCapTie(tie: CapTie): string {
  return (
    `cap ${formatCount(tie.cap)} cuts through the ${formatCount(tie.tokens)} tokens ${seen(tie.count)}: ` +
    `${formatCount(tie.kept)} kept by string order, ${formatCount(tie.left)} left out; ` +
    `caps ${formatCount(tie.below)} or ${formatCount(tie.above)} keep whole counts`
  );
}
