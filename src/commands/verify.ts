import { FORMAT_VERSION } from '../artifact/schema.js';
import { identifyingTokensOf } from '../audit/identifyingTokens.js';
import { loadLexicon } from '../files/loadLexicon.js';
import { describeLexiconText } from './describeLexicon.js';
import type { Io } from './Io.js';
import { parseArgs, positionals } from './parseArgs.js';

/** `lexlock verify --help`. */
export const VERIFY_HELP = `lexlock verify <lexicon.json> [--json]

Checks a lexicon file: format version, schema, fingerprint, duplicate tokens, and that every canary
still tokenizes as it did when the lexicon was built. Prints the fingerprint and a summary.

  --json    print {"ok", "fingerprint", "formatVersion", "tokens", "size", "labels", "canaries",
            "identifyingTokens"} as JSON: tokens in the lexicon (reserved included), size = ids 0 to
            size-1 (rows for an embedding), labels (0 without labels), canaries checked, and the tokens
            that may identify people: {"tokens", "email", "url", "mention", "phone", "ip"}, each kind
            {"tokens", "examples"} (up to 3, shortened)

The summary counts the tokens that look like e-mail addresses, URLs, @mentions, phone numbers or IP
addresses: a lexicon ships its tokens to whoever loads it.
`;

/** `lexlock verify`: exit 0 when the lexicon is sound, 1 (with the reason) when not. */
export async function verify(argv: readonly string[], io: Io): Promise<number> {
  const args = parseArgs('verify', argv, { json: { kind: 'switch' } });
  const [path] = positionals('verify', args, ['lexicon.json']) as [string];
  const lexicon = await loadLexicon(path);
  if (args.switches.has('json')) {
    io.stdout.write(
      `${JSON.stringify({
        ok: true,
        fingerprint: lexicon.fingerprint,
        formatVersion: FORMAT_VERSION,
        tokens: lexicon.encoding.tokens.length,
        size: lexicon.size,
        labels: lexicon.labels.length,
        canaries: lexicon.canaries.length,
        identifyingTokens: identifyingTokensOf(lexicon),
      })}\n`,
    );
    return 0;
  }
  io.stdout.write(`ok ${path}: schema, fingerprint and ${lexicon.canaries.length} canaries check out\n${describeLexiconText(lexicon)}`);
  return 0;
}
