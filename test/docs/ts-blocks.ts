/**
 * Runs a `ts` block of a documentation page and checks the results it states. The conventions, the same on
 * every page:
 *
 * - `expression; // => value` states the expression's value: `value` is JavaScript, compared by deep equality
 *   (NaN equals NaN; a typed array equals only a typed array of the same kind, written `Float64Array.of(...)`).
 *   A note may follow the value after ": " or " (" (`// => 5: Friday`, `// => 20133 (2025-02-14)`). An object
 *   written with `...` before its closing brace (`{ sign: 1, hours: 2, ... }`) states some of its fields only.
 * - `expression; // throws KalendsRangeError: message` states that it throws an error of that class (or a
 *   subclass) with that message; `...` in the message stands for any text, and the message may be left out.
 * - `const name = expression; // => value` states the value of `name`.
 * - The result may stand on the line after the statement instead (`// => value` on a line of its own), and
 *   continues on the following comment lines indented by two spaces or more after `//`, joined by one space.
 *
 * A comment after an expression that is not written so is refused, and so is a comment after any statement
 * that looks like a value: every stated result is checked.
 *
 * Blocks of a page run in order in one scope: a block sees what earlier blocks of its page imported and
 * declared, and a name it uses must be imported on the page (from 'kalends', 'kalends/warehouse',
 * 'kalends/tzdata', a Temporal polyfill or 'node:fs'), so a missing import fails.
 */
import ts from 'typescript';
import { expect } from 'vitest';
import type { Block } from './markdown.js';

/** One stated result: the page line of its statement, the statement's source and what the page says. */
interface Stated {
  readonly line: number;
  readonly source: string;
  readonly kind: 'value' | 'throws';
  readonly text: string;
}

interface Instrumented {
  readonly js: string;
  readonly stated: readonly Stated[];
  readonly declared: readonly string[];
  readonly faults: readonly string[];
}

const RESULT = /^\/\/\s*(=>|throws\b)\s*(.*)$/;
const CONTINUATION = /^\s*\/\/ {2,}(\S.*)$/;
/** A comment that reads as a value (a number, a string, an array or object, a boolean, a typed array). */
const LOOKS_LIKE_VALUE = /^\/\/\s*(-?\d|'|"|\[|\{|true\b|false\b|null\b|NaN\b|(Float64|Int32|Uint8)Array\b|Date\.(UTC|parse)\()/;

/** The result stated by the comment `comment` on block line `index`, with its continuation lines. */
function statedAt(lines: readonly string[], index: number, comment: string): { kind: 'value' | 'throws'; text: string } | undefined {
  const m = RESULT.exec(comment.trim());
  if (!m) return undefined;
  let text = m[2]!.trim();
  for (let k = index + 1; k < lines.length; k++) {
    const c = CONTINUATION.exec(lines[k]!);
    if (!c) break;
    text += ` ${c[1]!.trim()}`;
  }
  return { kind: m[1] === '=>' ? 'value' : 'throws', text };
}

/** Splits `value: note` or `value (note)` at the first such separator outside brackets and quotes. */
export function valueOfStated(text: string): { value: string; partial: boolean } {
  let depth = 0;
  let quote = '';
  let end = text.length;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quote) {
      if (c === '\\') i++;
      else if (c === quote) quote = '';
      continue;
    }
    if (c === "'" || c === '"' || c === '`') quote = c;
    else if ('([{'.includes(c)) depth++;
    else if (')]}'.includes(c)) depth--;
    else if (depth === 0 && (text.startsWith(': ', i) || text.startsWith(' (', i))) {
      end = i;
      break;
    }
  }
  let value = text.slice(0, end).trim();
  const partial = /,\s*\.\.\.\s*\}/.test(value);
  if (partial) value = value.replace(/,\s*\.\.\.\s*\}/g, ' }');
  return { value, partial };
}

function bindingNames(name: ts.BindingName): string[] {
  if (ts.isIdentifier(name)) return [name.text];
  return name.elements.flatMap((e) => (ts.isOmittedExpression(e) ? [] : bindingNames(e.name)));
}

