/**
 * The edges of the bulk kernels (issues 3 and 4: bulk results are identical to scalar results). The kernels read
 * one entry per UTC day (found by a multiplication, which test/zone/day-division.test.ts proves equal to the
 * division); the period kernel's entry is the ordinal at the UTC midnight and the instant of the next local
 * midnight if the ordinal steps there. These tests put instants on and next to every UTC midnight (whole and
 * fractional milliseconds, and the doubles adjacent to the midnight), in zones whose transitions and local
 * midnights fall on, or a second or two from, a UTC midnight, and at the ends of the supported range, and compare
 * every element with the scalar functions. The scalar functions themselves are checked against IANA TZif data and
 * @js-temporal/polyfill in the other files of test/zone.
 */
import { describe, expect, it } from 'vitest';
import { dayNumberFromEpochMs, dayNumberFromEpochMsBulk, wallMsFromEpochMs, wallMsFromEpochMsBulk, zoneFromRules, type Zone } from '../../src/zone/index.js';
import { defineUnit, ordinalFromEpochMsBulk, type PeriodUnit } from '../../src/period/index.js';

const DAY = 86_400_000;
const DAY_S = 86_400;
/** Instants around a UTC midnight: on it, whole milliseconds and fractions of one either side, and a second away. */
const NEAR = [0, 1, -1, 0.5, -0.5, 0.25, -0.001, 2, -2, 3, -3, 999, -999, 1000, -1000, 1001, -1001];

/** The doubles next to x, below and above (where the rounding of a multiplication is most likely to cross x). */
function neighbours(x: number): [number, number] {
  const f = new Float64Array([x]);
  const b = new BigInt64Array(f.buffer);
  const up = x > 0 ? 1n : -1n;
  b[0] = b[0]! + up;
  const away = f[0]!;
  b[0] = b[0]! - 2n * up;
  const toward = f[0]!;
  return x > 0 ? [toward, away] : [away, toward];
}

/** A transition of a made-up zone: on UTC day `day`, `extraSeconds` after its midnight, to `offset` seconds. */
type Change = readonly [day: number, extraSeconds: number, offset: number];

/** A zone made up for the test from its transitions (whole seconds, as zone rules are), from an offset of 0. */
function madeUpZone(changes: readonly Change[]): Zone {
  return zoneFromRules({
    id: 'Test/Made_Up',
    initialOffsetSeconds: 0,
    transitionsSeconds: changes.map(([day, extra]) => day * DAY_S + extra),
    offsetsSeconds: changes.map(([, , offset]) => offset),
  });
}

/**
 * Transitions on a UTC midnight, one and two seconds from one, and in the middle of a day, to offsets of 0
 * (local midnight on the UTC midnight), +1 h, -1 h, +2 h and +1 s, from UTC day `day0` on.
 */
function changesFrom(day0: number): Change[] {
  return [
    [day0 + 10, 0, 3600],
    [day0 + 20, -1, 0],
    [day0 + 30, 1, -3600],
    [day0 + 35, -2, 7200],
    [day0 + 40, 43_200, 1],
    [day0 + 50, 0, 0],
  ];
}

function instantsNearMidnights(firstDay: number, days: number): Float64Array {
  const out: number[] = [];
  for (let d = firstDay; d < firstDay + days; d++) {
    const midnight = d * DAY;
    for (const x of NEAR) out.push(midnight + x);
    if (midnight !== 0) out.push(...neighbours(midnight));
  }
  // Padding with ordinary instants, so that the period conversion takes its table path (2048 or more elements).
  for (let i = 0; out.length < 4096; i++) out.push((firstDay + (i % days)) * DAY + ((i * 7_919_777) % DAY));
  return Float64Array.from(out.filter((t) => Math.abs(t) <= 8.64e15));
}

const UNITS: PeriodUnit[] = [
  defineUnit('day'),
  defineUnit({ kind: 'fiscal-week', yearEnd: { weekday: 'saturday', month: 1, rule: 'nearest' }, naming: 'start-year', layout: '4-5-4' }),
  defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' }),
];

function checkAll(zone: Zone | string, data: Float64Array): void {
  const days = dayNumberFromEpochMsBulk(zone, data);
  const walls = wallMsFromEpochMsBulk(zone, data);
  for (let i = 0; i < data.length; i++) {
    const t = data[i]!;
    if (days[i] !== dayNumberFromEpochMs(zone, t)) expect([t, days[i]]).toEqual([t, dayNumberFromEpochMs(zone, t)]);
    if (walls[i] !== wallMsFromEpochMs(zone, t)) expect([t, walls[i]]).toEqual([t, wallMsFromEpochMs(zone, t)]);
  }
  for (const unit of UNITS) {
    const ords = ordinalFromEpochMsBulk(unit, zone, data);
    for (let i = 0; i < data.length; i++) {
      const want = unit.ordinalFromDayNumber(dayNumberFromEpochMs(zone, data[i]!));
      if (ords[i] !== want) expect([unit.kind, data[i], ords[i]]).toEqual([unit.kind, data[i], want]);
    }
  }
}

describe('bulk conversions next to UTC midnights', () => {
  it('a made-up zone with transitions on, and a second or two from, UTC midnights', () => {
    checkAll(madeUpZone(changesFrom(20_000)), instantsNearMidnights(20_000, 60));
  });

  it('zones whose local midnight is the UTC midnight for part of the year (IANA ids via Intl)', () => {
    for (const zone of ['Europe/London', 'Atlantic/Azores', 'Africa/Casablanca', 'America/Danmarkshavn']) {
      checkAll(zone, instantsNearMidnights(Math.floor(Date.UTC(2018, 0, 1) / DAY), 800));
    }
  });

  it('at the ends of the supported range (±8.64e15 ms): the last day table, and instants no table holds', () => {
    const last = 8.64e15 / DAY;
    const zone = madeUpZone([...changesFrom(-last + 1), ...changesFrom(last - 60)]);
    checkAll(zone, instantsNearMidnights(-last, 60));
    checkAll(zone, instantsNearMidnights(last - 60, 61));
    for (const id of ['Europe/London', 'America/New_York']) {
      checkAll(id, instantsNearMidnights(-last, 40));
      checkAll(id, instantsNearMidnights(last - 40, 41));
    }
  });
});
