/**
 * The bundled calendars, by name. Each is a plain definition that names its legal source and carries a caution.
 *
 * @module
 */
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
const HINTS: Readonly<Record<string, BundledCalendarName>> = {
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
};

function distance(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    let prev = row[0]!;
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const cur = row[j]!;
      row[j] = Math.min(row[j]! + 1, row[j - 1]! + 1, prev + (a[i - 1] === b[j - 1] ? 0 : 1));
      prev = cur;
    }
  }
  return row[b.length]!;
}

/** @internal Bundled names close to `name` (by edit distance, containment or a common synonym). */
export function suggestCalendarNames(name: string): string[] {
  if (typeof name !== 'string') return [];
  const key = name.trim().toLowerCase().replace(/[\s_]+/g, '-');
  const out = new Set<string>();
  const hint = Object.prototype.hasOwnProperty.call(HINTS, key) ? HINTS[key] : undefined;
  if (hint) out.add(hint);
  for (const candidate of BUNDLED_CALENDAR_NAMES) {
    if (key.length >= 2 && (candidate.includes(key) || key.includes(candidate))) out.add(candidate);
    else if (distance(key, candidate) <= Math.max(2, Math.floor(candidate.length / 4))) out.add(candidate);
  }
  return [...out];
}
