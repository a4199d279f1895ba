/**
 * Bad input to the hours layer: each a typed error (class and code as docs/design.md, "Errors", states them)
 * whose message names the parameter or definition path and quotes the value received.
 */
import { describe, expect, it } from 'vitest';
import {
  DefinitionError,
  type HoursDefinition,
  KalendsRangeError,
  KalendsSyntaxError,
  KalendsTypeError,
  NoSessionError,
  countBusinessMs,
  countBusinessMsBulk,
  defineHours,
  durationFromFields,
  isOpen,
  isOpenBulk,
  listSessions,
  nextOpeningEpochMs,
  parseDuration,
  shiftBusinessTime,
  shiftBusinessTimeBulk,
  valueDayNumberOfEpochMs,
} from '../../src/index.js';

const OFFICE = { monday: [{ open: '09:00', close: '17:00' }], tuesday: [{ open: '09:00', close: '17:00' }] };
const base: HoursDefinition = { zone: 'Europe/London', week: OFFICE };

/** The issues of the DefinitionError a definition throws, as "path: message". */
function issuesOf(def: unknown): string[] {
  try {
    defineHours(def as HoursDefinition);
  } catch (e) {
    expect(e).toBeInstanceOf(DefinitionError);
    expect((e as DefinitionError).code).toBe('invalid-definition');
    return (e as DefinitionError).issues.map((i) => `${i.path}: ${i.message}`);
  }
  throw new Error('expected a DefinitionError');
}

function thrown(f: () => unknown): Error & { code?: string; path?: string } {
  try {
    f();
  } catch (e) {
    return e as Error & { code?: string };
  }
  throw new Error('expected an error');
}

