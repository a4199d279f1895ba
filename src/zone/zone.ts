/**
 * Zones: construction from an IANA id (through the runtime's Intl or a pinned rules source), from TZif bytes,
 * from plain rules data, or from a fixed offset; and the bounded cache that resolves `ZoneInput` strings.
 *
 * @module
 */
import { MAX_OFFSET_SECONDS, ZONE_CACHE_LIMIT } from '../bounds.js';
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { Issues, checkKeys, isRecord, optionOf, readOptions } from '../diagnostics/index.js';
import { formatOffsetUnchecked } from '../instant/format.js';
import { parseOffsetText } from '../instant/text.js';
import { Engine, FixedEngine, IntlEngine, TableEngine } from './engine.js';
import { UnknownZoneError } from './errors.js';
import { listedIdIgnoringCase, probeFormatter, runtimeTzRelease, runtimeZoneIds, suggestZoneIds } from './intl.js';
import { type PosixTz, parsePosixTz } from './posix.js';
import { parseTzif } from './tzif.js';

/** Where a zone's rules come from. */
export type ZoneSource = 'intl' | 'tzif' | 'rules' | 'fixed';

/**
 * A compiled zone: immutable to its users (frozen). Its rules table is filled lazily, a year at a time, as
 * queries need it. Make one with {@link zoneFromId}, {@link zoneFromOffset}, {@link zoneFromTzif} or
 * {@link zoneFromRules}; every function that takes a zone also takes its id as a string ({@link ZoneInput}).
 */
export interface Zone {
  /** The id as asked for, case-normalized where the runtime lists it ("America/New_York", "+05:30", "UTC"). */
  readonly id: string;
  /** The runtime's canonical id (ECMA-402 `resolvedOptions().timeZone`); links resolve to it. Equal to `id` for
   * fixed offsets and rules data. */
  readonly canonicalId: string;
  /** Where the rules come from. */
  readonly source: ZoneSource;
  /** The tz database release of the rules, when known (Node's `process.versions.tz` for Intl; pinned data). */
  readonly tzRelease: string | undefined;
  /** The offset of a fixed-offset zone (UTC included), else undefined. */
  readonly fixedOffsetSeconds: number | undefined;
}

/** A zone, or a string that names one: an IANA id ("Europe/Dublin"), "UTC", or a fixed offset ("+05:30"). */
export type ZoneInput = Zone | string;

/**
 * Rules of one zone as plain data: the offset before the first transition, the transitions (POSIX seconds,
 * ascending) with the offset from each, and an optional tail rule (a POSIX TZ string, RFC 8536 section 3.3) for
 * instants after the last transition. The pinned module `kalends/tzdata` produces these.
 */
export interface ZoneRulesData {
  /** The zone's id. */
  readonly id: string;
  /** The tz database release the rules come from, when known (such as `"2025b"`). */
  readonly tzRelease?: string | undefined;
  /** The offset (seconds east of UTC) before the first transition. */
  readonly initialOffsetSeconds: number;
  /** The instants of the transitions, in seconds since the epoch, ascending. */
  readonly transitionsSeconds: ArrayLike<number>;
  /** The offset (seconds east of UTC) from each transition on; as long as `transitionsSeconds`. */
  readonly offsetsSeconds: ArrayLike<number>;
  /** A POSIX TZ string (RFC 8536 section 3.3) for the instants after the last transition. */
  readonly tailRule?: string | undefined;
}

/**
 * A set of rules by id, such as the pinned tz data of `kalends/tzdata` (`PINNED_TZDATA`). The source brings the
 * function that compiles its rules ({@link zoneFromRules}), so that a program that reads zones only from the
 * runtime's Intl does not bundle the rules compiler and the POSIX TZ reader.
 */
export interface ZoneRulesSource {
  /** The tz database release of the data, e.g. "2025b". */
  readonly tzRelease: string;
  /** Every id the source knows, links included. */
  readonly ids: readonly string[];
  /** The rules of `id` (exact spelling), or undefined. */
  rulesOf(id: string): ZoneRulesData | undefined;
  /** The compiler of the rules: {@link zoneFromRules} as imported from `kalends`. */
  readonly zoneFromRules: (data: ZoneRulesData) => Zone;
}

