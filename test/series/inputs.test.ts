/**
 * The input rules of docs/design.md ("Input rules", "Limits", "Errors") on every series function: options
 * objects (no null, no unknown key, no contradiction), row caps, fractions of a millisecond, bulk inputs, names
 * of calendars, and the ends of the supported range. Regression tests for issue 12 (defects 6, 8, 9, minor
 * items) and issue 13 (counting instants alone).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Temporal } from '@js-temporal/polyfill';
import {
  DefinitionError,
  KalendsRangeError,
  KalendsTypeError,
  MAX_BUCKET_PERIODS,
  MAX_SERIES_ROWS,
  UnknownCalendarError,
  alignSeries,
  bucketSeries,
  calendarFromName,
  columnOfSeries,
  defineBucketAccumulator,
  fillSeries,
  joinAsOf,
  lagSeries,
  leadSeries,
  matchAsOf,
  periodChangeFromBuckets,
  rollBulk,
  rollSeries,
  seriesFromBuckets,
  seriesFromColumns,
  seriesFromPairs,
  seriesFromRecords,
  seriesFromSeries,
  smoothSeries,
} from '../../src/index.js';
import { findRuns } from '../../src/series/bucket.js';
import { toUnit } from '../../src/period/index.js';
import { toZone } from '../../src/zone/index.js';

const DAY = 86_400_000;

/** The error `f` throws (or undefined). */
function thrown(f: () => unknown): (Error & { code?: string; path?: string }) | undefined {
  try {
    f();
  } catch (e) {
    return e as Error & { code?: string };
  }
  return undefined;
}

const s = seriesFromColumns([0, DAY, 2 * DAY], { v: [1, 2, 3] });
const table = bucketSeries(s, { unit: 'day', zone: 'UTC', aggregations: ['sum'] });

/**
 * Every series function that takes an options object, called with the given options in place of valid ones
 * (the other arguments valid). Adding a function with options to the layer means adding it here.
 */
const withOptions: Record<string, (options: unknown) => unknown> = {
  seriesFromColumns: (o) => seriesFromColumns([0], { v: [1] }, o as never),
  seriesFromRecords: (o) => seriesFromRecords([{ at: 0, value: 1 }], o as never),
  seriesFromPairs: (o) => seriesFromPairs([[0, 1]], o as never),
  bucketSeries: (o) => bucketSeries(s, o as never),
  defineBucketAccumulator: (o) => defineBucketAccumulator(o as never),
  'BucketAccumulator.finish': (o) => defineBucketAccumulator({ unit: 'day', zone: 'UTC', aggregations: ['sum'] }).finish(o as never),
  rollSeries: (o) => rollSeries(s, o as never),
  rollBulk: (o) => rollBulk(s.epochMs, s.columns.v!, o as never),
  smoothSeries: (o) => smoothSeries(s, o as never),
  lagSeries: (o) => lagSeries(s, { rows: 1 }, o as never),
  leadSeries: (o) => leadSeries(s, { rows: 1 }, o as never),
  periodChangeFromBuckets: (o) => periodChangeFromBuckets(table, o as never),
  matchAsOf: (o) => matchAsOf([0], [0], o as never),
  joinAsOf: (o) => joinAsOf(s, seriesFromColumns([0], { w: [1] }), o as never),
  alignSeries: (o) => alignSeries({ a: s }, o as never),
  fillSeries: (o) => fillSeries(s, o as never),
};

/** Valid options of each, to which one misspelled key is added. */
const validOptions: Record<string, Record<string, unknown>> = {
  seriesFromColumns: {},
  seriesFromRecords: {},
  seriesFromPairs: {},
  bucketSeries: { unit: 'day', zone: 'UTC', aggregations: ['sum'] },
  defineBucketAccumulator: { unit: 'day', zone: 'UTC', aggregations: ['sum'] },
  'BucketAccumulator.finish': {},
  rollSeries: { window: { rows: 2 }, aggregations: ['sum'] },
  rollBulk: { window: { rows: 2 }, aggregation: 'sum' },
  smoothSeries: { alpha: 0.5 },
  lagSeries: {},
  leadSeries: {},
  periodChangeFromBuckets: {},
  matchAsOf: {},
  joinAsOf: {},
  alignSeries: { unit: 'day', zone: 'UTC' },
  fillSeries: { grid: { epochMs: [0] } },
};

