/**
 * Looking up one date or instant in a profile: its labels in every unit, the business-day facts of each calendar,
 * the local time in the profile's zone, and the profile's opening hours at that moment. Text is read with the
 * library's own grammar (RFC 3339 / RFC 9557 / ISO 8601); a local time without an offset is read in the zone
 * given (or the one in its brackets), and one the clocks skipped or showed twice is said so.
 */
import {
  type Profile,
  countBusinessDays,
  cutoffEpochMsOfDayNumber,
  dayNumberFromEpochMs,
  dayNumberFromYmd,
  epochMsFromWallMs,
  firstDayNumberOfPeriod,
  firstEpochMsOfDayNumber,
  formatInstant,
  formatLabelForPeople,
  formatOffset,
  formatPeriod,
  formatPlainDate,
  isBusinessDay,
  isOpen,
  lastDayNumberOfPeriod,
  lengthMsOfDayNumber,
  listHolidays,
  listSessions,
  nextBusinessDay,
  nextClosingEpochMs,
  nextOpeningEpochMs,
  offsetSecondsFromEpochMs,
  parseExtendedDateTime,
  parseInstant,
  periodFromDayNumber,
  previousBusinessDay,
  resolveWallMs,
  toZone,
  valueDayNumberOfEpochMs,
  weekdayOfDayNumber,
  ymdFromDayNumber,
} from 'kalends';
import { escapeHtml } from './dom.js';
import { dayText } from './year.js';

/** What was asked about: a local date, or an instant. */
export type Subject =
  | { readonly kind: 'day'; readonly dayNumber: number }
  | { readonly kind: 'instant'; readonly epochMs: number; readonly zoneId: string; readonly note: string | undefined };

/** Reads the lookup's text: a date, an instant with an offset, or a local time in `zoneText` (or its bracketed zone). */
export function readSubject(text: string, zoneText: string, profile: Profile): Subject {
  const t = text.trim();
  if (t === '') throw new Error('type a date (2025-11-27) or an instant (2025-11-26T17:30:00-06:00, or a local time such as 2025-11-26T17:30 with a zone)');
  const ext = parseExtendedDateTime(t);
  const zoneId = ext.zoneId ?? (zoneText.trim() || profile.zone.id);
  if (!ext.hasTime && ext.offsetSeconds === undefined && ext.zoneId === undefined) return { kind: 'day', dayNumber: ext.dayNumber };
  if (ext.offsetSeconds !== undefined) return { kind: 'instant', epochMs: parseInstant(t).epochMs, zoneId, note: undefined };
  const zone = toZone(zoneId, 'zone');
  const r = resolveWallMs(zone, ext.wallMs);
  if (r.kind === 'unique') return { kind: 'instant', epochMs: r.epochMs, zoneId: zone.id, note: undefined };
  const epochMs = epochMsFromWallMs(zone, ext.wallMs, 'compatible');
  const note =
    r.kind === 'gap'
      ? `the clocks of ${zone.id} skipped this local time (from ${formatOffset(r.offsetBeforeSeconds)} to ${formatOffset(r.offsetAfterSeconds)}); it is read as the time after the change`
      : `the clocks of ${zone.id} showed this local time twice; it is read as the earlier instant`;
  return { kind: 'instant', epochMs, zoneId: zone.id, note };
}

function local(zoneId: string, epochMs: number): string {
  return formatInstant(epochMs, { offsetSeconds: offsetSecondsFromEpochMs(zoneId, epochMs) });
}

/** A fact, or the library's refusal of it, as text. */
function attempt(f: () => string): string {
  try {
    return f();
  } catch (e) {
    return `not available: ${e instanceof Error ? e.message : String(e)}`;
  }
}

function definitionList(items: readonly [string, string][]): string {
  return `<dl class="facts">${items.map(([k, v]) => `<dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd>`).join('')}</dl>`;
}

function table(caption: string, heads: readonly string[], rows: readonly (readonly string[])[], className: string): string {
  return `<table class="${className}"><caption>${escapeHtml(caption)}</caption><thead><tr>${heads.map((h) => `<th scope="col">${escapeHtml(h)}</th>`).join('')}</tr></thead><tbody>${rows
    .map((r) => `<tr>${r.map((c, i) => (i === 0 ? `<th scope="row">${escapeHtml(c)}</th>` : `<td>${escapeHtml(c)}</td>`)).join('')}</tr>`)
    .join('')}</tbody></table>`;
}

const H = 3_600_000;

function hoursText(ms: number): string {
  return `${Math.round((ms / H) * 100) / 100} h`;
}

