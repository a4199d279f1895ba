/**
 * Commands of the recurrence layer: list the dates (or instants) of a rule between bounds, and explain a rule
 * in plain words. A rule is given as JSON (a rule definition), as RFC 5545 text (DTSTART and RRULE lines, or a
 * bare `FREQ=...` with --start), or as a file holding either. Uses only the public API and the CLI kit.
 *
 * @module
 */
import {
  type Rule,
  type RuleDefinition,
  adjustmentOfOccurrence,
  defineRule,
  describeRule,
  formatCalendar,
  formatInstant,
  formatPlainDate,
  formatRecurrenceRule,
  iterateOccurrenceDayNumbers,
  iterateOccurrenceEpochMs,
  parseRecurrenceRule,
  ruleOfProfile,
  toDayNumber,
  toEpochMs,
} from '../../index.js';
import {
  type CliIo,
  type Command,
  type OptionSpec,
  type ParsedArgs,
  InputError,
  JSON_OPTION,
  Output,
  RowWriter,
  UsageError,
  optionFlag,
  optionInteger,
  optionString,
  parseDefinitionJson,
  readDefinitionSource,
  shellMessage,
  weekdayTitle,
} from '../kit.js';
import { profileOfArgs, ruleFromProfileOption } from '../profile.js';

const RULE_TEXT = `<rule> is a JSON rule definition ('{"kind":"monthly","on":{"day":15}}'), RFC 5545 text
('DTSTART;VALUE=DATE:20250101\\nRRULE:FREQ=WEEKLY;BYDAY=FR', or a bare 'FREQ=...' with --start),
the path of a file holding either, or "-" for standard input. See docs/schedules.md for every rule kind.`;

/** The most occurrences one schedule lists (also the most --count takes). */
const MAX_OCCURRENCES = 10_000_000;

const isRfc5545 = (text: string) => /FREQ=/i.test(text);

/** The rule named by the first positional argument: JSON, RFC 5545 text, a file holding either, or "-". */
async function ruleArgument(args: ParsedArgs, io: CliIo): Promise<Rule> {
  const fromProfile = ruleFromProfileOption(args);
  if (fromProfile) return fromProfile;
  const given = args.positionals[0];
  if (given === undefined) throw new UsageError('a rule is required: JSON, RFC 5545 text, a file holding either, or "-" (see --help)');
  if (args.positionals.length > 1) throw new UsageError(`expected one rule argument, got ${args.positionals.length}; quote the rule`);
  const source = await readDefinitionSource(given, '<rule>', io, { text: { test: isRfc5545, name: 'RFC 5545 text (with FREQ=)' } });
  if ('name' in source) throw new UsageError('<rule>: expected a rule'); // no rule has a name
  const text = source.text.trim();
  if (text.startsWith('{')) return defineRule(parseDefinitionJson({ text, origin: source.origin }, '<rule>') as RuleDefinition);
  if (isRfc5545(text)) {
    const start = optionString(args, 'start');
    const zone = optionString(args, 'zone');
    try {
      return parseRecurrenceRule(text.replace(/\\n/g, '\n'), { ...(start !== undefined ? { start } : {}), ...(zone !== undefined ? { zone } : {}) });
    } catch (e) {
      // The library names its options; the shell user gave --start and --zone.
      throw new InputError(shellMessage(e, { 'options.start': '--start', 'options.zone': '--zone' }));
    }
  }
  throw new UsageError(`<rule>: ${source.origin} is neither a JSON rule definition (starting with "{") nor RFC 5545 text (with FREQ=)`);
}

const START_OPTION: OptionSpec = { name: 'start', value: '<date>', text: "DTSTART for a bare 'FREQ=...' rule" };
const ZONE_OPTION: OptionSpec = { name: 'zone', value: '<zone>', text: 'zone for a floating RFC 5545 DTSTART (a local time without TZID)' };

/** A range bound read the way the rule's values are: dates for date rules, instants for the others. */
function bound(rule: Rule, option: string, text: string): number {
  try {
    return rule.values === 'dates' ? toDayNumber(text) : toEpochMs(text);
  } catch (e) {
    throw new UsageError(`--${option}: ${shellMessage(e)}`);
  }
}

