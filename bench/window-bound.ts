/**
 * A lower bound for a rolling window over time, measured rather than argued: how long it takes only to find each
 * row's window start, with nothing summed, counted or divided, on the same 10M irregular points as the rolling
 * benchmark in series.ts. If this step alone costs more than the goal allows for the whole rolling mean (6x the
 * plain sum loop), the goal is out of reach for that way of computing it.
 *
 * Window start of row i: the number l of rows with t <= t[i] - L (rows are sorted), so the window (t - L, t] holds
 * rows l..i. Each probe finds l by merging the instants with the instants minus L: three rows of look-ahead tested
 * branch-free, then a loop for any further row (the same step as the rolling kernel's). Each writes i + 1 - l for
 * every row, so the probes can be checked against each other.
 *
 * The probes: plain JavaScript with one merge; plain JavaScript with four independent merges over four quarters of
 * the rows, interleaved in one loop (so that four chains of dependent loads overlap); and the same four-merge loop
 * in WebAssembly (hand-encoded below: no typed-array checks per access, which V8 keeps in JavaScript loops), once
 * with the copies a WebAssembly kernel would need (instants and values into its memory, results out) and once
 * without them. A last case measures the other half of the work without the merge: compensated running sums in and
 * out at a fixed lag (the mean window size) and the division. Benchmark code only: the library itself stays
 * plain TypeScript.
 */
import type { Series } from '../src/index.js';
import type { Benchmark } from './harness.js';

const LANES = 4;

/** Unsigned LEB128, as WebAssembly encodes counts, sizes and indexes. */
function uleb(n: number): number[] {
  const out: number[] = [];
  do {
    let byte = n & 0x7f;
    n >>>= 7;
    if (n !== 0) byte |= 0x80;
    out.push(byte);
  } while (n !== 0);
  return out;
}

/** Signed LEB128, for i32.const immediates. */
function sleb(n: number): number[] {
  const out: number[] = [];
  for (;;) {
    const byte = n & 0x7f;
    n >>= 7;
    if ((n === 0 && (byte & 0x40) === 0) || (n === -1 && (byte & 0x40) !== 0)) {
      out.push(byte);
      return out;
    }
    out.push(byte | 0x80);
  }
}

const vector = (items: number[][]): number[] => [...uleb(items.length), ...items.flat()];
const section = (id: number, body: number[]): number[] => [id, ...uleb(body.length), ...body];
const name = (s: string): number[] => [...uleb(s.length), ...Array.from(s, (c) => c.charCodeAt(0))];

// Opcodes of the WebAssembly 1.0 core specification (section 5.4, instructions) used below.
const OP = {
  block: 0x02,
  loop: 0x03,
  end: 0x0b,
  br: 0x0c,
  brIf: 0x0d,
  localGet: 0x20,
  localSet: 0x21,
  i32Load: 0x28,
  f64Load: 0x2b,
  f64Store: 0x39,
  i32Const: 0x41,
  i32LtS: 0x48,
  f64Gt: 0x64,
  f64Le: 0x65,
  i32Add: 0x6a,
  i32Sub: 0x6b,
  i32Mul: 0x6c,
  i32Shl: 0x74,
  f64Sub: 0xa1,
  f64ConvertI32S: 0xb7,
} as const;
const VOID = 0x40;
const I32 = 0x7f;
const F64 = 0x7c;

/**
 * The module: imports memory `m.memory`, exports `starts(steps, lengthMs, outAt, startsAt)`. Instants are at byte
 * 0 (with three Infinity rows after the last), lane k handles rows [k * steps, (k + 1) * steps) and starts from the
 * window start stored as i32 at startsAt + 4k; i + 1 - l goes as f64 to outAt + 8i.
 */
