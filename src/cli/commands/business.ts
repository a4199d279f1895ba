/**
 * Commands of the business layer: holidays in a range, business-day checks, shifting and counting business days,
 * and adjustment by a business-day convention, each on a bundled calendar or a JSON definition file.
 * Uses only the public API (`../../index.js`) and the CLI kit.
 *
 * @module
 */
import {
  BUNDLED_CALENDAR_NAMES,
  BUSINESS_DAY_CONVENTIONS,
  MAX_DAY_NUMBER,
  MIN_DAY_NUMBER,
  type BusinessCalendar,
  type CalendarDefinition,
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
} from '../../index.js';
import {
  type CliIo,
  type Command,
  type OptionSpec,
  type ParsedArgs,
  type Row,
  InputError,
  JSON_OPTION,
  Output,
  RowWriter,
  UsageError,
  writeRowsPerValue,
  optionChoice,
  optionFlag,
  optionInteger,
  optionString,
  parseDefinitionJson,
  readDefinitionSource,
  shellMessage,
  weekdayTitle,
} from '../kit.js';
import { calendarFromProfileOption } from '../profile.js';

const CALENDAR_OPTION: OptionSpec = {
  name: 'calendar',
  value: '<calendar>',
  text: `a bundled calendar (${BUNDLED_CALENDAR_NAMES.join(', ')}), a calendar definition as JSON text, the path of a JSON file holding one, or "-" for standard input (see docs/business-days.md). Required.`,
};

const CAUTION_NOTE =
  'note: holiday calendars change by proclamation; verify dates against the official calendar of the jurisdiction.\n';

/** The calendar of --calendar, in the kit's one form: a bundled name, JSON text, "-" or a JSON file. */
async function calendarOption(args: ParsedArgs, io: CliIo): Promise<BusinessCalendar> {
  const fromProfile = calendarFromProfileOption(args);
  if (fromProfile) return fromProfile;
  const value = optionString(args, 'calendar');
  if (value === undefined) {
    throw new UsageError(`--calendar is required: a bundled calendar (${BUNDLED_CALENDAR_NAMES.join(', ')}), a definition as JSON text, or a JSON file`);
  }
  const source = await readDefinitionSource(value, '--calendar', io, { names: BUNDLED_CALENDAR_NAMES });
  if ('name' in source) return calendarFromName(source.name);
  return defineCalendar(parseDefinitionJson(source, '--calendar') as CalendarDefinition);
}

/** The caution goes first, so that it is seen even when the reader stops early (| head). */
function caution(io: CliIo, json: boolean): void {
  if (!json) io.stderr(CAUTION_NOTE);
}

/**
 * Runs a command that writes one row per date (arguments, or lines of stdin) on the calendar of --calendar,
 * after the caution. `row` gives the row of one date.
 */
async function rowsPerDate(
  args: ParsedArgs,
  io: CliIo,
  command: string,
  columns: readonly string[],
  row: (cal: BusinessCalendar, dayNumber: number) => Row,
): Promise<number> {
  const cal = await calendarOption(args, io);
  caution(io, optionFlag(args, 'json'));
  return writeRowsPerValue(args, io, { command, noun: 'dates', columns, handle: (text, writer) => writer.write(row(cal, parsePlainDate(text))) });
}

/** A date argument of a range: a usage error names it. */
function dateArgument(text: string, what: string): number {
  try {
    return parsePlainDate(text);
  } catch (e) {
    throw new UsageError(`${what}: ${shellMessage(e)}`);
  }
}

/** Holidays are listed in windows of 100 years, so that any range streams in bounded memory. */
const HOLIDAY_WINDOW_DAYS = 36_525;

