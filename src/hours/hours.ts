/**
 * Opening hours: define them from plain data, then ask about business time. `defineHours` validates a definition
 * (every fault at its path) and compiles it into an immutable value; the sessions themselves are compiled lazily,
 * a year at a time, as queries need them.
 *
 * @module
 */
import { KalendsRangeError, KalendsTypeError, describeValue } from '../errors.js';
import { Issues, isRecord } from '../diagnostics/index.js';
import type { Disambiguation } from './deps.js';
import type { HoursDefinition } from './definition.js';
import { HoursEngine } from './compile.js';
import { normalizeHours } from './validate.js';

const ENGINE = /* @__PURE__ */ Symbol('kalends.hours.engine');

/**
 * Compiled, immutable opening hours. Pass them to the functions of the hours layer. They keep their
 * `definition` (JSON-serializable: a compiled calendar given in it is kept as its definition), so they can be
 * serialized and defined again.
 */
export interface BusinessHours {
  /** The definition's `id`, or `"custom"`. */
  readonly id: string;
  /** The definition's `name`, if any. */
  readonly name: string | undefined;
  /** The definition's `source`, if any. */
  readonly source: string | undefined;
  /** The definition's `caution`, if any. */
  readonly caution: string | undefined;
  /** The zone of the wall clock, as the definition names it. */
  readonly zoneId: string;
  /** The business calendar's id, or undefined without one. */
  readonly calendarId: string | undefined;
  /** The years (inclusive) the hours answer for; instants outside them are refused. */
  readonly firstYear: number;
  /** The last year (inclusive) the hours answer for. */
  readonly lastYear: number;
  /** The names of the cut-off times, in definition order. */
  readonly cutoffNames: readonly string[];
  /** How wall times in a gap or an overlap became instants. */
  readonly disambiguation: Disambiguation;
  /** The definition it was compiled from (frozen). */
  readonly definition: HoursDefinition;
}

interface Internal extends BusinessHours {
  readonly [ENGINE]: HoursEngine;
}

/**
 * No session within the search limit: a search for an opening, a closing, a business day or the end of a business
 * duration walked {@link HOURS_SEARCH_LIMIT_DAYS} days (or to the edge of the hours' years) and found none.
 * Code `no-business-day`.
 *
 * @example
 * ```ts
 * const rare = defineHours({ zone: 'UTC', week: {}, special: [{ date: '2045-06-05', hours: [{ open: '09:00', close: '10:00' }] }] });
 * try { nextOpeningEpochMs(rare, Date.UTC(2025, 0, 1)); } catch (e) { if (e instanceof NoSessionError) e.searchedDays; } // 3660
 * ```
 */
export class NoSessionError extends KalendsRangeError {
  /** Days searched from the instant given. */
  readonly searchedDays: number;
  constructor(message: string, received: number, searchedDays: number) {
    super(message, { code: 'no-business-day', received });
    this.name = 'NoSessionError';
    this.searchedDays = searchedDays;
  }
}

function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const v of Object.values(value as object)) deepFreeze(v);
  }
  return value;
}

/** The definition as JSON data: a compiled calendar is kept as its definition. */
function plainCopy(def: Record<string, unknown>, zoneId: string): HoursDefinition {
  const cal = def['calendar'];
  const copy = { ...def };
  if (isRecord(cal) && 'definition' in cal && Object.isFrozen(cal)) copy['calendar'] = cal['definition'];
  if (typeof copy['zone'] !== 'string') copy['zone'] = zoneId;
  return deepFreeze(JSON.parse(JSON.stringify(copy)) as HoursDefinition);
}

/**
 * Validates a definition of opening hours and compiles it. Every fault is reported at once in a DefinitionError
 * whose `issues` name the path of each (`week.monday[1]: overlaps week.monday[0] (09:00-13:00)`); the bad inputs
 * it names are overlapping intervals on one day, intervals of zero length, cut-offs outside every session (unless
 * `allowCutoffsOutsideSessions`), special days outside the hours' years, holidays the calendar does not have,
 * unknown fields (with suggestions), and an unknown zone or calendar.
 *
 * @example
 * ```ts
 * const desk = defineHours({
 *   zone: 'America/New_York',
 *   calendar: 'us-federal',
 *   week: { monday: [{ open: '09:00', close: '17:00' }], tuesday: [{ open: '09:00', close: '17:00' }] },
 *   special: [{ holiday: 'Independence Day', offset: -1, close: '13:00', cutoffs: { payments: '12:00' } }],
 *   cutoffs: { payments: '17:00' },
 * });
 * desk.cutoffNames; // ['payments']
 * ```
 */
export function defineHours(definition: HoursDefinition): BusinessHours {
  const issues = new Issues();
  const norm = normalizeHours(definition, issues);
  issues.throwIfAny(definition);
  const def = definition as unknown as Record<string, unknown>;
  const frozen = plainCopy(def, norm!.zone.id);
  const engine = new HoursEngine(norm!);
  const hours: Internal = {
    id: typeof def['id'] === 'string' ? def['id'] : 'custom',
    name: frozen.name,
    source: frozen.source,
    caution: frozen.caution,
    zoneId: norm!.zone.id,
    calendarId: norm!.calendar?.id,
    firstYear: norm!.firstYear,
    lastYear: norm!.lastYear,
    cutoffNames: Object.freeze([...norm!.cutoffNames]),
    disambiguation: norm!.disambiguation,
    definition: frozen,
    [ENGINE]: engine,
  };
  return Object.freeze(hours);
}

/** @internal The engine of compiled hours; anything else is a KalendsTypeError that says how to compile. */
export function engineOfHours(hours: unknown, name = 'hours'): HoursEngine {
  const engine = typeof hours === 'object' && hours !== null ? (hours as Partial<Internal>)[ENGINE] : undefined;
  if (!engine) {
    const hint = isRecord(hours) && 'week' in hours ? '; compile the definition first with defineHours(definition)' : '';
    throw new KalendsTypeError(`${name}: expected opening hours from defineHours(definition), got ${describeValue(hours)}${hint}`, {
      code: 'invalid-type',
      received: hours,
    });
  }
  return engine;
}
