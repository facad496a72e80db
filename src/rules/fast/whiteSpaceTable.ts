/**
 * One byte per UTF-16 code unit: 1 where the JavaScript engine's own `\s` matches (the white space
 * wink-tokenizer splits and trims on), 0 elsewhere. Built from the engine, so it cannot drift from it.
 */
export const WHITE_SPACE_TABLE: Uint8Array = buildTable();

function buildTable(): Uint8Array {
  const table = new Uint8Array(0x10000);
  const units: string[] = [];
  for (let c = 0; c < 0x10000; c++) units.push(String.fromCharCode(c));
  // Without flag `u` every code unit (lone surrogates too) is one character to the regex.
  for (const m of units.join('').matchAll(/\s/g)) table[m.index] = 1;
  return table;
}
