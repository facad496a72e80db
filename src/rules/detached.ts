/**
 * `text` as a string of its own. A token cut from a document can be stored by the engine as a view into
 * the whole document (V8 does so from 13 characters on), so keeping the token would keep the document;
 * a copy made through a short concatenation holds only its own characters. Used wherever a token is
 * kept long after its document: tally entries, heavy-hitter counters, the chunk memo.
 * @example const token = detached(document.slice(10, 40)) // keeping `token` does not keep `document`
 */
export function detached(text: string): string {
  // Below 13 characters V8 copies on slicing anyway.
  return text.length < 13 ? text : (` ${text}`).slice(1);
}
