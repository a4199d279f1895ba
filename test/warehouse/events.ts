/**
 * Events for the engine tests: random instants in three zones from 1990 to 2040, then every transition ±1 s and
 * every local midnight ±1 ms of each zone; and the library's answers for each (the reference the engines must
 * equal): local day, fiscal quarter label, retail week label, business-day flag.
 */
import {
  DAY_UNIT,
  type Profile,
  calendarOfProfile,
  dayNumberFromYmd,
  firstEpochMsOfDayNumber,
  formatOrdinalBulk,
  isBusinessDay,
  listTransitions,
  ordinalFromEpochMsBulk,
  unitOfProfile,
} from '../../src/index.js';
import { seededRandom } from '../../bench/harness.js';

export const ZONES = ['America/Chicago', 'Europe/Dublin', 'Pacific/Auckland'] as const;
export const FIRST_MS = Date.UTC(1990, 0, 1);
export const END_MS = Date.UTC(2041, 0, 1);
/** The dimension's range: from the day before the first instant to the day after the last, in every zone. */
export const DIMENSION_RANGE = { start: '1989-12-30', end: '2041-01-03' } as const;

export interface Events {
  readonly epochMs: Float64Array;
  /** Index into ZONES. */
  readonly zone: Uint8Array;
  /** Whole amounts 1..1000, so that sums are exact in any engine. */
  readonly amount: Float64Array;
}

export function makeEvents(randomCount: number, seed = 20261204): Events {
  const rnd = seededRandom(seed);
  const times: number[] = [];
  const zones: number[] = [];
  for (let i = 0; i < randomCount; i++) {
    times.push(FIRST_MS + Math.floor(rnd() * (END_MS - FIRST_MS)));
    zones.push(Math.floor(rnd() * ZONES.length));
  }
  ZONES.forEach((zone, z) => {
    for (const t of listTransitions(zone, FIRST_MS, END_MS)) {
      for (const dt of [-1000, 0, 1000]) {
        times.push(t.epochMs + dt);
        zones.push(z);
      }
    }
    for (let d = dayNumberFromYmd(1990, 1, 2); d < dayNumberFromYmd(2041, 1, 1); d++) {
      const midnight = firstEpochMsOfDayNumber(zone, d);
      for (const dt of [-1, 0, 1]) {
        times.push(midnight + dt);
        zones.push(z);
      }
    }
  });
  return {
    epochMs: Float64Array.from(times),
    zone: Uint8Array.from(zones),
    amount: Float64Array.from({ length: times.length }, () => 1 + Math.floor(rnd() * 1000)),
  };
}

export interface Answers {
  readonly day: Int32Array;
  readonly quarter: string[];
  readonly week: string[];
  readonly business: boolean[];
}

/** The library's answers for every event, by event index (the event id). */
export function libraryAnswers(profile: Profile, events: Events): Answers {
  const n = events.epochMs.length;
  const day = new Int32Array(n);
  const quarter = new Array<string>(n);
  const week = new Array<string>(n);
  const business = new Array<boolean>(n);
  const fq = unitOfProfile(profile, 'fiscal-quarter');
  const rw = unitOfProfile(profile, 'retail-week');
  const calendar = calendarOfProfile(profile);
  ZONES.forEach((zone, z) => {
    const idx: number[] = [];
    for (let i = 0; i < n; i++) if (events.zone[i] === z) idx.push(i);
    const times = Float64Array.from(idx, (i) => events.epochMs[i]!);
    const d = ordinalFromEpochMsBulk(DAY_UNIT, zone, times);
    const q = formatOrdinalBulk(fq, ordinalFromEpochMsBulk(fq, zone, times));
    const w = formatOrdinalBulk(rw, ordinalFromEpochMsBulk(rw, zone, times));
    idx.forEach((i, k) => {
      day[i] = d[k]!;
      quarter[i] = q[k]!;
      week[i] = w[k]!;
      business[i] = isBusinessDay(calendar, d[k]!);
    });
  });
  return { day, quarter, week, business };
}
