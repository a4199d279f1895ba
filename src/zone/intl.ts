/**
 * The runtime's Intl as a zone source: id validation and canonicalization (ECMA-402 `resolvedOptions().timeZone`,
 * `Intl.supportedValuesOf('timeZone')`), the formatter the engine samples, and suggestions for unknown ids.
 *
 * @module
 */

/** The formatter options the engine parses: en-US, 24-hour clock, short era, all six wall fields. */
const PROBE_OPTIONS: Intl.DateTimeFormatOptions = {
  hourCycle: 'h23',
  era: 'short',
  year: 'numeric',
  month: 'numeric',
  day: 'numeric',
  hour: 'numeric',
  minute: 'numeric',
  second: 'numeric',
};

/** A formatter for `id`, or undefined when the runtime does not know the id. @internal */
export function probeFormatter(id: string): Intl.DateTimeFormat | undefined {
  try {
    return new Intl.DateTimeFormat('en-US', { ...PROBE_OPTIONS, timeZone: id });
  } catch (e) {
    if (e instanceof RangeError) return undefined;
    throw e;
  }
}

let supported: readonly string[] | undefined;
let lowerMap: Map<string, string> | undefined;

/**
 * The ids the runtime lists (ECMA-402 `Intl.supportedValuesOf('timeZone')`, sorted, canonical ids only), plus
 * "UTC". Empty when the runtime cannot list them.
 * @internal
 */
export function runtimeZoneIds(): readonly string[] {
  if (!supported) {
    const sv = (Intl as { supportedValuesOf?: (key: string) => string[] }).supportedValuesOf;
    let list: string[] = [];
    try {
      list = sv ? sv('timeZone') : [];
    } catch {
      list = [];
    }
    supported = Object.freeze([...new Set([...list, 'UTC'])].sort());
  }
  return supported;
}

/** The listed id equal to `id` ignoring ASCII case, if any. @internal */
export function listedIdIgnoringCase(id: string): string | undefined {
  if (!lowerMap) {
    lowerMap = new Map();
    for (const z of runtimeZoneIds()) lowerMap.set(z.toLowerCase(), z);
  }
  return lowerMap.get(id.toLowerCase());
}

/** Levenshtein distance between two strings, case-insensitive, with an early exit above `limit`. */
function editDistance(a: string, b: string, limit: number): number {
  a = a.toLowerCase();
  b = b.toLowerCase();
  if (Math.abs(a.length - b.length) > limit) return limit + 1;
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    let rowMin = i;
    for (let j = 1; j <= b.length; j++) {
      const v = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + (a[i - 1] === b[j - 1] ? 0 : 1));
      cur.push(v);
      if (v < rowMin) rowMin = v;
    }
    if (rowMin > limit) return limit + 1;
    prev = cur;
  }
  return prev[b.length]!;
}

/**
 * Up to three ids from `candidates` closest to `id` by edit distance (whole id, or the part after the last "/"),
 * within a distance of a third of the id's length (at least 2).
 * @internal
 */
export function suggestZoneIds(id: string, candidates: readonly string[]): string[] {
  const limit = Math.max(2, Math.floor(id.length / 3));
  const tail = id.slice(id.lastIndexOf('/') + 1);
  const scored: { id: string; d: number }[] = [];
  for (const c of candidates) {
    const whole = editDistance(id, c, limit);
    const ctail = c.slice(c.lastIndexOf('/') + 1);
    const partLimit = Math.max(1, Math.floor(tail.length / 3));
    const part = tail.length >= 3 ? editDistance(tail, ctail, partLimit) : partLimit + 1;
    const d = Math.min(whole, part <= partLimit ? part + 0.5 : Infinity);
    if (d <= limit) scored.push({ id: c, d });
  }
  scored.sort((x, y) => x.d - y.d || (x.id < y.id ? -1 : 1));
  const best = scored[0]?.d ?? 0;
  return scored.filter((s) => s.d <= best + 1).slice(0, 3).map((s) => s.id);
}

/** The runtime's tz release when it says (Node's `process.versions.tz`), else undefined. @internal */
export function runtimeTzRelease(): string | undefined {
  const p = (globalThis as { process?: { versions?: { tz?: string } } }).process;
  return p?.versions?.tz;
}
