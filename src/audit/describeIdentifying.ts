import { formatCount } from './report/formatCount.js';
import { IDENTIFYING_KINDS, collapseAdvice, type IdentifyingKind, type IdentifyingTokens } from './identifyingTokens.js';

/** Each kind's name, singular and plural. */
const NAMES: Readonly<Record<IdentifyingKind, [string, string]>> = {
  email: ['e-mail address', 'e-mail addresses'],
  url: ['URL', 'URLs'],
  mention: ['@mention', '@mentions'],
  phone: ['phone-like number', 'phone-like numbers'],
  ip: ['IP address', 'IP addresses'],
};

/** What a summary says when no token looks identifying. */
export const NO_IDENTIFYING_TOKENS = 'no token looks like an e-mail address, URL, @mention, phone number or IP address';

/** Examples shown per kind in a sentence. */
const SHOWN = 2;

/**
 * The tokens that look identifying, in words, with up to 2 shortened examples of each kind; null when
 * there are none. For summaries and the report.
 * @example describeIdentifying(found) // '3 tokens may identify people: 2 e-mail addresses (ta…@mail.example, o.…@port.example), 1 phone-like number (555-01…)'
 */
export function describeIdentifying(found: IdentifyingTokens): string | null {
  if (found.tokens === 0) return null;
  const parts: string[] = [];
  for (const kind of IDENTIFYING_KINDS) {
    const { tokens, examples } = found[kind];
    if (tokens === 0) continue;
    const [one, many] = NAMES[kind];
    parts.push(`${formatCount(tokens)} ${tokens === 1 ? one : many} (${examples.slice(0, SHOWN).join(', ')}${tokens > SHOWN ? ', …' : ''})`);
  }
  return `${formatCount(found.tokens)} ${found.tokens === 1 ? 'token' : 'tokens'} may identify people: ${parts.join(', ')}`;
}

/**
 * What to do about them, e.g. `anyone who loads the lexicon can read its tokens: --collapse
 * email,url,number folds these into placeholders`.
 */
export function identifyingAdvice(found: IdentifyingTokens): string {
  return `anyone who loads the lexicon can read its tokens: --collapse ${collapseAdvice(found)} folds these into placeholders`;
}
