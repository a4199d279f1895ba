/**
 * Bad input: a corpus of malformed strings, each of which must give a typed kalends error whose message quotes
 * the input, with no crash and no hang; then fuzzing with fast-check. Grammar references: RFC 3339 section 5.6
 * (date-time ABNF), RFC 9557 section 4.1 (suffix ABNF), ISO 8601-1:2019 5.2 (week and ordinal dates) and 5.5.2
 * (durations; from memory where the text was not at hand).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseDuration, parseInstant, parsePlainDate, parsePlainDateTime, toDayNumber, toEpochMs } from '../../src/instant/index.js';
import { KalendsRangeError, KalendsSyntaxError, KalendsTypeError, describeValue } from '../../src/errors.js';

type Kind = 'syntax' | 'range';
const I = parseInstant as (t: unknown) => unknown;
const D = parsePlainDate as (t: unknown) => unknown;
const DT = parsePlainDateTime as (t: unknown) => unknown;
const P = parseDuration as (t: unknown) => unknown;

/** [input, parser, expected error kind, why it is malformed] */
const CORPUS: ReadonlyArray<readonly [string, (t: unknown) => unknown, Kind, string]> = [
  // empty and blank
  ['', I, 'syntax', 'empty string'],
  [' ', I, 'syntax', 'blank'],
  ['', D, 'syntax', 'empty date'],
  ['', P, 'syntax', 'empty duration'],
  ['\n', DT, 'syntax', 'newline only'],
  // missing offset (an instant needs one: RFC 3339 time-offset is not optional)
  ['2025-02-14T09:30:00', I, 'syntax', 'no offset'],
  ['2025-02-14T09:30', I, 'syntax', 'no offset, no seconds'],
  ['2025-02-14', I, 'syntax', 'date only'],
  ['2025-02-14T09:30:00.123', I, 'syntax', 'no offset with fraction'],
  ['2025-02-14T09:30:00[Europe/Dublin]', I, 'syntax', 'zone annotation but no offset'],
  // out-of-range fields (RFC 3339 5.6 value ranges)
  ['2025-00-14T09:30:00Z', I, 'syntax', 'month 00'],
  ['2025-13-14T09:30:00Z', I, 'syntax', 'month 13'],
  ['2025-01-00T09:30:00Z', I, 'syntax', 'day 00'],
  ['2025-01-32T09:30:00Z', I, 'syntax', 'day 32'],
  ['2025-02-29T09:30:00Z', I, 'syntax', '29 February in a common year'],
  ['1900-02-29T00:00:00Z', I, 'syntax', '1900 is not a leap year (Gregorian century rule)'],
  ['2025-04-31T00:00:00Z', I, 'syntax', '31 April'],
  ['2025-06-31T00:00:00Z', I, 'syntax', '31 June'],
  ['2025-09-31T00:00:00Z', I, 'syntax', '31 September'],
  ['2025-11-31T00:00:00Z', I, 'syntax', '31 November'],
  ['2025-02-14T25:00:00Z', I, 'syntax', 'hour 25'],
  ['2025-02-14T99:00:00Z', I, 'syntax', 'hour 99'],
  ['2025-02-14T09:60:00Z', I, 'syntax', 'minute 60'],
  ['2025-02-14T09:30:61Z', I, 'syntax', 'second 61'],
  ['2025-02-14T09:30:99Z', I, 'syntax', 'second 99'],
  ['2025-02-14T09:30:00+24:00', I, 'syntax', 'offset hour 24'],
  ['2025-02-14T09:30:00+01:60', I, 'syntax', 'offset minute 60'],
  ['2025-02-14T09:30:00+01:00:60', I, 'syntax', 'offset second 60'],
  // hour 24 (RFC 3339 allows 00-23; Temporal rejects 24:00)
  ['2025-02-14T24:00:00Z', I, 'syntax', 'hour 24'],
  ['2025-02-14T24:00Z', I, 'syntax', 'hour 24 without seconds'],
  ['2025-12-31T24:00:00+01:00', I, 'syntax', 'hour 24 at year end'],
  ['2025-02-14T24:00:00', DT, 'syntax', 'hour 24 in a local date-time'],
  // second 60 where no UTC leap second can be (RFC 3339 5.7)
  ['2025-02-14T09:30:60Z', I, 'syntax', 'leap second mid-day'],
  ['1990-12-30T23:59:60Z', I, 'syntax', 'leap second not at a month end'],
  ['1990-12-31T23:58:60Z', I, 'syntax', 'leap second not in the last minute'],
  ['1990-12-31T23:59:60+00:30', I, 'syntax', 'local 23:59:60 with an offset is not 23:59:60 UTC'],
  // wrong separators
  ['2025/02/14T09:30:00Z', I, 'syntax', 'slashes in the date'],
  ['2025.02.14T09:30:00Z', I, 'syntax', 'dots in the date'],
  ['2025-02-14_09:30:00Z', I, 'syntax', 'underscore separator'],
  ['2025-02-14X09:30:00Z', I, 'syntax', 'X separator'],
  ['2025-02-14TT09:30:00Z', I, 'syntax', 'doubled T'],
  ['2025-02-14  09:30:00Z', I, 'syntax', 'two spaces'],
  ['2025-02-14T09.30.00Z', I, 'syntax', 'dots in the time'],
  ['2025-02-14T09-30-00Z', I, 'syntax', 'dashes in the time'],
  ['2025-02-14T0930Z', I, 'syntax', 'basic-format time'],
  ['20250214T093000Z', I, 'syntax', 'basic format throughout'],
  ['2025-0214T09:30:00Z', I, 'syntax', 'missing dash'],
  ['2025-02-14T09:30:00+0100', I, 'syntax', 'offset without colon'],
  ['2025-02-14T09:30:00+01', I, 'syntax', 'offset hour only'],
  ['2025-02-14T09:30:00+1:00', I, 'syntax', 'one-digit offset hour'],
  ['2025-02-14T09:30:00 +01:00', I, 'syntax', 'space before the offset'],
  ['2025-02-14T09:30:00ZZ', I, 'syntax', 'doubled Z'],
  ['2025-02-14T09:30:00UTC', I, 'syntax', 'UTC as an offset'],
  ['2025-02-14T09:30:00GMT', I, 'syntax', 'GMT as an offset'],
  ['2025-02-14T09:30:00+01:00:00.5', I, 'syntax', 'fractional offset seconds'],
  ['2025-2-14T09:30:00Z', I, 'syntax', 'one-digit month'],
  ['2025-02-4T09:30:00Z', I, 'syntax', 'one-digit day'],
  ['2025-02-14T9:30:00Z', I, 'syntax', 'one-digit hour'],
  ['2025-02-14T09:3:00Z', I, 'syntax', 'one-digit minute'],
  ['2025-02-14T09:30:0Z', I, 'syntax', 'one-digit second'],
  ['2025-02-14T09Z', I, 'syntax', 'hour only'],
  ['2025-02-14T09:30.5Z', I, 'syntax', 'fraction on the minute'],
  ['2025-02-14T09:30:00.Z', I, 'syntax', 'decimal point without digits'],
  ['2025-02-14T09:30:00.1234567890Z', I, 'syntax', 'ten fraction digits'],
  ['2025-02-14T09:30:00\u221201:00', I, 'syntax', 'U+2212 minus sign in the offset'],
  ['\uff12025-02-14T09:30:00Z', I, 'syntax', 'full-width digit'],
  ['٢٠٢٥-02-14T09:30:00Z', I, 'syntax', 'Arabic-Indic digits'],
  // trailing or leading junk
  ['2025-02-14T09:30:00Zjunk', I, 'syntax', 'trailing word'],
  ['2025-02-14T09:30:00Z ', I, 'syntax', 'trailing space'],
  [' 2025-02-14T09:30:00Z', I, 'syntax', 'leading space'],
  ['2025-02-14T09:30:00Z\n', I, 'syntax', 'trailing newline'],
  ['2025-02-14T09:30:00Z;', I, 'syntax', 'trailing semicolon'],
  ['x2025-02-14T09:30:00Z', I, 'syntax', 'leading letter'],
  ['2025-02-14T09:30:00+01:00:00:00', I, 'syntax', 'extra offset field'],
  ['2025-02-14extra', D, 'syntax', 'junk after a date'],
  ['2025-02-14 ', D, 'syntax', 'space after a date'],
  ['2025-02-14T09:30', D, 'syntax', 'a date-time where a date is wanted'],
  ['2025-02-14T09:30:00Z', DT, 'syntax', 'Z in a local date-time'],
  ['2025-02-14T09:30:00+01:00', DT, 'syntax', 'offset in a local date-time'],
  // annotations (RFC 9557 section 4.1)
  ['2025-02-14T09:30:00Z[', I, 'syntax', 'unclosed bracket'],
  ['2025-02-14T09:30:00Z[]', I, 'syntax', 'empty annotation'],
  ['2025-02-14T09:30:00Z[Europe/Paris', I, 'syntax', 'unclosed zone'],
  ['2025-02-14T09:30:00Z[Europe//Paris]', I, 'syntax', 'empty zone name part'],
  ['2025-02-14T09:30:00Z[/Europe]', I, 'syntax', 'zone name starts with /'],
  ['2025-02-14T09:30:00Z[1Europe]', I, 'syntax', 'zone part starts with a digit'],
  ['2025-02-14T09:30:00Z[Europe/..]', I, 'syntax', '".." zone part'],
  ['2025-02-14T09:30:00Z[Europe Paris]', I, 'syntax', 'space in a zone name'],
  ['2025-02-14T09:30:00Z[Europe/Paris][Europe/Rome]', I, 'syntax', 'two zone annotations'],
  ['2025-02-14T09:30:00Z[u-ca=iso8601][Europe/Paris]', I, 'syntax', 'zone after a suffix tag'],
  ['2025-02-14T09:30:00Z[U-CA=iso8601]', I, 'syntax', 'upper-case key'],
  ['2025-02-14T09:30:00Z[u-ca=]', I, 'syntax', 'empty value'],
  ['2025-02-14T09:30:00Z[=iso8601]', I, 'syntax', 'empty key'],
  ['2025-02-14T09:30:00Z[u-ca=iso_8601]', I, 'syntax', 'underscore in a value'],
  ['2025-02-14T09:30:00Z[u-ca=iso--8601]', I, 'syntax', 'empty value part'],
  ['2025-02-14T09:30:00Z[1key=v]', I, 'syntax', 'key starts with a digit'],
  ['2025-02-14T09:30:00Z[!knort=blargel]', I, 'syntax', 'unknown critical key (RFC 9557 3.3)'],
  ['2025-02-14T09:30:00Z[_foo=bar]', I, 'syntax', 'experimental key (RFC 9557 3.2)'],
  ['2025-02-14T09:30:00Z[!u-ca=hebrew]', I, 'syntax', 'critical calendar kalends does not use'],
  ['2025-02-14T09:30:00Z[+01]', I, 'syntax', 'offset annotation without minutes'],
  ['2025-02-14T09:30:00Z[+01:00:00]', I, 'syntax', 'offset annotation with seconds'],
  ['2025-02-14T09:30:00Z[!!Europe/Paris]', I, 'syntax', 'doubled critical flag'],
  ['2025-02-14T09:30:00Z[Europe/Paris]junk', I, 'syntax', 'junk after annotations'],
  // huge and invalid years
  ['+999999-01-01T00:00:00Z', I, 'range', 'year 999999'],
  ['-999999-01-01T00:00:00Z', I, 'range', 'year -999999'],
  ['+275761-01-01T00:00:00Z', I, 'range', 'one year past the range'],
  ['+275760-09-13T00:00:00.001Z', I, 'range', 'one ms past the last instant'],
  ['-271821-04-19T23:59:59.999Z', I, 'range', 'one ms before the first instant'],
  ['-271821-04-19T00:00:00Z', I, 'range', 'a day before the first instant'],
  ['99999-01-01T00:00:00Z', I, 'syntax', 'five-digit year without sign'],
  ['123456789-01-01T00:00:00Z', I, 'syntax', 'nine-digit year'],
  ['+12345-01-01T00:00:00Z', I, 'syntax', 'expanded year with five digits'],
  ['+1234567-01-01T00:00:00Z', I, 'syntax', 'expanded year with seven digits'],
  ['-000000-01-01T00:00:00Z', I, 'syntax', '-000000 (ISO 8601 / RFC 9557: invalid)'],
  ['-000000-01-01', D, 'syntax', '-000000 in a date'],
  ['925-02-14T09:30:00Z', I, 'syntax', 'three-digit year'],
  ['+999999-12-31', D, 'range', 'huge year in a date'],
  ['+275761-01-01', D, 'range', 'a date one year past the range'],
  // ISO 8601 week and ordinal dates
  ['2025-W00-1', D, 'syntax', 'week 00'],
  ['2025-W54-1', D, 'syntax', 'week 54'],
  ['2025-W53-1', D, 'syntax', 'week 53 in a 52-week year'],
  ['2025-W07-0', D, 'syntax', 'weekday 0'],
  ['2025-W07-8', D, 'syntax', 'weekday 8'],
  ['2025-W07', D, 'syntax', 'a week, not a date'],
  ['2025-W7-5', D, 'syntax', 'one-digit week'],
  ['2025-w07-5', D, 'syntax', 'lower-case w'],
  ['2025W075', D, 'syntax', 'basic-format week date'],
  ['2025-000', D, 'syntax', 'ordinal day 000'],
  ['2025-366', D, 'syntax', 'ordinal day 366 in a common year'],
  ['2024-367', D, 'syntax', 'ordinal day 367'],
  ['2025-45', D, 'syntax', 'two-digit ordinal day'],
  ['2025-0450', D, 'syntax', 'four-digit ordinal day'],
  ['-271822-W52-1', D, 'range', 'week date before the range'],
  // durations (ISO 8601-1:2019 5.5.2, from memory; Temporal grammar)
  ['P', P, 'syntax', 'no components'],
  ['PT', P, 'syntax', 'T with no components'],
  ['P1DT', P, 'syntax', 'trailing T'],
  ['1D', P, 'syntax', 'missing P'],
  ['p1d', P, 'syntax', 'lower-case designators'],
  ['P1', P, 'syntax', 'number without designator'],
  ['PD', P, 'syntax', 'designator without number'],
  ['P1H', P, 'syntax', 'hours before T'],
  ['PT1D', P, 'syntax', 'days after T'],
  ['P1D1Y', P, 'syntax', 'components out of order'],
  ['P1Y1Y', P, 'syntax', 'repeated component'],
  ['P1.5Y', P, 'syntax', 'fraction on years'],
  ['P1.5D', P, 'syntax', 'fraction on days'],
  ['PT1.5H30M', P, 'syntax', 'fraction not on the last component'],
  ['PT1.S', P, 'syntax', 'decimal sign without digits'],
  ['PT0.1234567891S', P, 'syntax', 'ten fraction digits'],
  ['--P1D', P, 'syntax', 'doubled sign'],
  ['P-1D', P, 'syntax', 'sign inside'],
  ['P1DT1H ', P, 'syntax', 'trailing space'],
  ['P99999999999999999Y', P, 'syntax', 'seventeen digits'],
  ['P9999999999Y', P, 'range', 'years beyond 2^32'],
  ['PT9999999999999999H', P, 'range', 'exact part beyond the safe integers'],
];

