/** One TypeScript code block of the README, with the line it starts on. */
export interface ReadmeBlock {
  line: number;
  code: string;
}

/** Every ```ts block of a Markdown text, in order. */
export function readmeBlocks(markdown: string): ReadmeBlock[] {
  const blocks: ReadmeBlock[] = [];
  const lines = markdown.split('\n');
  for (let i = 0; i < lines.length; i++) {
    if (lines[i] !== '```ts') continue;
    const start = i + 1;
    let end = start;
    while (end < lines.length && lines[end] !== '```') end++;
    blocks.push({ line: start + 1, code: lines.slice(start, end).join('\n') });
    i = end;
  }
  return blocks;
}

/**
 * Turns the README's `expression; // result` lines into checks: a result written as
 * `Int32Array(n) [a, b, …]` or as an array literal of numbers and quoted strings must equal what
 * the expression gives. Other lines are left as they are.
 */
export function withChecks(code: string): string {
  return code
    .split('\n')
    .map((line) => {
      const m = /^(\s*)(?:const \w+ = )?(.+?);\s*\/\/\s*(Int32Array\((\d+)\) )?(\[[^\]]*\])\s*$/.exec(line);
      if (m === null) return line;
      const [, indent, expression, , length, list] = m as unknown as [string, string, string, string | undefined, string | undefined, string];
      const expected = JSON.stringify(JSON.parse(asJson(list as string)));
      const declared = /^(\s*)const (\w+) = /.exec(line);
      const value = declared === null ? `(${expression})` : declared[2];
      const check = `__check(${value}, ${expected}, ${length ?? 'null'}, ${JSON.stringify(line.trim())});`;
      return declared === null ? `${indent}${check}` : `${line}\n${indent}${check}`;
    })
    .join('\n');
}

/** A result list as written in the README (strings in single or double quotes) as JSON text. */
function asJson(list: string): string {
  return list.replace(/'((?:[^'\\]|\\.)*)'|"((?:[^"\\]|\\.)*)"/g, (_m, single: string | undefined, double: string | undefined) =>
    single === undefined ? `"${double}"` : JSON.stringify(single.replace(/\\'/g, "'")),
  );
}

/** The checking function the rewritten blocks call. */
export const CHECK_FUNCTION = `
function __check(value, expected, length, line) {
  const got = Array.from(value);
  const ok = JSON.stringify(got) === JSON.stringify(expected) && (length === null || (value instanceof Int32Array && value.length === length));
  if (!ok) throw new Error('README line ' + line + ' gives ' + JSON.stringify(got) + (value instanceof Int32Array ? ' (Int32Array)' : ''));
}
`;
