/**
 * Known facts about clocks, each with its source, checked on the runtime's Intl zones and on the vendored TZif
 * fixtures (IANA tz 2025b).
 */
import { describe, expect, it } from 'vitest';
import {
  lengthMsOfDayNumber,
  dayNumberFromEpochMs,
  firstEpochMsOfDayNumber,
  listTransitions,
  offsetSecondsFromEpochMs,
  resolveWallMs,
  wallFieldsFromEpochMs,
  zoneFromId,
} from '../../src/zone/index.js';
import type { Zone } from '../../src/zone/index.js';
import { dayNumberFromYmd, dayCountOfMonth, weekdayOfDayNumber } from '../../src/civil/index.js';
import { HOUR, fixtureZone } from './helpers.js';

/** Day of the month of the n-th (1-based) given ISO weekday, or the last one when n = -1. */
function nthWeekday(year: number, month: number, weekday: number, n: number): number {
  if (n > 0) {
    const first = weekdayOfDayNumber(dayNumberFromYmd(year, month, 1));
    return 1 + ((weekday - first + 7) % 7) + (n - 1) * 7;
  }
  const dim = dayCountOfMonth(year, month);
  const last = weekdayOfDayNumber(dayNumberFromYmd(year, month, dim));
  return dim - ((last - weekday + 7) % 7);
}

const SUNDAY = 7;
const both = (id: string): [string, Zone][] => [
  ['Intl', zoneFromId(id)],
  ['TZif 2025b', fixtureZone(id)],
];

describe('US daylight saving time from 2007: Energy Policy Act of 2005, section 110 (15 U.S.C. 260a)', () => {
  // "2 a.m. on the second Sunday of March" to "2 a.m. on the first Sunday of November", local time.
  const zones: [string, number][] = [
    ['America/New_York', -5],
    ['America/Chicago', -6],
    ['America/Denver', -7],
    ['America/Los_Angeles', -8],
  ];
  for (const [id, std] of zones) {
    it(id, () => {
      const sources: [string, Zone][] = id === 'America/New_York' ? both(id) : [['Intl', zoneFromId(id)]];
      for (const [src, z] of sources) {
        for (let year = 2007; year <= 2040; year++) {
          const start = Date.UTC(year, 2, nthWeekday(year, 3, SUNDAY, 2), 2 - std);
          const end = Date.UTC(year, 10, nthWeekday(year, 11, SUNDAY, 1), 2 - (std + 1));
          const ts = listTransitions(z, Date.UTC(year, 0, 1), Date.UTC(year + 1, 0, 1));
          expect(ts.map((t) => t.epochMs), `${src} ${year}`).toEqual([start, end]);
          expect(ts.map((t) => t.offsetAfterSeconds / 3600)).toEqual([std + 1, std]);
        }
      }
    });
  }
});

describe('EU summer time: Directive 2000/84/EC, articles 1-3', () => {
  // Art. 2: begins at 1:00 a.m. GMT on the last Sunday in March; Art. 3: ends at 1:00 a.m. GMT on the last
  // Sunday in October; the same instant in every member state (from 2002, Art. 4).
  const zones: [string, number][] = [
    ['Europe/Amsterdam', 1],
    ['Europe/Dublin', 0],
    ['Europe/Paris', 1],
    ['Europe/Berlin', 1],
    ['Europe/Lisbon', 0],
    ['Europe/Helsinki', 2],
    ['Europe/Athens', 2],
  ];
  for (const [id, std] of zones) {
    it(id, () => {
      const sources: [string, Zone][] = id === 'Europe/Amsterdam' || id === 'Europe/Dublin' ? both(id) : [['Intl', zoneFromId(id)]];
      for (const [src, z] of sources) {
        for (let year = 2002; year <= 2040; year++) {
          const start = Date.UTC(year, 2, nthWeekday(year, 3, SUNDAY, -1), 1);
          const end = Date.UTC(year, 9, nthWeekday(year, 10, SUNDAY, -1), 1);
          const ts = listTransitions(z, Date.UTC(year, 0, 1), Date.UTC(year + 1, 0, 1));
          expect(ts.map((t) => t.epochMs), `${src} ${id} ${year}`).toEqual([start, end]);
          expect(ts.map((t) => t.offsetAfterSeconds / 3600)).toEqual([std + 1, std]);
        }
      }
    });
  }

  it('America/Nuuk changes at the same instants since 2024 (IANA tz data: Greenland follows the EU instants)', () => {
    for (const [src, z] of both('America/Nuuk')) {
      for (let year = 2024; year <= 2030; year++) {
        const ts = listTransitions(z, Date.UTC(year, 0, 1), Date.UTC(year + 1, 0, 1));
        expect(ts.map((t) => t.epochMs), `${src} ${year}`).toEqual([
          Date.UTC(year, 2, nthWeekday(year, 3, SUNDAY, -1), 1),
          Date.UTC(year, 9, nthWeekday(year, 10, SUNDAY, -1), 1),
        ]);
      }
    }
  });
});

