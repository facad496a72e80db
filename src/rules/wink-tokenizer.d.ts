// Types for the parts of wink-tokenizer (a CommonJS package without bundled types) that lexlock uses.
declare module 'wink-tokenizer' {
  interface WinkToken {
    value: string;
    tag: string;
  }
  interface WinkTokenizer {
    tokenize(sentence: string): WinkToken[];
  }
  function winkTokenizer(): WinkTokenizer;
  export default winkTokenizer;
}
