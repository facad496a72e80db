import type { Lexicon } from '../lexicon/Lexicon.js';
import { describeCapTie } from '../audit/describeCapTie.js';
import { NO_IDENTIFYING_TOKENS, describeIdentifying, identifyingAdvice } from '../audit/describeIdentifying.js';
import { identifyingTokensOf, type IdentifyingTokens } from '../audit/identifyingTokens.js';
import { PROBE_TEXTS } from '../artifact/canaries.js';
import { describeShape } from '../lexicon/Shape.js';
import { count, pairs, percent } from './format.js';

/** The summary lines build and verify print about a lexicon. */
export function describeLexicon(lexicon: Lexicon): Array<[string, string]> {
  const { encoding, fit } = lexicon;
  const r = encoding.rules;
  const rows: Array<[string, string]> = [
    ['fingerprint', lexicon.fingerprint],
    [
      'rules',
      `${r.level} level, ${r.unicode}, case ${r.case}, ${r.tokenizer}` +
        (r.drop.length > 0 ? `, drop ${r.drop.join(',')}` : '') +
        (r.collapse.length > 0 ? `, collapse ${r.collapse.join(',')}` : '') +
        (r.spaces === null ? '' : `, spaces ${r.spaces}`),
    ],
    [
      'vocabulary',
      `${count(encoding.tokens.length - encoding.layout.reserved)} tokens` +
        (encoding.layout.reserved > 0 ? ` + ${encoding.layout.reserved} reserved` : '') +
        `; padding 0, OOV ${lexicon.oovId}; ids 0 to ${count(lexicon.size - 1)} (${count(lexicon.size)} rows for an embedding)`,
    ],
    ['shape', encoding.shape === null ? 'none (variable length)' : describeShape(encoding.shape)],
    ['labels', encoding.labels === null ? 'none' : `${encoding.labels.length}: ${encoding.labels.slice(0, 12).join(', ')}${encoding.labels.length > 12 ? ', …' : ''}`],
  ];
  rows.push(...identifyingRows(identifyingTokensOf(lexicon)));
  const corpusTexts = lexicon.canaries.filter((c) => !PROBE_TEXTS.includes(c.text)).length;
  if (corpusTexts > 0) {
    rows.push(['corpus text', `${corpusTexts} ${corpusTexts === 1 ? 'canary is a document' : 'canaries are documents'} of the corpus, shipped with the lexicon; build it again with lexlock build to leave them out`]);
  }
  if (fit !== null) {
    rows.push(['corpus', `${count(fit.documents)} documents, ${count(fit.tokens)} tokens, ${count(fit.types)} distinct`]);
    rows.push(['OOV on corpus', `${percent(fit.oovRate)} of tokens (${count(fit.oovTokens)})`]);
    const l = fit.length;
    rows.push(['tokens/document', `min ${l.min}, p50 ${l.p50}, p90 ${l.p90}, p95 ${l.p95}, p99 ${l.p99}, max ${l.max}`]);
    if (fit.capTie !== null) rows.push(['cap', describeCapTie(fit.capTie)]);
    if (fit.truncation !== null) {
      const t = fit.truncation;
      rows.push(['cut at length', `${count(t.truncatedDocuments)} documents (${percent(fit.documents === 0 ? 0 : t.truncatedDocuments / fit.documents)}), ${count(t.droppedTokens)} tokens dropped`]);
    }
  }
  return rows;
}

/**
 * The summary rows about tokens that may identify people: one saying there are none, or two saying
 * how many of each kind (with shortened examples) and what to do about them.
 */
export function identifyingRows(found: IdentifyingTokens): Array<[string, string]> {
  const described = describeIdentifying(found);
  return described === null ? [['identifying', NO_IDENTIFYING_TOKENS]] : [['identifying', described], ['', identifyingAdvice(found)]];
}

/** {@link describeLexicon} as aligned text. */
export function describeLexiconText(lexicon: Lexicon): string {
  return pairs(describeLexicon(lexicon));
}
