/**
 * A reader for the Time Zone Information Format (TZif), RFC 8536 and its successor RFC 9636: versions 1 to 4,
 * the 64-bit data block of version 2 and later, and the footer's POSIX TZ string. Every fault is a
 * {@link CorruptTzifError} with the byte position; the reader never loops past the bytes it was given.
 *
 * @module
 */
import { MAX_OFFSET_SECONDS } from '../bounds.js';
import { CorruptTzifError } from './errors.js';
import { type PosixTz, parsePosixTz } from './posix.js';

/** One local time type of a TZif file (RFC 8536 section 3.2, "local time type records"). */
export interface TzifTimeType {
  readonly offsetSeconds: number;
  readonly isDst: boolean;
  readonly abbreviation: string;
}

/** The content of a TZif file, with transition times in POSIX seconds (leap seconds removed, see below). */
export interface TzifContent {
  /** 1, 2, 3 or 4. */
  readonly version: number;
  /** Transition times, POSIX seconds since 1970, strictly ascending. */
  readonly transitionsSeconds: Float64Array;
  /** Index into `types` of the local time type that starts at each transition. */
  readonly transitionTypes: Uint8Array;
  readonly types: readonly TzifTimeType[];
  /** The footer's TZ string ('' when absent or empty). */
  readonly footer: string;
  /** The parsed footer, when it is not empty. */
  readonly footerRule: PosixTz | undefined;
  /** Leap-second records: occurrence (in the file's own seconds) and the total correction from then on. */
  readonly leapSeconds: readonly { readonly occurrence: number; readonly correction: number }[];
}

class Reader {
  constructor(
    readonly bytes: Uint8Array,
    readonly view: DataView,
    public pos: number,
  ) {}
  need(count: number, what: string): void {
    if (count < 0 || this.pos + count > this.bytes.length) {
      throw new CorruptTzifError(`truncated: ${what} needs ${count} bytes, ${Math.max(0, this.bytes.length - this.pos)} left`, this.pos, this.bytes);
    }
  }
  u8(): number {
    return this.bytes[this.pos++]!;
  }
  u32(): number {
    const v = this.view.getUint32(this.pos);
    this.pos += 4;
    return v;
  }
  i32(): number {
    const v = this.view.getInt32(this.pos);
    this.pos += 4;
    return v;
  }
  i64(): number {
    const hi = this.view.getInt32(this.pos);
    const lo = this.view.getUint32(this.pos + 4);
    this.pos += 8;
    return hi * 4294967296 + lo; // exact below 2**53; TZif times beyond that are clamped by the caller
  }
}

interface Header {
  version: number;
  isutcnt: number;
  isstdcnt: number;
  leapcnt: number;
  timecnt: number;
  typecnt: number;
  charcnt: number;
}

function readHeader(r: Reader): Header {
  const at = r.pos;
  r.need(44, 'the header');
  if (r.bytes[at] !== 0x54 || r.bytes[at + 1] !== 0x5a || r.bytes[at + 2] !== 0x69 || r.bytes[at + 3] !== 0x66) {
    throw new CorruptTzifError('expected the magic "TZif"', at, r.bytes);
  }
  const v = r.bytes[at + 4]!;
  const version = v === 0 ? 1 : v >= 0x32 && v <= 0x34 ? v - 0x30 : -1;
  if (version < 0) throw new CorruptTzifError(`unsupported version byte 0x${v.toString(16)} (expected 0x00, "2", "3" or "4")`, at + 4, r.bytes);
  r.pos = at + 20;
  const h: Header = { version, isutcnt: r.u32(), isstdcnt: r.u32(), leapcnt: r.u32(), timecnt: r.u32(), typecnt: r.u32(), charcnt: r.u32() };
  // RFC 8536 section 3.1: typecnt and charcnt MUST NOT be zero; isutcnt and isstdcnt are zero or typecnt.
  if (h.typecnt === 0) throw new CorruptTzifError('typecnt is zero', at + 36, r.bytes);
  if (h.typecnt > 256) throw new CorruptTzifError(`typecnt ${h.typecnt} is above 256`, at + 36, r.bytes);
  if (h.charcnt === 0) throw new CorruptTzifError('charcnt is zero', at + 40, r.bytes);
  if (h.isutcnt !== 0 && h.isutcnt !== h.typecnt) throw new CorruptTzifError(`isutcnt ${h.isutcnt} is neither 0 nor typecnt ${h.typecnt}`, at + 20, r.bytes);
  if (h.isstdcnt !== 0 && h.isstdcnt !== h.typecnt) throw new CorruptTzifError(`isstdcnt ${h.isstdcnt} is neither 0 nor typecnt ${h.typecnt}`, at + 24, r.bytes);
  return h;
}