export function windowStartModule(): Uint8Array<ArrayBuffer> {
  // Locals: parameters 0-3, then per lane i, l (i32), st (f64), lp (i32); then the step counter.
  const [steps, lengthMs, outAt, startsAt] = [0, 1, 2, 3];
  const iOf = (k: number) => 4 + 4 * k;
  const lOf = (k: number) => 5 + 4 * k;
  const stOf = (k: number) => 6 + 4 * k;
  const lpOf = (k: number) => 7 + 4 * k;
  const step = 4 + 4 * LANES;
  const get = (x: number) => [OP.localGet, x];
  const set = (x: number) => [OP.localSet, x];
  const i32 = (v: number) => [OP.i32Const, ...sleb(v)];
  const loadF64 = (offset: number) => [OP.f64Load, 3, ...uleb(offset)];
  const setup: number[] = [];
  for (let k = 0; k < LANES; k++) {
    setup.push(...get(startsAt), OP.i32Load, 2, ...uleb(4 * k), ...set(lOf(k)));
    setup.push(...get(steps), ...i32(k), OP.i32Mul, ...set(iOf(k)));
  }
  const lane = (k: number): number[] => [
    // st = t[i] - L; lp = 8l
    ...get(iOf(k)), ...i32(3), OP.i32Shl, ...loadF64(0), ...get(lengthMs), OP.f64Sub, ...set(stOf(k)),
    ...get(lOf(k)), ...i32(3), OP.i32Shl, ...set(lpOf(k)),
    // l += (t[l] <= st) + (t[l + 1] <= st) + (t[l + 2] <= st)
    ...get(lOf(k)),
    ...get(lpOf(k)), ...loadF64(0), ...get(stOf(k)), OP.f64Le, OP.i32Add,
    ...get(lpOf(k)), ...loadF64(8), ...get(stOf(k)), OP.f64Le, OP.i32Add,
    ...get(lpOf(k)), ...loadF64(16), ...get(stOf(k)), OP.f64Le, OP.i32Add,
    ...set(lOf(k)),
    // while (!(t[l] > st)) l++
    OP.block, VOID, OP.loop, VOID,
    ...get(lOf(k)), ...i32(3), OP.i32Shl, ...loadF64(0), ...get(stOf(k)), OP.f64Gt, OP.brIf, 1,
    ...get(lOf(k)), ...i32(1), OP.i32Add, ...set(lOf(k)), OP.br, 0,
    OP.end, OP.end,
    // out[i] = i + 1 - l; i++
    ...get(outAt), ...get(iOf(k)), ...i32(3), OP.i32Shl, OP.i32Add,
    ...get(iOf(k)), ...i32(1), OP.i32Add, ...get(lOf(k)), OP.i32Sub, OP.f64ConvertI32S, OP.f64Store, 3, 0,
    ...get(iOf(k)), ...i32(1), OP.i32Add, ...set(iOf(k)),
  ];
  const lanes: number[] = [];
  for (let k = 0; k < LANES; k++) lanes.push(...lane(k));
  const body = [
    ...setup,
    OP.loop, VOID,
    ...lanes,
    ...get(step), ...i32(1), OP.i32Add, ...set(step),
    ...get(step), ...get(steps), OP.i32LtS, OP.brIf, 0,
    OP.end,
    OP.end,
  ];
  const locals: number[][] = [];
  for (let k = 0; k < LANES; k++) locals.push([2, I32], [1, F64], [1, I32]);
  locals.push([1, I32]);
  const code = [...vector(locals), ...body];
  return new Uint8Array([
    0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00, // magic, version 1
    ...section(1, vector([[0x60, ...vector([[I32], [F64], [I32], [I32]]), 0x00]])), // type: (i32 f64 i32 i32) -> ()
    ...section(2, vector([[...name('m'), ...name('memory'), 0x02, 0x00, ...uleb(1)]])), // import memory, min 1 page
    ...section(3, vector([[0]])), // one function of type 0
    ...section(7, vector([[...name('starts'), 0x00, 0]])), // export it
    ...section(10, vector([[...uleb(code.length), ...code]])),
  ]);
}

