/**
 * The defect checklist of issue 12 ("No silent wrong answer, no unbounded work"): one `describe` per defect (1-10
 * and the minor ones). Each names the regression tests that fail on 0.1's behaviour, by file and test name, and
 * checks that those tests still exist under those names (a renamed or deleted regression test fails here, so the
 * list cannot drift). Where no test existed, the regression test is written here.
 *
 * The adversarial suite itself (surface, valid, sweep, fuzz in this folder) guards every entry point against the
 * whole class of each defect: hostile numbers (defect 9), non-numbers in bulk input (2), enum and option values (3,
 * 6), Object.prototype names (7) and unbounded work (5, 8, 10, under the watchdog).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { defineRule, formatPlainDate, listOccurrenceDayNumbers } from '../../src/index.js';
import { cli } from '../cli/helpers.js';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));

/** A regression test elsewhere: its file (from the repository root) and the start of its name as written. */
interface Elsewhere {
  readonly file: string;
  readonly name: string;
}

const at = (file: string, name: string): Elsewhere => ({ file, name });

/** One `it` that checks that each listed test is still in its file, under that name. */
function pointsTo(tests: readonly Elsewhere[]): void {
  it(`the regression tests are in place: ${tests.map((t) => `${t.file} > ${t.name}`).join('; ')}`, () => {
    const missing = tests.filter((t) => {
      const text = readFileSync(`${ROOT}${t.file}`, 'utf8');
      return ![`it('${t.name}`, `it("${t.name}`, `it(\`${t.name}`, `describe('${t.name}`].some((s) => text.includes(s));
    });
    expect(missing.map((t) => `${t.file}: no test named "${t.name}"`)).toEqual([]);
  });
}

describe('defect 1: count with a business-day convention (0.1: a bogus limit-exceeded)', () => {
  pointsTo([
    at('test/recurrence/business.test.ts', 'the issue 12 reproduction: 12 payments on the 15th, moved by following on the US federal calendar'),
    at('test/recurrence/business.test.ts', 'the first `count` raw dates from start, each adjusted (ISDA 2006 section 4.12 by adjustDayNumber), equal the occurrences'),
  ]);

  it('the CLI schedule lists the same 12 payments (0.1 failed the same way as defineRule)', async () => {
    const json = '{"kind":"monthly","on":{"day":15},"calendar":"us-federal","convention":"following","start":"2025-01-01","count":12}';
    const r = await cli(['schedule', json, '--from', '2025-01-01', '--to', '2026-01-01', '--json']);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const dates = r.out.trim().split('\n').map((l) => (JSON.parse(l) as { date: string }).date);
    // The library's answer, itself checked against a brute-force stepper in test/recurrence/business.test.ts.
    const rule = defineRule({ kind: 'monthly', on: { day: 15 }, calendar: 'us-federal', convention: 'following', start: '2025-01-01', count: 12 });
    expect(dates).toEqual(listOccurrenceDayNumbers(rule, '2025-01-01', '2026-01-01').map(formatPlainDate));
    expect(dates).toHaveLength(12);
    // Saturday 2025-02-15 moves past Washington's Birthday, Monday 2025-02-17 (5 U.S.C. 6103), to the 18th.
    expect(dates[1]).toBe('2025-02-18');
  });
});

describe('defect 2: bulk conversions read non-numbers as numbers, depending on the array length', () => {
  pointsTo([
    at('test/zone/inputs.test.ts', 'the issue 12 reproduction: 2,047 and 2,048 numeric strings are both refused at index 0'),
    at('test/zone/inputs.test.ts', 'a hole is named; typed arrays are read as they are'),
    at('test/period/inputs.test.ts', 'period bulk inputs: non-numbers in plain arrays, whatever the length'),
    at('test/series/inputs.test.ts', 'a non-number in a plain array is named by its index, whatever the length of the array'),
  ]);
});