const scheduleCommand: Command = {
  name: 'schedule',
  summary: 'List the dates or instants of a frequency rule (JSON or RFC 5545) between bounds',
  usage: ['<rule> --from <when> (--to <when> [--end-inclusive] | --count <n>) [--json]'],
  description: `Lists the occurrences of a rule in [--from, --to), or the first --count of them from --from, as a stream.
Date rules print dates (YYYY-MM-DD) with their weekday; rules with a time of day print instants (RFC 3339,
UTC). A rule with a business-day convention also prints, for every date, the rule's date(s) that moved onto it
(unadjusted) and why they moved (why): each weekend day by name and each holiday by name, in the order passed.

${RULE_TEXT}`,
  options: [
    { name: 'from', value: '<when>', text: 'first date (YYYY-MM-DD) or instant (RFC 3339) to consider, inclusive. Required.' },
    { name: 'to', value: '<when>', text: 'end of the range, exclusive (add --end-inclusive to include it)' },
    { name: 'end-inclusive', text: 'include an occurrence that falls exactly on --to' },
    { name: 'count', value: '<n>', text: `instead of --to: the first n occurrences from --from (1 to ${MAX_OCCURRENCES})` },
    START_OPTION,
    ZONE_OPTION,
    JSON_OPTION,
  ],
  examples: [
    `kalends schedule '{"kind":"semi-monthly","days":[15,"last"]}' --from 2025-01-01 --to 2025-04-01`,
    `kalends schedule '{"kind":"monthly","on":{"businessDay":"last"},"calendar":"us-federal"}' --from 2025-01-01 --count 3`,
    `kalends schedule '{"kind":"monthly","on":{"day":15},"calendar":"us-federal","convention":"following"}' --from 2026-01-01 --count 3`,
    `kalends schedule 'DTSTART;TZID=America/New_York:19970902T090000\\nRRULE:FREQ=DAILY;COUNT=10' --from 1997-09-01T00:00Z --count 100`,
  ],
  async run(args, io) {
    const fromText = optionString(args, 'from');
    if (fromText === undefined) throw new UsageError('--from is required (a date YYYY-MM-DD or an RFC 3339 instant)');
    const toText = optionString(args, 'to');
    const count = optionInteger(args, 'count', 1, MAX_OCCURRENCES);
    if ((toText === undefined) === (count === undefined)) throw new UsageError('give exactly one of --to (end of the range) or --count (how many occurrences)');
    if (count !== undefined && optionFlag(args, 'end-inclusive')) throw new UsageError('--end-inclusive goes with --to, not with --count');
    const rule = await ruleArgument(args, io);
    const from = bound(rule, 'from', fromText);
    let end = Number.POSITIVE_INFINITY;
    if (toText !== undefined) {
      end = bound(rule, 'to', toText) + (optionFlag(args, 'end-inclusive') ? 1 : 0);
      if (end < from) throw new UsageError(`--to ${toText} is before --from ${fromText}`);
    }
    const dates = rule.values === 'dates';
    // A rule that moves its dates says, for every date, which date moved there and why.
    const convention = (rule.definition as { readonly convention?: unknown }).convention;
    const explains = dates && convention !== undefined && convention !== 'none';
    const out = new Output(io);
    const writer = new RowWriter(out, optionFlag(args, 'json'), dates ? (explains ? ['date', 'weekday', 'unadjusted', 'why'] : ['date', 'weekday']) : ['instant']);
    let n = 0;
    const iterate = dates ? iterateOccurrenceDayNumbers : iterateOccurrenceEpochMs;
    for (const v of iterate(rule, from, { limit: count ?? MAX_OCCURRENCES })) {
      if (v >= end) break;
      n++;
      if (explains) {
        const why = adjustmentOfOccurrence(rule, v);
        await writer.write({
          date: formatPlainDate(v),
          weekday: weekdayTitle(v),
          unadjusted: why.unadjustedDayNumbers.map(formatPlainDate).join(' '),
          why: why.reason === '' ? null : why.reason,
        });
      } else await writer.write(dates ? { date: formatPlainDate(v), weekday: weekdayTitle(v) } : { instant: formatInstant(v) });
    }
    await writer.end();
    if (count === undefined && n === MAX_OCCURRENCES) {
      io.stderr(`kalends schedule: stopped after ${MAX_OCCURRENCES} occurrences, the most one run lists; narrow --from and --to to go on\n`);
      return 1;
    }
    return 0;
  },
};

const explainCommand: Command = {
  name: 'explain-rule',
  summary: 'Explain a frequency rule (JSON or RFC 5545) in plain words',
  usage: ['<rule> [--start <date>] [--zone <zone>] [--json]'],
  description: `Prints the rule in plain words, and its RFC 5545 text when it has one. With --json, one JSON object: kind,
values, description, rfc5545 (or null).

${RULE_TEXT}`,
  options: [
    { name: 'start', value: '<date>', text: "DTSTART for a bare 'FREQ=...' rule, or where the RFC 5545 text of a rule without a start begins" },
    ZONE_OPTION,
    JSON_OPTION,
  ],
  examples: [`kalends explain-rule '{"kind":"weekly","weekdays":["friday"],"every":2,"anchor":"2025-01-03"}'`],
  async run(args, io) {
    const rule = await ruleArgument(args, io);
    const description = describeRule(rule);
    let rfc: string | null = null;
    try {
      const start = optionString(args, 'start');
      rfc = formatRecurrenceRule(rule, start !== undefined ? { start } : undefined);
    } catch {
      rfc = null;
    }
    const out = new Output(io);
    if (optionFlag(args, 'json')) {
      await out.write(`${JSON.stringify({ kind: rule.kind, values: rule.values, description, rfc5545: rfc })}\n`);
    } else {
      await out.write(`${description}\n${rfc === null ? '(no RFC 5545 form)' : `RFC 5545:\n${rfc}`}\n`);
    }
    await out.flush();
    return 0;
  },
};

