import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { Temporal } from 'temporal-polyfill';
import { clearZoneCache, dayNumberFromEpochMsBulk, listZoneIds, offsetSecondsFromEpochMs, zoneFromId, zoneFromRules } from '../src/zone/index.js';
import { IntlEngine } from '../src/zone/engine.js';
import { probeFormatter } from '../src/zone/intl.js';
import { pinnedZoneRules } from '../src/tzdata/index.js';
import { type Benchmark, seededRandom } from './harness.js';

const N = 1_000_000;
const ZONE = 'America/New_York';

/** The benchmark: 1M random instants 2000-2040 in America/New_York to local day numbers. */
function localDayNumbers(): Benchmark {
  const rnd = seededRandom(2040);
  const lo = Date.UTC(2000, 0, 1);
  const hi = Date.UTC(2040, 0, 1);
  const instants = new Float64Array(N);
  for (let i = 0; i < N; i++) instants[i] = Math.floor(lo + rnd() * (hi - lo));
  const out = new Int32Array(N);
  const temporalSample = 20_000;
  const intlSample = 100_000;
  const fmt = new Intl.DateTimeFormat('en-US', { timeZone: ZONE, year: 'numeric', month: 'numeric', day: 'numeric' });
  return {
    name: 'zone-day-numbers',
    description: `random instants 2000-2040 -> local day numbers in ${ZONE} (Intl source)`,
    elements: N,
    unit: 'instant',
    rounds: 9,
    processes: 3,
    ours: {
      name: 'kalends dayNumberFromEpochMsBulk',
      run: () => dayNumberFromEpochMsBulk(ZONE, instants, out)[N - 1],
    },
    // The floor loop first, right after ours in every round (see bench/period.ts); the slow samples last.
    baselines: [
      {
        name: 'floor loop Math.floor(ms / 86400000)',
        run: () => {
          for (let i = 0; i < N; i++) out[i] = Math.floor(instants[i]! / 86_400_000);
          return out[N - 1];
        },
      },
      {
        name: 'temporal-polyfill Instant -> ZonedDateTime per element',
        elements: temporalSample,
        run: () => {
          let acc = 0;
          for (let i = 0; i < temporalSample; i++) {
            const z = Temporal.Instant.fromEpochMilliseconds(instants[i]!).toZonedDateTimeISO(ZONE);
            acc += z.toPlainDate().since('1970-01-01').days;
          }
          return acc;
        },
      },
      {
        name: 'cached Intl.DateTimeFormat formatToParts per element',
        elements: intlSample,
        run: () => {
          let acc = 0;
          for (let i = 0; i < intlSample; i++) {
            const parts = fmt.formatToParts(instants[i]!);
            let y = 0;
            let m = 0;
            let d = 0;
            for (const p of parts) {
              if (p.type === 'year') y = Number(p.value);
              else if (p.type === 'month') m = Number(p.value);
              else if (p.type === 'day') d = Number(p.value);
            }
            acc += Date.UTC(y, m - 1, d) / 86_400_000;
          }
          return acc;
        },
      },
    ],
  };
}

/** Compiling a zone's table for 1900-2100 from Intl, fresh each run, against the pinned data. */
function compileCentury(): Benchmark {
  let k = 0;
  const ids = ['Europe/Paris', 'America/Chicago', 'Australia/Sydney', 'Africa/Casablanca', 'America/Sao_Paulo', 'Asia/Tehran', 'Europe/London'];
  return {
    name: 'zone-compile-1900-2100',
    description: 'compile one zone for 1900-2100: Intl search (fresh formatter and table) vs pinned data',
    elements: 1,
    unit: 'zone',
    rounds: 7,
    ours: {
      name: 'Intl source, 1900-2100',
      run: () => {
        const engine = new IntlEngine(probeFormatter(ids[k++ % ids.length]!)!);
        const at: number[] = [];
        engine.collect(Date.UTC(1900, 0, 1), Date.UTC(2100, 0, 1), at, []);
        return at.length + engine.probes;
      },
    },
    baselines: [
      {
        name: 'pinned tz data (kalends/tzdata), 1900-2100',
        run: () => {
          const z = zoneFromRules(pinnedZoneRules(ids[k++ % ids.length]!)!);
          let acc = 0;
          for (let y = 1900; y < 2100; y++) acc += offsetSecondsFromEpochMs(z, Date.UTC(y, 6, 1));
          return acc;
        },
      },
    ],
  };
}

/** A zone's first use: id validation, formatter, and the one-year chunk around the first query. */
function firstUse(): Benchmark {
  const ids = listZoneIds().filter((id) => id.includes('/'));
  let k = 0;
  return {
    name: 'zone-first-use',
    description: 'first query of a zone not seen before (zoneFromId + offsetSecondsFromEpochMs, Intl source)',
    elements: 1,
    unit: 'zone',
    rounds: 41,
    ours: {
      name: 'kalends first use',
      run: () => {
        clearZoneCache();
        return offsetSecondsFromEpochMs(zoneFromId(ids[k++ % ids.length]!), Date.UTC(2025, 6, 1));
      },
    },
    baselines: [
      {
        name: 'new Intl.DateTimeFormat + one formatToParts',
        run: () => new Intl.DateTimeFormat('en-US', { timeZone: ids[k++ % ids.length]!, timeZoneName: 'longOffset' }).formatToParts(Date.UTC(2025, 6, 1)).length,
      },
    ],
  };
}

/** Prints the memory of compiled tables and the size of the pinned module (not ratios: figures for the docs). */
function footprint(): Benchmark {
  const g = (globalThis as { gc?: () => void }).gc;
  const ids = listZoneIds().filter((id) => id.includes('/')).slice(0, 60);
  clearZoneCache();
  g?.();
  const before = process.memoryUsage().heapUsed;
  const keep = ids.map((id) => {
    const z = zoneFromId(id);
    offsetSecondsFromEpochMs(z, 0);
    dayNumberFromEpochMsBulk(z, [Date.UTC(1900, 0, 1), Date.UTC(2099, 11, 31)].concat(Array.from({ length: 200 }, (_, i) => Date.UTC(1900 + i, 0, 1))));
    return z;
  });
  g?.();
  const after = process.memoryUsage().heapUsed;
  const perZone = Math.round((after - before) / keep.length);
  const data = readFileSync(join(process.cwd(), 'src/tzdata/data.ts')); // run from the repository root
  console.log(`\n## zone-footprint: ${keep.length} zones compiled 1900-2100: about ${perZone.toLocaleString('en-US')} bytes of heap per zone${g ? '' : ' (run with --expose-gc for a steadier figure)'}`);
  console.log(`   pinned module src/tzdata/data.ts: ${data.length.toLocaleString('en-US')} bytes, ${gzipSync(data).length.toLocaleString('en-US')} bytes gzipped`);
  return {
    name: 'zone-footprint',
    description: 'offset lookups in the 60 compiled zones (scalar, cached tables)',
    elements: keep.length * 1000,
    unit: 'lookup',
    ours: {
      name: 'offsetSecondsFromEpochMs on compiled zones',
      run: () => {
        let acc = 0;
        for (const z of keep) for (let i = 0; i < 1000; i++) acc += offsetSecondsFromEpochMs(z, Date.UTC(1900 + (i % 200), i % 12, 1));
        return acc;
      },
    },
    baselines: [],
  };
}

/** Benchmarks of this layer. Each is a factory so that its data is made only when it runs. */
export const benchmarks: readonly (() => Benchmark)[] = [localDayNumbers, compileCentury, firstUse, footprint];
