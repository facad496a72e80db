/** Characters a preview may take before a value is summed up instead of shown. */
const BUDGET = 60;
/** Code units of a long string shown before the `…`. */
const HEAD = 40;

/** Thrown inside {@link previewValue} when a value does not fit the budget or is no JSON value. */
const TOO_MUCH = Symbol('too much');

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** A long string's first {@link HEAD} code units (never half a surrogate pair), its end marked `…`. */
function stringHead(s: string): string {
  let end = HEAD;
  const last = s.charCodeAt(end - 1);
  if (last >= 0xd800 && last <= 0xdbff) end -= 1;
  const quoted = JSON.stringify(s.slice(0, end));
  return `${quoted.slice(0, -1)}…" (${plural(s.length, 'character', 'characters')})`;
}

/** Writes `value` as compact JSON into `parts` within `room` characters; throws TOO_MUCH otherwise. */
function write(value: unknown, parts: string[], room: { left: number }): void {
  const add = (text: string) => {
    room.left -= text.length;
    if (room.left < 0) throw TOO_MUCH;
    parts.push(text);
  };
  if (value === null || typeof value === 'boolean') add(String(value));
  else if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw TOO_MUCH;
    add(JSON.stringify(value));
  } else if (typeof value === 'string') {
    // Checked before stringifying, so a long string costs nothing.
    if (value.length + 2 > room.left) throw TOO_MUCH;
    add(JSON.stringify(value));
  } else if (Array.isArray(value)) {
    add('[');
    // Every item costs at least one character, so the budget also bounds how deep this goes.
    for (let i = 0; i < value.length; i++) {
      if (i > 0) add(',');
      write(value[i], parts, room);
    }
    add(']');
  } else if (typeof value === 'object') {
    add('{');
    let first = true;
    for (const key of Object.keys(value)) {
      if (!first) add(',');
      first = false;
      write(key, parts, room);
      add(':');
      write((value as Record<string, unknown>)[key], parts, room);
    }
    add('}');
  } else {
    throw TOO_MUCH;
  }
}

/** What a value is when it cannot be shown whole: `an array of 3 items`, `a function`, `NaN`. */
function summary(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return stringHead(value);
  if (Array.isArray(value)) return `an array of ${plural(value.length, 'item', 'items')}`;
  if (typeof value === 'object' && value !== null) return `an object with ${plural(Object.keys(value).length, 'member', 'members')}`;
  return `a ${typeof value}`;
}

/**
 * A value as a short piece of an error message: its compact JSON when that is short, otherwise a
 * summary, so a huge, deeply nested or cyclic value never makes a huge message or a stack overflow.
 * @example previewValue(['a', 1]) // '["a",1]'
 * @example previewValue(new Array(100000).fill(0)) // 'an array of 100000 items'
 * @example previewValue('x'.repeat(100)) // '"xxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxxx…" (100 characters)'
 */
export function previewValue(value: unknown): string {
  const parts: string[] = [];
  try {
    write(value, parts, { left: BUDGET });
  } catch (e) {
    if (e !== TOO_MUCH) throw e;
    return summary(value);
  }
  return parts.join('');
}
