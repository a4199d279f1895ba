/**
 * Commands of the business layer: holidays in a range, business-day checks, shifting and counting business days,
 * and adjustment by a business-day convention, each on a bundled calendar or a JSON definition file.
 * Uses only the public API (`../../index.js`) and the CLI kit.
 *
 * @module
 */
import { existsSync, readFileSync } from 'node:fs';
import {
  BUNDLED_CALENDAR_NAMES,
  BUSINESS_DAY_CONVENTIONS,
  type BusinessCalendar,
  type BusinessDayConvention,
  type CalendarDefinition,
  UnknownCalendarError,
  adjustDayNumber,
  calendarFromName,
  countBusinessDays,
  dayNumberFromYmd,
  defineCalendar,
  formatPlainDate,
  isBusinessDay,
  listHolidays,
  nextBusinessDay,
  parsePlainDate,
  previousBusinessDay,
  shiftBusinessDays,
  weekdayOfDayNumber,
} from '../../index.js';
import {
  type CliIo,
  type Command,
  type ParsedArgs,
  RowWriter,
  UsageError,
  inputValues,
  optionFlag,
  optionString,
  rejectUnknownOptions,
} from '../kit.js';
import { calendarFromProfileOption } from '../profile.js';

const WEEKDAYS = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'] as const;

const CALENDAR_HELP = `  --calendar <name|file>  A bundled calendar (${BUNDLED_CALENDAR_NAMES.join(', ')}) or a JSON file
                          holding a calendar definition (see docs/business-days.md). Required.`;

const CAUTION_NOTE =
  'note: holiday calendars change by proclamation; verify dates against the official calendar of the jurisdiction.\n';

/** The calendar named by --calendar: a bundled name, or a JSON definition file. */
function calendarOption(args: ParsedArgs): BusinessCalendar {
  const fromProfile = calendarFromProfileOption(args);
  if (fromProfile) return fromProfile;
  const value = optionString(args, 'calendar');
  if (value === undefined) {
    throw new UsageError(
      `--calendar is required: a bundled calendar (${BUNDLED_CALENDAR_NAMES.join(', ')}) or a JSON definition file`,
    );
  }
  if ((BUNDLED_CALENDAR_NAMES as readonly string[]).includes(value)) return calendarFromName(value);
  if (existsSync(value)) {
    let def: unknown;
    try {
      def = JSON.parse(readFileSync(value, 'utf8'));
    } catch (e) {
      throw new UsageError(`--calendar ${value}: not a readable JSON file (${e instanceof Error ? e.message : String(e)})`);
    }
    return defineCalendar(def as CalendarDefinition);
  }
  const suggestions = new UnknownCalendarError(value, '--calendar').suggestions;
  throw new UsageError(
    `--calendar: no bundled calendar and no file named ${JSON.stringify(value)}${suggestions.length ? `; did you mean ${suggestions.map((s) => JSON.stringify(s)).join(' or ')}?` : ''} (bundled calendars: ${BUNDLED_CALENDAR_NAMES.join(', ')})`,
  );
}

function weekdayName(dayNumber: number): string {
  return WEEKDAYS[weekdayOfDayNumber(dayNumber) - 1]!;
}

function integerOption(args: ParsedArgs, name: string): number | undefined {
  const v = optionString(args, name);
  if (v === undefined) return undefined;
  if (!/^[+-]?\d+$/.test(v)) throw new UsageError(`--${name}: expected an integer, got ${JSON.stringify(v)}`);
  return Number(v);
}

function caution(io: CliIo, json: boolean): void {
  if (!json) io.stderr(CAUTION_NOTE);
}

