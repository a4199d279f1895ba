/**
 * @internal Validation and compilation of intraday rules: steps of minutes or hours in a zone, on the wall clock
 * or in elapsed time.
 *
 * @module
 */
import { MAX_COUNT, MAX_EPOCH_MS, MIN_EPOCH_MS, MS_PER_DAY } from '../bounds.js';
import { type Issues, checkKeys, isRecord, readEnum, readInt } from '../diagnostics/index.js';
import { describeValue } from '../errors.js';
import { type Compiled, readInstant, reasonOf } from './compile.js';
import { parsePlainDateTime, zoneOps } from './deps.js';
import type { ZoneOps } from './engine.js';
import { type RepeatedTime, type SkippedTime, elapsedEngine, resolveWall, wallClockEngine } from './engine-instants.js';

const SKIPPED: readonly SkippedTime[] = ['later', 'drop'];
const REPEATED: readonly RepeatedTime[] = ['earlier', 'later', 'both'];
/** The spelling of 0.1 ("shift-forward"), so that the message names its replacement. */
const SKIPPED_SYNONYMS: Readonly<Record<string, string>> = /* @__PURE__ */ Object.freeze({ 'shift-forward': 'later', forward: 'later', compatible: 'later' });

/** Compiles an intraday rule. */
export function compileIntraday(def: Record<string, unknown>, issues: Issues): Compiled | undefined {
  checkKeys(def, ['kind', 'zone', 'every', 'anchor', 'clock', 'skipped', 'repeated', 'start', 'end', 'count', 'label'], '', issues);
  let zone: ZoneOps | undefined;
  if (def['zone'] === undefined) issues.add('zone', 'expected an IANA zone id such as "America/Chicago" (or a zone); got none');
  else {
    try {
      zone = zoneOps(def['zone'], 'zone');
    } catch (e) {
      issues.add('zone', (e as Error).message);
    }
  }
  let stepMs = Number.NaN;
  const every = def['every'];
  if (!isRecord(every)) issues.add('every', `expected { "minutes": n } or { "hours": n }, got ${describeValue(every)}`);
  else {
    checkKeys(every, ['hours', 'minutes'], 'every', issues);
    const h = readInt(every, 'hours', 'every.hours', 0, 24, issues, 0);
    const m = readInt(every, 'minutes', 'every.minutes', 0, 1440, issues, 0);
    if (!Number.isNaN(h) && !Number.isNaN(m)) {
      stepMs = (h * 60 + m) * 60_000;
      if (stepMs === 0) {
        issues.add('every', `expected a step of at least one minute (an interval of 0 would never move), got ${describeValue(every)}`);
        stepMs = Number.NaN;
      } else if (stepMs > MS_PER_DAY) {
        issues.add('every', `expected a step of at most 24 hours (use a date rule for longer steps), got ${h * 60 + m} minutes`);
        stepMs = Number.NaN;
      }
    }
  }
  let anchorWall = Number.NaN;
  if (typeof def['anchor'] !== 'string') issues.add('anchor', `expected a local date-time such as "2025-03-09T00:00", got ${describeValue(def['anchor'])}`);
  else {
    try {
      anchorWall = parsePlainDateTime(def['anchor']);
    } catch (e) {
      issues.add('anchor', `expected a local date-time such as "2025-03-09T00:00"; ${reasonOf(e)}`);
    }
  }
  const clock = readEnum(def, 'clock', 'clock', ['wall', 'elapsed'] as const, issues, undefined);
  if (def['clock'] === undefined) issues.add('clock', 'state the clock: "wall" (steps of local wall-clock time) or "elapsed" (steps of absolute time); got none');
  const skipped = readEnum<SkippedTime>(def, 'skipped', 'skipped', SKIPPED, issues, 'later', { synonyms: SKIPPED_SYNONYMS });
  const repeated = readEnum<RepeatedTime>(def, 'repeated', 'repeated', REPEATED, issues, 'earlier');
  if (clock === 'elapsed') {
    for (const k of ['skipped', 'repeated']) {
      if (def[k] !== undefined) issues.add(k, `applies only to clock "wall": elapsed steps are never skipped or repeated; got ${describeValue(def[k])}`);
    }
  }
  const start = readInstant(def, 'start', 'start', issues);
  const end = readInstant(def, 'end', 'end', issues);
  if (start !== undefined && end !== undefined && end <= start) issues.add('end', `expected an instant after start, got ${describeValue(def['end'])}`);
  const countRaw = readInt(def, 'count', 'count', 1, MAX_COUNT, issues, Number.NaN);
  const count = Number.isNaN(countRaw) ? undefined : countRaw;
  if (count !== undefined && def['start'] === undefined) issues.add('count', `counts occurrences from start, so start is required; got count ${count} without start`);
  if (def['label'] !== undefined && typeof def['label'] !== 'string') issues.add('label', `expected a string, got ${describeValue(def['label'])}`);
  if (!issues.ok || !zone || Number.isNaN(stepMs) || Number.isNaN(anchorWall) || !clock) return undefined;
  const engine =
    clock === 'elapsed'
      ? elapsedEngine(resolveWall(zone, anchorWall).earlier, stepMs)
      : wallClockEngine(zone, anchorWall, stepMs, skipped ?? 'later', repeated ?? 'earlier');
  return {
    values: 'instants',
    engine,
    business: undefined,
    convention: 'none',
    rawStart: start ?? MIN_EPOCH_MS,
    rawEnd: end ?? MAX_EPOCH_MS + 1,
    count,
    exclude: undefined,
    zone,
    period: undefined,
  };
}
