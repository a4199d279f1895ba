/**
 * Reading the profile text: JSON first (a syntax fault with its line and column), then the library's whole
 * validation, whose faults each carry their dotted path. And finding a path's place in the text, so that a fault
 * can take the cursor to it.
 */
import { DefinitionError, type Profile, defineProfile } from 'kalends';

export interface Fault {
  readonly path: string;
  readonly message: string;
}

export type Reading = { readonly ok: true; readonly profile: Profile } | { readonly ok: false; readonly faults: readonly Fault[] };

/** Line and column (1-based) of character `index` of `text`. */
function lineAndColumn(text: string, index: number): { line: number; column: number } {
  const before = text.slice(0, index);
  const line = before.split('\n').length;
  return { line, column: index - before.lastIndexOf('\n') };
}

/** The profile the text describes, or every fault in it. */
export function readProfileText(text: string): Reading {
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    const at = /position (\d+)/.exec(message);
    const where = at ? lineAndColumn(text, Number(at[1])) : undefined;
    return { ok: false, faults: [{ path: '(JSON text)', message: where && !/line \d+/.test(message) ? `line ${where.line}, column ${where.column}: ${message}` : message }] };
  }
  try {
    return { ok: true, profile: defineProfile(doc as never) };
  } catch (e) {
    if (e instanceof DefinitionError) return { ok: false, faults: e.issues.map((i) => ({ path: i.path, message: i.message })) };
    const path = e instanceof Error && 'path' in e && typeof e.path === 'string' ? e.path : '(profile)';
    return { ok: false, faults: [{ path, message: e instanceof Error ? e.message : String(e) }] };
  }
}

/**
 * Where the value at dotted `path` (`fiscalYears.retail.layout`, `rules.pay.on[0].day`) is written in `text`: the
 * index of its last key that can be found, searching each key after the one before. A rough guide for the
 * cursor, not a JSON parser: undefined when not even the first key is found.
 */
export function placeOfPath(text: string, path: string): number | undefined {
  let from = 0;
  let found: number | undefined;
  for (const key of path.split('.').flatMap((part) => part.split(/\[\d+\]/)).filter(Boolean)) {
    const at = text.indexOf(JSON.stringify(key), from);
    if (at < 0) break;
    found = at;
    from = at + key.length + 2;
  }
  return found;
}
