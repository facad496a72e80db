import { LexlockError } from '../LexlockError.js';
import type { TextRules } from '../rules/TextRules.js';
import { Tally } from './Tally.js';
import { TALLY_SNIPPETS, tallyFileOrder, type TallyFile } from './tallyFile.js';

/** A tally file and the name it goes by in messages. */
export interface NamedTallyFile {
  name: string;
  file: TallyFile;
}

const RULE_MEMBERS = ['level', 'unicode', 'case', 'drop', 'collapse', 'spaces', 'tokenizer'] as const;

function ruleText(rules: TextRules, member: (typeof RULE_MEMBERS)[number]): string {
  const v = rules[member];
  return Array.isArray(v) ? (v.length === 0 ? 'none' : v.join(',')) : JSON.stringify(v);
}

/**
 * Refuses, with `TALLY_RULES_DIFFER`, two tallies counted under different rules, naming both and
 * the first rule that differs.
 */
export function tallyFileSameRules(a: NamedTallyFile, b: NamedTallyFile): void {
  const ra = a.file.tally.rules;
  const rb = b.file.tally.rules;
  for (const member of RULE_MEMBERS) {
    const x = ruleText(ra, member);
    const y = ruleText(rb, member);
    if (x === y) continue;
    const todo = member === 'tokenizer' ? 'count every part with the same lexlock version' : `count every part with the same --${member}`;
    throw new LexlockError(
      'TALLY_RULES_DIFFER',
      `${a.name} and ${b.name} were counted under different rules (${member}: ${x} in ${a.name}, ${y} in ${b.name}); ${todo}`,
      { file: b.name, field: `rules.${member}` },
    );
  }
}

/**
 * Merges tally files by addition (Tally.merge) into a new one, leaving the inputs as they were.
 * Snippets: the first few of all, in string order; fields: kept where every part agrees, else null.
 * Associative and commutative: any grouping and order give the same file. Refuses different rules.
 * @example const all = tallyFileMerge([{ name: 'a.tally', file: a }, { name: 'b.tally', file: b }]);
 */
export function tallyFileMerge(files: readonly NamedTallyFile[]): TallyFile {
  const first = files[0];
  if (first === undefined) throw new LexlockError('BAD_OPTION', 'no tally files to merge; pass at least one', {});
  const tally = new Tally(first.file.tally.rules);
  const snippets = new Set<string>();
  let text = first.file.fields.text;
  let label = first.file.fields.label;
  for (const f of files) {
    tallyFileSameRules(first, f);
    tally.merge(f.file.tally);
    for (const s of f.file.snippets) snippets.add(s);
    if (f.file.fields.text !== text) text = null;
    if (f.file.fields.label !== label) label = null;
  }
  return { tally, snippets: [...snippets].sort(tallyFileOrder).slice(0, TALLY_SNIPPETS), fields: { text, label } };
}