/** Options of {@link zoneFromId}. */
export interface ZoneFromIdOptions {
  /** Read rules from this source instead of the runtime's Intl (e.g. `PINNED_TZDATA` from `kalends/tzdata`). */
  readonly source?: ZoneRulesSource;
}

const ENGINE: unique symbol = Symbol('kalends.zone.engine');
type ZoneWithEngine = Zone & { readonly [ENGINE]: Engine };

function makeZone(fields: Zone, engine: Engine): Zone {
  const z = { ...fields };
  Object.defineProperty(z, ENGINE, { value: engine, enumerable: false });
  return Object.freeze(z);
}

/** @internal The engine of a zone. */
export function engineOf(zone: Zone): Engine {
  return (zone as ZoneWithEngine)[ENGINE];
}

/**
 * Whether `value` is a zone made by this library.
 *
 * @example
 * ```ts
 * isZone(zoneFromId('Asia/Kolkata')); // true
 * isZone('Asia/Kolkata');             // false (a name, not a zone)
 * ```
 */
export function isZone(value: unknown): value is Zone {
  return typeof value === 'object' && value !== null && ENGINE in value;
}

/** The UTC zone: offset 0 at every instant. */
export const UTC_ZONE: Zone = makeZone(
  { id: 'UTC', canonicalId: 'UTC', source: 'fixed', tzRelease: undefined, fixedOffsetSeconds: 0 },
  new FixedEngine(0),
);

// ---------------------------------------------------------------------------------------------------------
// Fixed offsets

/** Whether an id is written as an offset (a sign first; U+2212 too, so that its message says what to write). */
function looksLikeOffset(id: string): boolean {
  const c = id.charCodeAt(0);
  return c === 43 || c === 45 || c === 0x2212;
}

/**
 * A fixed-offset zone from an offset string (±HH, ±HH:MM, ±HHMM, ±HH:MM:SS, the ISO 8601-1:2019 basic and
 * extended forms, read by the instant layer; the sign is the ASCII "+" or "-", U+2212 is refused as in RFC 3339)
 * or a number of seconds east of UTC (an integer within ±86,399). Its id is the offset written ±HH:MM[:SS].
 *
 * @example
 * ```ts
 * zoneFromOffset('+05:30').id; // '+05:30'
 * zoneFromOffset(-18000).id;   // '-05:00'
 * ```
 */
export function zoneFromOffset(offset: string | number): Zone {
  return offsetZone(offset, 'offset');
}

/** {@link zoneFromOffset}, with the name of the parameter that held the offset (for messages). */
function offsetZone(offset: unknown, name: string): Zone {
  let seconds: number;
  if (typeof offset === 'number') {
    if (!Number.isInteger(offset) || Math.abs(offset) > MAX_OFFSET_SECONDS) {
      throw new KalendsRangeError(
        `${name}: expected an integer number of seconds from -${MAX_OFFSET_SECONDS} to ${MAX_OFFSET_SECONDS}, got ${describeValue(offset)}`,
        { code: 'out-of-range', received: offset },
      );
    }
    seconds = offset;
  } else if (typeof offset === 'string') {
    seconds = parseOffsetText(name, offset);
  } else {
    throw new KalendsTypeError(`${name}: expected a string like "+05:30" or a number of seconds, got ${describeValue(offset)}`, {
      code: 'invalid-type',
      received: offset,
    });
  }
  const id = formatOffsetUnchecked(seconds === 0 ? 0 : seconds);
  return makeZone({ id, canonicalId: id, source: 'fixed', tzRelease: undefined, fixedOffsetSeconds: seconds }, new FixedEngine(seconds));
}

// ---------------------------------------------------------------------------------------------------------
// Rules data and TZif

/**
 * A zone from plain rules data (see {@link ZoneRulesData}). Every fault is reported at once in a DefinitionError
 * with the path of each field.
 *
 * @example
 * ```ts
 * const z = zoneFromRules({ id: 'Example/Fixed', initialOffsetSeconds: 3600, transitionsSeconds: [], offsetsSeconds: [] });
 * offsetSecondsFromEpochMs(z, 0); // 3600
 * ```
 */
