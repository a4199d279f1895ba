/**
 * Bad input to the day-count functions: each gets a typed error of the kit's classes, with a stable code and a
 * message that starts with the parameter's name and quotes the value received (docs/design.md, "Errors").
 */
import { describe, expect, it } from 'vitest';
import {
  type DayCountConvention,
  KalendsRangeError,
  KalendsTypeError,
  dayNumberFromYmd,
  sumOfYearFractions,
  yearFractionOfDays,
  yearFractionOfDaysBulk,
} from '../../src/index.js';

type ErrorClass = typeof KalendsRangeError | typeof KalendsTypeError;

/** Runs `fn`, expects an error of `cls` with `code`, and a message matching every pattern. */
function expectError(fn: () => unknown, cls: ErrorClass, code: string, ...patterns: (string | RegExp)[]): void {
  let caught: unknown;
  try {
    fn();
  } catch (e) {
    caught = e;
  }
  expect(caught, 'expected an error').toBeInstanceOf(cls);
  const err = caught as KalendsRangeError;
  expect(err.code).toBe(code);
  for (const p of patterns) expect(err.message).toMatch(p);
}

const a = dayNumberFromYmd(2024, 1, 15);
const b = dayNumberFromYmd(2024, 7, 15);
const f = yearFractionOfDays;

describe('an end date before the start', () => {
  it('is refused by the scalar form, naming end and quoting both dates', () => {
    expectError(() => f('actual-360', b, a), KalendsRangeError, 'out-of-range', /^end: /, `got ${a} (2024-01-15)`, `start ${b} (2024-07-15)`);
  });
  it('is refused by the bulk form, naming the index', () => {
    expectError(() => yearFractionOfDaysBulk('actual-360', [a, b], [b, a]), KalendsRangeError, 'out-of-range', /^ends\[1\]: /, `got ${a} (2024-01-15)`);
  });
});

describe('Actual/Actual (ICMA) without its frequency or its regular period', () => {
  it('without couponsPerYear', () => {
    expectError(() => f('actual-actual-icma', a, b), KalendsTypeError, 'invalid-type', /^options\.couponsPerYear: Actual\/Actual \(ICMA\) needs the coupon frequency/, 'got undefined');
    expectError(() => f('actual-actual-icma', a, b, { regularStart: a, regularEnd: b }), KalendsTypeError, 'invalid-type', /^options\.couponsPerYear: /);
  });
  it('without the regular period', () => {
    expectError(() => f('actual-actual-icma', a, b, { couponsPerYear: 2 }), KalendsTypeError, 'invalid-type', /^options\.regularStart: .*regular coupon period/, 'got undefined');
    expectError(() => f('actual-actual-icma', a, b, { couponsPerYear: 2, regularStart: a }), KalendsTypeError, 'invalid-type', /^options\.regularEnd: /);
    expectError(() => yearFractionOfDaysBulk('actual-actual-icma', [a], [b], undefined, { couponsPerYear: 2 }), KalendsTypeError, 'invalid-type', /^options\.regularStarts: /);
  });
  it('with a frequency outside 1, 2, 3, 4, 6, 12, or not a number', () => {
    expectError(() => f('actual-actual-icma', a, b, { couponsPerYear: 5, regularStart: a, regularEnd: b }), KalendsRangeError, 'out-of-range', /^options\.couponsPerYear: .*got 5$/);
    expectError(() => f('actual-365-leap', a, b, { couponsPerYear: '2' as unknown as number }), KalendsTypeError, 'invalid-type', /^options\.couponsPerYear: .*got "2"/);
  });
  it('with a regular period that does not fit the frequency (a silent wrong answer otherwise)', () => {
    const yearLater = dayNumberFromYmd(2025, 1, 15);
    expectError(() => f('actual-actual-icma', a, b, { couponsPerYear: 2, regularStart: a, regularEnd: yearLater }), KalendsRangeError, 'out-of-range', /^options\.regularEnd: a regular period of 6 months/, '366 days', 'check couponsPerYear');
  });
  it('with a period outside its regular period, pointing to sumOfYearFractions for long periods', () => {
    const later = dayNumberFromYmd(2024, 8, 15);
    expectError(() => f('actual-actual-icma', a, later, { couponsPerYear: 2, regularStart: a, regularEnd: b }), KalendsRangeError, 'out-of-range', /^end: /, `got ${later} (2024-08-15)`, 'sumOfYearFractions');
    expectError(
      () => yearFractionOfDaysBulk('actual-actual-icma', [a, a], [b, later], undefined, { couponsPerYear: 2, regularStarts: [a, a], regularEnds: [b, b] }),
      KalendsRangeError,
      'out-of-range',
      /^ends\[1\]: /,
    );
  });
});

