/**
 * The zone transition table: one row per offset period of each zone over a range of instants, so that an engine
 * turns instants into local days with a range join, without trusting its own zone support.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { requireEpochMs } from '../diagnostics/index.js';
import {
  type Zone,
  type ZoneInput,
  MS_PER_DAY,
  listTransitions,
  nextTransition,
  offsetSecondsFromEpochMs,
  previousTransition,
  toZone,
} from './deps.js';
import type { WarehouseTable } from './table.js';

/** Most rows of one transition table. */
const MAX_TRANSITION_ROWS = 10_000_000;

/** English locales whose short zone names ICU writes as abbreviations (CST, GMT, IST, CET, AEST, NZST, ...). */
const ABBREVIATION_LOCALES = ['en-US', 'en-GB', 'en-AU', 'en-IN', 'en-NZ', 'en-IE', 'en-CA', 'en-ZA'];
const formatters = new Map<string, Intl.DateTimeFormat[]>();
const OFFSET_NAME = /^(?:GMT|UTC)[+−-]/;

/** Instants at which each zone is probed for the locales that name it (winters and summers of four years). */
const PROBES = [1950, 1980, 2000, 2025].flatMap((y) => [Date.UTC(y, 0, 15), Date.UTC(y, 6, 15)]);

function shortName(f: Intl.DateTimeFormat, epochMs: number): string | null {
  const name = f.formatToParts(epochMs).find((part) => part.type === 'timeZoneName')?.value;
  return name !== undefined && !OFFSET_NAME.test(name) ? name : null;
}

/**
 * The formatters of the locales that name `zone` with an abbreviation at one of the probe instants (most zones
 * have none, and then no row asks Intl at all).
 */
function formattersOf(zone: Zone): Intl.DateTimeFormat[] {
  let list = formatters.get(zone.canonicalId);
  if (!list) {
    let all: Intl.DateTimeFormat[];
    try {
      all = ABBREVIATION_LOCALES.map((l) => new Intl.DateTimeFormat(l, { timeZone: zone.canonicalId, timeZoneName: 'short' }));
    } catch {
      all = []; // a zone from pinned data or TZif that the runtime's Intl does not know: no names to ask for
    }
    list = all.filter((f) => PROBES.some((t) => shortName(f, t) !== null));
    if (formatters.size >= 1024) formatters.clear();
    formatters.set(zone.canonicalId, list);
  }
  return list;
}

/**
 * @internal The runtime's (ICU's) English abbreviation of a zone at an instant, or null where it has none (it then
 * writes an offset such as "GMT+5:30"). "UTC" and "GMT" are kept as they are.
 */
export function abbreviationAt(zone: Zone, epochMs: number): string | null {
  if (zone.fixedOffsetSeconds !== undefined && zone.id !== 'UTC') return null;
  for (const f of formattersOf(zone)) {
    const name = shortName(f, epochMs);
    if (name !== null) return name;
  }
  return null;
}

/** A year and a day: the longest offset period still counted as daylight saving time. */
const MAX_DST_PERIOD_MS = 366 * MS_PER_DAY;

/**
 * The offset periods of each zone within [startEpochMs, endEpochMs): columns `zone` (the id as given),
 * `from_epoch_ms` (inclusive) and `to_epoch_ms` (exclusive), clipped to the range so that a zone's rows cover it
 * exactly once; `offset_seconds` (east of UTC); `is_dst`; `abbreviation`.
 *
 * `is_dst` is ours, since the zone layer keeps offsets only: a period is daylight saving time when its offset is
 * above the offsets of the periods before and after it and it lasts at most a year and a day (a summer between
 * two winters). A lasting change of standard offset is not DST. The tz database's own flag differs for zones
 * whose data states a negative saving (Europe/Dublin's winter) and for double summer time; docs/warehouse.md
 * lists the differences the tests found. `abbreviation` is the runtime's English short name where it has one
 * (CST, CDT, GMT, IST, CET), else null.
 *
 * @example
 * ```ts
 * const t = transitionTableFromZones(['America/Chicago'], Date.UTC(2025, 0, 1), Date.UTC(2026, 0, 1));
 * t.rowCount; // 3: CST, CDT from 2025-03-09T08:00Z, CST from 2025-11-02T07:00Z
 * ```
 */
