/**
 * `--profile <file>`, taken by every command: the file is read and validated once (a faulty profile stops the
 * command with every fault at its path), then the profile fills in what the command was not told:
 *
 * - `--zone` defaults to the profile's zone;
 * - `--unit <name>` (period, bucket) and fiscal-layout's definition may name a unit or fiscal year of the profile;
 * - `--calendar <name>` (holidays and the business-day commands) may name a profile calendar, and defaults to the
 *   profile's default calendar;
 * - schedule and explain-rule take a rule's name as the rule.
 *
 * Commands see ordinary arguments (a unit or fiscal year becomes its JSON definition); only the calendar and rule
 * lookups ask this module, through {@link profileOfArgs}.
 *
 * @module
 */
import {
  type BusinessCalendar,
  type Profile,
  type Rule,
  calendarOfProfile,
  defineProfile,
  ruleOfProfile,
} from '../index.js';
import { type CliIo, type Command, type ParsedArgs, UsageError, readDefinition } from './kit.js';

const profiles = new WeakMap<ParsedArgs, Profile>();

/** The profile given with `--profile`, or undefined. */
export function profileOfArgs(args: ParsedArgs): Profile | undefined {
  return profiles.get(args);
}

function has(table: object, key: string): boolean {
  return Object.prototype.hasOwnProperty.call(table, key);
}

/**
 * Loads `--profile` (when given) and returns the arguments with the profile's defaults and names filled in. Called
 * once by `runCli` for every command.
 */
export async function applyProfileOption(args: ParsedArgs, command: Command, io: CliIo): Promise<ParsedArgs> {
  const path = args.options.get('profile');
  if (path === undefined) return args;
  if (path === true) throw new UsageError('option --profile needs a value: the path of a profile JSON file (see docs/profiles.md)');
  const profile = defineProfile((await readDefinition(path, '--profile', io, [])) as never);
  const options = new Map(args.options);
  const positionals = [...args.positionals];
  const takes = (name: string) => command.options.some((o) => o.name === name);
  if (takes('zone') && !options.has('zone')) options.set('zone', profile.zone.id);
  const unit = options.get('unit');
  if (typeof unit === 'string') {
    const fiscalYears = profile.definition.fiscalYears ?? {};
    if (command.name === 'fiscal-layout' && (has(fiscalYears, unit) || has(profile.unitFiscalYears, unit))) {
      // fiscal-layout lays out a fiscal year: a fiscal year of the profile, or the fiscal year of one of its units.
      const fy = has(fiscalYears, unit) ? unit : profile.unitFiscalYears[unit]!;
      options.set('unit', JSON.stringify({ kind: 'fiscal-year', ...fiscalYears[fy] }));
    } else if (has(profile.units, unit) || unit === 'week') {
      options.set('unit', JSON.stringify((unit === 'week' ? profile.week : profile.units[unit]!).definition));
    }
  }
  const parsed: ParsedArgs = { positionals, options };
  profiles.set(parsed, profile);
  return parsed;
}

/**
 * The calendar of a business command from the profile: `--calendar` naming a profile calendar, or, without
 * `--calendar`, the profile's default calendar. Undefined when there is no profile or the name is not one of its.
 */
export function calendarFromProfileOption(args: ParsedArgs): BusinessCalendar | undefined {
  const profile = profileOfArgs(args);
  if (!profile) return undefined;
  const name = args.options.get('calendar');
  if (typeof name === 'string') return has(profile.calendars, name) ? profile.calendars[name] : undefined;
  return calendarOfProfile(profile);
}

/** The rule named by the first positional argument in the profile, or undefined. */
export function ruleFromProfileOption(args: ParsedArgs): Rule | undefined {
  const profile = profileOfArgs(args);
  const name = args.positionals[0];
  if (!profile || name === undefined || !has(profile.rules, name)) return undefined;
  return ruleOfProfile(profile, name);
}