const holidays: Command = {
  name: 'holidays',
  summary: 'List the holidays of a business calendar in a range, with observed and actual dates',
  valueOptions: ['calendar', 'year'],
  help: `Usage: kalends holidays <start> <end> --calendar <name|file> [--json]
       kalends holidays --year <year> --calendar <name|file> [--json]

Lists the holidays observed in [start, end) (end-exclusive) or in one calendar year, in date order: the day
each holiday is observed, its name, the date its rule gives, and whether it was moved off a weekend.

${CALENDAR_HELP}
  --year <year>           The whole calendar year instead of <start> <end>.
  --json                  One JSON object per line.

Example:
  kalends holidays --year 2022 --calendar england-and-wales
`,
  async run(args, io) {
    rejectUnknownOptions(args, ['calendar', 'year']);
    const json = optionFlag(args, 'json');
    const cal = calendarOption(args);
    const year = integerOption(args, 'year');
    let start: number;
    let end: number;
    if (year !== undefined) {
      if (args.positionals.length > 0) throw new UsageError('give either --year or <start> <end>, not both');
      start = dayNumberFromYmd(year, 1, 1);
      end = dayNumberFromYmd(year + 1, 1, 1);
    } else {
      if (args.positionals.length !== 2) throw new UsageError('expected <start> <end> (end-exclusive) or --year <year>');
      start = parsePlainDate(args.positionals[0]!);
      end = parsePlainDate(args.positionals[1]!);
    }
    const out = new RowWriter(io, json, ['date', 'weekday', 'name', 'actualDate', 'moved', 'oneOff']);
    for (const h of listHolidays(cal, start, end)) {
      out.write({
        calendar: cal.id,
        date: h.date,
        weekday: weekdayName(h.dayNumber),
        name: h.name,
        actualDate: h.actualDate,
        moved: h.moved,
        oneOff: h.oneOff,
      });
    }
    out.end();
    caution(io, json);
    return 0;
  },
};

const businessDay: Command = {
  name: 'business-day',
  summary: 'Say whether dates are business days, with the holiday names and the next and previous business days',
  valueOptions: ['calendar'],
  help: `Usage: kalends business-day <date>... --calendar <name|file> [--json]

For each date (arguments, or one per line on stdin): whether it is a business day, the holidays observed on it,
and the next and previous business days (strictly after and before).

${CALENDAR_HELP}
  --json                  One JSON object per line.

Example:
  kalends business-day 2025-07-04 2025-07-07 --calendar us-federal
`,
  async run(args, io) {
    rejectUnknownOptions(args, ['calendar']);
    const json = optionFlag(args, 'json');
    const cal = calendarOption(args);
    const out = new RowWriter(io, json, ['date', 'weekday', 'businessDay', 'holidays', 'previous', 'next']);
    for await (const text of inputValues(args, io)) {
      const dn = parsePlainDate(text);
      const names = listHolidays(cal, dn, dn + 1).map((h) => (h.moved ? `${h.name} (observed)` : h.name));
      out.write({
        date: formatPlainDate(dn),
        weekday: weekdayName(dn),
        businessDay: isBusinessDay(cal, dn),
        holidays: names.length ? names.join('; ') : null,
        previous: formatPlainDate(previousBusinessDay(cal, dn)),
        next: formatPlainDate(nextBusinessDay(cal, dn)),
      });
    }
    out.end();
    caution(io, json);
    return 0;
  },
};

const businessShift: Command = {
  name: 'business-shift',
  summary: 'Move dates by a number of business days (negative: back)',
  valueOptions: ['calendar', 'by'],
  help: `Usage: kalends business-shift <date>... --by <n> --calendar <name|file> [--json]

Moves each date (arguments, or one per line on stdin) by n business days: n > 0 counts business days strictly
after the date, n < 0 strictly before it, n = 0 gives the date itself if it is a business day, else the next one.

${CALENDAR_HELP}
  --by <n>                Business days to move (an integer, may be negative). Required.
  --json                  One JSON object per line.

Example:
  kalends business-shift 2025-12-23 --by 2 --calendar us-federal
`,
  async run(args, io) {
    rejectUnknownOptions(args, ['calendar', 'by']);
    const json = optionFlag(args, 'json');
    const cal = calendarOption(args);
    const by = integerOption(args, 'by');
    if (by === undefined) throw new UsageError('--by <n> is required (the number of business days to move)');
    const out = new RowWriter(io, json, ['date', 'by', 'result', 'weekday']);
    for await (const text of inputValues(args, io)) {
      const dn = parsePlainDate(text);
      const r = shiftBusinessDays(cal, dn, by);
      out.write({ date: formatPlainDate(dn), by, result: formatPlainDate(r), weekday: weekdayName(r) });
    }
    out.end();
    caution(io, json);
    return 0;
  },
};