describe('30E/360 (ISDA) without its Termination Date', () => {
  it('is refused, scalar and bulk', () => {
    expectError(() => f('thirty-e-360-isda', a, b), KalendsTypeError, 'invalid-type', /^options\.terminationDayNumber: 30E\/360 \(ISDA\) needs the Termination Date/, 'got undefined');
    expectError(() => yearFractionOfDaysBulk('thirty-e-360-isda', [a], [b]), KalendsTypeError, 'invalid-type', /^options\.terminationDayNumber: /);
  });
  it('a period ending after the Termination Date is refused', () => {
    expectError(() => f('thirty-e-360-isda', a, b, { terminationDayNumber: b - 1 }), KalendsRangeError, 'out-of-range', /^end: .*options\.terminationDayNumber/, `got ${b} (2024-07-15)`);
    expectError(() => yearFractionOfDaysBulk('thirty-e-360-isda', [a, a], [a, b], undefined, { terminationDayNumber: b - 1 }), KalendsRangeError, 'out-of-range', /^ends\[1\]: /);
  });
});

describe('Business/252 without a calendar, or outside its years', () => {
  it('without a calendar', () => {
    expectError(() => f('business-252', a, b), KalendsTypeError, 'invalid-type', /^options\.calendar: Business\/252 needs the business calendar/);
  });
  it('an unknown bundled calendar (the business layer names it)', () => {
    expect(() => f('business-252', a, b, { calendar: 'us-fedral' })).toThrow(/"us-fedral".*us-federal/);
  });
  it('a period outside the calendar years, naming the index in bulk', () => {
    const before = dayNumberFromYmd(1960, 1, 1);
    expectError(() => yearFractionOfDaysBulk('business-252', [a, before], [b, a], undefined, { calendar: 'us-federal' }), KalendsRangeError, 'out-of-range', /^starts\[1\]: .*"us-federal"/, `got ${before} (1960-01-01)`);
  });
});

describe('unknown conventions: code unknown-name, with a suggestion that maps the trade spelling to ours', () => {
  const cases: readonly (readonly [string, DayCountConvention])[] = [
    ['act/360', 'actual-360'],
    ['Actual/360', 'actual-360'],
    ['act/365f', 'actual-365-fixed'],
    ['ACT/365 (Fixed)', 'actual-365-fixed'],
    ['30/360', 'thirty-360'],
    ['bond basis', 'thirty-360'],
    ['Eurobond Basis', 'thirty-e-360'],
    ['30E/360', 'thirty-e-360'],
    ['30E/360 (ISDA)', 'thirty-e-360-isda'],
    ['Act/Act (ISDA)', 'actual-actual-isda'],
    ['Act/Act (ICMA)', 'actual-actual-icma'],
    ['Actual/365L', 'actual-365-leap'],
    ['BUS/252', 'business-252'],
    ['1/1', 'one-one'],
    ['actual-36', 'actual-360'],
    ['thirty-e360', 'thirty-e-360'],
  ];
  for (const [given, ours] of cases) {
    it(`${JSON.stringify(given)} suggests ${JSON.stringify(ours)}`, () => {
      expectError(() => f(given as DayCountConvention, a, b), KalendsRangeError, 'unknown-name', /^convention: /, `got ${JSON.stringify(given)}`, `did you mean "${ours}"`);
      expectError(() => yearFractionOfDaysBulk(given as DayCountConvention, [a], [b]), KalendsRangeError, 'unknown-name', `did you mean "${ours}"`);
    });
  }
  it('a non-string convention is a KalendsTypeError; names inherited by every object are unknown', () => {
    expectError(() => f(42 as unknown as DayCountConvention, a, b), KalendsTypeError, 'invalid-type', /^convention: .*got 42/);
    expectError(() => f('constructor' as DayCountConvention, a, b), KalendsRangeError, 'unknown-name', 'got "constructor"');
  });
});

