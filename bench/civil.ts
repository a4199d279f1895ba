import { Temporal } from 'temporal-polyfill';
import { dayNumberFromYmdBulk, ymdFromDayNumberBulk } from '../src/index.js';
import type { Benchmark } from './harness.js';

const N = 10_000_000;

/** Day numbers to year/month/day and back, over 10 million consecutive days starting 1900-01-01. */
function civilRoundTrip(): Benchmark {
  const start = -25567; // 1900-01-01
  const days = new Int32Array(N);
  for (let i = 0; i < N; i++) days[i] = start + i;
  const years = new Int32Array(N);
  const months = new Int32Array(N);
  const dom = new Int32Array(N);
  const back = new Int32Array(N);
  const sample = 200_000;
  return {
    name: 'civil-round-trip',
    description: 'day number -> year/month/day -> day number',
    elements: N,
    unit: 'day',
    ours: {
      name: 'kalends bulk',
      run: () => {
        ymdFromDayNumberBulk(days, { years, months, days: dom });
        dayNumberFromYmdBulk(years, months, dom, back);
        return back[N - 1];
      },
    },
    baselines: [
      {
        name: 'Temporal.PlainDate (temporal-polyfill)',
        elements: sample,
        run: () => {
          const epoch = Temporal.PlainDate.from('1970-01-01');
          let acc = 0;
          for (let i = 0; i < sample; i++) {
            const d = epoch.add({ days: days[i]! });
            const again = Temporal.PlainDate.from({ year: d.year, month: d.month, day: d.day });
            acc += again.since(epoch).days;
          }
          return acc;
        },
      },
      {
        name: 'Date UTC methods',
        elements: N,
        run: () => {
          let acc = 0;
          for (let i = 0; i < N; i++) {
            const d = new Date(days[i]! * 86_400_000);
            acc += Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate()) / 86_400_000;
          }
          return acc;
        },
      },
      {
        name: 'typed-array copy loop (floor)',
        elements: N,
        run: () => {
          for (let i = 0; i < N; i++) back[i] = days[i]! + 1;
          return back[N - 1];
        },
      },
    ],
  };
}

export const benchmarks: readonly (() => Benchmark)[] = [civilRoundTrip];
