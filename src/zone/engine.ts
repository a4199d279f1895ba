/**
 * The compiled form of a zone: a lazily filled table of offset changes, kept in chunks of one mean Gregorian
 * year (31,556,952 s). Each source (Intl, TZif / rules data, fixed offset) knows how to compile one chunk; the
 * queries in this layer only read chunks. A chunk holds the offset in force just before it and the transitions
 * inside it, so the table can have holes (a query for 1900 and one for 9999 compile two chunks, not 8,100).
 *
 * A "transition" is an instant where the UTC offset changes. Changes of only an abbreviation or a DST flag are not
 * transitions here, because the runtime's Intl does not show them.
 *
 * @module
 */
import { MAX_EPOCH_MS, MIN_EPOCH_MS } from '../bounds.js';
import { KalendsRangeError } from '../errors.js';
import { dayNumberFromYmdUnchecked } from '../civil/gregorian.js';
import { type PosixTz, posixOffsetAt, posixTransitions } from './posix.js';

/** Length of a chunk: one mean Gregorian year (146,097 days / 400) in ms. */
export const CHUNK_MS = 31_556_952_000;

/** One compiled chunk [s, e): offset before s and the transitions inside. */
export interface Chunk {
  readonly s: number;
  readonly e: number;
  /** Offset (seconds) in force just before `s`. */
  readonly before: number;
  /** Transition instants (epoch ms), ascending, within [s, e). */
  readonly at: Float64Array;
  /** Offset (seconds) from each transition on. */
  readonly after: Int32Array;
}

/** A transition: the instant and the offsets before and after it. */
export interface ZoneTransition {
  /** The instant of the transition (epoch milliseconds). */
  readonly epochMs: number;
  /** The offset before the transition (seconds east of UTC). */
  readonly offsetBeforeSeconds: number;
  /** The offset after the transition (seconds east of UTC). */
  readonly offsetAfterSeconds: number;
}

const EMPTY_F64 = new Float64Array(0);
const EMPTY_I32 = new Int32Array(0);

/** @internal Base of the engines. Mutable caches inside; the Zone that holds it is frozen. */
export abstract class Engine {
  /** Chunks with `e <= lowQuietMs` contain no transitions. */
  abstract readonly lowQuietMs: number;
  /** From here on the rules repeat every year; two empty chunks in a row past it mean no transitions after. */
  abstract readonly periodicFromMs: number;
  readonly chunks = new Map<number, Chunk>();
  /** Compiled chunk count and the time spent compiling (for docs and benchmarks). */
  compileMs = 0;
  // One-interval cache for scalar queries: [lo, hi) has offset `off`.
  lo = 1;
  hi = 0;
  off = 0;

  protected abstract compile(s: number, e: number): Chunk;

  chunk(k: number): Chunk {
    let c = this.chunks.get(k);
    if (c === undefined) {
      const t0 = performance.now();
      c = this.compile(k * CHUNK_MS, (k + 1) * CHUNK_MS);
      this.compileMs += performance.now() - t0;
      this.chunks.set(k, c);
    }
    return c;
  }

  /** Offset in seconds at `t` (a valid epoch ms). */
  offsetAt(t: number): number {
    if (t >= this.lo && t < this.hi) return this.off;
    this.locate(t);
    return this.off;
  }

  /** Sets the interval cache to the interval (clipped to its chunk) that contains `t`. */
  locate(t: number): void {
    const c = this.chunk(Math.floor(t / CHUNK_MS));
    const at = c.at;
    let i = 0;
    while (i < at.length && at[i]! <= t) i++;
    this.off = i === 0 ? c.before : c.after[i - 1]!;
    this.lo = i === 0 ? c.s : at[i - 1]!;
    this.hi = i < at.length ? at[i]! : c.e;
  }

  /**
   * Transitions within [startMs, endMs), appended to `at`/`after`; returns the offset just before `startMs`. The walk
   * is bounded by the caller's range, or by {@link collectWithin}.
   */
  collect(startMs: number, endMs: number, at: number[], after: number[]): number {
    const k0 = Math.floor(startMs / CHUNK_MS);
    const before = this.offsetAt(startMs - 1);
    if (!(endMs > startMs)) return before;
    const k1 = Math.floor((endMs - 1) / CHUNK_MS);
    let empty = 0;
    const kStart = Math.max(k0, Math.floor(this.lowQuietMs / CHUNK_MS) - 1);
    for (let k = kStart; k <= k1; k++) {
      const c = this.chunk(k);
      if (c.at.length === 0) {
        if (c.s >= this.periodicFromMs && ++empty >= 2) break;
        continue;
      }
      empty = 0;
      for (let j = 0; j < c.at.length; j++) {
        const t = c.at[j]!;
        if (t >= startMs && t < endMs) {
          at.push(t);
          after.push(c.after[j]!);
        }
      }
    }
    return before;
  }
}