/** The block's code with every stated result turned into a check, imports into reads of `__mod`. */
export function instrument(block: Block): Instrumented {
  const text = block.text;
  const lines = text.split('\n');
  const sf = ts.createSourceFile('block.ts', text, ts.ScriptTarget.Latest, true, ts.ScriptKind.TS);
  const faults: string[] = [];
  const lineOf = (pos: number) => sf.getLineAndCharacterOfPosition(pos).line;
  const pageLine = (blockLine: number) => block.line + blockLine;
  for (const d of (sf as unknown as { parseDiagnostics: ts.Diagnostic[] }).parseDiagnostics) {
    faults.push(`${block.page}:${pageLine(lineOf(d.start ?? 0))}: ${ts.flattenDiagnosticMessageText(d.messageText, ' ')}`);
  }
  const edits: { start: number; end: number; text: string }[] = [];
  const stated: Stated[] = [];
  const declared: string[] = [];
  for (const statement of sf.statements) {
    const start = statement.getStart(sf);
    const first = lineOf(start);
    const last = lineOf(statement.end);
    const where = `${block.page}:${pageLine(first)}`;
    const at = `__at(${pageLine(first)}); `;
    const after = lines[last]!.slice(sf.getLineAndCharacterOfPosition(statement.end).character);
    const trailing = /^\s*(\/\/.*)$/.exec(after)?.[1];
    const nextLine = lines[last + 1]?.trim() ?? '';
    let result = trailing === undefined ? undefined : statedAt(lines, last, trailing);
    if (!result && trailing === undefined && nextLine.startsWith('//')) result = statedAt(lines, last + 1, nextLine);
    if (trailing !== undefined && !result && (ts.isExpressionStatement(statement) || LOOKS_LIKE_VALUE.test(trailing))) {
      faults.push(`${where}: "${trailing.trim()}" states a result without the convention: write "// => value" or "// throws Error: message"`);
    }
    if (trailing === undefined && !result && ts.isExpressionStatement(statement) && nextLine.startsWith('//') && LOOKS_LIKE_VALUE.test(nextLine)) {
      faults.push(`${where}: the comment after it states a result without the convention: write "// => value"`);
    }
    if (ts.isImportDeclaration(statement)) {
      const from = (statement.moduleSpecifier as ts.StringLiteral).text;
      const clause = statement.importClause;
      const parts: string[] = [];
      if (clause && !clause.isTypeOnly) {
        if (clause.name) parts.push(`const ${clause.name.text} = __mod(${JSON.stringify(from)}).default;`);
        const bindings = clause.namedBindings;
        if (bindings && ts.isNamespaceImport(bindings)) parts.push(`const ${bindings.name.text} = __mod(${JSON.stringify(from)});`);
        if (bindings && ts.isNamedImports(bindings)) {
          const names = bindings.elements.filter((e) => !e.isTypeOnly);
          parts.push(`const { ${names.map((e) => (e.propertyName ? `${e.propertyName.text}: ${e.name.text}` : e.name.text)).join(', ')} } = __mod(${JSON.stringify(from)});`);
          declared.push(...names.map((e) => e.name.text));
        }
        if (clause.name) declared.push(clause.name.text);
        if (bindings && ts.isNamespaceImport(bindings)) declared.push(bindings.name.text);
      }
      // Keep the statement's line count, so that later lines keep their numbers.
      edits.push({ start, end: statement.end, text: at + parts.join(' ') + '\n'.repeat(last - first) });
      continue;
    }
    if (ts.isVariableStatement(statement)) {
      for (const d of statement.declarationList.declarations) declared.push(...bindingNames(d.name));
    } else if ((ts.isFunctionDeclaration(statement) || ts.isClassDeclaration(statement)) && statement.name) {
      declared.push(statement.name.text);
    }
    if (!result) {
      edits.push({ start, end: start, text: at });
      continue;
    }
    const k = stated.length;
    if (ts.isExpressionStatement(statement)) {
      const expression = statement.expression.getText(sf);
      stated.push({ line: pageLine(first), source: expression, kind: result.kind, text: result.text });
      edits.push({
        start,
        end: statement.end,
        text:
          result.kind === 'value'
            ? `${at}__check(${k}, () => (${expression}), () => (${valueOfStated(result.text).value}));`
            : `${at}__throws(${k}, () => (${expression}));`,
      });
    } else if (ts.isVariableStatement(statement) && result.kind === 'value' && statement.declarationList.declarations.length === 1
      && ts.isIdentifier(statement.declarationList.declarations[0]!.name)) {
      const name = statement.declarationList.declarations[0]!.name.text;
      stated.push({ line: pageLine(first), source: name, kind: 'value', text: result.text });
      edits.push({ start, end: start, text: at });
      edits.push({ start: statement.end, end: statement.end, text: ` __check(${k}, () => (${name}), () => (${valueOfStated(result.text).value}));` });
    } else {
      faults.push(`${where}: a result is stated after an expression or after "const name = ...", not after this statement`);
    }
  }
  let code = text;
  for (const e of edits.sort((a, b) => b.start - a.start || b.end - a.end)) code = code.slice(0, e.start) + e.text + code.slice(e.end);
  const out = ts.transpileModule(code, {
    compilerOptions: { target: ts.ScriptTarget.ES2022, module: ts.ModuleKind.ESNext },
    reportDiagnostics: true,
  });
  for (const d of out.diagnostics ?? []) faults.push(`${block.page}:${block.line}: ${ts.flattenDiagnosticMessageText(d.messageText, ' ')}`);
  const js = out.outputText.replace(/^export \{\};\s*$/m, '');
  return { js, stated, declared: [...new Set(declared)], faults };
}