export function zoneFromRules(data: ZoneRulesData): Zone {
  if (!isRecord(data)) {
    throw new KalendsTypeError(`data: expected a ZoneRulesData object, got ${describeValue(data)}`, { code: 'invalid-type', received: data });
  }
  const issues = new Issues();
  checkKeys(data, ['id', 'tzRelease', 'initialOffsetSeconds', 'transitionsSeconds', 'offsetsSeconds', 'tailRule'], '', issues);
  const off = (path: string, v: unknown): void => {
    if (typeof v !== 'number' || !Number.isInteger(v) || Math.abs(v) > MAX_OFFSET_SECONDS) {
      issues.add(path, `expected an integer offset in seconds within ±${MAX_OFFSET_SECONDS}, got ${describeValue(v)}`);
    }
  };
  if (typeof data.id !== 'string' || data.id === '') issues.add('id', `expected a non-empty string, got ${describeValue(data.id)}`);
  off('initialOffsetSeconds', data.initialOffsetSeconds);
  const ts = data.transitionsSeconds;
  const os = data.offsetsSeconds;
  const isList = (v: unknown): v is ArrayLike<number> => typeof v === 'object' && v !== null && typeof (v as { length?: unknown }).length === 'number';
  if (!isList(ts)) issues.add('transitionsSeconds', `expected an array of numbers, got ${describeValue(ts)}`);
  if (!isList(os)) issues.add('offsetsSeconds', `expected an array of numbers, got ${describeValue(os)}`);
  if (isList(ts) && isList(os)) {
    if (ts.length !== os.length) issues.add('offsetsSeconds', `expected ${ts.length} offsets (one per transition), got ${os.length}`);
    for (let i = 0; i < ts.length && issues.count < 20; i++) {
      const t = ts[i];
      if (typeof t !== 'number' || !Number.isInteger(t)) issues.add(`transitionsSeconds[${i}]`, `expected an integer, got ${describeValue(t)}`);
      else if (i > 0 && !(t > (ts[i - 1] as number))) issues.add(`transitionsSeconds[${i}]`, `expected times in ascending order, got ${t} after ${ts[i - 1]}`);
      if (i < os.length) off(`offsetsSeconds[${i}]`, os[i]);
    }
  }
  let rule: PosixTz | undefined;
  if (data.tailRule !== undefined && data.tailRule !== '') {
    if (typeof data.tailRule !== 'string') issues.add('tailRule', `expected a POSIX TZ string, got ${describeValue(data.tailRule)}`);
    else {
      try {
        rule = parsePosixTz(data.tailRule);
      } catch (e) {
        issues.add('tailRule', (e as Error).message);
      }
    }
  }
  if (data.tzRelease !== undefined && typeof data.tzRelease !== 'string') issues.add('tzRelease', `expected a string, got ${describeValue(data.tzRelease)}`);
  issues.throwIfAny(data);
  return rulesZone(data.id, 'rules', data.tzRelease, data.initialOffsetSeconds, ts, os, rule);
}

function rulesZone(
  id: string,
  source: ZoneSource,
  tzRelease: string | undefined,
  initial: number,
  transitionsSeconds: ArrayLike<number>,
  offsets: ArrayLike<number>,
  rule: PosixTz | undefined,
): Zone {
  // Times outside the ECMAScript range: earlier ones set the initial offset, later ones are dropped.
  const ms: number[] = [];
  const os: number[] = [];
  let init = initial;
  for (let i = 0; i < transitionsSeconds.length; i++) {
    const t = transitionsSeconds[i]! * 1000;
    if (t < -8.64e15) init = offsets[i]!;
    else if (t <= 8.64e15) {
      ms.push(t);
      os.push(offsets[i]!);
    }
  }
  const engine = new TableEngine(init, ms, os, rule);
  return makeZone({ id, canonicalId: id, source, tzRelease, fixedOffsetSeconds: undefined }, engine);
}

/**
 * A zone from TZif bytes (RFC 8536 / RFC 9636, versions 1 to 4): the file's transitions and, for version 2 and
 * later, its footer rule for instants past the table. Corrupt or truncated bytes give a CorruptTzifError
 * (code 'corrupt-tzif') with the byte position.
 *
 * @example
 * ```ts
 * const ny = zoneFromTzif(readFileSync('/usr/share/zoneinfo/America/New_York'), 'America/New_York');
 * offsetSecondsFromEpochMs(ny, Date.UTC(2025, 6, 1)); // -14400
 * ```
 */
