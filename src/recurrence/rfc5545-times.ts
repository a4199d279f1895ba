/**
 * @internal Expansion of RFC 5545 rules with time parts (section 3.3.10: BYHOUR, BYMINUTE, BYSECOND, and the
 * sub-daily frequencies HOURLY, MINUTELY and SECONDLY with BYxxx parts). Units are epoch milliseconds.
 *
 * Day-level frequencies (DAILY to YEARLY) expand each period's days to the local times BYHOUR x BYMINUTE x
 * BYSECOND (missing parts from DTSTART), apply BYSETPOS to that set, and resolve each local time in the zone by
 * the rule of section 3.3.5 (a time in a gap is read with the offset before the gap, so it moves forward by the
 * gap; a repeated time is its first occurrence). Sub-daily frequencies step in elapsed time from DTSTART's period
 * (the hour, minute or second that holds DTSTART), expand a period by the finer parts the table of section 3.3.10
 * marks "Expand", and keep the instants whose local fields pass the parts it marks "Limit".
 *
 * @module
 */
import { MAX_DAY_NUMBER, MIN_DAY_NUMBER, MS_PER_DAY } from '../bounds.js';
import { type Engine, Sink, type ZoneOps, gcd, mod } from './engine.js';
import { resolveWall } from './engine-instants.js';
import { type RfcDaySpec, dayMatches, expandPeriod, periodIndexOf, rfcDayEngine } from './rfc5545-compile.js';

/** The time parts of a rule, compiled; lists are sorted and without repeats. */
export interface RfcTimeSpec {
  readonly hours: readonly number[] | undefined;
  readonly minutes: readonly number[] | undefined;
  readonly seconds: readonly number[] | undefined;
}

/** Picks the BYSETPOS positions of a sorted set, sorted and without repeats. */
function pickPositions(set: readonly number[], positions: readonly number[]): number[] {
  const picked: number[] = [];
  for (const p of positions) {
    const i = p > 0 ? p - 1 : set.length + p;
    if (i >= 0 && i < set.length) picked.push(set[i]!);
  }
  picked.sort((a, b) => a - b);
  return picked.filter((v, i) => i === 0 || v !== picked[i - 1]);
}

/** Sorts `scratch`, drops repeats and pushes it to `out`. */
function flushSorted(scratch: number[], out: Sink): void {
  scratch.sort((a, b) => a - b);
  let prev = Number.NaN;
  for (const t of scratch) {
    if (t !== prev) out.push(t);
    prev = t;
  }
  scratch.length = 0;
}

/**
 * Instants of a day-level rule with several times a day (or BYSETPOS over days and times): `spec` without its
 * BYSETPOS, `times` the local times of day in ms (sorted), `setPos` the BYSETPOS list. Returns undefined when the
 * rule can never produce a day.
 */
export function rfcDayTimesEngine(spec: RfcDaySpec, times: readonly number[], setPos: readonly number[] | undefined, zone: ZoneOps, startMs: number): Engine | undefined {
  const oneTime = times.length === 1;
  // With one time a day, BYSETPOS picks days, and the date engine proves the rule productive with it.
  const days = rfcDayEngine(oneTime ? { ...spec, bySetPos: setPos } : spec);
  if (!days) return undefined;
  const daySpec: RfcDaySpec = oneTime ? { ...spec, bySetPos: setPos } : spec;
  const startIndex = periodIndexOf(spec, spec.startDay);
  const dayList: number[] = [];
  const walls: number[] = [];
  const scratch: number[] = [];
  return {
    stride: Math.max(1000, (days.stride * MS_PER_DAY) / times.length),
    // BYSETPOS over days and times can pick nothing in a period: no gap is proven then.
    maxGap: oneTime || !setPos ? days.maxGap * MS_PER_DAY + 2 * MS_PER_DAY : Number.POSITIVE_INFINITY,
    fill(lo, hi, out) {
      lo = Math.max(lo, startMs);
      if (lo >= hi) return;
      const dLo = Math.max(Math.floor(lo / MS_PER_DAY) - 2, spec.startDay, MIN_DAY_NUMBER);
      const dHi = Math.min(Math.floor(hi / MS_PER_DAY) + 3, MAX_DAY_NUMBER + 1);
      if (dLo >= dHi) return;
      const iLo = periodIndexOf(spec, dLo);
      const iHi = periodIndexOf(spec, dHi - 1);
      for (let i = iLo + mod(startIndex - iLo, spec.interval); i <= iHi; i += spec.interval) {
        expandPeriod(daySpec, i, dayList);
        walls.length = 0;
        for (const d of dayList) for (const t of times) walls.push(d * MS_PER_DAY + t);
        const chosen = setPos && !oneTime ? pickPositions(walls, setPos) : walls;
        for (const w of chosen) {
          const t = resolveWall(zone, w).earlier;
          if (t >= lo && t < hi) scratch.push(t);
        }
      }
      flushSorted(scratch, out);
    },
  };
}

/** What a sub-daily rule needs. */
export interface RfcSubDailySpec {
  /** Length of the frequency's period in ms (3,600,000, 60,000 or 1,000). */
  readonly periodMs: number;
  readonly interval: number;
  /** Start of DTSTART's period (an instant). */
  readonly firstPeriodMs: number;
  /** Offsets within a period that the "Expand" parts give, sorted. */
  readonly offsets: readonly number[];
  /** Local hours, minutes and seconds the "Limit" parts allow (undefined: all). */
  readonly hours: readonly number[] | undefined;
  readonly minutes: readonly number[] | undefined;
  readonly seconds: readonly number[] | undefined;
  /** The date-level parts as a DAILY limit, or undefined when there are none. */
  readonly days: RfcDaySpec | undefined;
  readonly setPos: readonly number[] | undefined;
}