describe('Samoa skipped 30 December 2011 (it moved west of the date line; IANA tz data, Pacific/Apia)', () => {
  it('the day has length 0 and starts where 31 December starts', () => {
    const d30 = dayNumberFromYmd(2011, 12, 30);
    for (const [src, z] of both('Pacific/Apia')) {
      expect(lengthMsOfDayNumber(z, d30), src).toBe(0);
      expect(firstEpochMsOfDayNumber(z, d30), src).toBe(firstEpochMsOfDayNumber(z, d30 + 1));
      expect(lengthMsOfDayNumber(z, d30 - 1), src).toBe(24 * HOUR);
      const r = resolveWallMs(z, d30 * 86_400_000 + 12 * HOUR);
      expect(r.kind, src).toBe('gap');
      if (r.kind === 'gap') {
        // From memory: -10:00 (daylight time) before, +14:00 (+13:00 and daylight time) after.
        expect([r.offsetBeforeSeconds / 3600, r.offsetAfterSeconds / 3600]).toEqual([-10, 14]);
        expect(r.endWallMs - r.startWallMs).toBe(24 * HOUR);
      }
      // The instant after 29 December 23:59:59 local is 31 December 00:00 local.
      const t = firstEpochMsOfDayNumber(z, d30 + 1);
      expect(dayNumberFromEpochMs(z, t - 1), src).toBe(d30 - 1);
      expect(dayNumberFromEpochMs(z, t), src).toBe(d30 + 1);
    }
  });

  it('Kiribati Line Islands likewise skipped 31 December 1994 (IANA tz data, Pacific/Kiritimati)', () => {
    for (const [src, z] of both('Pacific/Kiritimati')) {
      expect(lengthMsOfDayNumber(z, dayNumberFromYmd(1994, 12, 31)), src).toBe(0);
      expect(offsetSecondsFromEpochMs(z, Date.UTC(2025, 0, 1)), src).toBe(14 * 3600);
    }
  });
});

describe("Lord Howe Island's 30-minute daylight saving (IANA tz data, Australia/Lord_Howe: +10:30 / +11:00)", () => {
  it('days of 23.5 and 24.5 hours on the first Sundays of October and April', () => {
    for (const [src, z] of both('Australia/Lord_Howe')) {
      for (let year = 2009; year <= 2035; year++) {
        const oct = dayNumberFromYmd(year, 10, nthWeekday(year, 10, SUNDAY, 1));
        const apr = dayNumberFromYmd(year, 4, nthWeekday(year, 4, SUNDAY, 1));
        expect(lengthMsOfDayNumber(z, oct) / HOUR, `${src} ${year}`).toBe(23.5);
        expect(lengthMsOfDayNumber(z, apr) / HOUR, `${src} ${year}`).toBe(24.5);
        expect(offsetSecondsFromEpochMs(z, Date.UTC(year, 0, 15))).toBe(11 * 3600);
        expect(offsetSecondsFromEpochMs(z, Date.UTC(year, 6, 15))).toBe(10.5 * 3600);
      }
    }
  });
});

