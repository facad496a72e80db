// Character classes for code units below 256 (anything above is "other").
const OTHER = 0;
const LETTER = 1;
const DIGIT = 2;
const PUNCT = 3;
const CURRENCY = 4;

const CLASS = new Uint8Array(256);
for (let c = 0x61; c <= 0x7a; c++) CLASS[c] = LETTER;
for (let c = 0x41; c <= 0x5a; c++) CLASS[c] = LETTER;
// wink's Latin-1 letter ranges: U+00C0-U+00D6, U+00D8-U+00F6, U+00F8-U+00FF.
for (let c = 0xc0; c <= 0xff; c++) if (c !== 0xd7 && c !== 0xf7) CLASS[c] = LETTER;
for (let c = 0x30; c <= 0x39; c++) CLASS[c] = DIGIT;
// Punctuation wink tags one character at a time and no earlier rule of its can claim here
// (the apostrophe and backtick are left out: the apostrophe belongs to words and contractions).
for (const ch of ',.!?;:"()[]{}-') CLASS[ch.charCodeAt(0)] = PUNCT;
// wink's currency signs below U+0100.
for (const ch of '$£¥') CLASS[ch.charCodeAt(0)] = CURRENCY;

// After ':' or ';' only these may follow without risking an emoticon (`:-)`, `;d`, `:[`…). No letter
// may follow, which also keeps out times written `10:am`.
const AFTER_EMOTICON_START = new Uint8Array(256);
// White space below U+0100 may follow too: it ends the chunk.
for (const ch of ',.!?;:"0123456789 \t\n\v\f\r\u00A0') AFTER_EMOTICON_START[ch.charCodeAt(0)] = 1;

const COLON = 0x3a;
const SEMICOLON = 0x3b;
const DOT = 0x2e;
const COMMA = 0x2c;
const HYPHEN = 0x2d;

function classAt(text: string, i: number): number {
  const code = text.charCodeAt(i);
  return code < 256 ? (CLASS[code] as number) : OTHER;
}

/**
 * Tokenizes directly the chunk that starts at `start` (a chunk ends at white space or the end of the
 * text) as far as every wink-tokenizer rule that could apply is one this scanner reproduces: runs of
 * Latin-1 letters (`word`), ASCII digits joined by single `.` `,` `-` (`number`), single punctuation
 * marks (`punctuation`) and `$ £ ¥` (`currency`). It stops at any other character, at a letter right
 * after a digit (times, ordinals), and at a `:`/`;` followed by anything but `, . ! ? " : ;`, a digit or
 * white space (emoticons, `10:am`). Appends value/tag pairs to `raw` (values alone when `tagged` is
 * false), in wink's order and with wink's tags, and returns where it stopped: the chunk was plain only if that is its end (white space or the
 * end of the text); otherwise the caller must drop what was appended.
 * @example scanPlainChunk('(well-known), ok', 0, raw) // 13; raw gets '(', 'punctuation', 'well', 'word', '-', …
 */
export function scanPlainChunk(text: string, start: number, raw: string[], tagged = true): number {
  const end = text.length;
  // The class of the last item emitted.
  let previous = OTHER;
  let i = start;
  while (i < end) {
    const kind = classAt(text, i);
    if (kind === LETTER) {
      if (previous === DIGIT) break;
      const from = i;
      for (i++; i < end && classAt(text, i) === LETTER; i++);
      if (tagged) raw.push(text.slice(from, i), 'word');
      else raw.push(text.slice(from, i));
      previous = LETTER;
    } else if (kind === DIGIT) {
      const from = i;
      for (;;) {
        for (i++; i < end && classAt(text, i) === DIGIT; i++);
        const joint = text.charCodeAt(i);
        if (i + 1 < end && (joint === DOT || joint === COMMA || joint === HYPHEN) && classAt(text, i + 1) === DIGIT) i++;
        else break;
      }
      if (tagged) raw.push(text.slice(from, i), 'number');
      else raw.push(text.slice(from, i));
      previous = DIGIT;
    } else if (kind === PUNCT) {
      const code = text.charCodeAt(i);
      if ((code === COLON || code === SEMICOLON) && i + 1 < end && AFTER_EMOTICON_START[text.charCodeAt(i + 1)] !== 1) break;
      if (tagged) raw.push(text[i] as string, 'punctuation');
      else raw.push(text[i] as string);
      previous = PUNCT;
      i++;
    } else if (kind === CURRENCY) {
      if (tagged) raw.push(text[i] as string, 'currency');
      else raw.push(text[i] as string);
      previous = CURRENCY;
      i++;
    } else break;
  }
  return i;
}
