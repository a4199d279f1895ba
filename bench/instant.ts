import { Temporal } from 'temporal-polyfill';
import { parseInstant } from '../src/index.js';
import { seededRandom, type Benchmark } from './harness.js';

const N = 200_000;

/** RFC 3339 strings with offsets and fractions, parsed to epoch ms. */
function parseRfc3339(): Benchmark {
  const rnd = seededRandom(3339);
  const texts: string[] = [];
  for (let i = 0; i < N; i++) {
    const ms = Math.floor(946_684_800_000 + rnd() * 1_262_304_000_000);
    const offsetMin = Math.round((rnd() * 24 - 12) * 4) * 15;
    const local = new Date(ms + offsetMin * 60_000).toISOString().slice(0, 23);
    const sign = offsetMin < 0 ? '-' : '+';
    const a = Math.abs(offsetMin);
    texts.push(`${local}${sign}${String(Math.floor(a / 60)).padStart(2, '0')}:${String(a % 60).padStart(2, '0')}`);
  }
  return {
    name: 'instant-parse',
    description: 'RFC 3339 text with offset -> epoch ms',
    elements: N,
    unit: 'string',
    ours: { name: 'parseInstant', run: () => texts.reduce((acc, t) => acc + parseInstant(t).epochMs, 0) },
    baselines: [
      { name: 'Temporal.Instant.from (temporal-polyfill)', run: () => texts.reduce((acc, t) => acc + Temporal.Instant.from(t).epochMilliseconds, 0) },
      { name: 'Date.parse', run: () => texts.reduce((acc, t) => acc + Date.parse(t), 0) },
    ],
  };
}

export const benchmarks: readonly (() => Benchmark)[] = [parseRfc3339];