export function zoneFromTzif(bytes: Uint8Array, id = 'TZif', options?: {
  /** The tz database release of the file, when known (such as `"2025b"`). */
  readonly tzRelease?: string;
}): Zone {
  if (typeof id !== 'string' || id === '') {
    throw new KalendsTypeError(`id: expected a non-empty string naming the zone, got ${describeValue(id)}`, { code: 'invalid-type', received: id });
  }
  const o = readOptions('options', options, ['tzRelease']);
  const tzRelease = optionOf(o, 'tzRelease');
  if (tzRelease !== undefined && typeof tzRelease !== 'string') {
    throw new KalendsTypeError(`options.tzRelease: expected a release name such as "2025b", got ${describeValue(tzRelease)}`, { code: 'invalid-type', received: tzRelease });
  }
  const c = parseTzif(bytes);
  const n = c.transitionsSeconds.length;
  const offsets = new Int32Array(n);
  for (let i = 0; i < n; i++) offsets[i] = c.types[c.transitionTypes[i]!]!.offsetSeconds;
  return rulesZone(id, 'tzif', tzRelease, c.types[0]!.offsetSeconds, c.transitionsSeconds, offsets, c.footerRule);
}

// ---------------------------------------------------------------------------------------------------------
// Ids and the cache

const cache = new Map<string, Zone>();

function cacheGet(key: string): Zone | undefined {
  const z = cache.get(key);
  if (z !== undefined) {
    cache.delete(key);
    cache.set(key, z);
  }
  return z;
}

function cachePut(key: string, z: Zone): void {
  cache.set(key, z);
  while (cache.size > ZONE_CACHE_LIMIT) cache.delete(cache.keys().next().value as string);
}

/**
 * Empties the zone cache (compiled tables are released once no zone object refers to them).
 *
 * @example
 * ```ts
 * clearZoneCache(); // the next zoneFromId('Europe/Dublin') compiles afresh
 * ```
 */
export function clearZoneCache(): void {
  cache.clear();
}

/** @internal The number of cached entries (for tests and docs). */
export function zoneCacheSize(): number {
  return cache.size;
}

const sourceIds = new WeakMap<ZoneRulesSource, Map<string, string>>();

function fromSource(id: string, source: ZoneRulesSource, name: string): Zone {
  let lower = sourceIds.get(source);
  if (!lower) {
    lower = new Map(source.ids.map((x) => [x.toLowerCase(), x]));
    sourceIds.set(source, lower);
  }
  const exact = lower.get(id.toLowerCase());
  const data = exact === undefined ? undefined : source.rulesOf(exact);
  if (exact === undefined || data === undefined) {
    throw new UnknownZoneError(name, id, suggestZoneIds(id, source.ids), `the pinned tz data ${source.tzRelease}`);
  }
  const z = source.zoneFromRules(data);
  if (!isZone(z)) {
    throw new KalendsTypeError(`options.source.zoneFromRules: expected a function that returns a Zone (zoneFromRules from 'kalends'), got ${describeValue(z)}`, {
      code: 'invalid-type',
      received: z,
    });
  }
  // Keep the source's release and mark the origin as TZif data.
  return makeZone({ ...z, source: 'tzif', tzRelease: data.tzRelease ?? source.tzRelease }, engineOf(z));
}

function fromIntl(id: string, name: string): Zone {
  if (/^utc$/i.test(id)) return UTC_ZONE;
  if (looksLikeOffset(id)) return offsetZone(id, name);
  const format = id === '' ? undefined : probeFormatter(id);
  if (!format) throw new UnknownZoneError(name, id, suggestZoneIds(id, runtimeZoneIds()));
  const canonicalId = format.resolvedOptions().timeZone ?? id;
  // The runtime spells the id it resolved with its own case (links too: "asia/calcutta" resolves to
  // "Asia/Calcutta"), so only an id that resolves to another id needs the list of every id (about 1 ms, once).
  const normalized = canonicalId.toLowerCase() === id.toLowerCase() ? canonicalId : (listedIdIgnoringCase(id) ?? id);
  const release = runtimeTzRelease();
  if (canonicalId === 'UTC' || canonicalId === 'Etc/UTC' || canonicalId === 'Etc/GMT') {
    return makeZone({ id: normalized, canonicalId: 'UTC', source: 'fixed', tzRelease: undefined, fixedOffsetSeconds: 0 }, new FixedEngine(0));
  }
  // Zones that share a canonical id share one engine.
  const shared = cache.get(`\u0000${canonicalId}`);
  const engine = shared ? engineOf(shared) : new IntlEngine(format);
  const z = makeZone({ id: normalized, canonicalId, source: 'intl', tzRelease: release, fixedOffsetSeconds: undefined }, engine);
  if (!shared) cachePut(`\u0000${canonicalId}`, z);
  return z;
}