const holidays: Command = {
  name: 'holidays',
  summary: 'List the holidays of a business calendar in a range, with observed and actual dates',
  usage: ['<start> <end> --calendar <calendar> [--json]', '--year <year> --calendar <calendar> [--json]'],
  description: `Lists the holidays observed in [start, end) (end-exclusive) or in one calendar year, in date order: the day
each holiday is observed, its name, the date its rule gives, and whether it was moved off a weekend.
Long ranges are streamed.`,
  options: [CALENDAR_OPTION, { name: 'year', value: '<year>', text: 'the whole calendar year instead of <start> <end>' }, JSON_OPTION],
  examples: ['kalends holidays --year 2022 --calendar england-and-wales', 'kalends holidays 2025-01-01 2030-01-01 --calendar us-federal --json'],
  async run(args, io) {
    const json = optionFlag(args, 'json');
    const year = optionInteger(args, 'year', -271820, 275759);
    let start: number;
    let end: number;
    if (year !== undefined) {
      if (args.positionals.length > 0) throw new UsageError('give either --year or <start> <end>, not both');
      start = dayNumberFromYmd(year, 1, 1);
      end = dayNumberFromYmd(year + 1, 1, 1);
    } else {
      if (args.positionals.length !== 2) throw new UsageError(`expected <start> <end> (end-exclusive) or --year <year>, got ${args.positionals.length} arguments`);
      start = dateArgument(args.positionals[0]!, '<start>');
      end = dateArgument(args.positionals[1]!, '<end>');
      if (end < start) throw new UsageError(`<end> ${args.positionals[1]} is before <start> ${args.positionals[0]}; the range is [start, end)`);
    }
    const cal = await calendarOption(args, io);
    // Checks both ends against the calendar's years before anything is written.
    listHolidays(cal, start, start);
    listHolidays(cal, end, end);
    caution(io, json);
    const out = new Output(io);
    const writer = new RowWriter(out, json, ['date', 'weekday', 'name', 'actualDate', 'moved', 'oneOff']);
    for (let lo = start; lo < end; lo += HOLIDAY_WINDOW_DAYS) {
      for (const h of listHolidays(cal, lo, Math.min(end, lo + HOLIDAY_WINDOW_DAYS))) {
        await writer.write({
          calendar: cal.id,
          date: h.date,
          weekday: weekdayTitle(h.dayNumber),
          name: h.name,
          actualDate: h.actualDate,
          moved: h.moved,
          oneOff: h.oneOff,
        });
      }
    }
    await writer.end();
    return 0;
  },
};

const businessDay: Command = {
  name: 'business-day',
  summary: 'Say whether dates are business days, with the holiday names and the next and previous business days',
  usage: ['[<date>...] --calendar <calendar> [--json]'],
  description: `For each date (arguments, or one per line on standard input): whether it is a business day, the holidays
observed on it, and the next and previous business days (strictly after and before).`,
  options: [CALENDAR_OPTION, JSON_OPTION],
  examples: ['kalends business-day 2025-07-04 2025-07-07 --calendar us-federal'],
  run(args, io) {
    return rowsPerDate(args, io, 'business-day', ['date', 'weekday', 'businessDay', 'holidays', 'previous', 'next'], (cal, dn) => {
      const names = listHolidays(cal, dn, dn + 1).map((h) => (h.moved ? `${h.name} (observed)` : h.name));
      return {
        date: formatPlainDate(dn),
        weekday: weekdayTitle(dn),
        businessDay: isBusinessDay(cal, dn),
        holidays: names.length ? names.join('; ') : null,
        previous: formatPlainDate(previousBusinessDay(cal, dn)),
        next: formatPlainDate(nextBusinessDay(cal, dn)),
      };
    });
  },
};

/** The widest shift that can stay within the supported days. */
const MAX_SHIFT = MAX_DAY_NUMBER - MIN_DAY_NUMBER;

const businessShift: Command = {
  name: 'business-shift',
  summary: 'Move dates by a number of business days (negative: back)',
  usage: ['[<date>...] --by <n> --calendar <calendar> [--json]'],
  description: `Moves each date (arguments, or one per line on standard input) by n business days: n > 0 counts business
days strictly after the date, n < 0 strictly before it, n = 0 gives the date itself if it is a business
day, else the next one.`,
  options: [CALENDAR_OPTION, { name: 'by', value: '<n>', text: 'business days to move (a whole number, may be negative). Required.' }, JSON_OPTION],
  examples: ['kalends business-shift 2025-12-23 --by 2 --calendar us-federal', 'kalends business-shift 2025-12-26 --by=-2 --calendar us-federal'],
  run(args, io) {
    const by = optionInteger(args, 'by', -MAX_SHIFT, MAX_SHIFT);
    if (by === undefined) throw new UsageError('--by <n> is required (the number of business days to move)');
    return rowsPerDate(args, io, 'business-shift', ['date', 'by', 'result', 'weekday'], (cal, dn) => {
      const r = shiftBusinessDays(cal, dn, by);
      return { date: formatPlainDate(dn), by, result: formatPlainDate(r), weekday: weekdayTitle(r) };
    });
  },
};