describe('defect 3: enum options changed behaviour silently', () => {
  pointsTo([
    at('test/instant/options.test.ts', 'parsePlainDateTime offset: a foreign value does not drop the offset'),
    at('test/instant/options.test.ts', 'parseInstant leapSecond: a misspelling does not accept the leap second'),
    at('test/instant/options.test.ts', 'shift overflow and toDayNumber dateFields'),
    at('test/series/inputs.test.ts', 'enum, boolean and count options are checked: class and code by the kind of fault'),
  ]);
});

describe('defect 4: the CLI overflowed the stack on long stdin', () => {
  pointsTo([
    at('test/cli/streams.test.ts', 'streams 1,000,000 instants through zone-at as a table: one row each, in order, bounded memory'),
    at('test/cli/streams.test.ts', 'streams 200,000 lines of stdin through a value-per-line command'),
    // holidays over the whole range streams (it is read until the pipe closes)
    at('test/cli/streams.test.ts', 'a reader that closes the pipe early (| head) ends a long listing quietly with exit code 0'),
  ]);
});

describe('defect 5: large counts were expanded eagerly', () => {
  pointsTo([
    at('test/recurrence/limits.test.ts', 'a count of 10,000,000 days, Mondays (RFC 5545 text) and weeks ends where Temporal arithmetic says'),
    at('test/recurrence/limits.test.ts', 'where the count ends agrees with listing for every locatable kind (random rules and counts, seeded)'),
    at('test/recurrence/limits.test.ts', 'counts that must be found by listing are bounded at 100,000 and say what to do; a fiscal count no longer fails inside'),
  ]);
});

describe('defect 6: limits and options objects were not validated', () => {
  pointsTo([
    at('test/recurrence/limits.test.ts', 'maxCount: Infinity, NaN, -1, 0, 1.5 and "5" are refused with typed errors (0.1 ran 14 s on Infinity)'),
    at('test/recurrence/limits.test.ts', 'options objects: null and arrays are refused, an unknown key is refused with a suggestion, enums are checked'),
    at('test/zone/inputs.test.ts', 'null options are a KalendsTypeError (listTransitions, zoneFromId, zoneFromTzif)'),
    at('test/series/inputs.test.ts', 'the misspellings of the issue are refused with the intended name suggested'),
    at('test/series/inputs.test.ts', 'contradictory shapes are refused: a window with rows and lengthMs'),
    at('test/instant/options.test.ts', 'names an unknown key with the nearest valid one'),
  ]);
});

describe('defect 7: Object.prototype names passed calendar validation', () => {
  pointsTo([
    at('test/business/definition.test.ts', 'names every object inherits are never taken for a rule kind, an observance, a weekday or a calendar'),
    at('test/recurrence/limits.test.ts', 'a "__proto__" key read from JSON stays a key and is refused; inherited names are no rule kinds'),
  ]);
});

describe('defect 8: unbounded CLI work', () => {
  pointsTo([
    at('test/cli/streams.test.ts', '200,000 bad lines: zone-changes names the first'),
    at('test/cli/streams.test.ts', 'one 10 MB line is refused unread by a value command and stops bucket, exit code 1, no stack'),
    at('test/zone/cli.test.ts', 'bounds work: at most the stated number of refused zone ids, each suggestion on bounded text'),
    at('test/series/cli.test.ts', '--range over more periods than the threshold needs --max-rows, named in the message'),
    at('test/series/inputs.test.ts', 'alignSeries and bucketSeries over 10,000 years of days refuse before building, saying how to page and what raises the cap'),
  ]);
});

