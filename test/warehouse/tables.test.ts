/**
 * The warehouse tables against outside references: the transition table's DST flag and abbreviations against
 * the IANA tz database's own (TZif files of tz 2025b, RFC 8536 section 3.2 "local time type records": isdst and
 * the abbreviation), the dimension's ISO week date against temporal-polyfill (ECMA-262 Temporal
 * `weekOfYear`/`yearOfWeek`), and the schedule against the recurrence layer; then the text formats (RFC 4180
 * CSV), the SQL options, and atomic writing.
 */
import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Temporal } from 'temporal-polyfill';
import {
  KalendsRangeError,
  calendarOfProfile,
  dayNumberFromYmd,
  defineProfile,
  dimensionTableFromProfile,
  formatExampleQueriesSql,
  formatLoadSql,
  formatPlainDate,
  formatTableCsv,
  formatTableJsonLines,
  isBusinessDay,
  listHolidays,
  listOccurrenceDayNumbers,
  ruleOfProfile,
  scheduleTableFromProfile,
  transitionTableFromZones,
  zoneFromRules,
  zoneFromTzif,
  type WarehouseTable,
} from '../../src/index.js';
import { parseTzif } from '../../src/zone/tzif.js';
import { writeFilesAtomically } from '../../src/warehouse/files.js';
import { fixtureBytes } from '../zone/helpers.js';

const profile = defineProfile(JSON.parse(readFileSync(new URL('../../examples/otterbrook.profile.json', import.meta.url), 'utf8')) as never);
const column = (t: WarehouseTable, name: string) => t.columns.find((c) => c.name === name)!.values as ArrayLike<unknown>;

