import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { Temporal } from 'temporal-polyfill';
import { clearZoneCache, dayNumberFromEpochMsBulk, listZoneIds, offsetSecondsFromEpochMs, zoneFromId, zoneFromRules } from '../src/zone/index.js';
import { IntlEngine } from '../src/zone/engine.js';
import { engineOf } from '../src/zone/zone.js';
import { defineUnit, ordinalFromEpochMsBulk } from '../src/period/index.js';
import { probeFormatter } from '../src/zone/intl.js';
import { pinnedZoneRules } from '../src/tzdata/index.js';
import { type Benchmark, seededRandom } from './harness.js';
import { daysFromCivil, sameOutput, zoneDayFloorLoop, zoneDayFloorTable } from './floors.js';

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
  const floor = zoneDayFloorTable(ZONE, lo, hi);
  const check = new Int32Array(N);
  const runFloor = (): number => Reflect.apply(zoneDayFloorLoop, undefined, [floor.d0, floor.offsets, floor.before, floor.changeAt, floor.after, instants, check, N]);
  runFloor();
  sameOutput('zone-day-numbers floor', dayNumberFromEpochMsBulk(ZONE, instants, out), check, N);
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
      { name: 'floor: per-UTC-day offset table (precomputed), a multiplication', run: runFloor },
      {
        name: 'temporal-polyfill Instant -> ZonedDateTime per element, fields and integer math',
        elements: temporalSample,
        run: () => {
          let acc = 0;
          for (let i = 0; i < temporalSample; i++) {
            const z = Temporal.Instant.fromEpochMilliseconds(instants[i]!).toZonedDateTimeISO(ZONE);
            acc += daysFromCivil(z.year, z.month, z.day);
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

/** The instant of the first answer in the fresh-process benchmark, and the year its bulk calls cover. */
const FIRST_ANSWER_MS = Date.UTC(2025, 6, 1, 12);

/** 1M random instants of 2025 (seeded). */
function instantsOf2025(): Float64Array {
  const rnd = seededRandom(2025);
  const lo = Date.UTC(2025, 0, 1);
  const instants = new Float64Array(N);
  for (let i = 0; i < N; i++) instants[i] = Math.floor(lo + rnd() * 365 * 86_400_000);
  return instants;
}

/** The floor of a bulk pass: local day numbers at a fixed offset (-4 h), a multiplication per element. */
function floorPass(instants: Float64Array, out: Int32Array): number {
  for (let i = 0; i < instants.length; i++) out[i] = Math.floor((instants[i]! - 14_400_000) * 1.1574074074074074e-8);
  return out[0]!;
}

/**
 * Times the first three calls of `pass` (ms) in this fresh process into `result`. The third shows whether the second
 * still paid for V8's tiering (a recompile of the kernel in flight while it runs).
 */
function timeFirstAndSecond(result: Record<string, number>, pass: () => unknown): void {
  for (const key of ['firstBulkMs', 'secondBulkMs', 'thirdBulkMs']) {
    const t = performance.now();
    pass();
    result[key] = performance.now() - t;
  }
}

/**
 * The child side of {@link firstAnswerFresh}, run by `bench/run.ts --fresh-child <mode>` in a process of its own:
 * with ICU already warm (one formatter made and used for another zone, as a process that has used Intl once),
 * times the first zoned answer of one mode and prints it as JSON. The bulk modes time the first three bulk calls
 * over 1M instants of 2025 instead:
 * - `kalends` also times dayNumberFromEpochMsBulk, and how long its first call spent compiling the zone from Intl;
 * - `intl` also times the runtime's own cold start on the simplest loop ({@link floorPass}), and the first and a
 *   second write of a fresh 1M-element Int32Array (`fill`: the cost of the OS mapping its pages, which every first
 *   call into a fresh output pays);
 * - `kalends-written` and `floor-written` time the same two passes into an output written once before (no page
 *   mapped during the calls);
 * - `period` times ordinalFromEpochMsBulk (fiscal quarters: period keys from instants).
 */
export function firstAnswerChild(mode: string): void {
  new Intl.DateTimeFormat('en-US', { timeZone: 'Europe/Paris' }).format(0);
  const result: Record<string, number> = {};
  if (mode === 'kalends' || mode === 'temporal' || mode === 'intl') {
    const t0 = performance.now();
    if (mode === 'kalends') result['answer'] = offsetSecondsFromEpochMs(zoneFromId(ZONE), FIRST_ANSWER_MS);
    else if (mode === 'temporal') result['answer'] = Temporal.Instant.fromEpochMilliseconds(FIRST_ANSWER_MS).toZonedDateTimeISO(ZONE).offsetNanoseconds / 1e9;
    else result['answer'] = new Intl.DateTimeFormat('en-US', { timeZone: ZONE, timeZoneName: 'longOffset' }).formatToParts(FIRST_ANSWER_MS).length;
    result['ms'] = performance.now() - t0;
  }
  const instants = mode === 'temporal' ? new Float64Array(0) : instantsOf2025();
  const out = new Int32Array(instants.length);
  if (mode.endsWith('-written')) out.fill(1);
  if (mode === 'intl' || mode === 'floor-written') timeFirstAndSecond(result, () => floorPass(instants, out));
  if (mode === 'kalends' || mode === 'kalends-written') {
    const z = zoneFromId(ZONE);
    timeFirstAndSecond(result, () => dayNumberFromEpochMsBulk(z, instants, out));
    result['compileMs'] = engineOf(z).compileMs;
  }
  if (mode === 'period') {
    const unit = defineUnit({ kind: 'fiscal-quarter', start: { month: 10, day: 1 }, naming: 'end-year' });
    const z = zoneFromId(ZONE);
    timeFirstAndSecond(result, () => ordinalFromEpochMsBulk(unit, z, instants, out));
  }
  if (mode === 'intl') {
    const fresh = new Int32Array(N);
    let t = performance.now();
    fresh.fill(1);
    result['touchMs'] = performance.now() - t;
    t = performance.now();
    fresh.fill(2);
    result['rewriteMs'] = performance.now() - t;
  }
  console.log(JSON.stringify(result));
}

/**
 * Time to the first zoned answer in fresh `node` processes (issue 17, section 3): kalends (zoneFromId and one
 * offset), temporal-polyfill (its first ZonedDateTime) and a bare Intl formatter (the runtime's own start), each
 * in 9 processes of its own, interleaved; and the first three bulk calls over 1M instants (kalends' day numbers
 * and period keys, and the floor loop), into a fresh output and into one written before. Prints its own table (the
 * figures come from the children, not from this process).
 */
function firstAnswerFresh(): Benchmark {
  let measured = false;
  return {
    name: 'zone-first-answer-fresh',
    // Measured when the harness reads the description, so that a run filtered to other benchmarks (which makes
    // every benchmark's factory to read its name) spawns nothing.
    get description(): string {
      if (!measured) measureFreshProcesses();
      measured = true;
      return 'the same first answer in this (warm) process after clearZoneCache, for comparison (fresh processes above)';
    },
    elements: 1,
    unit: 'answer',
    rounds: 21,
    ours: {
      name: 'kalends zoneFromId + offsetSecondsFromEpochMs, cache cleared',
      run: () => {
        clearZoneCache();
        return offsetSecondsFromEpochMs(zoneFromId(ZONE), FIRST_ANSWER_MS);
      },
    },
    baselines: [],
  };
}

function measureFreshProcesses(): void {
  const script = process.argv[1]!;
  const modes = ['kalends', 'temporal', 'intl', 'kalends-written', 'floor-written', 'period'];
  const runs: Record<string, Record<string, number>[]> = Object.fromEntries(modes.map((m) => [m, []]));
  for (let r = 0; r < 9; r++) {
    for (let m = 0; m < modes.length; m++) {
      const mode = modes[(r + m) % modes.length]!;
      const child = spawnSync(process.execPath, [script, '--fresh-child', mode], { encoding: 'utf8' });
      const line = child.stdout.trim().split('\n').pop() ?? '';
      if (child.status !== 0 || !line.startsWith('{')) throw new Error(`fresh child ${mode} failed: ${child.stderr}`);
      runs[mode]!.push(JSON.parse(line) as Record<string, number>);
    }
  }
  const med = (xs: number[]): number => [...xs].sort((a, b) => a - b)[xs.length >> 1]!;
  const range = (xs: number[], digits: number): string => `${Math.min(...xs).toFixed(digits)}-${Math.max(...xs).toFixed(digits)}`;
  const fmt = (xs: number[]): string => `${med(xs).toFixed(3)} ms (${range(xs, 3)})`;
  const of = (mode: string, key: string): number[] => runs[mode]!.map((x) => x[key]!);
  const k = of('kalends', 'ms');
  const tp = of('temporal', 'ms');
  const intl = of('intl', 'ms');
  console.log('\n## zone-first-answer-fresh: first zoned answer in a fresh node process, ICU warm (9 processes per case, interleaved)');
  console.log(`   kalends zoneFromId + offsetSecondsFromEpochMs        ${fmt(k)}`);
  console.log(`   temporal-polyfill first ZonedDateTime                ${fmt(tp)}`);
  console.log(`   bare Intl.DateTimeFormat + formatToParts (runtime)   ${fmt(intl)}`);
  console.log(`   kalends beyond the bare formatter: ${(med(k) - med(intl)).toFixed(3)} ms (goal <= 1 ms); kalends / temporal-polyfill: ${(med(k) / med(tp)).toFixed(2)}x (goal <= 1x)`);
  /** The first three bulk calls of a mode, and the median (and range) of the first's ratio to the others. */
  const bulk = (mode: string): string => {
    const first = of(mode, 'firstBulkMs');
    const second = of(mode, 'secondBulkMs');
    const third = of(mode, 'thirdBulkMs');
    const ratios = first.map((f, i) => f / second[i]!);
    const toThird = first.map((f, i) => f / third[i]!);
    return `first call ${fmt(first)}; second: ${fmt(second)}; first / second ${med(ratios).toFixed(2)}x (${range(ratios, 2)}); third: ${fmt(third)}; first / third ${med(toThird).toFixed(2)}x`;
  };
  console.log(`   kalends dayNumberFromEpochMsBulk, 1M instants of 2025, fresh output: ${bulk('kalends')} (goal <= 3x)`);
  console.log(`   the runtime's own cold start, a plain floor loop (fixed offset) over the same instants: ${bulk('intl')}`);
  const above = med(of('kalends', 'firstBulkMs')) - med(of('intl', 'firstBulkMs'));
  console.log(`   kalends' first call above the floor's first call: ${above.toFixed(3)} ms (medians); compiling the zone from Intl within it: ${fmt(of('kalends', 'compileMs'))}`);
  console.log(`   a fresh 1M-element Int32Array, first write (the OS maps its pages): ${fmt(of('intl', 'touchMs'))}; second write: ${fmt(of('intl', 'rewriteMs'))}`);
  console.log(`   into an output written once before, kalends: ${bulk('kalends-written')}`);
  console.log(`   into an output written once before, floor loop: ${bulk('floor-written')}`);
  console.log(`   kalends ordinalFromEpochMsBulk (fiscal quarters, period keys), fresh output: ${bulk('period')}`);
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
export const benchmarks: readonly (() => Benchmark)[] = [localDayNumbers, compileCentury, firstUse, firstAnswerFresh, footprint];