describe('defect 9: fractional instants (one rule: an instant lies within millisecond Math.floor(t))', () => {
  pointsTo([
    at('test/zone/inputs.test.ts', '-0.5 is on 1969-12-31 in UTC, and its fields are those of millisecond -1'),
    at('test/zone/inputs.test.ts', 'agrees with temporal-polyfill on random fractional instants (property)'),
    at('test/zone/denormal.test.ts', 'dayNumberFromEpochMs and its bulk form'),
    at('test/hours/denormal.test.ts', 'isOpen and isOpenBulk answer for 1969-12-31 (open), as for -1 ms'),
    at('test/period/inputs.test.ts', '-0.5 is in December 1969 in UTC (and in bulk)'),
    at('test/series/inputs.test.ts', 'the constructors keep the fraction of an instant'),
    at('test/instant/options.test.ts', 'text and Temporal objects carry the millisecond that holds the instant'),
  ]);
});

describe('defect 10: calls bound to fail took seconds; lists had no cap', () => {
  pointsTo([
    at('test/business/periodic.test.ts', 'a shift bound to leave the supported years fails by arithmetic, with the calendar and the year it passes'),
    at('test/business/periodic.test.ts', 'count over 30,000 years and to the last day equals the sum of 2,000-year pieces'),
    at('test/business/definition.test.ts', 'a holiday list of the whole range passes its cap: limit-exceeded before anything is built, saying how to page'),
    at('test/recurrence/limits.test.ts', 'a list that must pass its cap fails before building, and says how to page'),
  ]);
});

describe('minor: U+2212 as a minus sign (now refused in offsets and instants alike)', () => {
  pointsTo([
    at('test/instant/options.test.ts', 'is refused in an offset and in a zone annotation, as both Temporal polyfills do'),
    at('test/zone/inputs.test.ts', 'U+2212 is refused with the fix, as RFC 3339 section 5.6 and both Temporal polyfills refuse it'),
  ]);
});

describe('minor: a fiscal year label at the range edge broke its own accessors', () => {
  pointsTo([at('test/period/inputs.test.ts', 'the fiscal years at the edges (FY-271821 starts before the first supported day, FY+275761 ends after the last)')]);
});

describe('minor: the zone day range was narrower than the civil one (surfaced in bucketSeries)', () => {
  pointsTo([
    at('test/zone/inputs.test.ts', 'accepts MIN_ZONED_DAY_NUMBER..MAX_ZONED_DAY_NUMBER, a range wider than the civil one'),
    at('test/period/inputs.test.ts', 'bucketSeries over the first and last years of the range (the zone day range no longer surfaces)'),
    at('test/series/inputs.test.ts', 'bucketing instants at the ends either works or throws a typed error that names the parameter'),
  ]);
});

describe('minor: rollSeries business-day windows needed a compiled calendar', () => {
  pointsTo([at('test/series/inputs.test.ts', "'us-federal' gives what calendarFromName('us-federal') gives")]);
});

describe('minor: RFC 5545 limits unstated; definition errors quoted the normalized form', () => {
  pointsTo([
    at('test/recurrence/limits.test.ts', 'RFC 5545 states no upper bound for COUNT and INTERVAL; ours are 10,000,000 and 1,000,000, refused in the text'),
    at('test/recurrence/limits.test.ts', 'RFC 5545 field errors quote the text as written and point into it (0.1 quoted its own ISO form)'),
  ]);
});

describe('minor: understoodKeys as a string matched substrings', () => {
  pointsTo([
    at('test/instant/understood-keys.test.ts', 'a string (0.1 matched its substrings) or an array holding a non-string is a KalendsTypeError naming the option'),
    at('test/instant/options.test.ts', 'understoodKeys must be an array: a string would match keys by substring'),
  ]);
});

describe('minor: durationFromFields({}) gave PT0S', () => {
  pointsTo([at('test/instant/options.test.ts', 'an empty field set is a TypeError (Temporal.Duration.from({}) throws a TypeError in both polyfills)')]);
});

describe("minor: CLI --delimiter '', --json=5 and repeated options", () => {
  pointsTo([
    at('test/series/cli.test.ts', '--delimiter takes one character or tab; anything else is a usage error that says what is valid'),
    at('test/cli/main.test.ts', 'refuses a flag given a value, a repeated option and an unknown option (with a suggestion)'),
  ]);
});
