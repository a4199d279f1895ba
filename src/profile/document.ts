/**
 * The calendar profile document: its TypeScript types and its one description ({@link PROFILE_SHAPE}), from which
 * both the published JSON Schema and the validator's structural checks are made. Enums and bounds come from the
 * layers that own them (weekday names from civil, bundled calendars and conventions from business, years from
 * bounds); nothing here restates them by hand.
 *
 * @module
 */
import { MAX_HOURS_CUTOFFS, MAX_HOURS_INTERVALS_PER_DAY, MAX_YEAR, MIN_YEAR } from '../bounds.js';
import type { Shape } from './shape.js';
import {
  type BusinessDayConvention,
  type CalendarDefinition,
  type CalendarUnitName,
  type ExtraWeekPlacement,
  type FiscalKind,
  type HoursDefinition,
  type RuleDefinition,
  type RuleKind,
  type WeekLayout,
  type WeekdayName,
  type YearNaming,
  BUNDLED_CALENDAR_NAMES,
  BUSINESS_DAY_CONVENTIONS,
  WEEKDAY_NAMES,
} from './deps.js';

/** The names of a template's fields, in the order docs/profiles.md lists them (see {@link LABEL_FIELD_NAMES}). */
export type LabelFieldName =
  | 'label'
  | 'year'
  | 'yearShort'
  | 'index'
  | 'index2'
  | 'month'
  | 'month2'
  | 'monthName'
  | 'monthShort'
  | 'day'
  | 'weekdayName'
  | 'weekdayShort'
  | 'firstDate'
  | 'lastDate';

/** Every field a label template may name, e.g. `"Q{index} FY{yearShort}"`. */
export const LABEL_FIELD_NAMES: readonly LabelFieldName[] = Object.freeze(
  Object.keys({
    label: 0,
    year: 0,
    yearShort: 0,
    index: 0,
    index2: 0,
    month: 0,
    month2: 0,
    monthName: 0,
    monthShort: 0,
    day: 0,
    weekdayName: 0,
    weekdayShort: 0,
    firstDate: 0,
    lastDate: 0,
  } satisfies Record<LabelFieldName, 0>) as LabelFieldName[],
);

// Closed lists typed against the period layer's types: the compiler rejects a missing or an extra member.
const LAYOUTS = Object.keys({ '4-4-5': 0, '4-5-4': 0, '5-4-4': 0, '13x4': 0 } satisfies Record<WeekLayout, 0>) as WeekLayout[];
const PLACEMENTS = Object.keys({ 'last-period': 0, 'first-period': 0 } satisfies Record<ExtraWeekPlacement, 0>) as ExtraWeekPlacement[];
const NAMINGS = Object.keys({ 'end-year': 0, 'start-year': 0 } satisfies Record<YearNaming, 0>) as YearNaming[];
/** @internal The fiscal unit kinds a profile unit may take. */
export const FISCAL_KINDS = Object.keys({
  'fiscal-year': 0,
  'fiscal-half': 0,
  'fiscal-quarter': 0,
  'fiscal-period': 0,
  'fiscal-week': 0,
} satisfies Record<FiscalKind, 0>) as FiscalKind[];
/** @internal The kinds of frequency rule (the recurrence layer's). */
export const RULE_KINDS = Object.keys({
  days: 0,
  'business-days': 0,
  weekly: 0,
  monthly: 0,
  'semi-monthly': 0,
  quarterly: 0,
  'half-yearly': 0,
  yearly: 0,
  periods: 0,
  intraday: 0,
  rfc5545: 0,
} satisfies Record<RuleKind, 0>) as RuleKind[];
/** @internal The calendar units a profile unit may name. */
export const CALENDAR_KINDS = Object.keys({
  day: 0,
  'iso-week': 0,
  month: 0,
  quarter: 0,
  'half-year': 0,
  year: 0,
} satisfies Record<CalendarUnitName, 0>) as CalendarUnitName[];

