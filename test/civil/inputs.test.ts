/**
 * Input rules of the civil layer (docs/design.md, "Input rules"): bulk inputs are typed arrays or plain arrays of
 * numbers read once, and the first non-number is a KalendsTypeError naming its index, whatever the array's length;
 * a day number given as text gets the name of the parser to call. Expected values come from the civil layer's own
 * scalar functions, which test/civil/gregorian.test.ts checks against @js-temporal/polyfill.
 */
import { describe, expect, it } from 'vitest';
import { dayNumberFromYmd, dayNumberFromYmdBulk, weekdayOfDayNumber, ymdFromDayNumber, ymdFromDayNumberBulk } from '../../src/civil/index.js';
import { monthIndexOfDayNumberUnchecked, monthIndexOfPacked, packedYmdUnchecked } from '../../src/civil/gregorian.js';
import { MAX_DAY_NUMBER, MIN_DAY_NUMBER } from '../../src/bounds.js';
import { KalendsRangeError, KalendsTypeError } from '../../src/errors.js';
import fc from 'fast-check';

function thrown(f: () => unknown): Error & { code?: string; path?: string } {
  try {
    f();
  } catch (e) {
    return e as Error & { code?: string };
  }
  throw new Error('expected a throw');
}

const NON_NUMBERS: readonly [string, unknown][] = [
  ['a numeric string', '20133'],
  ['null', null],
  ['true', true],
  ['a Date', new Date(0)],
  ['undefined', undefined],
];

describe('civil bulk inputs: non-numbers in plain arrays', () => {
  for (const length of [3, 2047, 2048, 5000]) {
    for (const [what, bad] of NON_NUMBERS) {
      it(`ymdFromDayNumberBulk refuses ${what} at index ${length - 1} of ${length}`, () => {
        const days: unknown[] = new Array(length).fill(0);
        days[length - 1] = bad;
        const e = thrown(() => ymdFromDayNumberBulk(days as number[]));
        expect(e).toBeInstanceOf(KalendsTypeError);
        expect(e.code).toBe('invalid-type');
        expect(e.message).toMatch(new RegExp(`^dayNumbers\\[${length - 1}\\]: expected a number`));
      });
    }
  }

  it('a hole is named as a hole', () => {
    // eslint-disable-next-line no-sparse-arrays
    const e = thrown(() => ymdFromDayNumberBulk([0, , 2] as number[]));
    expect(e).toBeInstanceOf(KalendsTypeError);
    expect(e.message).toContain('dayNumbers[1]: expected a number, got a hole');
  });

  it('dayNumberFromYmdBulk names the array and index of the first non-number', () => {
    expect(thrown(() => dayNumberFromYmdBulk([2025, '2025'] as number[], [1, 1], [1, 1])).message).toMatch(/^years\[1\]: expected a number, got "2025"/);
    expect(thrown(() => dayNumberFromYmdBulk([2025], [null] as unknown as number[], [1])).message).toMatch(/^months\[0\]: expected a number, got null/);
    expect(thrown(() => dayNumberFromYmdBulk([2025], [1], [true] as unknown as number[])).message).toMatch(/^days\[0\]: expected a number, got true/);
    // A field out of range names its array and index too.
    const e = thrown(() => dayNumberFromYmdBulk([2025, 2025], [1, 2], [1, 30]));
    expect(e).toBeInstanceOf(KalendsRangeError);
    expect(e.message).toMatch(/^days\[1\]: expected an integer from 1 to 28, got 30/);
  });

  it('typed arrays of every numeric kind are read as they are', () => {
    const dn = dayNumberFromYmd(2025, 2, 14);
    for (const arr of [Int32Array.of(dn), Float64Array.of(dn), Uint32Array.of(dn), Float32Array.of(dn)]) {
      expect(ymdFromDayNumberBulk(arr).years[0]).toBe(2025);
    }
    expect(Array.from(dayNumberFromYmdBulk(Int16Array.of(2025), Uint8Array.of(2), Int8Array.of(14)))).toEqual([dn]);
  });

  it('output arrays are checked: kind, length and unknown keys', () => {
    expect(thrown(() => ymdFromDayNumberBulk([0], { years: new Float64Array(1) } as never))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => ymdFromDayNumberBulk([0, 1], { years: new Int32Array(1) } as never)).code).toBe('length-mismatch');
    expect(thrown(() => ymdFromDayNumberBulk([0], { year: new Int32Array(1) } as never)).message).toContain('did you mean "years"');
    expect(thrown(() => ymdFromDayNumberBulk([0], null as never))).toBeInstanceOf(KalendsTypeError);
    expect(thrown(() => dayNumberFromYmdBulk([2025], [1], [1], new Float64Array(1) as never))).toBeInstanceOf(KalendsTypeError);
    // Arrays given are filled and returned.
    const years = new Int32Array(2);
    expect(ymdFromDayNumberBulk([0, 31], { years }).years).toBe(years);
  });
});

describe('civil: a day number given as text names the parser', () => {
  it('says which parser or coercion to call', () => {
    const e = thrown(() => weekdayOfDayNumber('2025-02-14' as unknown as number));
    expect(e).toBeInstanceOf(KalendsTypeError);
    expect(e.message).toMatch(/^dayNumber: expected a day number .* got "2025-02-14"; parse text first with parsePlainDate\(text\)/);
    expect(thrown(() => ymdFromDayNumber({ year: 2025 } as unknown as number)).message).toContain('toDayNumber(value)');
  });
});

describe('civil: month index of a day number', () => {
  it('equals the month index of the packed date over the whole range (property, and both ends)', () => {
    for (const dn of [MIN_DAY_NUMBER, MIN_DAY_NUMBER + 1, -1, 0, 59, 60, MAX_DAY_NUMBER - 1, MAX_DAY_NUMBER]) {
      expect(monthIndexOfDayNumberUnchecked(dn)).toBe(monthIndexOfPacked(packedYmdUnchecked(dn)));
    }
    fc.assert(
      fc.property(fc.integer({ min: MIN_DAY_NUMBER, max: MAX_DAY_NUMBER }), (dn) => {
        const { year, month } = ymdFromDayNumber(dn);
        expect(monthIndexOfDayNumberUnchecked(dn)).toBe(year * 12 + month - 1);
      }),
      { seed: 1213, numRuns: 20_000 },
    );
  });
});
