/**
 * A brute-force model of opening hours, written from the rules in docs/business-time.md and independent of the
 * hours layer's tables: each day's intervals are read from the plain definition, every wall time becomes an
 * instant through temporal-polyfill (`PlainDateTime.toZonedDateTime` with Temporal's disambiguation, ECMA-262
 * Temporal `GetEpochNanosecondsFor`), and the business is open in a minute when some interval covers it. Every
 * answer then comes from stepping minute by minute over a mask of open minutes. Business days and holidays come
 * from the business layer (tested on its own against the official tables).
 */
import { Temporal } from 'temporal-polyfill';
import { type BusinessCalendar, type HoursDefinition, type SpecialDayDefinition, type IntervalDefinition, isBusinessDay, listHolidays, shiftBusinessDays } from '../../src/index.js';

const H24 = 86_400_000;
const EPOCH_DATE = Temporal.PlainDate.from('1970-01-01');
const WEEKDAYS = ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'] as const;

/** Wall ms of "HH:MM[:SS]". */
export function wallTime(text: string): number {
  const [h, m, s] = text.split(':').map(Number);
  return ((h! * 60 + m!) * 60 + (s ?? 0)) * 1000;
}

interface Iv {
  readonly open: number;
  readonly close: number;
}

function intervals(list: readonly IntervalDefinition[] | undefined): Iv[] {
  return (list ?? [])
    .map((i) => {
      const open = wallTime(i.open);
      const close = wallTime(i.close);
      return { open, close: close > open ? close : close + H24 };
    })
    .sort((a, b) => a.open - b.open);
}

/** A day number as a Temporal.PlainDate. */
export function plainDateOf(dayNumber: number): Temporal.PlainDate {
  return EPOCH_DATE.add({ days: dayNumber });
}

/** The brute-force model of one definition over a window of days. */
export class HoursModel {
  readonly zone: string;
  readonly disambiguation: 'compatible' | 'earlier' | 'later';
  /** The window: steps (minutes, or seconds where sessions use seconds) from `firstMinuteMs`, one byte each (1 = open). */
  readonly firstMinuteMs: number;
  readonly mask: Uint8Array;
  /** Raw intervals of each day of the window, as instants, after dropping empty ones. */
  readonly days = new Map<number, { s: number; e: number }[]>();

  constructor(
    readonly def: HoursDefinition,
    readonly calendar: BusinessCalendar | undefined,
    /** Days of the window [firstDay, endDay). */
    readonly firstDay: number,
    readonly endDay: number,
    /** The step in ms: 60,000 (minute by minute) or 1,000 where the definition writes seconds. */
    readonly step = 60_000,
  ) {
    const MIN = step;
    this.zone = def.zone;
    this.disambiguation = (def.disambiguation ?? 'compatible') as 'compatible' | 'earlier' | 'later';
    this.firstMinuteMs = this.dayStart(firstDay);
    const lastMs = this.dayStart(endDay);
    this.mask = new Uint8Array((lastMs - this.firstMinuteMs) / MIN);
    // Sessions of the two days before the window can reach into it (an overnight interval, a DST shift).
    for (let d = firstDay - 2; d < endDay; d++) {
      const list = this.instantsOfDay(d);
      this.days.set(d, list);
      for (const { s, e } of list) {
        for (let m = Math.max(s, this.firstMinuteMs); m < Math.min(e, lastMs); m += MIN) this.mask[(m - this.firstMinuteMs) / MIN] = 1;
      }
    }
  }

  /** Temporal's start of a local day (the first instant whose local date is that day or later). */
  dayStart(dayNumber: number): number {
    return plainDateOf(dayNumber).toZonedDateTime({ timeZone: this.zone }).epochMilliseconds;
  }

  /** The instant of a wall time `ms` after the start of local day `dayNumber`, by the definition's policy. */
  wallInstant(dayNumber: number, ms: number): number {
    const dt = plainDateOf(dayNumber).toPlainDateTime().add({ milliseconds: ms });
    return dt.toZonedDateTime(this.zone, { disambiguation: this.disambiguation }).epochMilliseconds;
  }

  /** The local day number of an instant. */
  localDay(epochMs: number): number {
    const date = Temporal.Instant.fromEpochMilliseconds(epochMs).toZonedDateTimeISO(this.zone).toPlainDate();
    return date.since(EPOCH_DATE).days;
  }

  /** The special day that applies on `d`: a dated one, else the first holiday rule that lands on it. */
  special(d: number): SpecialDayDefinition | undefined {
    const specials = this.def.special ?? [];
    const dated = specials.find((s) => s.date !== undefined && Temporal.PlainDate.compare(Temporal.PlainDate.from(s.date), plainDateOf(d)) === 0);
    if (dated) return dated;
    const cal = this.calendar;
    if (!cal) return undefined;
    for (const s of specials) {
      if (s.holiday === undefined) continue;
      for (const h of listHolidays(cal, d - 40, d + 41)) {
        if (h.name !== s.holiday && h.ruleId !== s.holiday) continue;
        const target = (s.offset ?? 0) === 0 ? h.dayNumber : shiftBusinessDays(cal, h.dayNumber, s.offset!);
        if (target === d) return s;
      }
    }
    return undefined;
  }

