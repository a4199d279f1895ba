/**
 * Aggregation names: an unknown name is refused with code `unknown-name`, lists the valid names and suggests the
 * intended one by meaning (common alternative words) before spelling (issue 13; docs/series.md, "Aggregations").
 * The alternative words are common practice in statistics and spreadsheet work ("std" and "sd" for the standard
 * deviation, "var" for the variance, "avg" for the mean), not from a published table.
 */
import { describe, expect, it } from 'vitest';
import { AGGREGATION_NAMES, KalendsRangeError, bucketSeries, defineBucketAccumulator, rollSeries, seriesFromColumns } from '../../src/index.js';
import { AGGREGATION_SYNONYMS } from '../../src/series/aggregate.js';

const s = seriesFromColumns([0, 1], { v: [1, 2] });

function refusal(name: string, roll = false): KalendsRangeError {
  try {
    if (roll) rollSeries(s, { window: { rows: 2 }, aggregations: [name as never] });
    else bucketSeries(s, { unit: 'day', zone: 'UTC', aggregations: [name as never] });
  } catch (e) {
    return e as KalendsRangeError;
  }
  throw new Error(`${name} was accepted`);
}

/** The names suggested in a message, in order. */
function suggested(e: Error): string[] {
  const m = /did you mean (.*)\?$/.exec(e.message);
  return m ? [...m[1]!.matchAll(/"([^"]+)"/g)].map((x) => x[1]!) : [];
}

describe('suggestions for unknown aggregation names, by meaning and by spelling', () => {
  const byMeaning: [string, string][] = [
    ['std', 'stddev'],
    ['stdev', 'stddev'],
    ['sd', 'stddev'],
    ['Standard_Deviation', 'stddev'],
    ['var', 'variance'],
    ['avg', 'mean'],
    ['average', 'mean'],
    ['total', 'sum'],
    ['n', 'count'],
    ['cnt', 'count'],
    ['minimum', 'min'],
    ['maximum', 'max'],
    ['earliest', 'first'],
    ['latest', 'last'],
    ['percentile', 'quantile'],
    ['med', 'median'],
  ];
  for (const [word, ours] of byMeaning) {
    it(`"${word}" suggests "${ours}" first`, () => {
      const e = refusal(word);
      expect(e).toBeInstanceOf(KalendsRangeError);
      expect(e.code).toBe('unknown-name');
      expect(e.message.startsWith(`options.aggregations[0]: unknown aggregation ${JSON.stringify(word)}; valid names are count, rows, sum, mean,`)).toBe(true);
      expect(suggested(e)[0]).toBe(ours);
    });
  }

  it('the two cases of the issue: a short form of the standard deviation suggests it before the sum, and of variance before the maximum', () => {
    // Before, by spelling alone: "std" suggested "sum" (distance 2) and "var" suggested "max" (distance 2).
    expect(suggested(refusal('std'))[0]).toBe('stddev');
    expect(suggested(refusal('var'))[0]).toBe('variance');
  });

  it('misspellings still get the nearest by spelling', () => {
    expect(suggested(refusal('summ'))).toContain('sum');
    expect(suggested(refusal('medain'))).toContain('median');
    expect(suggested(refusal('qunatile'))).toContain('quantile');
  });

  it('a name not offered in a context suggests only names offered there', () => {
    // Rolling windows offer no median: a synonym of it suggests nothing it cannot do.
    const e = refusal('med', true);
    expect(suggested(e)).not.toContain('median');
    const m = refusal('median', true);
    expect(m.code).toBe('unsupported');
    expect(m.message).toMatch(/^options.aggregations\[0\]: aggregation "median" is not offered here; valid names are count, sum, mean, min, max, variance, stddev/);
    expect(suggested(refusal('sd', true))[0]).toBe('stddev');
  });

  it('the streaming accumulator suggests the same, inside its definition error', () => {
    expect(() => defineBucketAccumulator({ unit: 'day', zone: 'UTC', aggregations: ['avg' as never] })).toThrow(/aggregations\[0\]: unknown aggregation "avg"; .*did you mean "mean"/);
  });

  it('every alternative word names one of our aggregations and is not itself one', () => {
    for (const [word, name] of Object.entries(AGGREGATION_SYNONYMS)) {
      expect(AGGREGATION_NAMES).toContain(name);
      expect(AGGREGATION_NAMES).not.toContain(word);
      expect(word).toBe(word.toLowerCase());
    }
  });
});