/** A fiscal year made of calendar months, starting on a fixed month and day. */
export interface MonthFiscalYear {
  readonly start: { readonly month: number; readonly day: number };
  readonly naming: YearNaming;
}

/** A 52/53-week fiscal year: where it ends, how it is named, and (for quarters and periods) its week layout. */
export interface WeekFiscalYear {
  readonly yearEnd: { readonly weekday: WeekdayName; readonly month: number; readonly rule: 'last' | 'nearest' };
  readonly naming: YearNaming;
  readonly layout?: WeekLayout;
  readonly extraWeek?: ExtraWeekPlacement;
}

/** A named unit of a profile: a fiscal unit derived from one of its fiscal years, or a calendar unit. */
export type ProfileUnitDefinition =
  | { readonly kind: FiscalKind; readonly fiscalYear: string; readonly layout?: WeekLayout }
  | { readonly kind: CalendarUnitName };

/** A business calendar of a profile: a bundled or profile calendar's name, or a definition (`extends` and `union` may name profile calendars). */
export type ProfileCalendarDefinition = string | CalendarDefinition;

/** A frequency rule of a profile: a rule definition whose `calendar` (and a periods rule's `unit`) name the profile's own. */
export type ProfileRuleDefinition = RuleDefinition;

/**
 * Opening hours of a profile: a definition of hours (docs/business-time.md) whose `zone` defaults to the profile's
 * zone and whose `calendar` is a bundled calendar's name, one of the profile's calendars by name, or an inline
 * definition (whose `extends` and `union` may name the profile's calendars).
 */
export type ProfileHoursDefinition = Omit<HoursDefinition, 'zone' | 'calendar'> & {
  /** The zone of the wall clock the hours are written in (default: the profile's zone). */
  readonly zone?: string;
  readonly calendar?: string | CalendarDefinition;
};

/** Labels for people: a locale and templates of named fields. */
export interface ProfileLabels {
  /** A BCP 47 language tag (`"en-US"`, `"de-DE"`, `"ja-JP"`): month and weekday names and digits come from Intl. */
  readonly locale: string;
  /** Templates by unit name: `{ "fiscal-quarter": "Q{index} FY{yearShort}" }`. */
  readonly units?: Readonly<Record<string, string>>;
  /** A template for single days: `"{weekdayName}, {day} {monthName} {year}"`. */
  readonly day?: string;
}

/** The default range and zones of warehouse exports. */
export interface ProfileWarehouse {
  /** First local day exported (ISO 8601 date, inclusive). */
  readonly start: string;
  /** End of the range (ISO 8601 date, exclusive). */
  readonly end: string;
  /** Zones of the transition table (default: the profile's zone). */
  readonly zones?: readonly string[];
  /** The business calendar of the dimension's business-day columns (default: the profile's default calendar). */
  readonly calendar?: string;
}

/** A calendar profile: one JSON document for a business's whole calendar. See docs/profiles.md. */
export interface ProfileDefinition {
  /** For editors: the JSON Schema's address (ignored by the library). */
  readonly $schema?: string;
  readonly id: string;
  readonly name: string;
  /** The home zone: an IANA id (or a fixed offset such as "+05:30"). */
  readonly zone: string;
  /** `"iso"` (ISO 8601 weeks) or weeks starting on a given weekday. */
  readonly week: 'iso' | { readonly firstWeekday: WeekdayName };
  readonly fiscalYears?: Readonly<Record<string, MonthFiscalYear | WeekFiscalYear>>;
  readonly units?: Readonly<Record<string, ProfileUnitDefinition>>;
  readonly calendars?: Readonly<Record<string, ProfileCalendarDefinition>>;
  /** The calendar used where none is named (default: the only one, when there is one). */
  readonly defaultCalendar?: string;
  readonly rules?: Readonly<Record<string, ProfileRuleDefinition>>;
  readonly labels?: ProfileLabels;
  readonly warehouse?: ProfileWarehouse;
  /** Named opening hours (business time): the support desk, the payments office with its cut-offs. */
  readonly hours?: Readonly<Record<string, ProfileHoursDefinition>>;
}

