/** Every bad-text policy, in the order help and messages name them. */
export const BAD_TEXT_POLICIES = ['fail', 'replace', 'skip'] as const;

/**
 * What to do with text whose bytes are not valid UTF-8 (encoding contract, rule 7): stop (`fail`),
 * decode it with U+FFFD for each bad sequence (`replace`), or leave the document out (`skip`).
 */
export type BadTextPolicy = (typeof BAD_TEXT_POLICIES)[number];

/** The policy of a lexicon whose `fit` names none (a lexicon without a fit, or one written before `fit.badText` existed). */
export const DEFAULT_BAD_TEXT: BadTextPolicy = 'fail';