/**
 * @internal {@link Engine.collect}, refusing a range that needs more than `maxChunks` years of rules: the range
 * itself, or the walk up to two empty years in the periodic part of the rules, after which the walk stops. (A
 * function, not a method, so that only the callers that bound their walk bundle it.)
 */
export function collectWithin(e: Engine, startMs: number, endMs: number, at: number[], after: number[], maxChunks: number): number {
  if (endMs > startMs) {
    const kStart = Math.max(Math.floor(startMs / CHUNK_MS), Math.floor(e.lowQuietMs / CHUNK_MS) - 1);
    if (Math.floor((endMs - 1) / CHUNK_MS) - kStart + 1 > maxChunks) {
      // Too many years to walk, unless the rules fall quiet in their periodic part: chunks kp and kp + 1 empty, both
      // at or past the periodic start, stop the walk of collect() within kp - kStart + 2 chunks.
      const kp = Math.max(kStart, Math.floor(e.periodicFromMs / CHUNK_MS) + 1);
      const quiet = Number.isFinite(kp) && kp - kStart + 2 <= maxChunks && e.chunk(kp).at.length === 0 && e.chunk(kp + 1).at.length === 0;
      if (!quiet) {
        throw new KalendsRangeError(
          `endEpochMs: the range needs more than ${maxChunks} years of this zone's rules at once, got ${startMs}..${endMs}; list in smaller ranges`,
          { code: 'limit-exceeded', received: endMs },
        );
      }
    }
  }
  return e.collect(startMs, endMs, at, after);
}

/** A constant offset: UTC and fixed offsets. */
export class FixedEngine extends Engine {
  readonly lowQuietMs = Infinity;
  readonly periodicFromMs = -Infinity;
  constructor(readonly offsetSeconds: number) {
    super();
    this.lo = -Infinity;
    this.hi = Infinity;
    this.off = offsetSeconds;
  }
  protected compile(s: number, e: number): Chunk {
    return { s, e, before: this.offsetSeconds, at: EMPTY_F64, after: EMPTY_I32 };
  }
  override offsetAt(): number {
    return this.offsetSeconds;
  }
  override locate(): void {}
}

/**
 * Rules given as a table of transitions (from TZif bytes or plain data) with an optional POSIX TZ tail rule for
 * instants past the table (RFC 8536 section 3.3). Redundant entries (no change of offset) are dropped.
 */
export class TableEngine extends Engine {
  readonly lowQuietMs: number;
  readonly periodicFromMs: number;
  private readonly trans: Float64Array;
  private readonly offs: Int32Array;
  private readonly tailStartMs: number;
  constructor(
    readonly initialOffsetSeconds: number,
    transitionsMs: ArrayLike<number>,
    offsetsSeconds: ArrayLike<number>,
    readonly rule: PosixTz | undefined,
  ) {
    super();
    const n = transitionsMs.length;
    this.trans = Float64Array.from(transitionsMs);
    this.offs = Int32Array.from(offsetsSeconds);
    const last = n > 0 ? this.trans[n - 1]! : -Infinity;
    const lastOffset = n > 0 ? this.offs[n - 1]! : initialOffsetSeconds;
    if (!rule) this.tailStartMs = Infinity;
    else if (n === 0) this.tailStartMs = -Infinity;
    else {
      // RFC 8536: the footer governs instants after the last transition. If it disagrees with the last
      // transition's type, the table's offset holds until the footer's first change.
      const at: number[] = [];
      const after: number[] = [];
      const p = posixTransitions(rule, last + 1, last + 1 + 3 * CHUNK_MS, at, after);
      this.tailStartMs = p === lastOffset ? last + 1 : (at[0] ?? Infinity);
    }
    this.lowQuietMs = n > 0 ? this.trans[0]! : rule ? -Infinity : Infinity;
    this.periodicFromMs = n > 0 ? last : -Infinity;
  }