/**
 * Instants of an HOURLY, MINUTELY or SECONDLY rule with BYxxx parts. Returns undefined when the date-level parts
 * can never match a day.
 */
export function rfcSubDailyEngine(s: RfcSubDailySpec, zone: ZoneOps, startMs: number): Engine | undefined {
  const dayEngine = s.days ? rfcDayEngine(s.days) : undefined;
  if (s.days && !dayEngine) return undefined;
  const step = s.periodMs * s.interval;
  const span = s.offsets[s.offsets.length - 1]!;
  const hourOk = mask(s.hours, 24);
  const minuteOk = mask(s.minutes, 60);
  const secondOk = mask(s.seconds, 60);
  const limited = s.hours !== undefined || s.minutes !== undefined || s.seconds !== undefined || s.days !== undefined || s.setPos !== undefined;
  // The steps visit the times of day firstPeriodMs + j * g (mod a day), g = gcd(step, day), and repeat after
  // lcm(step, day). Prove that one of them (at the zone's offsets at DTSTART and half a year later) passes the
  // time limits, so that a search never walks centuries of steps for nothing.
  const g = gcd(step, MS_PER_DAY);
  const repeatMs = (step / g) * MS_PER_DAY;
  const zoneOffsets = [...new Set([zone.offsetSecondsFromEpochMs(startMs), zone.offsetSecondsFromEpochMs(startMs + 182 * MS_PER_DAY)])];
  let reachable = false;
  for (let j = 0; j < MS_PER_DAY / g && !reachable; j++) {
    for (const o of s.offsets) {
      for (const z of zoneOffsets) {
        const inDay = mod(s.firstPeriodMs + j * g + o + z * 1000, MS_PER_DAY);
        if (hourOk && !hourOk[Math.floor(inDay / 3_600_000)]) continue;
        if (minuteOk && !minuteOk[Math.floor(inDay / 60_000) % 60]) continue;
        if (secondOk && !secondOk[Math.floor(inDay / 1000) % 60]) continue;
        reachable = true;
      }
    }
  }
  if (!reachable) return undefined;
  const passes = (t: number): boolean => {
    if (!limited) return true;
    const wall = t + zone.offsetSecondsFromEpochMs(t) * 1000;
    const day = Math.floor(wall / MS_PER_DAY);
    const inDay = wall - day * MS_PER_DAY;
    if (hourOk && !hourOk[Math.floor(inDay / 3_600_000)]) return false;
    if (minuteOk && !minuteOk[Math.floor(inDay / 60_000) % 60]) return false;
    if (secondOk && !secondOk[Math.floor(inDay / 1000) % 60]) return false;
    return s.days === undefined || dayMatches(s.days, day);
  };
  const days = new Sink(64);
  const period: number[] = [];
  const scratch: number[] = [];
  /** Occurrences of the periods that overlap [a, b), kept within [lo, hi). */
  const fillWindow = (a: number, b: number, lo: number, hi: number): void => {
    for (let k = Math.floor((a - span - s.firstPeriodMs) / step); s.firstPeriodMs + k * step < b; k++) {
      const p = s.firstPeriodMs + k * step;
      period.length = 0;
      for (const o of s.offsets) if (passes(p + o)) period.push(p + o);
      const chosen = s.setPos ? pickPositions(period, s.setPos) : period;
      for (const t of chosen) if (t >= Math.max(a, lo) && t < Math.min(b, hi)) scratch.push(t);
    }
  };
  return {
    stride: Math.max(1000, step / s.offsets.length),
    // Without date-level parts the times of day repeat after lcm(step, day); two days cover offset changes.
    maxGap: !limited ? step : s.days ? Number.POSITIVE_INFINITY : repeatMs + 2 * MS_PER_DAY,
    fill(lo, hi, out) {
      lo = Math.max(lo, startMs);
      if (lo >= hi) return;
      if (!dayEngine) {
        fillWindow(lo, hi, lo, hi);
        flushSorted(scratch, out);
        return;
      }
      // Only the local days the date-level parts allow can hold an occurrence: walk those days' instants.
      days.clear();
      const dLo = Math.max(Math.floor(lo / MS_PER_DAY) - 2, MIN_DAY_NUMBER);
      const dHi = Math.min(Math.floor(hi / MS_PER_DAY) + 3, MAX_DAY_NUMBER + 1);
      dayEngine.fill(dLo, dHi, days);
      for (let i = 0; i < days.length; i++) {
        const d = days.data[i]!;
        const a = resolveWall(zone, d * MS_PER_DAY).earlier;
        const b = resolveWall(zone, (d + 1) * MS_PER_DAY).earlier;
        if (b > lo && a < hi) fillWindow(a, b, lo, hi);
      }
      flushSorted(scratch, out);
    },
  };
}

function mask(values: readonly number[] | undefined, size: number): boolean[] | undefined {
  if (!values) return undefined;
  const m = new Array<boolean>(size).fill(false);
  for (const v of values) m[Math.min(v, size - 1)] = true;
  return m;
}
