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

// wink-tokenizer's table of English contractions (a CommonJS module of the package: word -> its parts).
declare module 'wink-tokenizer/src/eng-contractions.js' {
  const contractions: Readonly<Record<string, readonly { readonly value: string; readonly tag: string }[] | undefined>>;
  export default contractions;
}