export function transitionTableFromZones(zones: readonly ZoneInput[], startEpochMs: number, endEpochMs: number): WarehouseTable {
  if (!Array.isArray(zones) || zones.length === 0) {
    throw new KalendsTypeError(`zones: expected a non-empty array of zones or zone ids, got ${describeValue(zones)}`, { code: 'invalid-type', received: zones });
  }
  // The columns hold whole milliseconds (int64): an instant is that of its millisecond, Math.floor(t), as in
  // listTransitions (docs/design.md, "Input rules").
  startEpochMs = Math.floor(requireEpochMs('startEpochMs', startEpochMs));
  endEpochMs = Math.floor(requireEpochMs('endEpochMs', endEpochMs));
  if (!(endEpochMs > startEpochMs)) {
    throw new KalendsRangeError(`endEpochMs: expected an instant after startEpochMs (${startEpochMs}), got ${endEpochMs}`, { code: 'out-of-range', received: endEpochMs });
  }
  // A loop, not map: map skips the holes of a sparse array, and a hole is refused like any other non-zone.
  const compiled: Zone[] = [];
  for (let i = 0; i < zones.length; i++) compiled.push(toZone(zones[i]!, `zones[${i}]`));
  const zoneCol: string[] = [];
  const from: number[] = [];
  const to: number[] = [];
  const offset: number[] = [];
  const dst: number[] = [];
  const abbr: (string | null)[] = [];
  for (const zone of compiled) {
    // A change exactly at the start begins the first row; `before` finds it.
    const changes = listTransitions(zone, startEpochMs, endEpochMs, { limit: MAX_TRANSITION_ROWS }).filter((c) => c.epochMs > startEpochMs);
    const before = previousTransition(zone, startEpochMs + 1);
    const after = nextTransition(zone, endEpochMs - 1);
    const k = changes.length + 1;
    const bounds: number[] = [before?.epochMs ?? Number.NEGATIVE_INFINITY, ...changes.map((c) => c.epochMs), after?.epochMs ?? Number.POSITIVE_INFINITY];
    const offsets: number[] = [
      before?.offsetBeforeSeconds ?? Number.NaN,
      offsetSecondsFromEpochMs(zone, startEpochMs),
      ...changes.map((c) => c.offsetAfterSeconds),
      after?.offsetAfterSeconds ?? Number.NaN,
    ];
    for (let r = 0; r < k; r++) {
      const lo = r === 0 ? startEpochMs : bounds[r]!;
      const hi = r === k - 1 ? endEpochMs : bounds[r + 1]!;
      const own = offsets[r + 1]!;
      const realLength = bounds[r + 1]! - bounds[r]!;
      const isDst = own > offsets[r]! && own > offsets[r + 2]! && realLength <= MAX_DST_PERIOD_MS;
      zoneCol.push(zone.id);
      from.push(lo);
      to.push(hi);
      offset.push(own);
      dst.push(isDst ? 1 : 0);
      abbr.push(abbreviationAt(zone, lo + Math.floor((hi - lo) / 2)));
    }
    if (from.length > MAX_TRANSITION_ROWS) {
      throw new KalendsRangeError(`zones: the table would hold more than ${MAX_TRANSITION_ROWS} rows; export fewer zones or a narrower range`, { code: 'limit-exceeded', received: zones.length });
    }
  }
  return Object.freeze({
    name: 'zone_offset_period',
    rowCount: from.length,
    description: 'one row per offset period of a zone: [from_epoch_ms, to_epoch_ms)',
    columns: Object.freeze([
      { name: 'zone', type: 'string' as const, values: zoneCol, description: 'the zone id' },
      { name: 'from_epoch_ms', type: 'int64' as const, values: Float64Array.from(from), description: 'first instant of the period (epoch milliseconds), inclusive' },
      { name: 'to_epoch_ms', type: 'int64' as const, values: Float64Array.from(to), description: 'end of the period (epoch milliseconds), exclusive' },
      { name: 'offset_seconds', type: 'int32' as const, values: Int32Array.from(offset), description: 'UTC offset, seconds east of UTC' },
      { name: 'is_dst', type: 'boolean' as const, values: Uint8Array.from(dst), description: 'daylight saving time (see docs/warehouse.md)' },
      { name: 'abbreviation', type: 'string' as const, values: abbr, description: "the runtime's English abbreviation, where it has one" },
    ]),
  });
}
