/**
 * Runs the table's entry points against hostile values and reports every broken invariant (check.ts). Three passes:
 *
 * - `valid`: each row's valid example must return a value of its shape that meets its check (a row that cannot run
 *   its own example would make every other pass meaningless);
 * - `sweep` (issue 13's sweep): every parameter with every value of the hostile catalogue and of its kind's edges,
 *   every option key likewise, and every field of a definition;
 * - `fuzz`: fast-check, seeded, with generated hostile values for one parameter (or option key, or definition field)
 *   at a time while the others take generated valid values.
 *
 * The runner reports each call to a `Monitor` before it starts and after it ends: the worker's watchdog (pool.ts) and
 * the benchmark (bench/adversarial.ts) are monitors.
 */
import fc from 'fast-check';
import { EITHER, hostileArbitrary, hostileValues, type Expectation, type Kind } from './kinds.js';
import { errorFault, outcomeOf, rejectFault, related, sameFault, shiftedFault, showError, showResult, type Outcome } from './check.js';
import { CATALOGUE, PROTOTYPE_NAMES, show, type Hostile } from './hostile.js';
import type { FunctionRow } from './table.js';

export interface Fault {
  readonly entry: string;
  readonly call: string;
  readonly fault: string;
}

/** Told of every call: `begin` before it runs (with a description), `end` after (with its time and outcome). */
export interface Monitor {
  begin(description: () => string): void;
  end(ms: number, outcome: Outcome, expectation: Expectation): void;
}

const NO_MONITOR: Monitor = { begin: () => {}, end: () => {} };

export interface Entry {
  readonly name: string;
  readonly f: (...args: unknown[]) => unknown;
  readonly row: FunctionRow;
}

const now = (): number => performance.now();

function timed(f: () => unknown, monitor: Monitor, describe: () => string, expectation: Expectation): Outcome {
  monitor.begin(describe);
  const t0 = now();
  const o = outcomeOf(f);
  monitor.end(now() - t0, o, expectation);
  return o;
}

function validArgs(row: FunctionRow): unknown[] {
  return row.params.map((p) => p.example());
}

function namesOf(row: FunctionRow): string[] {
  return [...row.params.map((p) => p.name), ...row.params.flatMap((p) => (p.label ? [p.label] : [])), 'options', ...(row.names ?? [])];
}

function showArgs(args: readonly unknown[]): string {
  return args.map(show).join(', ');
}