describe('definitions: every fault at its path, quoting the value', () => {
  it('overlapping intervals on one day', () => {
    const issues = issuesOf({ ...base, week: { monday: [{ open: '09:00', close: '13:00' }, { open: '12:30', close: '17:00' }] } });
    expect(issues).toEqual([expect.stringMatching(/^week\.monday\[1\]: overlaps week\.monday\[0\] \(09:00-13:00\): intervals of one day must not overlap \(12:30-17:00\)$/)]);
  });

  it('an overnight interval running into the next weekday', () => {
    const issues = issuesOf({ ...base, week: { monday: [{ open: '20:00', close: '04:00' }], tuesday: [{ open: '02:00', close: '10:00' }] } });
    expect(issues).toEqual([expect.stringMatching(/^week\.tuesday\[0\]: overlaps the overnight interval week\.monday\[0\] \(20:00-04:00 the next day\)/)]);
  });

  it('an interval of zero length, with the 24-hour spelling as the fix', () => {
    const issues = issuesOf({ ...base, week: { monday: [{ open: '09:00', close: '09:00' }] } });
    expect(issues).toEqual([expect.stringMatching(/^week\.monday\[0\]: an interval of zero length \(open and close both "09:00"\); a 24-hour session is written \{ "open": "00:00", "close": "24:00" \}$/)]);
  });

  it('malformed and out-of-range wall times', () => {
    const issues = issuesOf({ ...base, week: { monday: [{ open: '9:00', close: '17:00' }, { open: '24:00', close: '25:00' }] } });
    expect(issues).toEqual([
      expect.stringMatching(/^week\.monday\[0\]\.open: expected a wall-clock time "HH:MM" or "HH:MM:SS" .* got "9:00"$/),
      expect.stringMatching(/^week\.monday\[1\]\.open: expected a wall-clock time from 00:00 to 23:59:59, got "24:00"$/),
      expect.stringMatching(/^week\.monday\[1\]\.close: expected a wall-clock time from 00:00 to 24:00, got "25:00"$/),
    ]);
  });

  it('a cut-off outside all sessions is refused, unless the definition allows it', () => {
    const def = { ...base, cutoffs: { payments: '17:30' } };
    expect(issuesOf(def)).toEqual([
      expect.stringMatching(/^cutoffs\.payments: 17:30 is outside every session of Monday \(09:00-17:00\); move it within them, or set "allowCutoffsOutsideSessions": true/),
      expect.stringMatching(/^cutoffs\.payments: 17:30 is outside every session of Tuesday/),
    ]);
    expect(defineHours({ ...def, allowCutoffsOutsideSessions: true }).cutoffNames).toEqual(['payments']);
    // At the close is inside (the close instant is the session's end).
    expect(defineHours({ ...base, cutoffs: { payments: '17:00' } }).cutoffNames).toEqual(['payments']);
    // An early close that leaves the cut-off outside names the special day and the fix.
    const early = issuesOf({ ...base, cutoffs: { payments: '16:00' }, special: [{ date: '2025-12-23', close: '13:00' }] });
    expect(early).toEqual([expect.stringMatching(/^special\[0\]: the cut-off "payments" at 16:00 is outside the sessions of 2025-12-23 \(09:00-13:00\); give "cutoffs": \{ "payments": a time within them \}/)]);
  });

  it('a special day for a date outside the calendar\'s years', () => {
    const issues = issuesOf({ ...base, calendar: 'us-federal', week: OFFICE, special: [{ date: '1965-07-05', closed: true }] });
    expect(issues).toEqual([expect.stringMatching(/^special\[0\]\.date: "1965-07-05" is outside the years 1971\.\.275759 of these hours; the calendar "us-federal" answers for 1971\.\.275760/)]);
    expect(issuesOf({ ...base, years: { from: 2020, until: 2030 }, special: [{ date: '2031-01-06', closed: true }] })).toEqual([
      expect.stringMatching(/^special\[0\]\.date: "2031-01-06" is outside the years 2020\.\.2030 of these hours/),
    ]);
    expect(issuesOf({ ...base, calendar: 'us-federal', years: { from: 1960 } })).toEqual([
      expect.stringMatching(/^years\.from: expected an integer year from 1971 to 275759 \(the years of calendar "us-federal"\), got 1960$/),
    ]);
  });

  it('special days: one selector, a known holiday, a real early close, one entry per date', () => {
    const issues = issuesOf({
      ...base,
      calendar: 'england-and-wales',
      special: [
        { date: '2025-12-24', holiday: 'Christmas Day', closed: true },
        { holiday: 'Christmass Day', offset: -1, close: '13:00' },
        { date: '2025-12-23', close: '18:00' },
        { date: '2025-12-22', closed: true },
        { date: '2025-12-22', closed: true },
        { date: '2025-12-27', close: '13:00' },
        { date: '2025-12-29' },
      ],
    });
    expect(issues).toEqual([
      expect.stringMatching(/^special\[0\]: expected exactly one of "date" .* or "holiday"/),
      expect.stringMatching(/^special\[1\]\.holiday: no holiday of calendar "england-and-wales" is named "Christmass Day" \(by name or rule id\) in 1995\.\.2194; did you mean "Christmas Day" or "christmas-day"\?$/),
      expect.stringMatching(/^special\[4\]\.date: 2025-12-22 is already a special day at special\[3\]/),
      expect.stringMatching(/^special\[6\]: expected what changes on the day/),
      expect.stringMatching(/^special\[2\]\.close: 18:00 is not an early close: the regular hours of 2025-12-23 \(Tuesday\) are 09:00-17:00$/),
      expect.stringMatching(/^special\[5\]: there are no regular hours on 2025-12-27 \(Saturday, not a business day of calendar "england-and-wales"\) to open late or close early/),
    ]);
  });

  it('unknown fields, zones, calendars and policies get suggestions', () => {
    const issues = issuesOf({ zone: 'Europe/Londn', calendar: 'us-fedral', week: { mondy: [] }, disambiguation: 'earliest', cutofs: {} });
    expect(issues).toEqual([
      expect.stringMatching(/^cutofs: unknown field; did you mean "cutoffs"\?/),
      expect.stringMatching(/^zone: unknown time zone "Europe\/Londn".*did you mean "Europe\/London"/),
      expect.stringMatching(/^calendar: unknown calendar "us-fedral"; did you mean "us-federal"\?/),
      expect.stringMatching(/^disambiguation: expected one of "compatible", "earlier", "later", "reject", got "earliest"; did you mean "earlier"\?$/),
      expect.stringMatching(/^week\.mondy: unknown field; did you mean "monday"\?/),
    ]);
  });

  it('hours that never open, and weekday intervals that a calendar weekend always closes', () => {
    expect(issuesOf({ zone: 'UTC', week: {} })).toEqual([expect.stringMatching(/^week: no weekday has an opening interval and no special day adds one/)]);
    expect(issuesOf({ zone: 'UTC', calendar: 'us-federal', week: { saturday: [{ open: '10:00', close: '14:00' }] } })).toEqual([
      expect.stringMatching(/^week\.saturday: Saturday is a weekend day of calendar "us-federal", so these intervals would never apply/),
    ]);
  });

  it('not a definition at all', () => {
    expect(issuesOf(null)).toEqual([expect.stringMatching(/^\(definition\): expected a definition of hours \{ zone, week, \.\.\. \}, got null$/)]);
  });
});