// ---------------------------------------------------------------------------------------------------------
// The description

const NAME_PATTERN = '^[a-z][a-z0-9]*(?:-[a-z0-9]+)*$';
const NAME_HINT = 'use lower-case letters and digits in words joined by single hyphens, starting with a letter (e.g. "fiscal-quarter")';
/** Most entries in one named section. */
export const MAX_PROFILE_ENTRIES = 64;
/** Longest label template, in characters. */
export const MAX_TEMPLATE_LENGTH = 200;
const DATE_PATTERN = '^(?:\\d{4}|[+-]\\d{6})-\\d{2}-\\d{2}$';

const weekday: Shape = { type: 'enum', description: 'a weekday, lower case', values: WEEKDAY_NAMES };
const naming: Shape = {
  type: 'enum',
  description: 'name the fiscal year after the calendar year in which it ends ("end-year") or starts ("start-year")',
  values: NAMINGS,
};
const layout: Shape = { type: 'enum', description: 'weeks per period in each quarter of a 52-week year', values: LAYOUTS };
const name = (what: string): Shape => ({ type: 'string', description: what, maxLength: 64, pattern: NAME_PATTERN, patternHint: `a name (${NAME_HINT})` });

/** Named entries: keys are profile names. */
const map = (description: string, values: Shape, maxEntries = MAX_PROFILE_ENTRIES): Shape => ({
  type: 'map',
  description,
  keyPattern: NAME_PATTERN,
  keyHint: NAME_HINT,
  values,
  maxEntries,
});

const monthFiscalYear: Shape = {
  type: 'object',
  description: 'a fiscal year of calendar months',
  required: ['start', 'naming'],
  fields: {
    start: {
      type: 'object',
      description: 'the month and day on which each fiscal year starts (29 February is refused)',
      required: ['month', 'day'],
      fields: {
        month: { type: 'integer', description: 'month of the start, 1..12', min: 1, max: 12 },
        day: { type: 'integer', description: 'day of the start, 1..31 (at most the month\'s length, 28 for February)', min: 1, max: 31 },
      },
    },
    naming,
  },
};

const weekFiscalYear: Shape = {
  type: 'object',
  description: 'a 52/53-week fiscal year',
  required: ['yearEnd', 'naming'],
  fields: {
    yearEnd: {
      type: 'object',
      description: 'where the year ends: on a weekday, the last one in a month or the one nearest its last day',
      required: ['weekday', 'month', 'rule'],
      fields: {
        weekday,
        month: { type: 'integer', description: 'the month the year ends in (or nearest)', min: 1, max: 12 },
        rule: { type: 'enum', description: '"last" weekday in the month, or the one "nearest" its last day', values: ['last', 'nearest'] },
      },
    },
    naming,
    layout,
    extraWeek: { type: 'enum', description: 'which period of a 53-week year takes the extra week', values: PLACEMENTS },
  },
};

const fiscalYear: Shape = {
  type: 'union',
  description: 'a fiscal year: by months ("start") or 52/53 weeks ("yearEnd")',
  variants: [monthFiscalYear, weekFiscalYear],
  pick: (v) => {
    if (typeof v !== 'object' || v === null || Array.isArray(v)) return 'expected a fiscal year object with "start" (months) or "yearEnd" (52/53 weeks)';
    return Object.prototype.hasOwnProperty.call(v, 'yearEnd') && !Object.prototype.hasOwnProperty.call(v, 'start') ? 1 : 0;
  },
};