/** The first row whose instant is above `x` (rows sorted): the window start for a window ending after x + L. */
function firstAbove(t: Float64Array, x: number): number {
  let lo = 0;
  let hi = t.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (t[mid]! <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** One merge in plain JavaScript. `t` carries three Infinity rows after the `n` real ones. */
function startsOneMerge(t: Float64Array, n: number, lengthMs: number, out: Float64Array): void {
  let l = 0;
  for (let i = 0; i < n; i++) {
    const st = t[i]! - lengthMs;
    l += +(t[l]! <= st) + +(t[l + 1]! <= st) + +(t[l + 2]! <= st);
    while (t[l]! <= st) l++;
    out[i] = i + 1 - l;
  }
}

/** Four independent merges over the four quarters of the rows, interleaved in one loop. */
function startsFourMerges(t: Float64Array, n: number, lengthMs: number, out: Float64Array): void {
  const m = n / LANES;
  let i0 = 0;
  let i1 = m;
  let i2 = 2 * m;
  let i3 = 3 * m;
  let l0 = 0;
  let l1 = firstAbove(t, t[i1]! - lengthMs);
  let l2 = firstAbove(t, t[i2]! - lengthMs);
  let l3 = firstAbove(t, t[i3]! - lengthMs);
  for (let s = 0; s < m; s++) {
    const s0 = t[i0]! - lengthMs;
    const s1 = t[i1]! - lengthMs;
    const s2 = t[i2]! - lengthMs;
    const s3 = t[i3]! - lengthMs;
    l0 += +(t[l0]! <= s0) + +(t[l0 + 1]! <= s0) + +(t[l0 + 2]! <= s0);
    l1 += +(t[l1]! <= s1) + +(t[l1 + 1]! <= s1) + +(t[l1 + 2]! <= s1);
    l2 += +(t[l2]! <= s2) + +(t[l2 + 1]! <= s2) + +(t[l2 + 2]! <= s2);
    l3 += +(t[l3]! <= s3) + +(t[l3 + 1]! <= s3) + +(t[l3 + 2]! <= s3);
    while (t[l0]! <= s0) l0++;
    while (t[l1]! <= s1) l1++;
    while (t[l2]! <= s2) l2++;
    while (t[l3]! <= s3) l3++;
    out[i0] = i0 + 1 - l0;
    out[i1] = i1 + 1 - l1;
    out[i2] = i2 + 1 - l2;
    out[i3] = i3 + 1 - l3;
    i0++;
    i1++;
    i2++;
    i3++;
  }
}

/**
 * The other half of a rolling mean, without the merge: compensated running sums (Knuth's TwoSum) of the rows
 * added and the rows removed, at a fixed lag of `lag` rows (a window by row count), and one division per row.
 */
function sumsAtFixedLag(v: Float64Array, n: number, lag: number, out: Float64Array): void {
  let ph = 0;
  let ch = 0;
  let pt = 0;
  let ct = 0;
  for (let i = 0; i < n; i++) {
    const x = v[i]!;
    let y = ph + x;
    let b = y - ph;
    ch += ph - (y - b) + (x - b);
    ph = y;
    const j = i - lag;
    const z = j >= 0 ? v[j]! : 0;
    y = pt + z;
    b = y - pt;
    ct += pt - (y - b) + (z - b);
    pt = y;
    out[i] = (ph - pt + (ch - ct)) / (j >= 0 ? lag : i + 1);
  }
}

/**
 * The bound benchmark over a series' instants and first value column (at least 4 rows, a multiple of 4). The
 * probes' outputs are compared with each other before anything is timed; a mismatch throws.
 */
export function windowStartBound(s: Series, lengthMs: number, floor: { name: string; run: () => unknown }): Benchmark {
  const n = s.length;
  if (n % LANES !== 0) throw new RangeError(`windowStartBound: expected a multiple of ${LANES} rows, got ${n}`);
  const values = Object.values(s.columns)[0]!;
  // Plain arrays with three Infinity rows of look-ahead padding.
  const padded = new Float64Array(n + 3);
  padded.set(s.epochMs);
  padded.fill(Infinity, n);
  // WebAssembly memory: instants (+3 padding), values, results, lane starts.
  const valuesAt = (n + 3) * 8;
  const outAt = valuesAt + n * 8;
  const startsAt = outAt + n * 8;
  const memory = new WebAssembly.Memory({ initial: Math.ceil((startsAt + 4 * LANES) / 65536) });
  const { exports } = new WebAssembly.Instance(new WebAssembly.Module(windowStartModule()), { m: { memory } });
  const starts = exports.starts as (steps: number, lengthMs: number, outAt: number, startsAt: number) => void;
  const wt = new Float64Array(memory.buffer, 0, n + 3);
  const wv = new Float64Array(memory.buffer, valuesAt, n);
  const wout = new Float64Array(memory.buffer, outAt, n);
  const wstarts = new Int32Array(memory.buffer, startsAt, LANES);
  const out = new Float64Array(n);
  const m = n / LANES;
  const runWasm = (copy: boolean): number => {
    if (copy) {
      wt.set(s.epochMs);
      wv.set(values);
    }
    for (let k = 0; k < LANES; k++) wstarts[k] = k === 0 ? 0 : firstAbove(s.epochMs, s.epochMs[k * m]! - lengthMs);
    starts(m, lengthMs, outAt, startsAt);
    if (copy) out.set(wout);
    return copy ? out[n - 1]! : wout[n - 1]!;
  };
  wt.fill(Infinity, n);
  runWasm(true);
  const reference = Float64Array.from(out);
  const check = (label: string, got: Float64Array) => {
    for (let i = 0; i < n; i++) {
      if (got[i] !== reference[i]) throw new Error(`windowStartBound: ${label} gives ${got[i]} at row ${i}, WebAssembly ${reference[i]}`);
    }
  };
  startsOneMerge(padded, n, lengthMs, out);
  check('one merge', out);
  startsFourMerges(padded, n, lengthMs, out);
  check('four merges', out);
  // The lag of the sums-only case: the mean number of rows in a window.
  let rows = 0;
  for (let i = 0; i < n; i++) rows += reference[i]!;
  const lag = Math.round(rows / n);
  return {
    name: 'series-window-start-bound',
    description: 'lower bound for a 30-day time window over 10M irregular points: window starts only, no sums',
    elements: n,
    unit: 'point',
    ours: { name: 'window starts only: WebAssembly, 4 merges, copies in and out', run: () => runWasm(true) },
    baselines: [
      floor,
      { name: 'window starts only: WebAssembly, 4 merges, data already in its memory', run: () => runWasm(false) },
      { name: 'window starts only: JavaScript, 4 merges', run: () => (startsFourMerges(padded, n, lengthMs, out), out[n - 1]) },
      { name: 'window starts only: JavaScript, 1 merge', run: () => (startsOneMerge(padded, n, lengthMs, out), out[n - 1]) },
      { name: `sums only: compensated, fixed lag of ${lag} rows, no merge`, run: () => (sumsAtFixedLag(values, n, lag, out), out[n - 1]) },
    ],
  };
}