describe('options objects (docs/design.md, "Input rules"; issue 12, defect 6)', () => {
  for (const [name, call] of Object.entries(withOptions)) {
    it(`${name}: null and an array are a KalendsTypeError naming the options; a misspelled key is unknown-name`, () => {
      for (const bad of [null, [], 'x', 5]) {
        const e = thrown(() => call(bad));
        expect(e, `${name}(${String(bad)})`).toBeInstanceOf(KalendsTypeError);
        expect(e!.code).toBe('invalid-type');
        expect(e!.message).toMatch(/^options: expected .*, got /);
      }
      expect(thrown(() => call(validOptions[name]))).toBeUndefined();
      const e = thrown(() => call({ ...validOptions[name], colunm: 'v' }));
      if (name === 'defineBucketAccumulator') {
        // A define… function reports every fault of its definition at once.
        expect(e).toBeInstanceOf(DefinitionError);
        expect((e as DefinitionError).issues.map((i) => i.path)).toEqual(['colunm']);
      } else {
        expect(e).toBeInstanceOf(KalendsTypeError);
        expect(e!.code).toBe('unknown-name');
        expect(e!.message).toMatch(/^options\.colunm: unknown option/);
      }
    });
  }

  it('the misspellings of the issue are refused with the intended name suggested', () => {
    const e1 = thrown(() => bucketSeries(s, { unit: 'day', zone: 'UTC', aggregations: ['sum'], emtpy: 'zero' } as never));
    expect(e1).toMatchObject({ code: 'unknown-name', path: 'options.emtpy' });
    expect(e1!.message).toContain('did you mean "empty"?');
    const e2 = thrown(() => rollSeries(s, { window: { lengthMs: DAY }, aggregations: ['sum'], endInclusve: false } as never));
    expect(e2).toMatchObject({ code: 'unknown-name', path: 'options.endInclusve' });
    expect(e2!.message).toContain('did you mean "endInclusive"?');
    expect(thrown(() => periodChangeFromBuckets(table, null as never))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => matchAsOf([0], [0], null as never))).toBeInstanceOf(KalendsTypeError);
  });

  it('contradictory shapes are refused: a window with rows and lengthMs, a lag by rows and durationMs, a grid of two kinds', () => {
    const w = thrown(() => rollSeries(s, { window: { rows: 2, lengthMs: DAY } as never, aggregations: ['sum'] }));
    expect(w).toBeInstanceOf(KalendsTypeError);
    expect(w!.message).toBe('options.window: expected exactly one of "rows", "lengthMs", "span", "businessDays", got "rows" and "lengthMs"; keep one of them');
    expect(thrown(() => rollBulk(s.epochMs, s.columns.v!, { window: { rows: 2, lengthMs: DAY } as never, aggregation: 'sum' }))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => lagSeries(s, { rows: 1, durationMs: DAY } as never))!.message).toMatch(/^by: expected exactly one of/);
    expect(thrown(() => fillSeries(s, { grid: { epochMs: [0], unit: 'day', zone: 'UTC', range: { start: 0, end: 1 } } as never }))!.message).toMatch(
      /^options.grid: expected exactly one of "unit", "rule", "epochMs"/,
    );
    // A key of another window kind is not this kind's: zone means nothing to a window of rows.
    expect(thrown(() => rollSeries(s, { window: { rows: 2, zone: 'UTC' } as never, aggregations: ['sum'] }))).toMatchObject({ code: 'unknown-name', path: 'options.window.zone' });
    expect(thrown(() => smoothSeries(s, { alpha: 0.1, halfLife: 3 }))!.message).toMatch(/^options: expected exactly one of alpha, equivalentWindowRows, halfLife, halfLifeMs, got alpha and halfLife/);
  });

  it('edge options a window has no use for are refused, not ignored', () => {
    expect(thrown(() => rollSeries(s, { window: { rows: 2 }, aggregations: ['sum'], startInclusive: true }))).toMatchObject({
      code: 'unsupported',
      path: 'options.startInclusive',
    });
    const weekdays = { businessDays: 1, calendar: 'us-federal', zone: 'UTC' } as const;
    const s2025 = seriesFromColumns([Date.UTC(2025, 0, 2)], { v: [1] });
    expect(thrown(() => rollSeries(s2025, { window: weekdays, aggregations: ['sum'], startInclusive: false }))).toMatchObject({ code: 'unsupported' });
    expect(thrown(() => rollSeries(s2025, { window: weekdays, aggregations: ['sum'], startInclusive: true }))).toBeUndefined();
    // Before the years the calendar answers for, the error names the parameter, not an internal day number.
    const early = thrown(() => rollSeries(s, { window: weekdays, aggregations: ['sum'] }));
    expect(early).toMatchObject({ code: 'out-of-range', path: 'series.epochMs' });
    expect(early!.message).toMatch(/^series\.epochMs: the business days of calendar "us-federal" reach past the supported range \(.*\); keep the instants within the years 1971\.\.\d+ that it supports$/);
  });

  it('a window of rows with endInclusive false holds the rows before the row (as docs/series.md states)', () => {
    const r = seriesFromColumns([0, 1, 2, 3], { v: [1, 2, 4, 8] });
    // By hand: the two rows before rows 0..3 are {}, {1}, {1, 2}, {2, 4}.
    expect(Array.from(rollSeries(r, { window: { rows: 2 }, aggregations: ['sum'], endInclusive: false, minObservations: 0 }).columns.sum!)).toEqual([0, 1, 3, 6]);
  });

  it('enum, boolean and count options are checked: class and code by the kind of fault', () => {
    expect(thrown(() => bucketSeries(s, { unit: 'day', zone: 'UTC', aggregations: ['sum'], missing: 'drop' as never }))).toMatchObject({ code: 'unknown-name' });
    expect(thrown(() => rollSeries(s, { window: { lengthMs: DAY }, aggregations: ['sum'], endInclusive: 'no' as never }))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => rollSeries(s, { window: { rows: 2 }, aggregations: ['sum'], minObservations: 1.5 }))).toMatchObject({ code: 'out-of-range' });
    expect(thrown(() => rollSeries(s, { window: { rows: 2 }, aggregations: ['sum'], minObservations: '2' as never }))!.message).toContain('pass the number 2, not a string');
    expect(thrown(() => smoothSeries(s, { alpha: 0.5, form: 'adjusted' as never }))).toMatchObject({ code: 'unknown-name' });
    expect(thrown(() => seriesFromPairs([], { inputOrder: 'yes' as never }))).toMatchObject({ code: 'unknown-name' });
    expect(thrown(() => matchAsOf([0], [0], { toleranceMs: Number.NaN }))).toMatchObject({ code: 'out-of-range' });
    expect(thrown(() => fillSeries(s, { grid: { epochMs: [0] }, columns: ['w'] }))!.message).toMatch(/^options.columns\[0\]: no column named "w"; valid columns are "v"/);
    // An aggregation spec takes the keys of its kind only: q means nothing to a sum.
    expect(thrown(() => bucketSeries(s, { unit: 'day', zone: 'UTC', aggregations: [{ kind: 'sum', q: 0.5 } as never] }))).toMatchObject({
      code: 'unknown-name',
      path: 'options.aggregations[0].q',
    });
  });

  it('defineBucketAccumulator lists every fault of its definition, each with its path', () => {
    const e = thrown(() => defineBucketAccumulator({ unit: 'fortnight', zone: 'Mars/Olympus', aggregations: ['std', 'sum', { kind: 'quantile', q: 2 }], missing: 'drop', extra: 1 } as never));
    expect(e).toBeInstanceOf(DefinitionError);
    expect((e as DefinitionError).issues.map((i) => i.path)).toEqual(['extra', 'unit', 'zone', 'aggregations[0]', 'aggregations[2].q', 'missing']);
    expect((e as DefinitionError).issues[3]!.message).toContain('did you mean "stddev"');
  });
});