/**
 * The zone named by an IANA id ("America/New_York"), "UTC", or a fixed offset ("+05:30"). By default the
 * runtime's Intl supplies the rules; `options.source` picks another source such as pinned tz data. Ids are
 * matched ignoring case and canonicalized as the runtime knows them (`zone.canonicalId`). An unknown id gives an
 * UnknownZoneError (code 'unknown-zone') with the closest valid ids. Zones are cached (see ZONE_CACHE_LIMIT).
 *
 * @example
 * ```ts
 * zoneFromId('europe/dublin').id; // 'Europe/Dublin'
 * zoneFromId('Europe/Londn');     // throws UnknownZoneError: ... did you mean "Europe/London"?
 * ```
 */
export function zoneFromId(id: string, options?: ZoneFromIdOptions): Zone {
  if (typeof id !== 'string') {
    throw new KalendsTypeError(`id: expected a time zone id string, got ${describeValue(id)}`, { code: 'invalid-type', received: id });
  }
  const source = optionOf(readOptions('options', options, ['source']), 'source');
  if (source !== undefined) {
    requireRulesSource(source);
    if (/^utc$/i.test(id)) return UTC_ZONE;
    if (looksLikeOffset(id)) return offsetZone(id, 'id');
    return fromSource(id, source, 'id');
  }
  return intlZoneNamed(id, 'id');
}

/**
 * The zone that an id names in the runtime's Intl (or UTC, or a fixed offset), through the cache; `name` is the
 * parameter that held the id (for messages). {@link toZone} reads strings here, so that it does not reach the
 * options and the rules sources of {@link zoneFromId}.
 */
function intlZoneNamed(id: string, name: string): Zone {
  const hit = cacheGet(id);
  if (hit) return hit;
  const z = fromIntl(id, name);
  cachePut(id, z);
  return z;
}

function requireRulesSource(source: unknown): asserts source is ZoneRulesSource {
  const s = source as Partial<ZoneRulesSource> | null;
  if (typeof s !== 'object' || s === null || typeof s.rulesOf !== 'function' || typeof s.zoneFromRules !== 'function' || !Array.isArray(s.ids) || typeof s.tzRelease !== 'string') {
    throw new KalendsTypeError(`options.source: expected a zone rules source { tzRelease, ids, rulesOf, zoneFromRules } such as PINNED_TZDATA from 'kalends/tzdata', got ${describeValue(source)}`, {
      code: 'invalid-type',
      received: source,
    });
  }
}

/**
 * The one coercion point for zones: a Zone is returned as it is; a string is resolved by {@link zoneFromId}
 * through the cache. `name` is the parameter name used in error messages.
 *
 * @example
 * ```ts
 * toZone('Asia/Kolkata') === toZone('Asia/Kolkata'); // true (cached)
 * ```
 */
export function toZone(input: ZoneInput, name = 'zone'): Zone {
  if (typeof name !== 'string' || name === '') {
    throw new KalendsTypeError(`name: expected the parameter name to use in messages (a non-empty string), got ${describeValue(name)}`, { code: 'invalid-type', received: name });
  }
  if (typeof input === 'string') return intlZoneNamed(input, name);
  if (isZone(input)) return input;
  throw new KalendsTypeError(`${name}: expected a Zone or a time zone id string, got ${describeValue(input)}`, {
    code: 'invalid-type',
    received: input,
  });
}

/**
 * The zone ids the runtime lists (ECMA-402 `Intl.supportedValuesOf('timeZone')`: canonical ids, no links), plus
 * "UTC", sorted.
 *
 * @example
 * ```ts
 * listZoneIds().includes('Europe/Dublin'); // true
 * ```
 */
export function listZoneIds(): readonly string[] {
  return runtimeZoneIds();
}
