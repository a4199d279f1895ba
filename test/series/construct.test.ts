import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  KalendsRangeError,
  KalendsTypeError,
  columnOfSeries,
  seriesFromColumns,
  seriesFromPairs,
  seriesFromRecords,
  sliceSeries,
  seriesFromSeries,
} from '../../src/index.js';

describe('series constructors', () => {
  it('sorts unsorted input stably: equal instants keep their input order', () => {
    const s = seriesFromPairs([
      [30, 1],
      [10, 2],
      [30, 3],
      [10, 4],
      [20, 5],
    ]);
    expect(Array.from(s.epochMs)).toEqual([10, 10, 20, 30, 30]);
    expect(Array.from(columnOfSeries(s))).toEqual([2, 4, 5, 1, 3]);
    expect(Object.isFrozen(s)).toBe(true);
    expect(Object.isFrozen(s.columns)).toBe(true);
  });

  it('property: the constructed series is the stable sort of its input (checked against Array.prototype.sort, stable by ECMA-262)', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.integer({ min: 0, max: 50 }), fc.double({ noNaN: true })), { maxLength: 60 }), (pairs) => {
        const s = seriesFromPairs(pairs);
        const expected = pairs.map((p, i) => [p[0], p[1], i] as const).sort((a, b) => a[0] - b[0]);
        expect(Array.from(s.epochMs)).toEqual(expected.map((e) => e[0]));
        expect(Array.from(s.columns.value!)).toEqual(expected.map((e) => e[1]));
      }),
      { seed: 7001, numRuns: 200 },
    );
  });

  it('rejects unsorted input when the caller promised sorted input, naming the first row out of order', () => {
    const err = (() => {
      try {
        seriesFromColumns([1, 5, 3, 2], { v: [0, 0, 0, 0] }, { inputOrder: 'sorted' });
      } catch (e) {
        return e;
      }
      return undefined;
    })();
    expect(err).toBeInstanceOf(KalendsRangeError);
    expect((err as KalendsRangeError).code).toBe('unsorted');
    expect((err as Error).message).toContain('row 2 (3) comes before row 1 (5)');
    expect(seriesFromColumns([1, 1, 2], { v: [0, 1, 2] }, { inputOrder: 'sorted' }).length).toBe(3);
  });

  it('rejects NaN instants, naming the index', () => {
    expect(() => seriesFromColumns([1, NaN], { v: [1, 2] })).toThrow(/epochMs\[1\].*NaN/);
    expect(() => seriesFromPairs([[0, 1], [NaN, 2]])).toThrow(/pairs\[1\]\[0\].*NaN/);
    expect(() => seriesFromRecords([{ at: NaN, value: 1 }])).toThrow(/records\[0\]\.at/);
  });

  it('rejects columns of mismatched length with code length-mismatch', () => {
    try {
      seriesFromColumns([1, 2, 3], { a: [1, 2, 3], b: [1, 2] });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(KalendsRangeError);
      expect((e as KalendsRangeError).code).toBe('length-mismatch');
      expect((e as Error).message).toContain('columns.b: expected 3 values');
    }
    expect(() => seriesFromSeries(seriesFromPairs([[0, 1]]), { x: [1, 2] })).toThrow(/columns.x: expected 1 values/);
  });

  it('reads records with a column map, null as missing, and instants through the instant layer (RFC 3339 strings)', () => {
    const s = seriesFromRecords(
      [
        { when: '2025-03-01T12:00:00Z', kg: 2, eur: null },
        { when: 0, kg: 1, eur: 3 },
      ],
      { at: 'when', columns: { weight: 'kg', price: 'eur' } },
    );
    expect(s.columnNames).toEqual(['weight', 'price']);
    // 2025-03-01T12:00Z = Date.UTC(2025, 2, 1, 12), ECMA-262 time value
    expect(Array.from(s.epochMs)).toEqual([0, Date.UTC(2025, 2, 1, 12)]);
    expect(Number.isNaN(s.columns.price![1])).toBe(true);
    expect(() => seriesFromRecords([{ at: 0, value: 'x' }])).toThrow(KalendsTypeError);
    expect(() => seriesFromRecords([{ at: {}, value: 1 }])).toThrow(/records\[0\]\.at/);
  });

  it('columnOfSeries names the valid columns for an unknown name', () => {
    const s = seriesFromColumns([0], { a: [1], b: [2] });
    expect(() => columnOfSeries(s, 'c')).toThrow(/valid columns are "a", "b"/);
  });

  it('sliceSeries is end-exclusive', () => {
    const s = seriesFromPairs([[0, 1], [5, 2], [5, 3], [9, 4]]);
    expect(Array.from(sliceSeries(s, 5, 9).columns.value!)).toEqual([2, 3]);
    expect(sliceSeries(s, 10, 20).length).toBe(0);
  });

  it('rejects an unknown inputOrder', () => {
    expect(() => seriesFromPairs([], { inputOrder: 'yes' as never })).toThrow(/inputOrder/);
  });
});