/** The value at a path such as `.limit` or `[3]` inside `value`. */
function valueAt(value: unknown, at: string | undefined): unknown {
  if (!at) return value;
  let v = value;
  for (const m of at.matchAll(/\.([^.[]+)|\[(\d+)\]/g)) {
    if (typeof v !== 'object' || v === null) return undefined;
    v = (v as Record<string, unknown>)[m[1] ?? Number(m[2])];
  }
  return v;
}

/** The faults of a result of a successful call: its shape and the row's check. */
function resultFaults(row: FunctionRow, value: unknown, args: readonly unknown[]): string | undefined {
  if (!row.returns.test(value)) return `returned ${showResult(value)}, which is not ${row.returns.what}`;
  if (row.check) {
    try {
      return row.check(value, args);
    } catch (e) {
      return `returned ${showResult(value)}, and checking it threw ${showError(e)}`;
    }
  }
  return undefined;
}

/**
 * One call with `value` in parameter `index` (others from `args`), judged by `expectation`. Returns the fault, or
 * undefined.
 */
export function attack(entry: Entry, args: readonly unknown[], index: number, value: unknown, expectation: Expectation, label: string, monitor: Monitor, baseline = false): string | undefined {
  const { row, f } = entry;
  if (baseline && expectation.kind === 'reject') {
    // The fuzz varies the other parameters too: when they are refused with the valid example in this place (a
    // combination such as a date outside a calendar's years), the call may name them, so only the error's form
    // is checked.
    const example = [...args];
    example[index] = row.params[index]!.example();
    trimTrailingUndefined(example, row);
    const base = timed(() => f(...example), monitor, () => `${entry.name}(${showArgs(example)}) [the valid example in place of ${label}]`, EITHER);
    if (!base.ok) expectation = { kind: 'either' };
  }
  const given = [...args];
  given[index] = value;
  trimTrailingUndefined(given, row);
  const describe = () => `${entry.name}(${showArgs(given)}) [${row.params[index]?.name ?? '?'} = ${label}]`;
  const o = timed(() => f(...given), monitor, describe, expectation);
  const name = row.params[index]?.label ?? row.params[index]?.name ?? '';
  const x = expectation;
  let fault: string | undefined;
  if (x.kind === 'reject') {
    fault = rejectFault(o, x, name, valueAt(value, x.at), !x.noQuote && valueAt(value, x.at) !== undefined);
  } else if (x.kind === 'either') {
    fault = o.ok ? resultFaults(row, o.value, given) : errorFault(o.error, namesOf(row));
  } else {
    const other = [...args];
    other[index] = x.as;
    trimTrailingUndefined(other, row);
    const reference = timed(() => f(...other), monitor, () => `${entry.name}(${showArgs(other)}) [the equivalent of ${label}]`, EITHER);
    const probe = row.probe ?? ((v: unknown) => v);
    fault = x.kind === 'same' ? sameFault(o, reference, x.why, probe) : shiftedFault(o, reference, x.delta, x.deltas, x.why, probe);
    if (!fault) fault = o.ok ? resultFaults(row, o.value, given) : errorFault(o.error, namesOf(row));
  }
  return fault ? `${describe()}: ${fault}` : undefined;
}

/** Leaves trailing undefined arguments out, so that `f.length`-sensitive code sees the call a user would write. */
function trimTrailingUndefined(args: unknown[], row: FunctionRow): void {
  while (args.length > 0 && args[args.length - 1] === undefined && row.params[args.length - 1]?.kind.optional) args.pop();
}

// ---------------------------------------------------------------------------------------------------------
// Definitions: mutations of a valid definition's fields

interface Mutation {
  readonly label: string;
  readonly path: string;
  readonly make: () => unknown;
  readonly expectation: Expectation;
}

/** Paths of free text, where any string (a prototype name too) is fine. */
const FREE_TEXT = /(^|\.)(id|name|label|source|caution|description|locale|\$schema)$|^labels\./;
/** Objects whose keys are names chosen by the user (a new key is a new entry, not an unknown field). */
const DICTIONARIES = /(^|\.)(units|calendars|rules|fiscalYears|cutoffs|hours)$|^labels\.units$/;

function isJsonValue(v: unknown): boolean {
  if (v === null || typeof v === 'string' || typeof v === 'boolean') return true;
  if (typeof v === 'number') return Number.isFinite(v);
  if (Array.isArray(v)) return true;
  if (typeof v === 'object') return Object.getPrototypeOf(v) === Object.prototype || Object.getPrototypeOf(v) === null;
  return false;
}

/** Every leaf and object path of a plain definition. */
function pathsOf(def: unknown, path = '', out: { path: string; value: unknown }[] = []): { path: string; value: unknown }[] {
  if (typeof def !== 'object' || def === null) return out;
  if (Array.isArray(def)) {
    def.forEach((v, i) => {
      const p = `${path}[${i}]`;
      out.push({ path: p, value: v });
      pathsOf(v, p, out);
    });
    return out;
  }
  for (const [key, v] of Object.entries(def)) {
    const p = path === '' ? key : `${path}.${key}`;
    out.push({ path: p, value: v });
    pathsOf(v, p, out);
  }
  return out;
}

/** A deep copy of a definition with `path` set to `value` (or deleted when `remove`). */
function withPath(def: unknown, path: string, value: unknown, remove = false): unknown {
  const copy = structuredClone(def) as Record<string, unknown>;
  const parts = [...path.matchAll(/([^.[\]]+)|\[(\d+)\]/g)].map((m) => (m[2] !== undefined ? Number(m[2]) : m[1]!));
  let node: Record<string | number, unknown> = copy;
  for (const p of parts.slice(0, -1)) node = node[p] as Record<string | number, unknown>;
  const last = parts.at(-1)!;
  if (remove) {
    if (Array.isArray(node)) node.splice(last as number, 1);
    else delete node[last];
  } else if (last === '__proto__') {
    Object.defineProperty(node, '__proto__', { value, enumerable: true, configurable: true, writable: true });
  } else node[last] = value;
  return copy;
}

/** What a definition with `hostile` at `path` (whose valid value was `was`) must give. */
function mutationExpectation(path: string, was: unknown, hostile: unknown, json: boolean): Expectation {
  const at = path;
  const rejectAt = (why: string): Expectation => ({ kind: 'reject', classes: ['definition'], codes: ['invalid-definition'], why, at });
  if (hostile === undefined) return EITHER;
  if (json && !isJsonValue(hostile)) return rejectAt('a definition is JSON: no NaN, Infinity, Date, function, Map or typed array');
  if (typeof hostile === 'string' && typeof was === 'string' && (PROTOTYPE_NAMES as readonly string[]).includes(hostile) && !FREE_TEXT.test(path)) {
    return rejectAt('an Object.prototype name is no name of ours');
  }
  return EITHER;
}

/** The mutations of a definition: each field replaced by each hostile value, removed, and unknown keys added. */
function mutationsOf(def: unknown, values: readonly Hostile[], json: boolean): Mutation[] {
  const list: Mutation[] = [];
  const paths = pathsOf(def);
  for (const { path, value: was } of paths) {
    for (const h of values) {
      list.push({ label: `${path} = ${h.label}`, path, make: () => withPath(def, path, h.make()), expectation: mutationExpectation(path, was, h.make(), json) });
    }
    list.push({ label: `${path} removed`, path, make: () => withPath(def, path, undefined, true), expectation: EITHER });
  }
  const objects = [{ path: '', value: def }, ...paths].filter((p) => typeof p.value === 'object' && p.value !== null && !Array.isArray(p.value));
  for (const { path, value } of objects) {
    for (const key of ['notAField', ...PROTOTYPE_NAMES]) {
      if (Object.prototype.hasOwnProperty.call(value, key)) continue;
      const at = path === '' ? key : `${path}.${key}`;
      const dictionary = DICTIONARIES.test(path);
      list.push({
        label: `unknown field ${at}`,
        path: at,
        make: () => withPath(def, at, 1),
        expectation: dictionary ? EITHER : { kind: 'reject', classes: ['definition'], codes: ['invalid-definition'], why: 'an unknown field is reported at its path', at },
      });
    }
  }
  return list;
}

/** The values a definition's fields are replaced with in the sweep (a selection of the catalogue). */
const FIELD_VALUES: readonly Hostile[] = CATALOGUE.filter((h) =>
  ['NaN', 'Infinity', '-0', '1.5', '1e300', '-1e300', '""', '"1"', '"constructor"', '"toString"', '"__proto__"', '"valueOf"', '"hasOwnProperty"', 'null', 'true', 'new Date(0)', '{}', '[]', '[1, <hole>, 3]', 'a function', 'new Float32Array(3)', '1n', 'a 10,000-character string'].includes(h.label),
);

function mutationFault(entry: Entry, args: readonly unknown[], m: Mutation, monitor: Monitor): string | undefined {
  const index = entry.row.mutates!;
  const x = m.expectation;
  const given = [...args];
  given[index] = m.make();
  const describe = () => `${entry.name}(${showArgs(given)}) [${m.label}]`;
  const o = timed(() => entry.f(...given), monitor, describe, x);
  let fault: string | undefined;
  if (x.kind === 'reject') {
    if (o.ok) fault = `returned ${showResult(o.value)}; expected a DefinitionError at ${m.path} (${x.why})`;
    else {
      fault = rejectFault(o, x, entry.row.params[index]!.name, undefined, false);
      if (!fault) {
        const issues = (o.error as { issues?: readonly { path: string }[] }).issues ?? [];
        if (!issues.some((i) => related(i.path, m.path))) fault = `threw ${showError(o.error)}; no issue is at or around ${m.path}`;
      }
    }
  } else fault = o.ok ? resultFaults(entry.row, o.value, given) : errorFault(o.error, namesOf(entry.row));
  return fault ? `${describe()}: ${fault}` : undefined;
}

// ---------------------------------------------------------------------------------------------------------
// The passes

/** The valid example of a row: it must work. */
export function runValid(entry: Entry, monitor: Monitor = NO_MONITOR): Fault[] {
  const args = validArgs(entry.row);
  const call = `${entry.name}(${showArgs(args)})`;
  const o = timed(() => entry.f(...args), monitor, () => call, EITHER);
  if (!o.ok) return [{ entry: entry.name, call, fault: `the valid example threw ${showError(o.error)}` }];
  const fault = resultFaults(entry.row, o.value, args);
  return fault ? [{ entry: entry.name, call, fault: `the valid example ${fault}` }] : [];
}

/** The values the sweep gives one parameter: the catalogue and the kind's edges, and per option key the same. */
export function sweepValues(kind: Kind, example: unknown): { label: string; make: () => unknown }[] {
  const values = hostileValues(kind).map((h) => ({ label: h.label, make: h.make }));
  const keys = (kind as Kind & { keys?: Readonly<Record<string, Kind>> }).keys;
  if (keys) {
    for (const [key, keyKind] of Object.entries(keys)) {
      for (const h of hostileValues(keyKind)) {
        values.push({ label: `options.${key} = ${h.label}`, make: () => ({ ...((typeof example === 'object' && example) || {}), [key]: h.make() }) });
      }
    }
  }
  return values;
}

/** Issue 13's sweep: every parameter, every hostile value of the catalogue and of its kind; definition fields. */
export function runSweep(entry: Entry, monitor: Monitor = NO_MONITOR, limit = 50): Fault[] {
  const faults: Fault[] = [];
  const args = validArgs(entry.row);
  const push = (fault: string | undefined) => {
    if (fault && faults.length < limit) faults.push({ entry: entry.name, call: '', fault });
  };
  entry.row.params.forEach((p, index) => {
    const sandboxed = entry.row.sandboxed?.includes(index);
    for (const h of sweepValues(p.kind, args[index])) {
      const value = h.make();
      if (sandboxed && typeof value === 'string') continue;
      push(attack(entry, args, index, value, p.kind.expect(value, args), h.label, monitor));
    }
  });
  if (entry.row.mutates !== undefined) {
    for (const m of mutationsOf(args[entry.row.mutates], FIELD_VALUES, !entry.row.notJson)) push(mutationFault(entry, args, m, monitor));
  }
  return faults;
}

/** The fuzz: `runs` generated calls, seeded; stops at the first fault (shrunk by fast-check). */
export function runFuzz(entry: Entry, seed: number, runs: number, monitor: Monitor = NO_MONITOR): Fault[] {
  const { row } = entry;
  const n = row.params.length;
  const base = validArgs(row);
  const mutable = row.mutates !== undefined ? mutationsOf(base[row.mutates], CATALOGUE, !row.notJson) : [];
  type Case = { kind: 'param'; index: number; value: unknown; others: unknown[] } | { kind: 'mutation'; m: number; others: unknown[] };
  const others = fc.tuple(...row.params.map((p, i) => fc.oneof({ weight: 3, arbitrary: fc.constant(null).map(() => base[i]) }, { weight: 1, arbitrary: p.kind.valid() })));
  const arbitraries: fc.Arbitrary<Case>[] = [];
  if (n > 0) {
    arbitraries.push(
      fc.integer({ min: 0, max: n - 1 }).chain((index) =>
        fc.record({
          kind: fc.constant('param' as const),
          index: fc.constant(index),
          value: row.sandboxed?.includes(index) ? row.params[index]!.kind.fuzz?.() ?? fc.constant(undefined) : hostileArbitrary(row.params[index]!.kind),
          others,
        }),
      ),
    );
  }
  if (mutable.length > 0) arbitraries.push(fc.record({ kind: fc.constant('mutation' as const), m: fc.integer({ min: 0, max: mutable.length - 1 }), others }));
  if (arbitraries.length === 0) return [];
  const judge = (c: Case): string | undefined =>
    c.kind === 'param'
      ? attack(entry, c.others, c.index, c.value, row.params[c.index]!.kind.expect(c.value, c.others), show(c.value), monitor, true)
      : mutationFault(entry, c.others, mutable[c.m]!, monitor);
  const property = fc.property(fc.oneof(...arbitraries), (c) => judge(c) === undefined);
  const result = fc.check(property, { seed, numRuns: runs });
  if (!result.failed) return [];
  const shrunk = result.counterexample?.[0];
  const fault = shrunk ? judge(shrunk) : undefined;
  return [{ entry: entry.name, call: '', fault: `${fault ?? showError(result.errorInstance)} (fast-check seed ${seed}, path "${result.counterexamplePath ?? ''}", after ${result.numRuns} runs)` }];
}