function expectTyped(fn: () => unknown, input: string, kind: Kind): void {
  let caught: unknown;
  try {
    fn();
  } catch (e) {
    caught = e;
  }
  expect(caught, `no error for ${JSON.stringify(input)}`).toBeDefined();
  if (kind === 'syntax') expect(caught).toBeInstanceOf(KalendsSyntaxError);
  else expect(caught).toBeInstanceOf(KalendsRangeError);
  const err = caught as KalendsSyntaxError;
  expect(err.message).toContain(describeValue(input)); // the message quotes the input
  expect(err.received).toBe(input);
  if (err instanceof KalendsSyntaxError) {
    expect(err.position).toBeGreaterThanOrEqual(0);
    expect(err.position).toBeLessThanOrEqual(input.length);
  }
}

describe('malformed corpus: each gives a typed error that quotes the input', () => {
  it('has at least 100 entries, all distinct per parser', () => {
    expect(CORPUS.length).toBeGreaterThanOrEqual(100);
    const keys = new Set(CORPUS.map(([s, f]) => `${[I, D, DT, P].indexOf(f)}:${s}`));
    expect(keys.size).toBe(CORPUS.length);
  });

  it.each(CORPUS.map(([s, f, k, why]) => [why, s, f, k] as const))('%s: %j', (_why, input, fn, kind) => {
    expectTyped(() => fn(input), input, kind);
  });
});