const fiscalUnit: Shape = {
  type: 'object',
  description: 'a fiscal unit derived from one of the profile\'s fiscal years',
  required: ['kind', 'fiscalYear'],
  fields: {
    kind: { type: 'enum', description: 'the fiscal unit', values: FISCAL_KINDS },
    fiscalYear: name('the name of one of the profile\'s fiscal years'),
    layout: { ...layout, description: 'restates the fiscal year\'s layout (must agree with it)' },
  },
};

const calendarUnit: Shape = {
  type: 'object',
  description: 'a calendar unit',
  required: ['kind'],
  fields: { kind: { type: 'enum', description: 'the calendar unit', values: CALENDAR_KINDS } },
};

const unit: Shape = {
  type: 'union',
  description: 'a unit: a fiscal unit of a fiscal year, or a calendar unit',
  variants: [fiscalUnit, calendarUnit],
  pick: (v) => {
    if (typeof v !== 'object' || v === null || Array.isArray(v)) return 'expected a unit object such as {"kind": "fiscal-quarter", "fiscalYear": "main"}';
    const kind = (v as Record<string, unknown>)['kind'];
    return (CALENDAR_KINDS as readonly unknown[]).includes(kind) ? 1 : 0;
  },
};

const calendarDefinitionShape: Shape = {
  type: 'definition',
  description: 'a business calendar definition (docs/business-days.md); "extends" and "union" may name the profile\'s calendars',
};

const calendar: Shape = {
  type: 'union',
  description: `a bundled calendar (${BUNDLED_CALENDAR_NAMES.join(', ')}), another profile calendar's name, or a definition`,
  variants: [name('a bundled calendar or another of the profile\'s calendars'), calendarDefinitionShape],
  pick: (v) => (typeof v === 'string' ? 0 : typeof v === 'object' && v !== null && !Array.isArray(v) ? 1 : 'expected a calendar name or a calendar definition object'),
};

const rule: Shape = {
  type: 'definition',
  description: 'a frequency rule definition (docs/schedules.md); its "calendar" names one of the profile\'s calendars',
  required: ['kind'],
  hintFields: {
    kind: {
      type: 'enum',
      description: 'the rule kind',
      values: RULE_KINDS,
    },
    calendar: name('the name of one of the profile\'s calendars'),
    convention: { type: 'enum', description: 'business-day adjustment (ISDA 2006 Definitions 4.12 names)', values: BUSINESS_DAY_CONVENTIONS as readonly BusinessDayConvention[] },
  },
};

/** A wall-clock time as the hours layer writes it; the validator also refuses 24:00 as an opening time. */
const TIME_PATTERN = '^(?:(?:[01][0-9]|2[0-3]):[0-5][0-9](?::[0-5][0-9])?|24:00(?::00)?)$';
const time = (what: string): Shape => ({ type: 'string', description: what, maxLength: 8, pattern: TIME_PATTERN, patternHint: 'a wall-clock time "HH:MM" or "HH:MM:SS" from 00:00 to 24:00' });
const interval: Shape = {
  type: 'object',
  description: 'an opening interval in wall-clock time; a close before the open runs overnight into the next day',
  required: ['open', 'close'],
  fields: { open: time('when the interval opens, 00:00..23:59:59'), close: time('when it closes, 00:00..24:00') },
};
const hoursWeek: Shape = {
  type: 'object',
  description: 'the regular opening intervals of each weekday (a weekday left out is closed)',
  required: [],
  fields: Object.fromEntries(
    WEEKDAY_NAMES.map((d) => [d, { type: 'array', description: `the intervals of each ${d}`, items: interval, maxItems: MAX_HOURS_INTERVALS_PER_DAY } satisfies Shape]),
  ),
};
const hours: Shape = {
  type: 'definition',
  description: 'opening hours (docs/business-time.md): the weekly intervals, special days and named cut-off times; the zone defaults to the profile\'s',
  required: ['week'],
  hintFields: {
    zone: { type: 'string', description: 'the zone of the wall clock the hours are written in (default: the profile\'s zone)', maxLength: 64 },
    calendar: { ...calendar, description: `the business calendar that closes days: a bundled calendar (${BUNDLED_CALENDAR_NAMES.join(', ')}), one of the profile's calendars by name, or a definition` },
    week: hoursWeek,
    cutoffs: map('named cut-off times of each business day, e.g. {"payments": "17:00"}', time('the cut-off time'), MAX_HOURS_CUTOFFS),
  },
};

