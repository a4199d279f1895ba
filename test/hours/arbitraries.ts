/**
 * fast-check arbitraries of random definitions of hours, windows and queries, shared by the reference and the
 * property tests: weekly intervals (overnight ones included, times often in the small hours where clocks change),
 * special days by date and relative to holidays, a cut-off, each disambiguation, zones with DST changes, and
 * windows drawn around the zone's transitions, the calendar's holidays, or anywhere in 2009..2028.
 */
import fc from 'fast-check';
import {
  type BusinessCalendar,
  type CalendarDefinition,
  type HoursDefinition,
  type IntervalDefinition,
  type SpecialDayDefinition,
  DefinitionError,
  calendarFromName,
  dayNumberFromEpochMs,
  dayNumberFromYmd,
  defineCalendar,
  defineHours,
  formatPlainDate,
  listHolidays,
  listTransitions,
} from '../../src/index.js';

export const MIN = 60_000;
const WEEKDAYS = ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'] as const;
export const DST_ZONES = [
  'America/New_York',
  'Europe/London',
  'Europe/Dublin',
  'Australia/Lord_Howe',
  'America/Santiago',
  'America/Havana',
  'Asia/Beirut',
  'Pacific/Apia',
  'Pacific/Chatham',
  'America/St_Johns',
  'Antarctica/Troll',
  'Africa/Casablanca',
  'Asia/Kolkata',
] as const;

/** A shop calendar with a Sunday-only weekend (an invented one, inline). */
const SHOP: CalendarDefinition = {
  id: 'shop',
  weekend: ['sunday'],
  holidays: [
    { id: 'christmas', name: 'Christmas Day', kind: 'fixed', month: 12, day: 25 },
    { id: 'easter-monday', name: 'Easter Monday', kind: 'easter', offset: 1 },
  ],
};
const CALENDARS: readonly (string | CalendarDefinition | undefined)[] = [undefined, 'us-federal', 'england-and-wales', SHOP];

