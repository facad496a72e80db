// The white space table checked against String.prototype.trim (what wink-tokenizer trims pieces with)
// and the ECMAScript list (WhiteSpace + LineTerminator: TAB, VT, FF, SP, NBSP, ZWNBSP, Zs, LF, CR, LS, PS).
import { describe, expect, it } from 'vitest';
import { WHITE_SPACE_TABLE } from '../../../src/rules/fast/whiteSpaceTable.js';

describe('WHITE_SPACE_TABLE', () => {
  it('marks exactly the code units String.prototype.trim removes', () => {
    let differing = 0;
    for (let c = 0; c < 0x10000; c++) {
      const trimmed = `x${String.fromCharCode(c)}`.trim() === 'x';
      if (trimmed !== (WHITE_SPACE_TABLE[c] === 1)) differing += 1;
    }
    expect(differing).toBe(0);
  });

  it('holds the ECMAScript white space and line terminators of Unicode 15/16', () => {
    const marked: number[] = [];
    for (let c = 0; c < 0x10000; c++) if (WHITE_SPACE_TABLE[c] === 1) marked.push(c);
    expect(marked).toEqual([
      0x09, 0x0a, 0x0b, 0x0c, 0x0d, 0x20, 0xa0, 0x1680, 0x2000, 0x2001, 0x2002, 0x2003, 0x2004, 0x2005, 0x2006, 0x2007, 0x2008,
      0x2009, 0x200a, 0x2028, 0x2029, 0x202f, 0x205f, 0x3000, 0xfeff,
    ]);
  });
});