describe('row caps (docs/design.md, "Limits"; issue 12, defect 8)', () => {
  const tenThousandYears = { start: '1970-01-01', end: '+011970-01-01' };

  it('alignSeries and bucketSeries over 10,000 years of days refuse before building, saying how to page and what raises the cap', () => {
    const a = thrown(() => alignSeries({ a: s }, { unit: 'day', zone: 'UTC', range: tenThousandYears }));
    expect(a).toBeInstanceOf(KalendsRangeError);
    expect(a).toMatchObject({ code: 'limit-exceeded', path: 'options.range' });
    // 1970-01-01 to 11970-01-01: 10,000 Gregorian years of 365.2425 days (400-year cycles of 146,097 days).
    expect(a!.message).toBe(
      `options.range: a range of 3652425 periods of unit day gives 3652425 rows, more than the cap of ${MAX_SERIES_ROWS}; page with a narrower range or a coarser unit, or raise the cap with options.maxRows (up to ${MAX_BUCKET_PERIODS})`,
    );
    expect(thrown(() => bucketSeries(s, { unit: 'day', zone: 'UTC', aggregations: ['sum'], range: tenThousandYears }))).toMatchObject({ code: 'limit-exceeded' });
    expect(thrown(() => fillSeries(s, { grid: { unit: 'day', zone: 'UTC', range: tenThousandYears } }))).toMatchObject({ code: 'limit-exceeded', path: 'options.grid.range' });
    const acc = defineBucketAccumulator({ unit: 'day', zone: 'UTC', aggregations: ['count'] });
    expect(thrown(() => acc.finish({ range: tenThousandYears }))).toMatchObject({ code: 'limit-exceeded' });
    // Without a range, alignment spans the periods from the earliest row to the latest.
    const far = seriesFromColumns([0, 10_000 * 365.2425 * DAY], { v: [1, 2] });
    expect(thrown(() => alignSeries({ a: far }, { unit: 'day', zone: 'UTC' }))).toMatchObject({ code: 'limit-exceeded', path: 'series' });
    expect(alignSeries({ a: far }, { unit: 'year', zone: 'UTC' }).length).toBe(10_001);
  });

  it('maxRows lowers or raises the cap, up to MAX_BUCKET_PERIODS', () => {
    const range = { start: '2025-01-01', end: '2025-01-11' };
    expect(thrown(() => bucketSeries(s, { unit: 'day', zone: 'UTC', aggregations: ['sum'], range, maxRows: 9 }))).toMatchObject({ code: 'limit-exceeded' });
    expect(bucketSeries(s, { unit: 'day', zone: 'UTC', aggregations: ['sum'], range, maxRows: 10 }).length).toBe(10);
    expect(fillSeries(s, { grid: { unit: 'day', zone: 'UTC', range }, maxRows: 10 }).length).toBe(10);
    expect(thrown(() => fillSeries(s, { grid: { unit: 'day', zone: 'UTC', range }, maxRows: 9 }))).toMatchObject({ code: 'limit-exceeded' });
    expect(thrown(() => alignSeries({ a: s }, { unit: 'day', zone: 'UTC', maxRows: MAX_BUCKET_PERIODS + 1 }))).toMatchObject({ code: 'out-of-range', message: expect.stringMatching(/^options.maxRows: expected an integer from 1 to 50000000/) });
    expect(thrown(() => alignSeries({ a: s }, { unit: 'day', zone: 'UTC', maxRows: 0 }))).toBeInstanceOf(KalendsRangeError);
  });
});