  offsetAtExact(t: number): number {
    if (this.rule && t >= this.tailStartMs) return posixOffsetAt(this.rule, t);
    const tr = this.trans;
    if (tr.length === 0 || t < tr[0]!) return this.initialOffsetSeconds;
    let lo = 0;
    let hi = tr.length; // first index with tr[i] > t
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (tr[mid]! <= t) lo = mid + 1;
      else hi = mid;
    }
    return this.offs[lo - 1]!;
  }

  protected compile(s: number, e: number): Chunk {
    const before = this.offsetAtExact(s - 1);
    let state = before;
    const at: number[] = [];
    const after: number[] = [];
    const tr = this.trans;
    let lo = 0;
    let hi = tr.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (tr[mid]! < s) lo = mid + 1;
      else hi = mid;
    }
    for (let i = lo; i < tr.length && tr[i]! < e; i++) {
      const o = this.offs[i]!;
      if (o !== state) {
        at.push(tr[i]!);
        after.push(o);
        state = o;
      }
    }
    if (this.rule && e > this.tailStartMs) {
      const pa: number[] = [];
      const po: number[] = [];
      posixTransitions(this.rule, Math.max(s, this.tailStartMs), e, pa, po);
      for (let j = 0; j < pa.length; j++) {
        if (po[j] !== state) {
          at.push(pa[j]!);
          after.push(po[j]!);
          state = po[j]!;
        }
      }
    }
    return { s, e, before, at: at.length ? Float64Array.from(at) : EMPTY_F64, after: after.length ? Int32Array.from(after) : EMPTY_I32 };
  }
}

/** Before this instant (1800-01-01T00:00Z) the Intl engine assumes a constant offset; test/zone checks it. */
export const INTL_QUIET_BEFORE_MS = dayNumberFromYmdUnchecked(1800, 1, 1) * 86_400_000;
/** From this instant (2200-01-01T00:00Z) the Intl engine assumes yearly repeating rules; test/zone checks it. */
export const INTL_PERIODIC_FROM_MS = dayNumberFromYmdUnchecked(2200, 1, 1) * 86_400_000;
/**
 * Sampling step of the Intl search: 2 days. Two offset changes closer than one step could hide each other; the
 * closest pair in the tz database since 1800 is 3.99 days apart (Africa/Freetown, 1939), and test/zone compares
 * every zone against TZif files at every transition.
 */
export const INTL_STEP_MS = 2 * 86_400_000;

/** Rules read from the runtime's Intl.DateTimeFormat, by sampling and bisection to the second. */
export class IntlEngine extends Engine {
  readonly lowQuietMs = INTL_QUIET_BEFORE_MS;
  readonly periodicFromMs = INTL_PERIODIC_FROM_MS;
  /** Formatter calls so far (for docs and benchmarks). */
  probes = 0;
  /** Scalar answers given by one probe each instead of compiling their year (see {@link offsetAt}). */
  private pointAnswers = 0;
  constructor(private readonly format: Intl.DateTimeFormat) {
    super();
  }

  /**
   * The first few scalar queries in a year not compiled yet are answered by one probe each (tens of
   * microseconds) instead of compiling the year (about 180 probes, 2-3 ms): a process that asks a zone once or
   * twice never pays for a year's table. The probe reads the whole second holding `t` (offsets change on whole
   * seconds). The interval cache is left empty, so callers that read `lo`/`hi` take their general path, which
   * compiles. After 16 such answers, or outside the years the search covers, the year is compiled.
   */
  override offsetAt(t: number): number {
    if (t >= this.lo && t < this.hi) return this.off;
    if (this.pointAnswers < 16 && t >= INTL_QUIET_BEFORE_MS && t < INTL_PERIODIC_FROM_MS && !this.chunks.has(Math.floor(t / CHUNK_MS))) {
      this.pointAnswers++;
      this.lo = 1;
      this.hi = 0;
      return this.probe(Math.floor(t / 1000) * 1000);
    }
    this.locate(t);
    return this.off;
  }

  /** Offset in seconds at `t`, a multiple of 1000 ms within the ECMAScript range, from the formatted wall clock. */
  probe(t: number): number {
    this.probes++;
    const text = this.format.format(t);
    // "12/31/1999 AD, 19:00:00" (en-US, h23, era short): six numbers and an era.
    let f0 = 0;
    let f1 = 0;
    let f2 = 0;
    let f3 = 0;
    let f4 = 0;
    let f5 = 0;
    let field = 0;
    let inNum = false;
    let bc = false;
    for (let i = 0; i < text.length; i++) {
      const c = text.charCodeAt(i);
      if (c >= 48 && c <= 57) {
        const d = c - 48;
        switch (field) {
          case 0: f0 = f0 * 10 + d; break;
          case 1: f1 = f1 * 10 + d; break;
          case 2: f2 = f2 * 10 + d; break;
          case 3: f3 = f3 * 10 + d; break;
          case 4: f4 = f4 * 10 + d; break;
          default: f5 = f5 * 10 + d;
        }
        inNum = true;
      } else {
        if (inNum) field++;
        inNum = false;
        if (c === 66) bc = true; // 'B' of "BC"
      }
    }
    const year = bc ? 1 - f2 : f2;
    const hour = f3 === 24 ? 0 : f3;
    const wall = (dayNumberFromYmdUnchecked(year, f0, f1) * 86400 + hour * 3600 + f4 * 60 + f5) * 1000;
    return Math.round((wall - t) / 1000) | 0; // `| 0` also turns -0 into 0
  }