  /** The wall intervals of day `d`, by the definition's rules. */
  wallIntervalsOfDay(d: number): Iv[] {
    const weekday = WEEKDAYS[plainDateOf(d).dayOfWeek - 1]!;
    const regular = !this.calendar || isBusinessDay(this.calendar, d) ? intervals(this.def.week[weekday]) : [];
    const s = this.special(d);
    if (!s) return regular;
    if (s.closed) return [];
    if (s.hours) return intervals(s.hours);
    const open = s.open === undefined ? -Infinity : wallTime(s.open);
    const close = s.close === undefined ? Infinity : wallTime(s.close);
    const cut = regular.map((i) => ({ open: Math.max(i.open, open), close: Math.min(i.close, close) })).filter((i) => i.close > i.open);
    return [...cut, ...intervals(s.extra)];
  }

  /** The instants of day `d`'s intervals; none on a day the zone skipped (its start equals the next day's). */
  instantsOfDay(d: number): { s: number; e: number }[] {
    if (this.dayStart(d) === this.dayStart(d + 1)) return [];
    return this.wallIntervalsOfDay(d)
      .map((i) => ({ s: this.wallInstant(d, i.open), e: this.wallInstant(d, i.close) }))
      .filter((i) => i.e > i.s);
  }

  /** Whether `m` (a minute of the window) is open. */
  openAt(m: number): boolean {
    return this.mask[(m - this.firstMinuteMs) / this.step] === 1;
  }

  get endMs(): number {
    return this.firstMinuteMs + this.mask.length * this.step;
  }

  /** Open minutes in [a, b) times a minute, signed. */
  elapsed(a: number, b: number): number {
    if (b < a) return 0 - this.elapsed(b, a) || 0;
    let n = 0;
    for (let m = a; m < b; m += this.step) n += this.mask[(m - this.firstMinuteMs) / this.step]!;
    return n * this.step;
  }

  /** The first opening (closed minute, then open minute) after `t` (at `t` when inclusive), or null in the window. */
  nextOpening(t: number, inclusive: boolean): number | null {
    for (let m = inclusive ? t : t + this.step; m < this.endMs; m += this.step) if (this.openAt(m) && (m === this.firstMinuteMs || !this.openAt(m - this.step))) return m;
    return null;
  }

  /** The first closing (open minute, then closed minute) after `t` (at `t` when inclusive), or null. */
  nextClosing(t: number, inclusive: boolean): number | null {
    for (let m = inclusive ? t : t + this.step; m < this.endMs; m += this.step) if (m > this.firstMinuteMs && this.openAt(m - this.step) && !this.openAt(m)) return m;
    return null;
  }

  /** The last opening before `t` (at `t` when inclusive), or null. */
  previousOpening(t: number, inclusive: boolean): number | null {
    for (let m = inclusive ? t : t - this.step; m > this.firstMinuteMs; m -= this.step) if (this.openAt(m) && !this.openAt(m - this.step)) return m;
    return null;
  }

  /** The last closing before `t` (at `t` when inclusive), or null. */
  previousClosing(t: number, inclusive: boolean): number | null {
    for (let m = inclusive ? t : t - this.step; m > this.firstMinuteMs; m -= this.step) if (m < this.endMs && this.openAt(m - this.step) && !this.openAt(m)) return m;
    return null;
  }

  /** `t` moved by `ms` (whole minutes) of open minutes, stepping a minute at a time; null past the window. */
  shift(t: number, ms: number): number | null {
    if (ms === 0) return t;
    let left = Math.abs(ms) / this.step;
    if (ms > 0) {
      for (let m = t; m < this.endMs; m += this.step) if (this.openAt(m) && --left === 0) return m + this.step;
    } else {
      for (let m = t - this.step; m >= this.firstMinuteMs; m -= this.step) if (this.openAt(m) && --left === 0) return m;
    }
    return null;
  }

  /** The runs of open minutes that overlap [a, b): start, end, and the business day of the interval opening it. */
  sessions(a: number, b: number): { startEpochMs: number; endEpochMs: number; dayNumber: number }[] {
    const out: { startEpochMs: number; endEpochMs: number; dayNumber: number }[] = [];
    let m = this.firstMinuteMs;
    while (m < this.endMs) {
      if (!this.openAt(m)) {
        m += this.step;
        continue;
      }
      const start = m;
      while (m < this.endMs && this.openAt(m)) m += this.step;
      if (start < b && m > a) out.push({ startEpochMs: start, endEpochMs: m, dayNumber: this.dayOpening(start) });
    }
    return out;
  }

  /** The earliest day among those with an interval starting at `s`. */
  dayOpening(s: number): number {
    let best = Infinity;
    for (const [d, list] of this.days) if (list.some((i) => i.s === s) && d < best) best = d;
    return best;
  }

  /** The cut-off instant of day `d`, or null when the day has no session. */
  cutoff(d: number, name: string): number | null {
    if (this.instantsOfDay(d).length === 0) return null;
    const own = this.special(d)?.cutoffs?.[name];
    return this.wallInstant(d, wallTime(own ?? this.def.cutoffs![name]!));
  }

  /** The value date: the local day if a business day and at or before its cut-off, else the next business day. */
  valueDay(t: number, name: string): number {
    const d = this.localDay(t);
    const cut = this.cutoff(d, name);
    if (cut !== null && Math.floor(t) <= cut) return d;
    for (let k = d + 1; k < d + 400; k++) if (this.instantsOfDay(k).length > 0) return k;
    throw new Error('no business day within 400 days');
  }
}