describe('options and day numbers', () => {
  it('options must be a plain object; unknown keys are refused with a suggestion', () => {
    expectError(() => f('actual-360', a, b, null as unknown as undefined), KalendsTypeError, 'invalid-type', /^options: .*got null/);
    expectError(
      () => f('actual-actual-icma', a, b, { couponPerYear: 2 } as unknown as undefined),
      KalendsTypeError,
      'unknown-name',
      /^options\.couponPerYear: unknown option; did you mean "couponsPerYear"\?/,
    );
  });
  it('an option the convention does not use is refused (code unsupported), naming who uses it', () => {
    expectError(() => f('actual-360', a, b, { calendar: 'us-federal' }), KalendsRangeError, 'unsupported', /^options\.calendar: convention "actual-360" \(Actual\/360\) does not use this option, got "us-federal"; only "business-252" uses it/);
    expectError(() => f('actual-actual-isda', a, b, { couponsPerYear: 2 }), KalendsRangeError, 'unsupported', /only "actual-actual-icma" and "actual-365-leap" use it/);
    expectError(() => yearFractionOfDaysBulk('thirty-360', [a], [b], undefined, { regularStarts: [a] }), KalendsRangeError, 'unsupported', /^options\.regularStarts: .*only "actual-actual-icma" uses it/);
  });
  it('day numbers are integers in the civil range; text gets the parser to call', () => {
    expectError(() => f('actual-360', '2024-01-15' as unknown as number, b), KalendsTypeError, 'invalid-type', /^start: .*got "2024-01-15"; parse text first with parsePlainDate/);
    expectError(() => f('actual-360', a, 1.5), KalendsRangeError, 'out-of-range', /^end: .*got 1\.5/);
    expectError(() => f('actual-360', a, Number.NaN), KalendsRangeError, 'out-of-range', /^end: .*got NaN/);
    expectError(() => f('thirty-e-360-isda', a, b, { terminationDayNumber: 2e9 }), KalendsRangeError, 'out-of-range', /^options\.terminationDayNumber: .*got 2000000000/);
  });
});

describe('bulk inputs', () => {
  it('non-numbers in plain arrays, and NaN or fractions in typed arrays, name their index', () => {
    expectError(() => yearFractionOfDaysBulk('actual-360', [a, '2024-01-01' as unknown as number], [b, b]), KalendsTypeError, 'invalid-type', /^starts\[1\]: .*got "2024-01-01"/);
    expectError(() => yearFractionOfDaysBulk('actual-360', Float64Array.of(a, Number.NaN), Float64Array.of(b, b)), KalendsRangeError, 'out-of-range', /^starts\[1\]: .*got NaN/);
    expectError(() => yearFractionOfDaysBulk('actual-actual-isda', Float64Array.of(a), Float64Array.of(b + 0.5)), KalendsRangeError, 'out-of-range', /^ends\[0\]: /, `got ${b + 0.5}`);
    expectError(() => yearFractionOfDaysBulk('thirty-360', Float64Array.of(a, 3e9), Float64Array.of(b, 3e9)), KalendsRangeError, 'out-of-range', /^starts\[1\]: .*got 3000000000/);
  });
  it('lengths must match; out must be a Float64Array long enough', () => {
    expectError(() => yearFractionOfDaysBulk('actual-360', [a, a], [b]), KalendsRangeError, 'length-mismatch', /^ends: expected 2 elements.*got 1/);
    expectError(() => yearFractionOfDaysBulk('actual-360', [a, a], [b, b], new Float64Array(1)), KalendsRangeError, 'length-mismatch', /^out: .*got 1/);
    expectError(() => yearFractionOfDaysBulk('actual-360', [a], [b], new Float32Array(1) as unknown as Float64Array), KalendsTypeError, 'invalid-type', /^out: expected a Float64Array/);
    expectError(
      () => yearFractionOfDaysBulk('actual-actual-icma', [a], [b], undefined, { couponsPerYear: 2, regularStarts: [a, a], regularEnds: [b] }),
      KalendsRangeError,
      'length-mismatch',
      /^options\.regularStarts: expected 1 elements/,
    );
  });
  it('answers the same for an empty input', () => {
    expect(yearFractionOfDaysBulk('actual-360', [], [])).toEqual(new Float64Array(0));
  });
});

describe('sumOfYearFractions', () => {
  it('refuses what is not an array of year fractions, naming the element', () => {
    expectError(() => sumOfYearFractions('1/2' as unknown as []), KalendsTypeError, 'invalid-type', /^fractions: .*got "1\/2"/);
    expectError(() => sumOfYearFractions([{ numerator: 1, denominator: 2, value: 0.5 }, { numerator: 1 } as never]), KalendsTypeError, 'invalid-type', /^fractions\[1\]\.denominator: .*got undefined/);
    expectError(() => sumOfYearFractions([{ numerator: 1, denominator: 0, value: 0 }]), KalendsRangeError, 'out-of-range', /^fractions\[0\]\.denominator: .*got 0/);
    expectError(() => sumOfYearFractions([{ numerator: 0.5, denominator: 2, value: 0 }]), KalendsRangeError, 'out-of-range', /^fractions\[0\]\.numerator: .*got 0\.5/);
  });
  it('refuses a sum whose exact denominator passes 2^53 - 1 (limit-exceeded), rather than round it', () => {
    const primes = [1_000_003, 1_000_033, 1_000_037];
    expectError(() => sumOfYearFractions(primes.map((p) => ({ numerator: 1, denominator: p, value: 1 / p }))), KalendsRangeError, 'limit-exceeded', /^fractions: the exact sum of the first 3 fractions/);
  });
  it('an empty sum is 0', () => {
    expect(sumOfYearFractions([])).toEqual({ numerator: 0, denominator: 1, value: 0 });
  });
});