describe('non-strings are type errors that name what was received', () => {
  const values: ReadonlyArray<readonly [unknown, string]> = [
    [undefined, 'undefined'],
    [null, 'null'],
    [20250214, '20250214'],
    [true, 'true'],
    [{}, 'an object'],
    [[], 'an array'],
    [new Map(), 'a Map'],
    [Symbol('x'), 'Symbol(x)'],
    [10n, '10n'],
    [() => 1, 'a function'],
  ];
  it.each(values.map(([v, name]) => [name, v] as const))('parseInstant(%s)', (name, v) => {
    expect(() => I(v)).toThrow(KalendsTypeError);
    expect(() => I(v)).toThrow(name);
  });
  it('parsePlainDate, parsePlainDateTime and parseDuration reject non-strings too', () => {
    for (const fn of [D, DT, P]) {
      expect(() => fn(new Date(0))).toThrow(KalendsTypeError);
      expect(() => fn(42)).toThrow(/got 42/);
    }
  });
});

describe('no hang on long input', () => {
  it('a megabyte of digits, brackets or annotations is rejected in one linear pass', () => {
    const long = [
      '2'.repeat(1_000_000),
      `2025-02-14T09:30:00Z${'['.repeat(200_000)}`,
      `2025-02-14T09:30:00Z${'[a=b]'.repeat(100_000)}x`,
      `P${'1'.repeat(500_000)}D`,
      `2025-02-14T09:30:00.${'1'.repeat(500_000)}Z`,
    ];
    for (const s of long) {
      let caught: unknown;
      try {
        (s.startsWith('P') ? P : I)(s);
      } catch (e) {
        caught = e;
      }
      expect(caught instanceof KalendsSyntaxError || caught instanceof KalendsRangeError).toBe(true);
      expect((caught as Error).message.length).toBeLessThan(1000); // the message quotes a shortened input
    }
  });
});