describe('zone_offset_period against the tz database (TZif, tz 2025b)', () => {
  /** Rows whose DST flag differs from tz's isdst, by their first day; and abbreviation pairs (ours~tz) that differ. */
  function compare(id: string): { dst: string[]; abbreviations: string[] } {
    const bytes = fixtureBytes(id);
    const tz = parseTzif(bytes);
    const zone = zoneFromTzif(bytes, id);
    const last = tz.transitionsSeconds[tz.transitionsSeconds.length - 1]! * 1000;
    const t = transitionTableFromZones([zone], Date.UTC(1970, 0, 1), Math.min(Date.UTC(2037, 0, 1), last));
    const from = column(t, 'from_epoch_ms') as Float64Array;
    const dst = column(t, 'is_dst') as Uint8Array;
    const abbr = column(t, 'abbreviation') as (string | null)[];
    const out = { dst: [] as string[], abbreviations: new Set<string>() };
    for (let i = 0; i < t.rowCount; i++) {
      let k = -1;
      for (let j = 0; j < tz.transitionsSeconds.length && tz.transitionsSeconds[j]! * 1000 <= from[i]!; j++) k = j;
      const type = tz.types[tz.transitionTypes[k]!]!;
      if ((dst[i] === 1) !== type.isDst) out.dst.push(formatPlainDate(Math.floor(from[i]! / 86_400_000)));
      // tz writes numeric "abbreviations" (-03, +0530) where no English one is in use: not compared.
      if (!/^[+-]\d+$/.test(type.abbreviation) && abbr[i] !== type.abbreviation) out.abbreviations.add(`${abbr[i]}~${type.abbreviation}`);
    }
    return { dst: out.dst, abbreviations: [...out.abbreviations] };
  }

  it('equals tz on every offset period since 1970 in zones with ordinary summer time', () => {
    for (const id of ['America/New_York', 'Europe/Amsterdam', 'America/Sao_Paulo', 'America/Nuuk', 'Pacific/Chatham', 'Australia/Lord_Howe', 'Asia/Tehran']) {
      expect({ id, ...compare(id) }).toEqual({ id, dst: [], abbreviations: [] });
    }
  });

  it('differs from tz exactly where listed, each for its reason', () => {
    // Summer time kept for more than a year and a day is not DST by our rule: Cuba 2004-2006 (tz: Cuba rules),
    // Chile 2014-2016 (tz: Chile rules, "summer time" all year 2015).
    expect(compare('America/Havana')).toEqual({ dst: ['2004-03-28'], abbreviations: ['null~CST', 'null~CDT'] }); // the runtime has no English name for Cuba's time
    expect(compare('America/Santiago').dst).toEqual(['2014-09-07']);
    // Samoa's last summer ended with the date-line jump to a higher offset (tz: Pacific/Apia 2011-12-29).
    expect(compare('Pacific/Apia').dst).toEqual(['2011-09-24']);
    // Negative DST in tz's data: Irish Standard Time is the standard and winter GMT the saving (tz: Europe/Dublin
    // since 1971-10-31); Morocco's Ramadan hour at +00 is the saving (tz: Africa/Casablanca since 2019).
    const dublin = compare('Europe/Dublin');
    expect(dublin.dst.length).toBeGreaterThan(100);
    expect(dublin.dst[0]).toBe('1971-10-31');
    expect(dublin.abbreviations).toEqual(['null~IST']); // 1968-1971, "Irish Standard Time" all year
    const casablanca = compare('Africa/Casablanca');
    expect(casablanca.dst[0]).toBe('2019-05-05');
    expect(casablanca.dst.every((d) => d >= '2019-05-05')).toBe(true);
    // The runtime's names: British Standard Time 1968-1971 has none; St John's double daylight time of 1988 is NDT.
    expect(compare('Europe/London')).toEqual({ dst: [], abbreviations: ['null~BST'] });
    expect(compare('America/St_Johns')).toEqual({ dst: [], abbreviations: ['NDT~NDDT'] });
  });

  it('rows of a zone cover the range exactly once, in order, and a fixed offset is one row', () => {
    const start = Date.UTC(1990, 0, 1);
    const end = Date.UTC(2041, 0, 1);
    const t = transitionTableFromZones(['America/Chicago', 'Pacific/Auckland', '+05:30'], start, end);
    const zone = column(t, 'zone') as string[];
    const from = column(t, 'from_epoch_ms') as Float64Array;
    const to = column(t, 'to_epoch_ms') as Float64Array;
    for (const id of ['America/Chicago', 'Pacific/Auckland', '+05:30']) {
      const rows = [...zone.keys()].filter((i) => zone[i] === id);
      expect(from[rows[0]!]).toBe(start);
      expect(to[rows[rows.length - 1]!]).toBe(end);
      for (let k = 1; k < rows.length; k++) expect(from[rows[k]!]).toBe(to[rows[k - 1]!]);
    }
    expect(zone.filter((z) => z === '+05:30').length).toBe(1);
    // A zone the runtime's Intl does not know (rules given as data) has no abbreviation, and no error.
    const invented = zoneFromRules({ id: 'Test/Nowhere', initialOffsetSeconds: 3600, transitionsSeconds: [1e9], offsetsSeconds: [7200] });
    const own = transitionTableFromZones([invented], 0, 2e12);
    expect([column(own, 'offset_seconds'), column(own, 'abbreviation')].map((c) => Array.from(c))).toEqual([[3600, 7200], [null, null]]);
    expect(() => transitionTableFromZones([], start, end)).toThrow(TypeError);
    expect(() => transitionTableFromZones(['America/Chicgo'], start, end)).toThrow(/did you mean "America\/Chicago"/);
  });
});