const businessCount: Command = {
  name: 'business-count',
  summary: 'Count the business days in [start, end) (end-exclusive)',
  valueOptions: ['calendar'],
  help: `Usage: kalends business-count <start> <end> --calendar <name|file> [--json]

Counts the business days from start (included) to end (excluded). With no arguments, reads one "start end" pair
per line from stdin (separated by a space or a comma). When end is before start the count is negative.

${CALENDAR_HELP}
  --json                  One JSON object per line.

Example:
  kalends business-count 2025-01-01 2026-01-01 --calendar euro-t2
`,
  async run(args, io) {
    rejectUnknownOptions(args, ['calendar']);
    const json = optionFlag(args, 'json');
    const cal = calendarOption(args);
    const pairs: [string, string][] = [];
    if (args.positionals.length > 0) {
      if (args.positionals.length % 2 !== 0) throw new UsageError('expected pairs of dates: <start> <end>');
      for (let i = 0; i < args.positionals.length; i += 2) pairs.push([args.positionals[i]!, args.positionals[i + 1]!]);
    }
    const out = new RowWriter(io, json, ['start', 'end', 'businessDays', 'calendarDays']);
    const emit = (a: string, b: string) => {
      const start = parsePlainDate(a);
      const end = parsePlainDate(b);
      out.write({ start: formatPlainDate(start), end: formatPlainDate(end), businessDays: countBusinessDays(cal, start, end), calendarDays: end - start });
    };
    if (pairs.length > 0) for (const [a, b] of pairs) emit(a, b);
    else {
      for await (const line of inputValues(args, io)) {
        const parts = line.split(/[\s,]+/).filter((p) => p !== '');
        if (parts.length !== 2) throw new UsageError(`expected "start end" on each input line, got ${JSON.stringify(line)}`);
        emit(parts[0]!, parts[1]!);
      }
    }
    out.end();
    caution(io, json);
    return 0;
  },
};

const adjust: Command = {
  name: 'adjust',
  summary: 'Adjust dates that fall on non-business days by a business-day convention',
  valueOptions: ['calendar', 'convention'],
  help: `Usage: kalends adjust <date>... --convention <convention> --calendar <name|file> [--json]

Adjusts each date (arguments, or one per line on stdin) by a business-day convention; business days are never
moved. Conventions (ISDA 2006 Definitions, section 4.12, plus modified preceding, which is common practice):
  following            the next business day
  modified-following   the next business day, unless it is in the next month: then the previous one
  preceding            the previous business day
  modified-preceding   the previous business day, unless it is in the previous month: then the next one
  none                 no adjustment

${CALENDAR_HELP}
  --convention <name>     One of ${BUSINESS_DAY_CONVENTIONS.join(', ')}. Required.
  --json                  One JSON object per line.

Example:
  kalends adjust 2026-01-31 --convention modified-following --calendar us-federal
`,
  async run(args, io) {
    rejectUnknownOptions(args, ['calendar', 'convention']);
    const json = optionFlag(args, 'json');
    const cal = calendarOption(args);
    const convention = optionString(args, 'convention');
    if (convention === undefined || !(BUSINESS_DAY_CONVENTIONS as readonly string[]).includes(convention)) {
      throw new UsageError(
        `--convention: expected one of ${BUSINESS_DAY_CONVENTIONS.join(', ')}${convention === undefined ? '' : `, got ${JSON.stringify(convention)}`}`,
      );
    }
    const out = new RowWriter(io, json, ['date', 'weekday', 'convention', 'adjusted', 'adjustedWeekday', 'moved']);
    for await (const text of inputValues(args, io)) {
      const dn = parsePlainDate(text);
      const r = adjustDayNumber(cal, dn, convention as BusinessDayConvention);
      out.write({
        date: formatPlainDate(dn),
        weekday: weekdayName(dn),
        convention,
        adjusted: formatPlainDate(r),
        adjustedWeekday: weekdayName(r),
        moved: r !== dn,
      });
    }
    out.end();
    caution(io, json);
    return 0;
  },
};

/** Commands of this layer. */
export const commands: readonly Command[] = [holidays, businessDay, businessShift, businessCount, adjust];