const templatePattern = `^(?:[^{}]|\\{(?:${LABEL_FIELD_NAMES.join('|')})\\})*$`;
const template: Shape = {
  type: 'string',
  description: 'a label template: text with named fields in braces, e.g. "Q{index} FY{yearShort}"',
  maxLength: MAX_TEMPLATE_LENGTH,
  pattern: templatePattern,
  patternHint: `a template whose fields in braces are among ${LABEL_FIELD_NAMES.map((f) => `{${f}}`).join(' ')} (braces are only for fields)`,
};

const labels: Shape = {
  type: 'object',
  description: 'labels for people, beside the canonical machine labels',
  required: ['locale'],
  fields: {
    locale: { type: 'string', description: 'a BCP 47 language tag, e.g. "en-US"', maxLength: 64 },
    units: map('a template for each unit, by the unit\'s name', template),
    day: { ...template, description: 'a template for single days' },
  },
};

const date = (what: string): Shape => ({ type: 'string', description: what, maxLength: 20, pattern: DATE_PATTERN, patternHint: 'an ISO 8601 date YYYY-MM-DD' });

const warehouse: Shape = {
  type: 'object',
  description: `the default range and zones of warehouse exports (years ${MIN_YEAR}..${MAX_YEAR}, within the calendars' years)`,
  required: ['start', 'end'],
  fields: {
    start: date('the first local day exported, inclusive'),
    end: date('the end of the range, exclusive'),
    zones: {
      type: 'array',
      description: 'zones of the transition table (default: the profile\'s zone)',
      items: { type: 'string', description: 'an IANA zone id', maxLength: 64 },
      minItems: 1,
      maxItems: 1000,
    },
    calendar: name('the calendar of the business-day columns'),
  },
};

/** The one description of a profile document: the schema and the validator's structural checks come from it. */
export const PROFILE_SHAPE: Shape = {
  type: 'object',
  description: 'a kalends calendar profile (docs/profiles.md)',
  required: ['id', 'name', 'zone', 'week'],
  fields: {
    $schema: { type: 'string', description: 'the address of this schema, for editors', maxLength: 1000 },
    id: name('a short identifier of the profile'),
    name: { type: 'string', description: 'the profile\'s name for people', maxLength: 200 },
    zone: { type: 'string', description: 'the home zone: an IANA zone id such as "America/Chicago", or a fixed offset such as "+05:30"', maxLength: 64 },
    week: {
      type: 'union',
      description: 'the week convention: "iso", or weeks starting on a weekday',
      variants: [
        { type: 'const', description: 'ISO 8601 weeks (Monday to Sunday, numbered by week-year)', value: 'iso' },
        {
          type: 'object',
          description: 'weeks starting on a weekday, labelled by their first day',
          required: ['firstWeekday'],
          fields: { firstWeekday: weekday },
        },
      ],
      pick: (v) => (typeof v === 'string' ? 0 : typeof v === 'object' && v !== null && !Array.isArray(v) ? 1 : 'expected "iso" or {"firstWeekday": "sunday"}'),
    },
    fiscalYears: map('the fiscal years, by name', fiscalYear),
    units: map('the units, by name', unit),
    calendars: map('the business calendars, by name', calendar),
    defaultCalendar: name('the calendar used where none is named'),
    rules: map('the frequency rules, by name', rule),
    labels,
    warehouse,
    hours: map('opening hours, by name', hours),
  },
};
