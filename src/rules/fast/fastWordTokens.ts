import { detached } from '../detached.js';
import type { TextRules } from '../TextRules.js';
import { finishTokens } from './finishTokens.js';
import { GroupCache } from './GroupCache.js';
import { scanLinkChunk } from './scanLinkChunk.js';
import { scanPlainChunk } from './scanPlainChunk.js';
import { tokenizeGroups } from './tokenizeGroups.js';
import { WHITE_SPACE_TABLE } from './whiteSpaceTable.js';

const cache = new GroupCache();
/** Groups longer than this are not memoized: they rarely come again. */
const CACHE_MAX_LENGTH = 64;
/** The tag of the placeholder pair that holds a wink-tokenized group's place (wink has no such tag). */
const PLACE = '\u0000';
const AT = 0x40;
const COLON = 0x3a;

function isDigitOrColon(code: number): boolean {
  return (code >= 0x30 && code <= 0x39) || code === 0x3a;
}

function startsTimeSuffix(code: number): boolean {
  // a, p, h in either case: what may follow the one white space of wink's time rule.
  const lower = code | 0x20;
  return lower === 0x61 || lower === 0x70 || lower === 0x68;
}

/**
 * The word level (encoding contract, rule 2) of already-normalized text, token for token the same as
 * wink-tokenizer on the whole text, but faster. The text is cut into chunks at white space; wink's
 * rules never match across white space except the time rule (`10 am`), so a chunk ending in a digit
 * or `:` is kept with the next when one white space separates them and that one starts with a, p or h.
 * Plain chunks (see {@link scanPlainChunk}) are tokenized directly, so are chunks with URLs or e-mail
 * addresses around plain parts (see {@link scanLinkChunk}); the rest by wink in one call per text,
 * memoized.
 * @example fastWordTokens('Depart 10 am, ok?', { drop: [], collapse: [] }) // ['Depart', '10 am', ',', 'ok', '?']
 */
export function fastWordTokens(text: string, rules: Pick<TextRules, 'drop' | 'collapse'>): string[] {
  // Without drop or collapse tags are not needed: plain chunks go straight to the tokens, values only.
  // Otherwise value/tag pairs are gathered and finished at the end.
  const tagged = rules.drop.length > 0 || rules.collapse.length > 0;
  const step = tagged ? 2 : 1;
  const raw: string[] = [];
  // The groups left to wink, in order; each holds its place in `raw` by an empty value: with values
  // alone no token is empty (finished tokens never are), with pairs the tag PLACE marks it.
  const slowGroups: string[] = [];
  const n = text.length;
  let i = 0;
  while (i < n) {
    while (i < n && WHITE_SPACE_TABLE[text.charCodeAt(i)] === 1) i++;
    if (i >= n) break;
    const groupStart = i;
    const saved = raw.length;
    let end = scanPlainChunk(text, i, raw, tagged);
    let plain = end === n || WHITE_SPACE_TABLE[text.charCodeAt(end)] === 1;
    if (!plain) raw.length = saved;
    const stop = end;
    let joined = false;
    for (;;) {
      while (end < n && WHITE_SPACE_TABLE[text.charCodeAt(end)] !== 1) end++;
      // Keep the next chunk with this group when a time match could span the one white space between.
      if (
        end + 2 <= n &&
        isDigitOrColon(text.charCodeAt(end - 1)) &&
        WHITE_SPACE_TABLE[text.charCodeAt(end + 1)] !== 1 &&
        startsTimeSuffix(text.charCodeAt(end + 1))
      ) {
        if (plain) raw.length = saved;
        plain = false;
        joined = true;
        end += 1;
        continue;
      }
      break;
    }
    i = end;
    if (plain) continue;
    // A chunk the plain scanner stopped in at an '@' or a ':' may hold an address or a URL.
    const at = text.charCodeAt(stop);
    if (!joined && (at === AT || at === COLON)) {
      if (scanLinkChunk(text, groupStart, end, raw, tagged)) continue;
      raw.length = saved;
    }
    const group = text.slice(groupStart, end);
    const known = cache.get(group);
    if (known !== undefined) {
      if (tagged) for (const part of known) raw.push(part);
      else finishTokens(known, rules, raw);
      continue;
    }
    slowGroups.push(group);
    if (tagged) raw.push('', PLACE);
    else raw.push('');
  }
  if (slowGroups.length === 0) return tagged ? finishTokens(raw, rules, []) : raw;
  const results = tokenizeGroups(slowGroups);
  const out: string[] = [];
  let g = 0;
  // Finished a segment of pairs at a time, so the drop/collapse sets are built once a segment.
  let from = 0;
  for (let k = 0; k < raw.length; k += step) {
    const value = raw[k] as string;
    if (value !== '') {
      if (!tagged) out.push(value);
      continue;
    }
    if (tagged) {
      if (raw[k + 1] !== PLACE) continue;
      finishTokens(raw, rules, out, from, k);
      from = k + 2;
    }
    const pairs = results[g] as string[];
    const group = slowGroups[g] as string;
    g++;
    if (group.length <= CACHE_MAX_LENGTH) cache.set(detached(group), pairs.map(detached));
    finishTokens(pairs, rules, out);
  }
  return tagged ? finishTokens(raw, rules, out, from, raw.length) : out;
}