  protected compile(s: number, e: number): Chunk {
    if (e <= INTL_QUIET_BEFORE_MS) {
      return { s, e, before: this.probe(Math.max(s, MIN_EPOCH_MS)), at: EMPTY_F64, after: EMPTY_I32 };
    }
    const first = Math.max(s - 1000, MIN_EPOCH_MS);
    const last = Math.min(e - 1000, MAX_EPOCH_MS);
    let cur = first;
    let curOff = this.probe(cur);
    const before = curOff;
    const at: number[] = [];
    const after: number[] = [];
    while (cur < last) {
      const nxt = Math.min(cur + INTL_STEP_MS, last);
      const nxtOff = this.probe(nxt);
      if (nxtOff !== curOff) {
        // Exactly one change in (cur, nxt]: bisect to the second.
        let lo = cur;
        let hi = nxt;
        let hiOff = nxtOff;
        while (hi - lo > 1000) {
          const mid = lo + Math.floor((hi - lo) / 2000) * 1000;
          const o = this.probe(mid);
          if (o === curOff) lo = mid;
          else {
            hi = mid;
            hiOff = o;
          }
        }
        if (hi >= s) {
          at.push(hi);
          after.push(hiOff);
        }
      }
      cur = nxt;
      curOff = nxtOff;
    }
    return { s, e, before, at: at.length ? Float64Array.from(at) : EMPTY_F64, after: after.length ? Int32Array.from(after) : EMPTY_I32 };
  }
}

/**
 * @internal The first transition of `e` strictly after `t`, or undefined. A function, not a method of the engine,
 * so that a program that never lists transitions does not bundle it.
 */
export function transitionAfter(e: Engine, t: number): ZoneTransition | undefined {
  if (e instanceof FixedEngine) return undefined;
  let k = Math.floor(Math.max(t, e.lowQuietMs - CHUNK_MS) / CHUNK_MS);
  if (!Number.isFinite(k)) return undefined;
  let empty = 0;
  for (;;) {
    const c = e.chunk(k);
    for (let j = 0; j < c.at.length; j++) {
      if (c.at[j]! > t) return { epochMs: c.at[j]!, offsetBeforeSeconds: j === 0 ? c.before : c.after[j - 1]!, offsetAfterSeconds: c.after[j]! };
    }
    if (c.at.length === 0 && c.s >= e.periodicFromMs) {
      if (++empty >= 2) return undefined;
    } else empty = 0;
    if (c.e > MAX_EPOCH_MS) return undefined;
    k++;
  }
}

/** @internal The last transition of `e` strictly before `t`, or undefined (a function, as {@link transitionAfter}). */
export function transitionBefore(e: Engine, t: number): ZoneTransition | undefined {
  if (e instanceof FixedEngine) return undefined;
  let k = Math.floor(t / CHUNK_MS);
  let empty = 0;
  for (;;) {
    const c = e.chunk(k);
    for (let j = c.at.length - 1; j >= 0; j--) {
      if (c.at[j]! < t) return { epochMs: c.at[j]!, offsetBeforeSeconds: j === 0 ? c.before : c.after[j - 1]!, offsetAfterSeconds: c.after[j]! };
    }
    if (c.e <= e.lowQuietMs || c.s <= MIN_EPOCH_MS) return undefined;
    if (c.at.length === 0 && c.s >= e.periodicFromMs) {
      // Past the periodic start, two empty years mean every year since the periodic start is empty.
      if (++empty >= 2) {
        if (!Number.isFinite(e.periodicFromMs)) return undefined;
        const kp = Math.floor(e.periodicFromMs / CHUNK_MS);
        if (kp < k - 1) {
          k = kp;
          empty = 0;
          continue;
        }
      }
    } else empty = 0;
    k--;
  }
}