describe('calendar_day', () => {
  const dim = dimensionTableFromProfile(profile, { start: '2023-01-01', end: '2027-01-01' });

  it('ISO week dates equal temporal-polyfill\'s (Temporal.PlainDate weekOfYear, yearOfWeek, dayOfWeek)', () => {
    const days = column(dim, 'day_number') as Int32Array;
    for (let i = 0; i < dim.rowCount; i++) {
      const p = Temporal.PlainDate.from(formatPlainDate(days[i]!));
      expect([column(dim, 'iso_week_year')[i], column(dim, 'iso_week')[i], column(dim, 'iso_weekday')[i]]).toEqual([p.yearOfWeek, p.weekOfYear, p.dayOfWeek]);
    }
  });

  it('business columns equal the business layer day by day, and holidays show on observed and actual dates', () => {
    const cal = calendarOfProfile(profile);
    const days = column(dim, 'day_number') as Int32Array;
    const flag = column(dim, 'is_business_day') as Uint8Array;
    const running = column(dim, 'business_day_ordinal') as Int32Array;
    let count = 0;
    for (let i = 0; i < dim.rowCount; i++) {
      const b = isBusinessDay(cal, days[i]!);
      if (b) count++;
      expect([flag[i] === 1, running[i]]).toEqual([b, count]);
    }
    const names = column(dim, 'holiday_name') as (string | null)[];
    const start = days[0]!;
    for (const h of listHolidays(cal, start, start + dim.rowCount)) {
      expect(names[h.dayNumber - start]).toContain(h.name);
      if (h.actualDayNumber >= start && h.actualDayNumber < start + dim.rowCount) expect(names[h.actualDayNumber - start]).toContain(h.name);
    }
    // Independence Day 2026 falls on a Saturday and is observed on Friday 3 July (5 U.S.C. 6103(b)).
    const i = dayNumberFromYmd(2026, 7, 3) - start;
    expect([names[i], formatPlainDate((column(dim, 'holiday_actual_date') as Int32Array)[i]!)]).toEqual(['Independence Day', '2026-07-04']);
  });

  it('flags the 53-week retail years (from memory: the 4-5-4 retail calendar\'s fiscal 2023 ended on 3 February 2024 after 53 weeks)', () => {
    const days = column(dim, 'day_number') as Int32Array;
    const flag = column(dim, 'retail_53_weeks') as Uint8Array;
    const label = column(dim, 'retail_year_label') as string[];
    const long = new Set<string>();
    for (let i = 0; i < dim.rowCount; i++) if (flag[i] === 1) long.add(label[i]!);
    expect([...long]).toEqual(['FY2023']);
    expect(formatPlainDate(days[label.lastIndexOf('FY2023')]!)).toBe('2024-02-03');
  });

  it('refuses a range beyond the calendar\'s years, or over the row limit', () => {
    expect(() => dimensionTableFromProfile(profile, { start: '1960-01-01', end: '1961-01-01' })).toThrow(/1971/);
    expect(() => dimensionTableFromProfile(profile, { start: '2000-01-01', end: '1999-01-01' })).toThrow(KalendsRangeError);
    expect(() => dimensionTableFromProfile(profile, { start: '2000-01-01', end: '2000-02-01', calendar: 'federl' })).toThrow(/did you mean "federal"/);
  });
});

describe('schedule_occurrence', () => {
  const t = scheduleTableFromProfile(profile, { start: '2026-01-01', end: '2027-01-01' });

  it('adjusted dates are the rule\'s occurrences, and each move names its holiday or weekend', () => {
    const rule = column(t, 'rule_name') as string[];
    const adjusted = column(t, 'adjusted_date') as Int32Array;
    const unadjusted = column(t, 'unadjusted_date') as Int32Array;
    for (const name of Object.keys(profile.rules)) {
      const mine = [...new Set([...rule.keys()].filter((i) => rule[i] === name).map((i) => adjusted[i]!))].sort((a, b) => a - b);
      const lib = listOccurrenceDayNumbers(ruleOfProfile(profile, name), '2026-01-01', '2027-01-01');
      // Adjusted dates near the range's ends may fall outside it (their unadjusted dates are inside).
      expect(mine.filter((d) => d >= dayNumberFromYmd(2026, 1, 3) && d < dayNumberFromYmd(2026, 12, 29))).toEqual(lib.filter((d) => d >= dayNumberFromYmd(2026, 1, 3) && d < dayNumberFromYmd(2026, 12, 29)));
    }
    const because = column(t, 'moved_because') as (string | null)[];
    const detail = column(t, 'moved_because_detail') as (string | null)[];
    const row = [...rule.keys()].find((i) => rule[i] === 'supplier-payments' && formatPlainDate(unadjusted[i]!) === '2026-02-15')!;
    // 2026-02-15 is a Sunday; modified following moves it to Tuesday 17 February past Washington's Birthday (the
    // third Monday of February, 5 U.S.C. 6103(a)): both causes are named, in the order the convention met them.
    expect([formatPlainDate(adjusted[row]!), because[row], detail[row]]).toEqual(['2026-02-17', 'holiday', "weekend: sunday; holiday: Washington's Birthday (2026-02-16)"]);
    // A move past a weekend alone says so: 2026-08-15 is a Saturday (ECMA-262 21.4.4.13 getUTCDay gives 6).
    expect(new Date(Date.UTC(2026, 7, 15)).getUTCDay()).toBe(6);
    const weekendRow = [...rule.keys()].find((i) => rule[i] === 'supplier-payments' && formatPlainDate(unadjusted[i]!) === '2026-08-15')!;
    expect([formatPlainDate(adjusted[weekendRow]!), because[weekendRow], detail[weekendRow]]).toEqual(['2026-08-17', 'weekend', 'weekend: saturday; weekend: sunday (2026-08-16)']);
  });
});