describe('queries: typed errors naming the parameter', () => {
  const hours = defineHours({ ...base, cutoffs: { payments: '16:00' }, years: { from: 2020, until: 2030 } });
  const monday = Date.UTC(2025, 2, 31, 8);

  it('a business duration with calendar fields is refused, and says why', () => {
    for (const d of ['P1D', 'P1W', 'P1M', 'P1DT2H']) {
      const e = thrown(() => shiftBusinessTime(hours, monday, d));
      expect(e).toBeInstanceOf(KalendsRangeError);
      expect(e.code).toBe('unsupported');
      expect(e.message).toMatch(new RegExp(`^duration: "${d}" has calendar fields \\(.*\\); business time is elapsed time, and a business day has no fixed length here`));
      expect(e.message).toMatch(/Write the elapsed time, such as "PT8H", or move whole business days with shiftBusinessDays$/);
    }
    expect(thrown(() => shiftBusinessTime(hours, monday, durationFromFields({ days: 1 }))).message).toMatch(/^duration: the duration has calendar fields \(days\)/);
    expect(thrown(() => shiftBusinessTime(hours, monday, 'PT8'))).toBeInstanceOf(KalendsSyntaxError);
    expect(thrown(() => shiftBusinessTime(hours, monday, {} as never))).toBeInstanceOf(KalendsTypeError);
    expect(shiftBusinessTime(hours, monday, parseDuration('PT8H'))).toBe(Date.UTC(2025, 2, 31, 16));
    expect(thrown(() => shiftBusinessTimeBulk(hours, [monday], 'P1D')).code).toBe('unsupported');
  });

  it('a range with no session at all within the search limit is a NoSessionError, never a hang', () => {
    const rare = defineHours({ zone: 'UTC', week: {}, special: [{ date: '2045-06-05', hours: [{ open: '09:00', close: '10:00' }] }] });
    const e = thrown(() => nextOpeningEpochMs(rare, Date.UTC(2025, 0, 1)));
    expect(e).toBeInstanceOf(NoSessionError);
    expect(e).toBeInstanceOf(RangeError);
    expect(e.code).toBe('no-business-day');
    expect(e.message).toMatch(/^epochMs: no opening within 3660 days after 2025-01-01T00:00:00Z \(the search limit, HOURS_SEARCH_LIMIT_DAYS\)/);
    expect(nextOpeningEpochMs(rare, Date.UTC(2040, 0, 1))).toBe(Date.UTC(2045, 5, 5, 9));
    expect(thrown(() => shiftBusinessTime(rare, Date.UTC(2025, 0, 1), 'PT1H'))).toBeInstanceOf(NoSessionError);
    expect(thrown(() => valueDayNumberOfEpochMs(defineHours({ zone: 'UTC', week: {}, special: [{ date: '2045-06-05', hours: [{ open: '09:00', close: '10:00' }] }], cutoffs: { x: '09:30' } }), Date.UTC(2025, 0, 1), 'x'))).toBeInstanceOf(NoSessionError);
  });

  it('past the hours\' years: out-of-range, naming the years', () => {
    const e = thrown(() => isOpen(hours, Date.UTC(2031, 0, 2)));
    expect(e.code).toBe('out-of-range');
    expect(e.message).toMatch(/^epochMs: 2031-01-02T00:00:00Z \(1925078400000\) is outside the years 2020\.\.2030 that these hours answer for/);
    expect(thrown(() => nextOpeningEpochMs(hours, Date.UTC(2030, 11, 31, 18))).message).toMatch(/^epochMs: no opening after 2030-12-31T18:00:00Z within the years 2020\.\.2030/);
    expect(thrown(() => shiftBusinessTime(hours, Date.UTC(2030, 11, 1), 'PT800H')).message).toMatch(/ends after the years 2020\.\.2030 .*business time passes no faster than elapsed time/);
    expect(thrown(() => shiftBusinessTime(hours, Date.UTC(2030, 11, 1), 'PT300H')).message).toMatch(/^duration: 1080000000 ms of business time from 2030-12-01T00:00:00Z run past the years 2020\.\.2030/);
  });

  it('not compiled hours, unknown cut-offs, bad options', () => {
    expect(thrown(() => isOpen(base as never, monday)).message).toMatch(/^hours: expected opening hours from defineHours\(definition\), got an object; compile the definition first with defineHours\(definition\)$/);
    const c = thrown(() => valueDayNumberOfEpochMs(hours, monday, 'payment'));
    expect([c.code, c.message]).toEqual(['unknown-name', 'cutoff: unknown cut-off "payment"; did you mean "payments"?; the cut-offs of these hours are one of "payments"']);
    expect(thrown(() => nextOpeningEpochMs(hours, monday, { inclusve: true } as never)).code).toBe('unknown-name');
    expect(thrown(() => nextOpeningEpochMs(hours, monday, { inclusive: 'yes' } as never))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => isOpen(hours, '2025-03-31T08:00Z' as never)).message).toMatch(/parseInstant\(text\)\.epochMs/);
    expect(thrown(() => countBusinessMs(hours, monday, Number.NaN)).message).toMatch(/^endEpochMs: expected epoch milliseconds/);
  });

  it('lists are capped with a limit that says how to page; one call spans at most 400 years', () => {
    const e = thrown(() => listSessions(hours, Date.UTC(2021, 0, 1), Date.UTC(2022, 0, 1), { limit: 50 }));
    expect(e.code).toBe('limit-exceeded');
    expect(e.message).toBe('options.limit: the range holds 104 sessions, more than the limit 50; narrow the range, or page: call again with startEpochMs set to the endEpochMs of the last session returned');
    const wide = defineHours({ zone: 'UTC', week: OFFICE, years: { from: 1600, until: 2100 } });
    expect(thrown(() => countBusinessMs(wide, Date.UTC(1601, 0, 1), Date.UTC(2099, 0, 1))).message).toMatch(/more than the 400 years one call may cover; split the call/);
  });

  it('bulk inputs: non-numbers and instants outside the years name their index; lengths must agree', () => {
    expect(thrown(() => isOpenBulk(hours, [monday, '1'] as never)).message).toMatch(/^epochMs\[1\]: expected a number, got "1"/);
    expect(thrown(() => isOpenBulk(hours, Float64Array.of(monday, Number.NaN))).message).toMatch(/^epochMs\[1\]: NaN \(NaN\) is outside the years 2020\.\.2030/);
    expect(thrown(() => countBusinessMsBulk(hours, [monday], [monday, monday])).code).toBe('length-mismatch');
    expect(thrown(() => countBusinessMsBulk(hours, [monday], [monday], new Float32Array(1) as never))).toBeInstanceOf(KalendsTypeError);
  });
});
