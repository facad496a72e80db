/**
 * How many code units the word level's searches have stepped over in this thread since it started:
 * each rule's search counts the text it covered (up to the end of its match, or of the text when it
 * found none), the e-mail and ordinal scanners every step they take, and a word split every code unit
 * it looks at. Tests read it to prove that tokenizing costs a bounded number of steps per code unit on
 * any text (tests/rules/fast/scanWork.test.ts); nothing else depends on it.
 */
export const scanWork = { units: 0 };
