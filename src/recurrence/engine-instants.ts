/**
 * @internal The expansion engines of instants: a wall time resolved in a zone, fixed steps of elapsed time,
 * steps of wall-clock time, and a time of day on the days of a date engine. Units are epoch milliseconds.
 *
 * @module
 */
import { MAX_DAY_NUMBER, MIN_DAY_NUMBER, MS_PER_DAY } from '../bounds.js';
import { type Engine, Sink, type ZoneOps, stepEngine } from './engine.js';

/** How a wall-clock time maps to instants in a zone: one instant, a gap, or an overlap with two. */
export interface WallResolution {
  /** 0 = unique, 1 = in a gap (skipped), 2 = in an overlap (repeated). */
  readonly state: 0 | 1 | 2;
  /** Unique: the instant; gap: the instant shifted forward by the gap; overlap: the earlier instant. */
  readonly earlier: number;
  /** Overlap: the later instant; otherwise the same as `earlier`. */
  readonly later: number;
}

const resolution = { state: 0 as 0 | 1 | 2, earlier: 0, later: 0 };

/**
 * Resolves a wall time by probing the zone's offsets a day before and after (the approach of Temporal's
 * GetPossibleEpochNanoseconds), so that only `offsetSecondsFromEpochMs` is needed. Returns a shared object: copy it.
 */
export function resolveWall(zone: ZoneOps, wallMs: number): WallResolution {
  const before = zone.offsetSecondsFromEpochMs(wallMs - MS_PER_DAY) * 1000;
  const after = zone.offsetSecondsFromEpochMs(wallMs + MS_PER_DAY) * 1000;
  const e1 = wallMs - before;
  const e2 = wallMs - after;
  const ok1 = zone.offsetSecondsFromEpochMs(e1) * 1000 === before;
  const ok2 = before !== after && zone.offsetSecondsFromEpochMs(e2) * 1000 === after;
  if (ok1 && ok2) {
    resolution.state = 2;
    resolution.earlier = Math.min(e1, e2);
    resolution.later = Math.max(e1, e2);
  } else if (ok1 || ok2) {
    resolution.state = 0;
    resolution.earlier = resolution.later = ok1 ? e1 : e2;
  } else if (before === after) {
    // Two transitions within two days: fall back to the offset at the first guess.
    const e = wallMs - zone.offsetSecondsFromEpochMs(e1) * 1000;
    resolution.state = 0;
    resolution.earlier = resolution.later = e;
  } else {
    // In a gap: read the wall time with the offset in force before the gap (RFC 5545 section 3.3.5; Temporal
    // 'compatible'), which lands after the transition by the length of the gap.
    resolution.state = 1;
    resolution.earlier = resolution.later = e1;
  }
  return resolution;
}

/** Fixed steps of absolute time from `anchorMs`. */
export function elapsedEngine(anchorMs: number, stepMs: number): Engine {
  return stepEngine(anchorMs, stepMs);
}

/** Where a wall-clock step that a daylight-saving gap skips goes: forward by the gap (Temporal's `'later'`), or nowhere. */
export type SkippedTime = 'later' | 'drop';
/** Which instants a wall-clock step that an overlap repeats gives: the first, the second, or both. */
export type RepeatedTime = 'earlier' | 'later' | 'both';

/** Steps of wall-clock time from `anchorWallMs`, resolved in `zone` with the stated gap and overlap rules. */
export function wallClockEngine(zone: ZoneOps, anchorWallMs: number, stepMs: number, skipped: SkippedTime, repeated: RepeatedTime): Engine {
  const scratch: number[] = [];
  const drop = skipped === 'drop';
  const first = repeated !== 'later';
  const second = repeated !== 'earlier';
  return {
    stride: stepMs,
    // A step can vanish in a gap (dropped) and gaps are shorter than a day.
    maxGap: stepMs + MS_PER_DAY,
    fill(lo, hi, out) {
      if (lo >= hi) return;
      // Every instant in [lo, hi) has a wall time within a day of it (offsets are below 24 hours).
      const wLo = lo - MS_PER_DAY;
      const wHi = hi + MS_PER_DAY;
      scratch.length = 0;
      let k = Math.ceil((wLo - anchorWallMs) / stepMs);
      for (let w = anchorWallMs + k * stepMs; w < wHi; w = anchorWallMs + ++k * stepMs) {
        const r = resolveWall(zone, w);
        if (r.state === 1 && drop) continue;
        const pick1 = r.state !== 2 || first;
        if (pick1 && r.earlier >= lo && r.earlier < hi) scratch.push(r.earlier);
        if (r.state === 2 && second && r.later >= lo && r.later < hi) scratch.push(r.later);
      }
      let sorted = true;
      for (let i = 1; i < scratch.length; i++) if (scratch[i]! < scratch[i - 1]!) sorted = false;
      if (!sorted) scratch.sort((a, b) => a - b);
      let prev = Number.NaN;
      for (const t of scratch) {
        if (t !== prev) out.push(t);
        prev = t;
      }
    },
  };
}

/**
 * Instants at wall time `timeOfDayMs` on the days of a date engine, resolved in `zone` (a gap moves the time
 * forward, an overlap takes the earlier instant: RFC 5545 section 3.3.5).
 */
export function timeOfDayEngine(days: Engine, zone: ZoneOps, timeOfDayMs: number): Engine {
  const buffer = new Sink(64);
  const instantOf = (day: number): number => resolveWall(zone, day * MS_PER_DAY + timeOfDayMs).earlier;
  return {
    /**
     * One instant per day of the date engine, in the same order, as long as no offset change of 12 hours or more
     * lies between (consecutive days are 24 hours apart and a zone's offsets lie within ±24 hours, so only such a
     * change can merge two days' instants): then the k-th instant is that of the k-th day.
     */
    locate(lo, k, end) {
      if (!days.locate) return undefined;
      const dayEnd = MAX_DAY_NUMBER + 1;
      const from = Math.max(Math.floor(lo / MS_PER_DAY) - 2, MIN_DAY_NUMBER);
      let skip = 0;
      for (;;) {
        const d = days.locate(from, skip, dayEnd);
        if (d === undefined) return undefined;
        if (d !== d) return Number.NaN;
        if (instantOf(d) >= lo) break;
        skip++;
      }
      const dk = days.locate(from, skip + k, dayEnd);
      if (dk === undefined) return undefined;
      if (dk !== dk) return Number.NaN;
      const t = instantOf(dk);
      if (zone.mayJumpHalfADay(lo - MS_PER_DAY, t + MS_PER_DAY)) return undefined;
      return t < end ? t : Number.NaN;
    },
    stride: days.stride * MS_PER_DAY,
    maxGap: days.maxGap * MS_PER_DAY + MS_PER_DAY,
    fill(lo, hi, out) {
      if (lo >= hi) return;
      buffer.clear();
      const dLo = Math.max(Math.floor(lo / MS_PER_DAY) - 2, MIN_DAY_NUMBER);
      const dHi = Math.min(Math.floor(hi / MS_PER_DAY) + 3, MAX_DAY_NUMBER + 1);
      days.fill(dLo, dHi, buffer);
      let prev = Number.NaN;
      for (let i = 0; i < buffer.length; i++) {
        const t = resolveWall(zone, buffer.data[i]! * MS_PER_DAY + timeOfDayMs).earlier;
        if (t >= lo && t < hi && !(t <= prev)) {
          out.push(t);
          prev = t;
        }
      }
    },
  };
}