describe('days that do not start at midnight (spring-forward at 00:00; IANA tz 2025b footers)', () => {
  // America/Santiago footer "<-04>4<-03>,M9.1.6/24,M4.1.6/24": daylight time from the first Saturday of
  // September at 24:00, so the next day starts at 01:00. America/Havana "CST5CDT,M3.2.0/0,...": the second
  // Sunday of March at 00:00. Asia/Beirut "EET-2EEST,M3.5.0/0,...": the last Sunday of March at 00:00.
  const cases: [string, number, number, number, number][] = [
    ['America/Santiago', 2025, 9, nthWeekday(2025, 9, 6, 1) + 1, -3],
    ['America/Havana', 2025, 3, nthWeekday(2025, 3, SUNDAY, 2), -4],
    ['Asia/Beirut', 2025, 3, nthWeekday(2025, 3, SUNDAY, -1), 3],
  ];
  for (const [id, y, m, d, offAfter] of cases) {
    it(`${id} ${y}-${m}-${d} starts at 01:00 and lasts 23 hours`, () => {
      for (const [src, z] of both(id)) {
        const dn = dayNumberFromYmd(y, m, d);
        const start = firstEpochMsOfDayNumber(z, dn);
        expect(start, src).toBe(Date.UTC(y, m - 1, d, 1) - offAfter * HOUR);
        const f = wallFieldsFromEpochMs(z, start);
        expect([f.hour, f.minute], src).toEqual([1, 0]);
        expect(lengthMsOfDayNumber(z, dn), src).toBe(23 * HOUR);
        expect(resolveWallMs(z, dn * 86_400_000).kind).toBe('gap');
      }
    });
  }
});

describe('offsets with seconds and odd minutes (IANA tz data)', () => {
  it('Asia/Kolkata used Madras time, +05:21:10, until 1906', () => {
    for (const [src, z] of both('Asia/Kolkata')) expect(offsetSecondsFromEpochMs(z, Date.UTC(1900, 0, 1)), src).toBe(5 * 3600 + 21 * 60 + 10);
  });
  it('Asia/Kathmandu +05:45 since 1986, America/St_Johns -03:30 / -02:30, Pacific/Chatham +12:45 / +13:45, Asia/Tehran +03:30', () => {
    for (const [id, jan, jul] of [
      ['Asia/Kathmandu', 20700, 20700],
      ['America/St_Johns', -12600, -9000],
      ['Pacific/Chatham', 49500, 45900],
      ['Asia/Tehran', 12600, 12600],
      ['America/Sao_Paulo', -10800, -10800],
    ] as const) {
      for (const [src, z] of both(id)) {
        expect(offsetSecondsFromEpochMs(z, Date.UTC(2025, 0, 15)), `${src} ${id}`).toBe(jan);
        expect(offsetSecondsFromEpochMs(z, Date.UTC(2025, 6, 15)), `${src} ${id}`).toBe(jul);
      }
    }
  });
  it('Antarctica/Troll: a two-hour daylight saving change, days of 22 and 26 hours (footer <+00>0<+02>-2,M3.5.0/1,M10.5.0/3)', () => {
    for (const [src, z] of both('Antarctica/Troll')) {
      expect(lengthMsOfDayNumber(z, dayNumberFromYmd(2025, 3, 30)) / HOUR, src).toBe(22);
      expect(lengthMsOfDayNumber(z, dayNumberFromYmd(2025, 10, 26)) / HOUR, src).toBe(26);
    }
  });
  it('America/Sao_Paulo: no daylight saving since 2019 (IANA tz data; Brazil decree 9,772 of 2019, from memory)', () => {
    for (const [src, z] of both('America/Sao_Paulo')) expect(listTransitions(z, Date.UTC(2019, 6, 1), Date.UTC(2030, 0, 1)), src).toEqual([]);
  });
});