describe('fractions of a millisecond (docs/design.md, "Input rules"; issue 12, defect 9)', () => {
  it('the constructors keep the fraction of an instant', () => {
    expect(Array.from(seriesFromColumns([1.5, -0.25], { v: [1, 2] }).epochMs)).toEqual([-0.25, 1.5]);
    expect(Array.from(seriesFromPairs([[1.5, 1]]).epochMs)).toEqual([1.5]);
    expect(Array.from(seriesFromRecords([{ at: 2.75, value: 1 }]).epochMs)).toEqual([2.75]);
  });

  it('-0.5 lies in the millisecond -1, on 1969-12-31 in UTC (ECMA-262 time value 0 is 1970-01-01T00:00Z)', () => {
    const f = seriesFromColumns([-0.5, 0, 0.5], { v: [1, 2, 4] });
    const t = bucketSeries(f, { unit: 'day', zone: 'UTC', aggregations: ['sum'] });
    expect([...t.labels]).toEqual(['1969-12-31', '1970-01-01']);
    expect(Array.from(t.columns.sum!)).toEqual([1, 6]);
    // Both ways of finding the runs agree on fractions.
    const unit = toUnit('day');
    const zone = toZone('UTC');
    for (const strategy of ['boundaries', 'bulk'] as const) {
      const runs = findRuns(f.epochMs, 0, 3, unit, zone, strategy);
      expect(Array.from(runs.ordinals.subarray(0, runs.count))).toEqual([-1, 0]);
    }
  });

  it('property: a fractional instant falls in the period of Math.floor(t), as @js-temporal/polyfill places that millisecond', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(fc.integer({ min: -3 * 366, max: 3 * 366 }), fc.integer({ min: -2, max: 2 }), fc.constantFrom(0.25, 0.5, 0.75)),
          { minLength: 1, maxLength: 40 },
        ),
        fc.constantFrom('day', 'month', 'iso-week'),
        fc.constantFrom('UTC', 'America/New_York', 'Asia/Kolkata'),
        (parts, unit, zone) => {
          // Instants a few milliseconds around local midnights, with a fraction.
          const times = parts.map(([d, ms, frac]) => Temporal.PlainDate.from('1970-01-01').add({ days: d }).toZonedDateTime(zone).epochMilliseconds + ms + frac);
          const table = bucketSeries(seriesFromColumns(times), { unit: unit as 'day', zone, aggregations: ['count'] });
          const expected = new Map<string, number>();
          for (const t of [...times].sort((a, b) => a - b)) {
            const z = Temporal.Instant.fromEpochMilliseconds(Math.floor(t)).toZonedDateTimeISO(zone);
            const p2 = (n: number) => String(n).padStart(2, '0');
            const label = unit === 'day' ? `${z.year}-${p2(z.month)}-${p2(z.day)}` : unit === 'month' ? `${z.year}-${p2(z.month)}` : `${z.yearOfWeek}-W${p2(z.weekOfYear!)}`;
            expected.set(label, (expected.get(label) ?? 0) + 1);
          }
          expect([...table.labels]).toEqual([...expected.keys()]);
          expect(Array.from(table.columns.count!)).toEqual([...expected.values()]);
        },
      ),
      { seed: 7601, numRuns: 150 },
    );
  });
});

