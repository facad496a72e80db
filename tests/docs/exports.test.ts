import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

// Every export of the public entries carries a doc comment (the API reference users see in their
// editor), read with the TypeScript compiler's own API.
const src = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'src');
const ENTRIES = ['index.ts', 'node.ts', 'browser.ts'];

function undocumented(entry: string): { checked: number; missing: string[] } {
  const file = join(src, entry);
  const program = ts.createProgram([file], { module: ts.ModuleKind.NodeNext, moduleResolution: ts.ModuleResolutionKind.NodeNext, target: ts.ScriptTarget.ES2022, strict: true, noEmit: true });
  const checker = program.getTypeChecker();
  const source = program.getSourceFile(file);
  const moduleSymbol = source === undefined ? undefined : checker.getSymbolAtLocation(source);
  if (moduleSymbol === undefined) throw new Error(`${entry}: no module symbol`);
  const missing: string[] = [];
  const exports = checker.getExportsOfModule(moduleSymbol);
  for (const exported of exports) {
    const symbol = exported.flags & ts.SymbolFlags.Alias ? checker.getAliasedSymbol(exported) : exported;
    if (symbol.getDocumentationComment(checker).length === 0) missing.push(exported.getName());
  }
  return { checked: exports.length, missing };
}

describe('API documentation', () => {
  it.each(ENTRIES)('every export of src/%s has a doc comment', (entry) => {
    const { checked, missing } = undocumented(entry);
    expect(checked).toBeGreaterThan(15);
    expect(missing).toEqual([]);
  });
});