/** An instant from a date (its midnight UTC) or an RFC 3339 instant. */
function instantOption(args: ParsedArgs, name: string): number {
  const text = optionString(args, name);
  if (text === undefined) throw new UsageError(`--${name} is required: a date YYYY-MM-DD or an RFC 3339 instant`);
  try {
    return toEpochMs(/^[+-]?\d{4,6}-\d{2}-\d{2}$/.test(text) ? `${text}T00:00:00Z` : text);
  } catch (e) {
    throw new UsageError(`--${name}: ${shellMessage(e)}`);
  }
}

const calendarFileCommand: Command = {
  name: 'calendar-file',
  summary: 'Write rules as an iCalendar (.ics) file to subscribe to (RFC 5545)',
  usage: ['<rule>... --from <when> --to <when> [--occurrences] [--title <text>] [--domain <name>] [--stamp <instant>] [--json]'],
  description: `Writes an RFC 5545 VCALENDAR to standard output (redirect it to a .ics file): one event per rule, carrying
its RRULE, or with --occurrences one event per occurrence in [--from, --to). Rules with a time of day get a
VTIMEZONE for their zone covering [--from, --to). Rules on business days (a profile's close, a payroll) have no
RFC 5545 form: give --occurrences. With --profile, each <rule> may be the name of one of the profile's rules;
otherwise give one rule. With --json, one JSON object { calendar } holding the file's text.

${RULE_TEXT}`,
  options: [
    { name: 'from', value: '<when>', text: 'start of the span the file covers: a date (midnight UTC) or an RFC 3339 instant. Required.' },
    { name: 'to', value: '<when>', text: 'end of the span, exclusive. Required.' },
    { name: 'occurrences', text: 'one event per occurrence in the span instead of one event per rule' },
    { name: 'title', value: '<text>', text: "the events' title (SUMMARY) for a single rule; default: the rule's label or name" },
    { name: 'domain', value: '<name>', text: 'domain that makes the event ids (UID) unique, e.g. your company domain (default calendar.invalid)' },
    { name: 'stamp', value: '<instant>', text: 'when the file was made (DTSTAMP), RFC 3339; default: now' },
    START_OPTION,
    ZONE_OPTION,
    JSON_OPTION,
  ],
  examples: [
    'kalends calendar-file month-end-close --profile examples/otterbrook.profile.json --from 2026-01-01 --to 2027-01-01 --occurrences > close.ics',
    `kalends calendar-file 'DTSTART;TZID=America/New_York:20260105T090000\\nRRULE:FREQ=WEEKLY;BYDAY=MO;BYHOUR=9,15' --from 2026-01-01 --to 2027-01-01 --title 'Stand-up'`,
  ],
  async run(args, io) {
    const from = instantOption(args, 'from');
    const to = instantOption(args, 'to');
    if (to <= from) throw new UsageError(`--to ${optionString(args, 'to')} is not after --from ${optionString(args, 'from')}`);
    const stampText = optionString(args, 'stamp');
    const stamp = stampText === undefined ? Date.now() : instantOption(args, 'stamp');
    const domain = optionString(args, 'domain') ?? 'calendar.invalid';
    const title = optionString(args, 'title');
    const profile = profileOfArgs(args);
    const named = profile !== undefined && args.positionals.length > 0 && args.positionals.every((n) => Object.prototype.hasOwnProperty.call(profile.rules, n));
    const rules: { rule: Rule; name: string }[] = named
      ? args.positionals.map((n) => ({ rule: ruleOfProfile(profile, n), name: n }))
      : [{ rule: await ruleArgument(args, io), name: 'rule' }];
    if (title !== undefined && rules.length > 1) throw new UsageError('--title names the events of a single rule; with several rules each takes its label or name');
    const events = rules.map(({ rule, name }) => {
      const label = (rule.definition as { label?: unknown }).label;
      return { rule, summary: title ?? (typeof label === 'string' && label !== '' ? label : name), uid: `${name}@${domain}` };
    });
    let text: string;
    try {
      text = formatCalendar(events, { stamp, from, to, form: optionFlag(args, 'occurrences') ? 'occurrences' : 'rule' });
    } catch (e) {
      throw new InputError(shellMessage(e, { 'options.form': '--occurrences' }));
    }
    const out = new Output(io);
    // With --json: one JSON object holding the file's text (for programs that pass it on).
    await out.write(optionFlag(args, 'json') ? `${JSON.stringify({ calendar: text })}\n` : text);
    await out.flush();
    return 0;
  },
};

/** Commands of this layer. */
export const commands: readonly Command[] = [scheduleCommand, explainCommand, calendarFileCommand];