describe('bulk inputs (docs/design.md, "Input rules"; issue 12, defect 2)', () => {
  it('a non-number in a plain array is named by its index, whatever the length of the array', () => {
    for (const n of [3, 2047, 2048, 5000]) {
      const times = Array.from({ length: n }, (_, i) => i as unknown);
      times[n - 1] = String(n - 1);
      const e = thrown(() => seriesFromColumns(times as number[]));
      expect(e).toBeInstanceOf(KalendsTypeError);
      expect(e!.message).toMatch(new RegExp(`^epochMs\\[${n - 1}\\]: expected a number, got "${n - 1}"`));
    }
    expect(thrown(() => seriesFromColumns([0, 1], { v: [1, null] as never }))!.message).toMatch(/^columns\.v\[1\]: expected a number, got null/);
    expect(thrown(() => seriesFromColumns([0, new Date(0)] as never))!.message).toMatch(/^epochMs\[1\]: expected a number, got a Date/);
    expect(thrown(() => matchAsOf([0, true] as never, [0]))!.message).toMatch(/^leftEpochMs\[1\]: expected a number, got true/);
    expect(thrown(() => fillSeries(s, { grid: { epochMs: [0, '1'] as never } }))!.message).toMatch(/^options\.grid\.epochMs\[1\]: expected a number/);
    expect(thrown(() => seriesFromSeries(s, { w: [1, 2, 'x'] as never }))!.message).toMatch(/^columns\.w\[2\]: expected a number, got "x"/);
    // Typed arrays of other kinds are read as numbers.
    expect(Array.from(seriesFromColumns(Int32Array.from([2, 1]), { v: Float32Array.from([0.5, 1.5]) }).columns.v!)).toEqual([1.5, 0.5]);
  });

  it('instants outside ±8.64e15 ms (ECMA-262, "Time Values and Time Range") are refused, naming the row', () => {
    expect(thrown(() => seriesFromColumns([0, 8.64e15 + 1]))).toMatchObject({ code: 'out-of-range', path: 'epochMs[1]' });
    expect(thrown(() => seriesFromColumns([0, Number.NaN]))!.message).toMatch(/^epochMs\[1\]: .*got NaN; remove or fill the row/);
  });
});