function blockSize(h: Header, timeSize: number): number {
  return h.timecnt * timeSize + h.timecnt + h.typecnt * 6 + h.charcnt + h.leapcnt * (timeSize + 4) + h.isstdcnt + h.isutcnt;
}

/**
 * Parses TZif bytes (RFC 8536 / RFC 9636). For version 2 and later the version 1 block is skipped and the 64-bit
 * block and footer are read. Leap-second files (the "right/" zones) are converted to POSIX time: each transition
 * time has the leap-second correction in force at it subtracted. Version 4 allows the leap-second table to start
 * with a correction other than +1 or -1 (a truncated table) and to end with an expiry record that repeats the
 * previous correction (RFC 9636 section 3.2); earlier versions must start at +1 or -1.
 *
 * @example
 * ```ts
 * parseTzif(bytes).footer; // 'EST5EDT,M3.2.0,M11.1.0'
 * ```
 * @internal
 */
export function parseTzif(bytes: Uint8Array): TzifContent {
  if (!(bytes instanceof Uint8Array)) throw new CorruptTzifError('expected a Uint8Array', 0, bytes);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const r = new Reader(bytes, view, 0);
  let h = readHeader(r);
  const version = h.version;
  let timeSize = 4;
  if (version >= 2) {
    const skip = blockSize(h, 4);
    r.need(skip, 'the version 1 data block');
    r.pos += skip;
    const second = r.pos;
    h = readHeader(r);
    if (h.version !== version) throw new CorruptTzifError(`the second header says version ${h.version}, the first ${version}`, second + 4, bytes);
    timeSize = 8;
  }
  r.need(blockSize(h, timeSize), 'the data block');
  const times = new Float64Array(h.timecnt);
  for (let i = 0; i < h.timecnt; i++) {
    const at = r.pos;
    const t = timeSize === 4 ? r.i32() : r.i64();
    if (i > 0 && !(t > times[i - 1]!)) throw new CorruptTzifError(`transition times are not ascending (index ${i})`, at, bytes);
    times[i] = t;
  }
  const idx = new Uint8Array(h.timecnt);
  for (let i = 0; i < h.timecnt; i++) {
    const at = r.pos;
    const k = r.u8();
    if (k >= h.typecnt) throw new CorruptTzifError(`transition type index ${k} is not below typecnt ${h.typecnt}`, at, bytes);
    idx[i] = k;
  }
  const raw: { off: number; dst: number; desig: number }[] = [];
  for (let i = 0; i < h.typecnt; i++) {
    const at = r.pos;
    const off = r.i32();
    const dst = r.u8();
    const desig = r.u8();
    if (off === -2147483648) throw new CorruptTzifError('utoff is -2**31', at, bytes);
    if (Math.abs(off) > MAX_OFFSET_SECONDS) throw new CorruptTzifError(`utoff ${off} is outside the ±${MAX_OFFSET_SECONDS} s that kalends supports`, at, bytes);
    if (dst > 1) throw new CorruptTzifError(`isdst ${dst} is neither 0 nor 1`, at + 4, bytes);
    if (desig >= h.charcnt) throw new CorruptTzifError(`desigidx ${desig} is not below charcnt ${h.charcnt}`, at + 5, bytes);
    raw.push({ off, dst, desig });
  }
  const charsAt = r.pos;
  r.pos += h.charcnt;
  const types: TzifTimeType[] = raw.map((t) => {
    let end = charsAt + t.desig;
    while (end < charsAt + h.charcnt && bytes[end] !== 0) end++;
    let abbreviation = '';
    for (let j = charsAt + t.desig; j < end; j++) abbreviation += String.fromCharCode(bytes[j]!);
    return Object.freeze({ offsetSeconds: t.off, isDst: t.dst === 1, abbreviation });
  });
  const leapSeconds: { occurrence: number; correction: number }[] = [];
  for (let i = 0; i < h.leapcnt; i++) {
    const at = r.pos;
    const occurrence = timeSize === 4 ? r.i32() : r.i64();
    const correction = r.i32();
    const prev = leapSeconds[i - 1];
    if (prev && !(occurrence > prev.occurrence)) throw new CorruptTzifError(`leap-second occurrences are not ascending (record ${i})`, at, bytes);
    if (i === 0 && occurrence < 0) throw new CorruptTzifError('the first leap second occurs before 1970', at, bytes);
    if (i === 0 && version < 4 && Math.abs(correction) !== 1) {
      throw new CorruptTzifError(`the first leap-second correction is ${correction}; only version 4 files may start a truncated table`, at + timeSize, bytes);
    }
    if (prev) {
      const step = Math.abs(correction - prev.correction);
      const expiry = step === 0 && version >= 4 && i === h.leapcnt - 1;
      if (step !== 1 && !expiry) throw new CorruptTzifError(`leap-second correction ${correction} does not differ by 1 from ${prev.correction}`, at + timeSize, bytes);
    }
    leapSeconds.push({ occurrence, correction });
  }
  for (let i = 0; i < h.isstdcnt; i++) {
    const at = r.pos;
    if (r.u8() > 1) throw new CorruptTzifError('standard/wall indicator is neither 0 nor 1', at, bytes);
  }
  for (let i = 0; i < h.isutcnt; i++) {
    const at = r.pos;
    const v = r.u8();
    if (v > 1) throw new CorruptTzifError('UT/local indicator is neither 0 nor 1', at, bytes);
    if (v === 1 && h.isstdcnt > 0 && bytes[at - h.isstdcnt] !== 1) throw new CorruptTzifError('a UT indicator is set but its standard indicator is not', at, bytes);
  }
  let footer = '';
  let footerRule: PosixTz | undefined;
  if (version >= 2) {
    const at = r.pos;
    r.need(2, 'the footer');
    if (bytes[at] !== 0x0a) throw new CorruptTzifError('expected a newline starting the footer', at, bytes);
    let end = at + 1;
    while (end < bytes.length && bytes[end] !== 0x0a) end++;
    if (end >= bytes.length) throw new CorruptTzifError('the footer has no closing newline', end, bytes);
    for (let j = at + 1; j < end; j++) {
      const c = bytes[j]!;
      if (c < 0x20 || c > 0x7e) throw new CorruptTzifError(`footer byte 0x${c.toString(16)} is not printable ASCII`, j, bytes);
      footer += String.fromCharCode(c);
    }
    if (footer !== '') {
      try {
        footerRule = parsePosixTz(footer);
      } catch (e) {
        const pos = (e as { position?: number }).position ?? 0;
        throw new CorruptTzifError(`bad footer TZ string ${JSON.stringify(footer)}: ${(e as Error).message}`, at + 1 + pos, bytes);
      }
    }
  }
  // Leap-second files count leap seconds in their times; convert each to POSIX time (RFC 8536 section 3.2).
  if (leapSeconds.length > 0) {
    let j = -1;
    for (let i = 0; i < times.length; i++) {
      while (j + 1 < leapSeconds.length && leapSeconds[j + 1]!.occurrence <= times[i]!) j++;
      if (j >= 0) times[i] = times[i]! - leapSeconds[j]!.correction;
    }
  }
  return Object.freeze({
    version,
    transitionsSeconds: times,
    transitionTypes: idx,
    types: Object.freeze(types),
    footer,
    footerRule,
    leapSeconds: Object.freeze(leapSeconds.map((l) => Object.freeze(l))),
  });
}