describe('fuzz: random text throws only kalends errors', () => {
  const ours = (e: unknown) => e instanceof KalendsSyntaxError || e instanceof KalendsRangeError || e instanceof KalendsTypeError;
  const run = (fn: (t: unknown) => unknown) => (s: string) => {
    try {
      fn(s);
    } catch (e) {
      if (!ours(e)) throw e;
    }
  };

  it('random strings over the grammar alphabet', () => {
    const alphabet = fc.constantFrom(...'0123456789-+:.,TtZzWP YMDHS[]!=/_aEu'.split(''));
    const text = fc.array(alphabet, { maxLength: 40 }).map((a) => a.join(''));
    for (const fn of [I, D, DT, P, toEpochMs as (t: unknown) => unknown, toDayNumber as (t: unknown) => unknown]) {
      fc.assert(fc.property(text, run(fn)), { seed: 3339, numRuns: 3000 });
    }
  });

  it('mutations of valid strings (one character replaced, inserted or removed)', () => {
    const valid = [
      '1985-04-12T23:20:50.52Z',
      '1996-12-19T16:39:57-08:00[America/Los_Angeles][u-ca=hebrew]',
      '1990-12-31T23:59:60Z',
      '+275760-09-13T00:00:00Z',
      '2025-W07-5',
      '2025-045',
      'P1Y2M3W4DT5H6M7.008S',
    ];
    const mutation = fc.record({
      base: fc.constantFrom(...valid),
      at: fc.nat(80),
      op: fc.constantFrom('replace', 'insert', 'delete'),
      ch: fc.string({ unit: 'binary', minLength: 1, maxLength: 1 }),
    });
    fc.assert(
      fc.property(mutation, ({ base, at, op, ch }) => {
        const i = at % (base.length + 1);
        const s = op === 'delete' ? base.slice(0, i) + base.slice(i + 1) : base.slice(0, i) + ch + base.slice(op === 'replace' ? i + 1 : i);
        for (const fn of [I, D, DT, P]) run(fn)(s);
      }),
      { seed: 9557, numRuns: 4000 },
    );
  });

  it('arbitrary unicode strings', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme', maxLength: 30 }), (s) => {
        for (const fn of [I, D, DT, P]) run(fn)(s);
      }),
      { seed: 8601, numRuns: 2000 },
    );
  });
});
