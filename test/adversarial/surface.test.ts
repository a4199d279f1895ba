/**
 * The adversarial table covers the whole public surface, and only it: every export of `kalends` (src/index.ts),
 * `kalends/tzdata` (src/tzdata/index.ts) and `kalends/warehouse` (src/warehouse/files.ts) has a row in test/adversarial/table.ts, of the right kind,
 * naming its parameters as the declaration does, and listing every option key the function reads. A new export
 * (or a new option) without a row fails here with a message that names it, so whoever adds it adds the row.
 *
 * Constants are frozen (immutable values, the project's standard), and the error classes extend the built-in class
 * docs/design.md ("Errors") names, with a documented code.
 */
import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';
import { Temporal } from 'temporal-polyfill';
import { DOCUMENTED_CODES } from './check.js';
import { declaredExports } from './declared.js';
import { configureTable, MODULES, type FunctionRow, type Row } from './table.js';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readFileSync } from 'node:fs';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const FILES: Readonly<Record<string, string>> = { kalends: join(ROOT, 'src/index.ts'), 'kalends/tzdata': join(ROOT, 'src/tzdata/index.ts'), 'kalends/warehouse': join(ROOT, 'src/warehouse/files.ts') };
configureTable({ root: ROOT, sandbox: join(tmpdir(), `kalends-adversarial-surface-${process.pid}`), temporal: Temporal });

const declared = declaredExports(Object.values(FILES));

describe('every export has a row in the adversarial table', () => {
  for (const m of MODULES) {
    const exports = declared.get(FILES[m.name]!)!;
    it(`${m.name}: every export has a row (add one to test/adversarial/table.ts)`, () => {
      const missing = [...exports.keys()].filter((name) => !Object.prototype.hasOwnProperty.call(m.table, name));
      expect(missing.map((name) => `${m.name} exports ${name} (a ${exports.get(name)!.kind}), which has no row in test/adversarial/table.ts`)).toEqual([]);
      expect(Object.keys(m.exports).filter((name) => !Object.prototype.hasOwnProperty.call(m.table, name))).toEqual([]);
    });

    it(`${m.name}: every row names an export of the same kind, with the declared parameters`, () => {
      const faults: string[] = [];
      for (const [name, row] of Object.entries(m.table)) {
        const d = exports.get(name);
        if (!d) {
          faults.push(`${name}: a row for no export of ${m.name}`);
          continue;
        }
        if (row.type !== d.kind) faults.push(`${name}: the row is a ${row.type}, the export a ${d.kind}`);
        if (row.type === 'function' && d.kind === 'function') {
          const names = row.params.map((p) => p.name).join(', ');
          if (names !== d.params.join(', ')) faults.push(`${name}: the row's parameters (${names}) are not the declared ones (${d.params.join(', ')})`);
        }
      }
      expect(faults).toEqual([]);
    });
  }

  // A new subpath of package.json's exports needs a module here; JSON files (the profile schema) are data, not code.
  it('covers every subpath package.json exports', () => {
    const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { exports: Record<string, unknown> };
    const subpaths = Object.keys(pkg.exports).filter((p) => !p.endsWith('.json')).map((p) => (p === '.' ? 'kalends' : `kalends/${p.slice(2)}`));
    expect(MODULES.map((m) => m.name).sort()).toEqual(subpaths.sort());
    expect(Object.keys(FILES).sort()).toEqual(subpaths.sort());
  });

  it('has the size of the surface (about 250 exports)', () => {
    expect(Object.keys(MODULES[0]!.table).length).toBeGreaterThan(240);
  });
});

/**
 * The option keys a call reads: the options parameter is a proxy with no keys that records every key the function
 * looks up (as an own property or by reading it).
 */
function optionKeysRead(f: (...args: unknown[]) => unknown, row: FunctionRow, index: number): Set<string> {
  const read = new Set<string>();
  const args = row.params.map((p) => p.example());
  const base = (args[index] ?? {}) as Record<string, unknown>;
  args[index] = new Proxy(
    { ...base },
    {
      get(target, key, receiver) {
        if (typeof key === 'string') read.add(key);
        return Reflect.get(target, key, receiver);
      },
      has(target, key) {
        if (typeof key === 'string') read.add(key);
        return Reflect.has(target, key);
      },
      getOwnPropertyDescriptor(target, key) {
        if (typeof key === 'string') read.add(key);
        return Reflect.getOwnPropertyDescriptor(target, key);
      },
    },
  );
  try {
    f(...args);
  } catch {
    // the keys read before a refusal still count
  }
  for (const inherited of ['constructor', 'toJSON', 'then', 'length', 'valueOf', 'toString', 'hasOwnProperty', Symbol.toPrimitive.toString()]) read.delete(inherited);
  return read;
}

describe('every option key a function reads has a kind in its row', () => {
  for (const m of MODULES) {
    it(`${m.name}: options rows list the keys the functions read`, () => {
      const faults: string[] = [];
      for (const [name, row] of Object.entries(m.table) as [string, Row][]) {
        if (row.type !== 'function') continue;
        row.params.forEach((p, index) => {
          const keys = (p.kind as { keys?: Readonly<Record<string, unknown>> }).keys;
          if (!keys) return;
          const listed = Object.keys(keys);
          const read = [...optionKeysRead(m.exports[name] as (...args: unknown[]) => unknown, row, index)].filter((k) => !/^\d+$/.test(k));
          const unlisted = read.filter((k) => !listed.includes(k));
          if (unlisted.length > 0) faults.push(`${name}: reads ${p.name}.${unlisted.join(`, ${p.name}.`)}, which the row does not list`);
        });
      }
      expect(faults).toEqual([]);
    });
  }
});

describe('constants and classes', () => {
  it('every exported constant is frozen, deeply enough that a caller cannot change the library through it', () => {
    const faults: string[] = [];
    for (const m of MODULES) {
      for (const [name, row] of Object.entries(m.table)) {
        if (row.type !== 'constant') continue;
        const v = m.exports[name];
        if (typeof v === 'object' && v !== null && !Object.isFrozen(v)) faults.push(`${name} is not frozen`);
        if (typeof v === 'object' && v !== null) {
          for (const [key, inner] of Object.entries(v)) {
            if (typeof inner === 'object' && inner !== null && !ArrayBuffer.isView(inner) && !Object.isFrozen(inner)) faults.push(`${name}.${key} is not frozen`);
          }
        }
      }
    }
    expect(faults).toEqual([]);
  });

  it('every error class extends the built-in class of its row and carries a documented code', () => {
    for (const m of MODULES) {
      for (const [name, row] of Object.entries(m.table)) {
        if (row.type !== 'class') continue;
        const C = m.exports[name] as new (...args: unknown[]) => Error & { code: string };
        const e = new C(...row.example());
        expect(e, name).toBeInstanceOf(row.base);
        expect(e.name, name).toBe(name);
        expect(DOCUMENTED_CODES, name).toContain(e.code);
      }
    }
  });
});