describe('business-day windows take a calendar by name (issue 12, minor)', () => {
  it("'us-federal' gives what calendarFromName('us-federal') gives; Independence Day is no business day (5 U.S.C. 6103)", () => {
    const noon = (y: number, m: number, d: number) => Date.UTC(y, m - 1, d, 16); // 12:00 in New York (EDT, UTC-4)
    const r = seriesFromColumns([noon(2025, 7, 2), noon(2025, 7, 3), noon(2025, 7, 4), noon(2025, 7, 7)], { v: [1, 2, 4, 8] });
    const byName = rollSeries(r, { window: { businessDays: 1, calendar: 'us-federal', zone: 'America/New_York' }, aggregations: ['sum'] });
    const compiled = rollSeries(r, { window: { businessDays: 1, calendar: calendarFromName('us-federal'), zone: 'America/New_York' }, aggregations: ['sum'] });
    expect(Array.from(byName.columns.sum!)).toEqual(Array.from(compiled.columns.sum!));
    // 4 July 2025 (a Friday) is a holiday, so its window starts on 3 July and holds the rows of 3 and 4 July.
    expect(Array.from(byName.columns.sum!)).toEqual([1, 2, 6, 8]);
    const lag = lagSeries(r, { businessDays: 1, calendar: 'us-federal', zone: 'America/New_York' });
    // The business day before Monday 7 July is Thursday 3 July.
    expect(lag.columns.lag![3]).toBe(2);
    const e = thrown(() => rollSeries(r, { window: { businessDays: 1, calendar: 'us-fedral', zone: 'UTC' }, aggregations: ['sum'] }));
    expect(e).toBeInstanceOf(UnknownCalendarError);
    expect(e!.message).toMatch(/^options.window.calendar: unknown calendar "us-fedral"; did you mean "us-federal"/);
    expect(thrown(() => lagSeries(r, { businessDays: 1, calendar: 5 as never, zone: 'UTC' }))!.message).toMatch(/^by.calendar: expected a bundled calendar name/);
  });
});

describe('the ends of the supported range (issue 12, minor: the zone day range surfaced in bucketSeries)', () => {
  it('bucketing instants at the ends either works or throws a typed error that names the parameter', () => {
    const edges = [-8.64e15, -8.64e15 + 1, -8.64e15 + 3 * DAY, 8.64e15 - 3 * DAY, 8.64e15 - 1, 8.64e15];
    let worked = 0;
    for (const zone of ['UTC', 'America/New_York', '+14:00', '-12:00']) {
      for (const unit of ['day', 'month', 'year', 'iso-week']) {
        for (const t of edges) {
          const e = thrown(() => {
            const b = bucketSeries(seriesFromColumns([t], { v: [1] }), { unit: unit as 'day', zone, aggregations: ['sum'] });
            expect(b.columns.sum![0]).toBe(1);
          });
          if (e === undefined) worked++;
          else {
            expect(e, `${zone} ${unit} ${t}: ${e.message}`).toBeInstanceOf(KalendsRangeError);
            expect(e.message).toMatch(/^series\.epochMs: /);
            expect(e.code).toBe('out-of-range');
          }
        }
      }
    }
    // Instants three days inside the ends bucket by day in UTC whatever the zone layer's day range.
    expect(worked).toBeGreaterThan(0);
  });
});