describe('text formats and SQL', () => {
  const table: WarehouseTable = {
    name: 't',
    rowCount: 2,
    description: 'two rows',
    columns: [
      { name: 's', type: 'string', values: ['a, "b"', null], description: '' },
      { name: 'd', type: 'date', values: Int32Array.of(0, 1), valid: Uint8Array.of(1, 0), description: '' },
      { name: 'b', type: 'boolean', values: Uint8Array.of(1, 0), description: '' },
      { name: 'm', type: 'int64', values: Float64Array.of(-1, 8.64e15), description: '' },
    ],
  };

  it('CSV quotes as RFC 4180 section 2 says, and writes NULL as an empty field', () => {
    expect(formatTableCsv(table)).toBe('s,d,b,m\n"a, ""b""",1970-01-01,true,-1\n,,false,8640000000000000\n');
  });

  it('JSON Lines keeps types and nulls', () => {
    expect(formatTableJsonLines(table).split('\n').map((l) => (l ? JSON.parse(l) : l))).toEqual([
      { s: 'a, "b"', d: '1970-01-01', b: true, m: -1 },
      { s: null, d: null, b: false, m: 8.64e15 },
      '',
    ]);
  });

  it('load SQL: PostgreSQL refuses Parquet, options are checked', () => {
    expect(() => formatLoadSql([table], { dialect: 'postgresql', format: 'parquet' })).toThrow(/CSV/);
    expect(() => formatLoadSql([table], { dialect: 'postgres' as never, format: 'csv' })).toThrow(/did you mean "postgresql"/);
    expect(formatLoadSql([table], { dialect: 'postgresql', format: 'csv', directory: '/data/' })).toContain("\\copy t FROM '/data/t.csv' WITH (FORMAT csv, HEADER true)");
    expect(() => formatLoadSql(null as never, { dialect: 'duckdb', format: 'csv' })).toThrow(TypeError);
    expect(() => formatLoadSql([table], undefined as never)).toThrow(TypeError);
    expect(() => formatExampleQueriesSql(table, { labelColumns: 'fiscal_quarter_label' as never })).toThrow(TypeError);
    expect(() => formatExampleQueriesSql(table, { labelColumns: ['nope'] })).toThrow(/no column "nope"/);
  });
});

describe('writing files atomically', () => {
  it('a failure leaves no partial file and no file under its final name, and says so', () => {
    const dir = mkdtempSync(join(tmpdir(), 'kalends-atomic-'));
    try {
      writeFileSync(join(dir, 'b.csv'), 'old');
      let error: Error | undefined;
      try {
        writeFilesAtomically(dir, [
          { name: 'a.csv', content: () => 'x\n' },
          { name: 'b.csv', content: () => 'y\n' },
          {
            name: 'c.parquet',
            content: () => {
              throw new Error('disk full (simulated)');
            },
          },
        ]);
      } catch (e) {
        error = e as Error;
      }
      expect(error?.message).toMatch(/failed and wrote nothing under its final names: disk full \(simulated\); removed the partial files/);
      expect(readdirSync(dir).sort()).toEqual(['b.csv']);
      expect(readFileSync(join(dir, 'b.csv'), 'utf8')).toBe('old');
      expect(writeFilesAtomically(dir, [{ name: 'a.csv', content: () => 'x\n' }])).toEqual([join(dir, 'a.csv')]);
      expect(existsSync(join(dir, 'a.csv'))).toBe(true);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