/** The facts about `subject` in `profile`, as markup. */
export function lookupHtml(profile: Profile, subject: Subject): string {
  const zone = profile.zone;
  const day = subject.kind === 'day' ? subject.dayNumber : dayNumberFromEpochMs(zone, subject.epochMs);
  const head: [string, string][] = [];
  if (subject.kind === 'instant') {
    head.push(['Instant (UTC)', formatInstant(subject.epochMs)]);
    head.push([`Local time in the profile's zone (${zone.id})`, local(zone.id, subject.epochMs)]);
    if (subject.zoneId !== zone.id) head.push([`Local time in ${subject.zoneId}`, local(subject.zoneId, subject.epochMs)]);
    if (subject.note) head.push(['Note', subject.note]);
  }
  head.push([subject.kind === 'instant' ? `Day in ${zone.id}` : 'Day', dayText(profile, day)]);
  head.push([
    `That day in ${zone.id}`,
    attempt(() => `starts ${local(zone.id, firstEpochMsOfDayNumber(zone, day))} and lasts ${hoursText(lengthMsOfDayNumber(zone, day))}`),
  ]);

  const unitRows: string[][] = [];
  const units = [['week', profile.week] as const, ...Object.entries(profile.units)];
  for (const [name, unit] of units) {
    unitRows.push([
      name,
      ...(() => {
        try {
          const p = periodFromDayNumber(unit, day);
          const people = profile.labels?.units?.[name] ? formatLabelForPeople(profile, name, p.ordinal) : '';
          return [formatPeriod(p), people, `${formatPlainDate(firstDayNumberOfPeriod(p))} to ${formatPlainDate(lastDayNumberOfPeriod(p))}`];
        } catch (e) {
          return [`not available: ${e instanceof Error ? e.message : String(e)}`, '', ''];
        }
      })(),
    ]);
  }

  const businessRows: string[][] = Object.entries(profile.calendars).map(([name, cal]) => {
    try {
      const open = isBusinessDay(cal, day);
      const holidays = listHolidays(cal, day, day + 1).map((h) => (h.moved ? `${h.name} (observed; falls on ${h.actualDate})` : h.name));
      const weekend = cal.weekend.includes(weekdayOfDayNumber(day)) ? 'weekend' : '';
      const ymd = ymdFromDayNumber(day);
      const nth = open ? `business day ${countBusinessDays(cal, dayNumberFromYmd(ymd.year, ymd.month, 1), day) + 1} of the month` : '';
      return [
        name + (name === profile.defaultCalendarName ? ' (default)' : ''),
        open ? 'business day' : 'closed',
        [...holidays, weekend].filter(Boolean).join('; '),
        nth,
        formatPlainDate(previousBusinessDay(cal, day)),
        formatPlainDate(nextBusinessDay(cal, day)),
      ];
    } catch (e) {
      return [name, `not available: ${e instanceof Error ? e.message : String(e)}`, '', '', '', ''];
    }
  });

  const hoursRows: string[][] = Object.entries(profile.hours).map(([name, hours]) => {
    if (subject.kind === 'instant') {
      const t = subject.epochMs;
      const cutoffs = hours.cutoffNames.map((c) => `${c}: value date ${attempt(() => formatPlainDate(valueDayNumberOfEpochMs(hours, t, c)))}`).join('; ');
      return [
        name,
        attempt(() => (isOpen(hours, t) ? `open; closes ${local(hours.zoneId, nextClosingEpochMs(hours, t))}` : `closed; opens ${local(hours.zoneId, nextOpeningEpochMs(hours, t))}`)),
        cutoffs,
      ];
    }
    const sessions = attempt(() => {
      const list = listSessions(hours, firstEpochMsOfDayNumber(hours.zoneId, day), firstEpochMsOfDayNumber(hours.zoneId, day + 1));
      return list.length === 0 ? 'no session' : list.map((s) => `${local(hours.zoneId, s.startEpochMs)} to ${local(hours.zoneId, s.endEpochMs)} (${hoursText(s.lengthMs)})`).join('; ');
    });
    const cutoffs = hours.cutoffNames
      .map((c) => `${c}: ${attempt(() => {
        const at = cutoffEpochMsOfDayNumber(hours, day, c);
        return at === null ? 'none (not a business day of the hours)' : local(hours.zoneId, at);
      })}`)
      .join('; ');
    return [name, sessions, cutoffs];
  });

  return [
    definitionList(head),
    table('Labels in every unit of the profile', ['Unit', 'Label', 'For people', 'Days'], unitRows, 'lookup-units'),
    table('Business-day facts, by calendar', ['Calendar', 'State', 'Holiday or weekend', 'Place in the month', 'Previous business day', 'Next business day'], businessRows, 'lookup-business'),
    hoursRows.length > 0
      ? table(subject.kind === 'instant' ? 'Opening hours at that instant' : 'Opening hours that day', ['Hours', subject.kind === 'instant' ? 'Open or closed' : 'Sessions', 'Cut-offs'], hoursRows, 'lookup-hours')
      : '',
  ].join('');
}