/** Whether an error's class, or a class it extends, has this name. */
function isErrorOf(e: unknown, name: string): boolean {
  if ((e as Error | undefined)?.name === name) return true;
  for (let p = Object.getPrototypeOf(e); p && p !== Object.prototype; p = Object.getPrototypeOf(p)) {
    if ((p as { constructor?: { name?: string } }).constructor?.name === name) return true;
  }
  return false;
}

function messageMatches(message: string, written: string): boolean {
  const pieces = written.split('...').map((p) => p.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'));
  return new RegExp(`^${pieces.join('[\\s\\S]*')}$`).test(message);
}

function describeError(e: unknown): string {
  return e instanceof Error ? `${e.name}: ${e.message}` : String(e);
}

/**
 * Runs the block in the page's scope `env` (names from earlier blocks), with `modules` for its imports; adds
 * the names it declares to `env`. Throws, naming the page and line, at the first failure.
 */
export function runTsBlock(block: Block, env: Map<string, unknown>, modules: Record<string, unknown>): { checks: number } {
  const { js, stated, declared, faults } = instrument(block);
  if (faults.length > 0) throw new Error(faults.join('\n'));
  let line = block.line;
  let checks = 0;
  const fail = (s: Stated, message: string): never => {
    throw new Error(`${block.page}:${s.line}: ${s.source}\n${message}`);
  };
  const check = (k: number, got: () => unknown, want: () => unknown) => {
    const s = stated[k]!;
    let value: unknown;
    try {
      value = got();
    } catch (e) {
      fail(s, `threw ${describeError(e)}; the page says ${s.text}`);
    }
    let expected: unknown;
    try {
      expected = want();
    } catch (e) {
      fail(s, `the result written, "${s.text}", is not a value: ${describeError(e)}`);
    }
    try {
      if (valueOfStated(s.text).partial) expect(value).toMatchObject(expected as object);
      else expect(value).toEqual(expected);
    } catch (e) {
      (e as Error).message = `${block.page}:${s.line}: ${s.source}: ${(e as Error).message}`;
      throw e;
    }
    checks++;
  };
  const throws = (k: number, f: () => unknown) => {
    const s = stated[k]!;
    const m = /^(\w+)(?::\s([\s\S]*))?$/.exec(s.text);
    if (!m) fail(s, `write "// throws ErrorClass" or "// throws ErrorClass: message", not "${s.text}"`);
    let returned: unknown;
    try {
      returned = f();
    } catch (e) {
      if (!isErrorOf(e, m![1]!)) fail(s, `threw ${describeError(e)}; the page says ${s.text}`);
      if (m![2] !== undefined && !messageMatches((e as Error).message, m![2])) {
        fail(s, `threw the message\n  ${(e as Error).message}\nthe page says\n  ${m![2]}`);
      }
      checks++;
      return;
    }
    fail(s, `returned ${String(returned)}; the page says it throws ${s.text}`);
  };
  const mod = (name: string) => {
    if (!(name in modules)) throw new Error(`import from "${name}": the docs tests know ${Object.keys(modules).join(', ')}`);
    return modules[name];
  };
  const names = [...env.keys()];
  const body = `"use strict";\nconst { ${names.join(', ')} } = __env;\nreturn (() => {\n${js}\nreturn { ${declared.join(', ')} };\n})();`;
  const run = new Function('__env', '__check', '__throws', '__mod', '__at', body) as (...args: unknown[]) => Record<string, unknown>;
  let made: Record<string, unknown>;
  try {
    made = run(Object.fromEntries(env), check, throws, mod, (n: number) => {
      line = n;
    });
  } catch (e) {
    if (e instanceof Error && /^(README\.md|docs\/)/.test(e.message)) throw e;
    throw new Error(`${block.page}:${line}: ${describeError(e)}`, { cause: e });
  }
  if (checks !== stated.length) throw new Error(`${block.page}:${block.line}: ${stated.length} results stated, ${checks} checked`);
  for (const [k, v] of Object.entries(made)) env.set(k, v);
  return { checks };
}
