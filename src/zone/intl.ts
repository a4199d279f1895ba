/**
 * The runtime's Intl as a zone source: id validation and canonicalization (ECMA-402 `resolvedOptions().timeZone`,
 * `Intl.supportedValuesOf('timeZone')`), the formatter the engine samples, and suggestions for unknown ids.
 *
 * @module
 */
import { MAX_SUGGEST_INPUT, editDistance } from '../diagnostics/index.js';

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

/**
 * Up to three ids from `candidates` closest to `id` by edit distance, ignoring case (the kit's distance), ranked
 * for zones: the whole id, or the part after the last "/" (the city) at half a step more, within a distance of a
 * third of the id's length (at least 2). Ids longer than the kit's MAX_SUGGEST_INPUT get no suggestion, so the
 * work per bad id is bounded.
 * @internal
 */
export function suggestZoneIds(input: string, candidates: readonly string[]): string[] {
  if (input.length > MAX_SUGGEST_INPUT) return [];
  const id = input.toLowerCase();
  const limit = Math.max(2, Math.floor(id.length / 3));
  const tail = id.slice(id.lastIndexOf('/') + 1);
  const scored: { id: string; d: number }[] = [];
  for (const original of candidates) {
    const c = original.toLowerCase();
    const whole = editDistance(id, c, limit);
    const ctail = c.slice(c.lastIndexOf('/') + 1);
    const partLimit = Math.max(1, Math.floor(tail.length / 3));
    const part = tail.length >= 3 ? editDistance(tail, ctail, partLimit) : partLimit + 1;
    const d = Math.min(whole, part <= partLimit ? part + 0.5 : Infinity);
    if (d <= limit) scored.push({ id: original, d });
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
