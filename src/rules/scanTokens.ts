import { scanWordTokens } from './fast/scanWordTokens.js';
import { normalize } from './normalize.js';
import { scanCharTokens } from './scanCharTokens.js';
import type { TextRules } from './TextRules.js';
import type { TokenSpans } from './TokenSpans.js';

/** True when every code unit of `text` is ASCII: normalization (NFC or NFKC) leaves such text as it is. */
function isAscii(text: string): boolean {
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) > 0x7f) return false;
  return true;
}

/**
 * Finds one text's tokens under the given rules (normalize, lower-case, tokenize: encoding contract,
 * rules 1 and 2) and leaves them in `out`. This is the only path from text to tokens: tally, encode,
 * canaries and audits all come through it (through {@link tokenize} where they need strings).
 *
 * With `mayFold`, ASCII text is not copied to be lower-cased: its spans are read lower-cased instead
 * (`out.folded`), so encoding such a text allocates nothing but its output. Other text is normalized
 * and lower-cased into a new string first.
 * @example scanTokens("Can't wait!", resolveRules(), out, true) // out holds 'ca', "n't", 'wait', '!'
 */
export function scanTokens(text: string, rules: TextRules, out: TokenSpans, mayFold: boolean): TokenSpans {
  if (mayFold && isAscii(text)) out.begin(text, rules.case === 'lower', rules);
  else out.begin(normalize(text, rules), false, rules);
  if (rules.level === 'char') scanCharTokens(out, rules.spaces === 'drop' ? 'drop' : 'keep');
  else scanWordTokens(out);
  return out;
}