const businessCount: Command = {
  name: 'business-count',
  summary: 'Count the business days in [start, end) (end-exclusive)',
  usage: ['[<start> <end>]... --calendar <calendar> [--json]'],
  description: `Counts the business days from start (included) to end (excluded). With no arguments, reads one "start end"
pair per line from standard input (separated by a space or a comma). When end is before start the count is
negative.`,
  options: [CALENDAR_OPTION, JSON_OPTION],
  examples: ['kalends business-count 2025-01-01 2026-01-01 --calendar euro-t2', "printf '2025-01-01,2026-01-01\\n' | kalends business-count --calendar us-federal --json"],
  async run(args, io) {
    if (args.positionals.length % 2 !== 0) throw new UsageError(`expected pairs of dates <start> <end>, got ${args.positionals.length} arguments`);
    const pairs: string[] = [];
    for (let i = 0; i < args.positionals.length; i += 2) pairs.push(`${args.positionals[i]} ${args.positionals[i + 1]}`);
    const cal = await calendarOption(args, io);
    caution(io, optionFlag(args, 'json'));
    return writeRowsPerValue({ positionals: pairs, options: args.options }, io, {
      command: 'business-count',
      noun: 'pairs',
      columns: ['start', 'end', 'businessDays', 'calendarDays'],
      handle(line, writer) {
        const parts = line.split(/[\s,]+/).filter((p) => p !== '');
        if (parts.length !== 2) throw new InputError(`expected "start end" (two dates separated by a space or a comma), got ${parts.length} fields`);
        const start = parsePlainDate(parts[0]!);
        const end = parsePlainDate(parts[1]!);
        return writer.write({ start: formatPlainDate(start), end: formatPlainDate(end), businessDays: countBusinessDays(cal, start, end), calendarDays: end - start });
      },
    });
  },
};

const adjust: Command = {
  name: 'adjust',
  summary: 'Adjust dates that fall on non-business days by a business-day convention',
  usage: ['[<date>...] --convention <convention> --calendar <calendar> [--json]'],
  description: `Adjusts each date (arguments, or one per line on standard input) by a business-day convention; business days
are never moved. Conventions (ISDA 2006 Definitions, section 4.12, plus modified preceding, which is common
practice):
  following            the next business day
  modified-following   the next business day, unless it is in the next month: then the previous one
  preceding            the previous business day
  modified-preceding   the previous business day, unless it is in the previous month: then the next one
  none                 no adjustment`,
  options: [CALENDAR_OPTION, { name: 'convention', value: '<name>', text: `one of ${BUSINESS_DAY_CONVENTIONS.join(', ')}. Required.` }, JSON_OPTION],
  examples: ['kalends adjust 2026-01-31 --convention modified-following --calendar us-federal'],
  run(args, io) {
    const convention = optionChoice(args, 'convention', BUSINESS_DAY_CONVENTIONS);
    if (convention === undefined) throw new UsageError(`--convention is required: one of ${BUSINESS_DAY_CONVENTIONS.join(', ')}`);
    return rowsPerDate(args, io, 'adjust', ['date', 'weekday', 'convention', 'adjusted', 'adjustedWeekday', 'moved'], (cal, dn) => {
      const r = adjustDayNumber(cal, dn, convention);
      return { date: formatPlainDate(dn), weekday: weekdayTitle(dn), convention, adjusted: formatPlainDate(r), adjustedWeekday: weekdayTitle(r), moved: r !== dn };
    });
  },
};

/** Commands of this layer. */
export const commands: readonly Command[] = [holidays, businessDay, businessShift, businessCount, adjust];
