/**
 * The exports of a module as TypeScript declares them: for each exported value, whether it is a function, a class
 * or a constant, and a function's parameter names. The surface test compares the table with these, so that a row
 * names its parameters as the declaration does (and so as messages must).
 */
import ts from 'typescript';

export interface Declared {
  readonly kind: 'function' | 'class' | 'constant';
  readonly params: readonly string[];
}

/** The value exports of each of `files` (paths of .ts modules), by export name. */
export function declaredExports(files: readonly string[]): Map<string, Map<string, Declared>> {
  const program = ts.createProgram([...files], { target: ts.ScriptTarget.ES2022, module: ts.ModuleKind.ESNext, moduleResolution: ts.ModuleResolutionKind.Bundler, noEmit: true, skipLibCheck: true, paths: { kalends: [files[0]!] } });
  const checker = program.getTypeChecker();
  const result = new Map<string, Map<string, Declared>>();
  for (const file of files) {
    const source = program.getSourceFile(file);
    if (!source) throw new Error(`cannot read ${file}`);
    const moduleSymbol = checker.getSymbolAtLocation(source);
    const exports = new Map<string, Declared>();
    for (const symbol of moduleSymbol ? checker.getExportsOfModule(moduleSymbol) : []) {
      const target = symbol.flags & ts.SymbolFlags.Alias ? checker.getAliasedSymbol(symbol) : symbol;
      if (!(target.flags & ts.SymbolFlags.Value)) continue;
      const decl = target.valueDeclaration ?? target.declarations?.[0];
      if (!decl) continue;
      if (ts.isFunctionDeclaration(decl)) exports.set(symbol.name, { kind: 'function', params: decl.parameters.map((p) => p.name.getText()) });
      else if (ts.isClassDeclaration(decl)) exports.set(symbol.name, { kind: 'class', params: [] });
      else exports.set(symbol.name, { kind: 'constant', params: [] });
    }
    result.set(file, exports);
  }
  return result;
}