describe('a series of instants alone: counting events per period (issue 13)', () => {
  // Three events in March 2025 and one in April, Chicago local time (CST UTC-6 until 9 March, then CDT UTC-5).
  const events = ['2025-03-01T08:00:00-06:00', '2025-03-14T23:30:00-05:00', '2025-03-31T23:59:59-05:00', '2025-04-01T00:00:00-05:00'];
  const epochs = events.map((e) => Temporal.Instant.from(e).epochMilliseconds);

  it('seriesFrom* build it, and bucketSeries counts the events per month', () => {
    const a = seriesFromColumns(epochs);
    const b = seriesFromRecords(events.map((at) => ({ at })), { columns: [] });
    for (const x of [a, b]) {
      expect(x.columnNames).toEqual([]);
      const monthly = bucketSeries(x, { unit: 'month', zone: 'America/Chicago', aggregations: ['count', 'rows'] });
      expect([...monthly.labels]).toEqual(['2025-03', '2025-04']);
      expect(Array.from(monthly.columns.count!)).toEqual([3, 1]);
      expect(Array.from(monthly.columns.rows!)).toEqual([3, 1]);
    }
    const rolled = rollSeries(a, { window: { lengthMs: 20 * DAY }, aggregations: ['count'] });
    expect(Array.from(rolled.columns.count!)).toEqual([1, 2, 2, 3]);
  });

  it('an aggregation that needs a value column says so', () => {
    const e = thrown(() => bucketSeries(seriesFromColumns(epochs), { unit: 'month', zone: 'UTC', aggregations: ['count', 'sum'] }));
    expect(e).toMatchObject({ code: 'unsupported', path: 'options.aggregations[1]' });
    expect(e!.message).toBe(
      'options.aggregations[1]: "sum" needs a value column, and the series holds instants alone; use "count" or "rows" to count its rows, or build the series with a value column',
    );
    expect(thrown(() => columnOfSeries(seriesFromColumns(epochs)))!.message).toMatch(/^column: the series holds instants alone/);
    expect(thrown(() => smoothSeries(seriesFromColumns(epochs), { alpha: 0.5 }))!.message).toMatch(/^options.column: the series holds instants alone/);
    expect(thrown(() => alignSeries({ a: seriesFromColumns(epochs) }, { unit: 'month', zone: 'UTC' }))!.message).toMatch(/^options.aggregation: "last" needs a value column/);
    expect(Array.from(alignSeries({ a: seriesFromColumns(epochs) }, { unit: 'month', zone: 'America/Chicago', aggregation: 'count' }).columns.a!)).toEqual([3, 1]);
  });
});

describe('seriesFromSeries (was withColumn)', () => {
  it('adds and replaces columns on the same instants, sharing the others', () => {
    const base = seriesFromColumns([0, 1], { a: [1, 2], b: [3, 4] });
    const out = seriesFromSeries(base, { b: [30, 40], c: Float32Array.from([5, 6]) });
    expect(out.columnNames).toEqual(['a', 'b', 'c']);
    expect(out.epochMs).toBe(base.epochMs);
    expect(out.columns.a).toBe(base.columns.a);
    expect(Array.from(out.columns.b!)).toEqual([30, 40]);
    expect(Array.from(base.columns.b!)).toEqual([3, 4]);
    expect(Array.from(out.columns.c!)).toEqual([5, 6]);
    expect(thrown(() => seriesFromSeries(base, null as never))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => seriesFromSeries(base, { c: [1] }))).toMatchObject({ code: 'length-mismatch', path: 'columns.c' });
  });

  it('seriesFromBuckets keeps working on the table of instants alone', () => {
    const t = bucketSeries(seriesFromColumns([0, 1, DAY]), { unit: 'day', zone: 'UTC', aggregations: ['count'] });
    expect(Array.from(seriesFromBuckets(t).columns.count!)).toEqual([2, 1]);
  });
});
