/** How many names a message lists before it says how many more there are. */
const LISTED = 12;

/**
 * Names for a message, JSON-quoted and comma-separated: `"body", "stars"`; long lists end with
 * `and 5 more`.
 */
export function quotedNames(names: readonly string[]): string {
  const shown = names.slice(0, LISTED).map((n) => JSON.stringify(n));
  if (names.length > LISTED) shown.push(`and ${names.length - LISTED} more`);
  return shown.join(', ');
}