function hhmm(minutes: number): string {
  const m = ((minutes % 1440) + 1440) % 1440;
  return `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
}

/** Minutes of the day, often in the small hours where the clocks change. */
const minuteArb = fc.oneof(fc.integer({ min: 0, max: 1439 }), fc.integer({ min: 0, max: 240 }), fc.integer({ min: 1320, max: 1439 }));

/** Intervals of one day from sorted distinct points, and maybe an overnight interval. */
const dayArb = fc
  .record({
    points: fc.uniqueArray(minuteArb, { maxLength: 4 }),
    night: fc.option(fc.record({ open: fc.integer({ min: 1080, max: 1439 }), close: fc.integer({ min: 0, max: 360 }) }), { freq: 4 }),
    full: fc.integer({ min: 0, max: 20 }),
  })
  .map(({ points, night, full }) => {
    if (full === 0) return [{ open: '00:00', close: '24:00' }];
    const p = [...points].sort((a, b) => a - b);
    const out: IntervalDefinition[] = [];
    for (let k = 0; k + 1 < p.length; k += 2) out.push({ open: hhmm(p[k]!), close: hhmm(p[k + 1]!) });
    const last = p.length >= 2 ? p[p.length - (p.length % 2 === 0 ? 1 : 2)]! : -1;
    if (night && night.open > last && night.close !== night.open) out.push({ open: hhmm(night.open), close: hhmm(night.close) });
    return out;
  });

const effectArb = fc.oneof(
  fc.constant({ closed: true } as SpecialDayDefinition),
  dayArb.filter((l) => l.length > 0).map((hours) => ({ hours }) as SpecialDayDefinition),
  fc.record({ close: fc.integer({ min: 1, max: 1439 }) }).map((r) => ({ close: hhmm(r.close) }) as SpecialDayDefinition),
  fc.record({ open: fc.integer({ min: 0, max: 1439 }) }).map((r) => ({ open: hhmm(r.open) }) as SpecialDayDefinition),
  fc.record({ a: fc.integer({ min: 0, max: 1438 }), b: fc.integer({ min: 1, max: 1439 }) }).map((r) => ({ extra: [{ open: hhmm(Math.min(r.a, r.b - 1)), close: hhmm(Math.max(r.b, r.a + 1)) }] }) as SpecialDayDefinition),
);

export interface Case {
  readonly def: HoursDefinition;
  readonly calendar: BusinessCalendar | undefined;
  readonly firstDay: number;
  readonly endDay: number;
  /** Minutes (from the window's first instant) of the queries, and amounts in minutes. */
  readonly picks: readonly number[];
  readonly amounts: readonly number[];
  readonly inclusive: boolean;
  /** The step of the reference: 60,000 ms, or 1,000 where the definition's times have seconds. */
  readonly step: number;
}

/** The definition with a second added to every wall time ("09:00" -> "09:00:37"), by a fixed scramble of the text. */
function withSeconds(def: HoursDefinition): HoursDefinition {
  const sec = (t: string) => (t === '24:00' ? t : `${t}:${String((Number(t.slice(0, 2)) * 7 + Number(t.slice(3, 5)) * 13) % 60).padStart(2, '0')}`);
  return JSON.parse(JSON.stringify(def), (key, value: unknown) =>
    typeof value === 'string' && /^\d\d:\d\d$/.test(value) && key !== 'date' ? sec(value) : value,
  ) as HoursDefinition;
}

export const caseArb = fc
  .record({
    zone: fc.constantFrom(...DST_ZONES),
    calendar: fc.constantFrom(...CALENDARS),
    year: fc.integer({ min: 2009, max: 2028 }),
    anchorKind: fc.constantFrom('transition', 'transition', 'holiday', 'any'),
    anchorPick: fc.nat(),
    week: fc.tuple(dayArb, dayArb, dayArb, dayArb, dayArb, dayArb, dayArb),
    specials: fc.array(fc.record({ where: fc.oneof(fc.integer({ min: -6, max: 12 }), fc.integer({ min: -2, max: 2 }).map((o) => ({ offset: o }))), holidayPick: fc.nat(), effect: effectArb, cut: fc.option(fc.integer({ min: 0, max: 1440 })) }), { maxLength: 3 }),
    cutoff: fc.integer({ min: 0, max: 1440 }),
    allowOutside: fc.boolean(),
    disambiguation: fc.constantFrom('compatible', 'earlier', 'later'),
    picks: fc.array(fc.integer({ min: 0, max: 6 * 1440 }), { minLength: 8, maxLength: 8 }),
    amounts: fc.array(fc.integer({ min: -1200, max: 1200 }), { minLength: 4, maxLength: 4 }),
    inclusive: fc.boolean(),
    skippedDay: fc.integer({ min: 0, max: 9 }),
    seconds: fc.integer({ min: 0, max: 5 }),
    secondPicks: fc.array(fc.integer({ min: 0, max: 59 }), { minLength: 12, maxLength: 12 }),
  })
  .map((raw): Case | undefined => {
    // One case in ten sits on Pacific/Apia's skipped 2011-12-30 (the zone moved from -10:00 to +14:00).
    const r = raw.skippedDay === 0 ? { ...raw, zone: 'Pacific/Apia' as const, year: 2011, anchorKind: 'skipped' } : raw;
    const calendar = r.calendar === undefined ? undefined : typeof r.calendar === 'string' ? calendarFromName(r.calendar) : defineCalendar(r.calendar);
    const y0 = dayNumberFromYmd(r.year, 1, 1);
    const y1 = dayNumberFromYmd(r.year + 1, 1, 1);
    let anchor = y0 + (r.anchorPick % (y1 - y0));
    const holidays = calendar ? listHolidays(calendar, y0, y1) : [];
    if (r.anchorKind === 'transition') {
      const ts = listTransitions(r.zone, Date.UTC(r.year, 0, 1), Date.UTC(r.year + 1, 0, 1));
      if (ts.length > 0) anchor = dayNumberFromEpochMs(r.zone, ts[r.anchorPick % ts.length]!.epochMs) - 2;
    } else if (r.anchorKind === 'holiday' && holidays.length > 0) anchor = holidays[r.anchorPick % holidays.length]!.dayNumber - 3;
    else if (r.anchorKind === 'skipped') anchor = dayNumberFromYmd(2011, 12, 28);
    const week: Record<string, IntervalDefinition[]> = {};
    WEEKDAYS.forEach((name, k) => {
      if (calendar?.weekend.includes(k + 1)) return;
      // The next weekday's intervals that open before this day's overnight interval closes are left out.
      const prev = r.week[(k + 6) % 7]!;
      const night = prev[prev.length - 1];
      const tail = night && night.close < night.open && !calendar?.weekend.includes(((k + 6) % 7) + 1) ? night.close : '00:00';
      const list = r.week[k]!.filter((i) => i.open >= tail);
      if (list.length > 0) week[name] = list;
    });
    const special = r.specials.map((s): SpecialDayDefinition => {
      const where =
        typeof s.where === 'number' || holidays.length === 0
          ? { date: formatPlainDate(anchor + (typeof s.where === 'number' ? s.where : 0)) }
          : { holiday: holidays[s.holidayPick % holidays.length]!.name, offset: s.where.offset };
      const cut = s.cut !== null && !('closed' in s.effect) ? { cutoffs: { payments: hhmm(s.cut) === '00:00' && s.cut === 1440 ? '24:00' : hhmm(s.cut) } } : {};
      return { ...where, ...s.effect, ...cut };
    });
    const def: HoursDefinition = {
      zone: r.zone,
      ...(r.calendar === undefined ? {} : { calendar: r.calendar }),
      week,
      special,
      cutoffs: { payments: r.cutoff === 1440 ? '24:00' : hhmm(r.cutoff) },
      allowCutoffsOutsideSessions: r.allowOutside,
      disambiguation: r.disambiguation as 'compatible',
    };
    // One case in six writes its times with seconds, and the reference steps second by second.
    const seconds = r.seconds === 0;
    const fixed = definable(seconds ? withSeconds(def) : def);
    if (!fixed) return undefined;
    const step = seconds ? 1000 : MIN;
    return {
      def: fixed,
      calendar,
      firstDay: anchor - 8,
      endDay: anchor + (seconds ? 10 : 16),
      picks: r.picks.map((m, k) => m * MIN + (seconds ? r.secondPicks[k]! * 1000 : 0)),
      amounts: r.amounts.map((m, k) => m * MIN + (seconds ? r.secondPicks[8 + k]! * 1000 : 0)),
      inclusive: r.inclusive,
      step,
    };
  });

/** The definition, with the special days a validation refused taken out (and cut-offs allowed outside if need be). */
function definable(def: HoursDefinition): HoursDefinition | undefined {
  let d = def;
  for (let attempt = 0; attempt < 4; attempt++) {
    try {
      defineHours(d);
      return d;
    } catch (e) {
      if (!(e instanceof DefinitionError)) throw e;
      const bad = new Set(e.issues.map((i) => /^special\[(\d+)\]/.exec(i.path)?.[1]).filter((x) => x !== undefined).map(Number));
      const special = (d.special ?? []).filter((_, k) => !bad.has(k));
      const cutoffFault = e.issues.some((i) => i.path.startsWith('cutoffs'));
      if (e.issues.some((i) => i.path.startsWith('week'))) return undefined;
      d = { ...d, special, allowCutoffsOutsideSessions: d.allowCutoffsOutsideSessions || cutoffFault };
    }
  }
  return undefined;
}

