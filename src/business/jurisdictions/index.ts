/**
 * The bundled calendars, by name. Each is a plain definition that names its legal source and carries a caution.
 *
 * @module
 */
import { suggestNames } from '../../diagnostics/index.js';
import { describeValue } from '../../errors.js';
import type { BundledCalendarName, CalendarDefinition } from '../definition.js';
import { ENGLAND_AND_WALES_BANK_HOLIDAYS } from './england-and-wales.js';
import { EURO_T2_CLOSING_DAYS } from './euro-t2.js';
import { US_FEDERAL_HOLIDAYS } from './us-federal.js';

export { ENGLAND_AND_WALES_BANK_HOLIDAYS, EURO_T2_CLOSING_DAYS, US_FEDERAL_HOLIDAYS };

/** Bundled calendar definitions by name. */
export const BUNDLED_DEFINITIONS: Readonly<Record<BundledCalendarName, CalendarDefinition>> = Object.freeze({
  'us-federal': US_FEDERAL_HOLIDAYS,
  'england-and-wales': ENGLAND_AND_WALES_BANK_HOLIDAYS,
  'euro-t2': EURO_T2_CLOSING_DAYS,
});

/** The names of the bundled calendars. */
export const BUNDLED_CALENDAR_NAMES: readonly BundledCalendarName[] = Object.freeze(
  Object.keys(BUNDLED_DEFINITIONS) as BundledCalendarName[],
);

/** Words people may type for a bundled calendar; used only to suggest the right name. */
const HINTS: Readonly<Record<string, BundledCalendarName>> = Object.freeze({
  us: 'us-federal',
  usa: 'us-federal',
  federal: 'us-federal',
  'united-states': 'us-federal',
  uk: 'england-and-wales',
  gb: 'england-and-wales',
  england: 'england-and-wales',
  wales: 'england-and-wales',
  'bank-holidays': 'england-and-wales',
  target: 'euro-t2',
  target2: 'euro-t2',
  t2: 'euro-t2',
  ecb: 'euro-t2',
  euro: 'euro-t2',
  eur: 'euro-t2',
});

/** @internal Bundled names close to `name`: a common synonym first, then the nearest by spelling. */
export function suggestCalendarNames(name: unknown): string[] {
  return suggestNames(name, BUNDLED_CALENDAR_NAMES, { synonyms: HINTS });
}

/** @internal The bundled names, quoted, for messages: `"us-federal", "england-and-wales", "euro-t2"`. */
export function listedCalendarNames(): string {
  return BUNDLED_CALENDAR_NAMES.map((n) => JSON.stringify(n)).join(', ');
}

/** @internal The message text for an unknown calendar name (without the parameter), with close names. */
export function unknownCalendarText(name: unknown, suggestions: readonly string[] = suggestCalendarNames(name)): string {
  const close = suggestions.length ? `; did you mean ${suggestions.map((s) => JSON.stringify(s)).join(' or ')}?` : '';
  return `unknown calendar ${describeValue(name)}${close}; bundled calendars are ${listedCalendarNames()}`;
}
