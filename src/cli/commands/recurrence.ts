/**
 * Commands of the recurrence layer: list the dates (or instants) of a rule between bounds, and explain a rule
 * in plain words. A rule is given as JSON (a rule definition), as RFC 5545 text (DTSTART and RRULE lines, or a
 * bare `FREQ=...` with --start), or as a file holding either. Uses only the public API and the CLI kit.
 *
 * @module
 */
import { existsSync, readFileSync } from 'node:fs';
import {
  type Rule,
  type RuleDefinition,
  defineRule,
  describeRule,
  formatInstant,
  formatPlainDate,
  formatRecurrenceRule,
  iterateOccurrences,
  listOccurrences,
  parseRecurrenceRule,
  weekdayOfDayNumber,
} from '../../index.js';
import { type CliIo, type Command, type ParsedArgs, RowWriter, UsageError, optionFlag, optionString, rejectUnknownOptions } from '../kit.js';
import { ruleFromProfileOption } from '../profile.js';

const WEEKDAYS = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'] as const;

const RULE_HELP = `  <rule>               The rule: a JSON rule definition ('{"kind":"monthly","on":{"day":15}}'),
                       RFC 5545 text ('DTSTART;VALUE=DATE:20250101\\nRRULE:FREQ=WEEKLY;BYDAY=FR',
                       or a bare 'FREQ=...' with --start), or a file holding either. "-" reads stdin.
                       See docs/schedules.md for every rule kind.`;

async function readAll(io: CliIo): Promise<string> {
  if (!io.stdin) throw new UsageError('<rule> is "-" but there is no standard input');
  const decoder = new TextDecoder();
  let text = '';
  for await (const chunk of io.stdin) text += typeof chunk === 'string' ? chunk : decoder.decode(chunk, { stream: true });
  return text + decoder.decode();
}

/** The rule named by the first positional argument. */
async function ruleArgument(args: ParsedArgs, io: CliIo): Promise<Rule> {
  const fromProfile = ruleFromProfileOption(args);
  if (fromProfile) return fromProfile;
  const given = args.positionals[0];
  if (given === undefined) throw new UsageError('a rule is required: JSON, RFC 5545 text, or a file holding either (see --help)');
  if (args.positionals.length > 1) throw new UsageError(`expected one rule argument, got ${args.positionals.length}; quote the rule`);
  let text = given;
  if (given === '-') text = await readAll(io);
  else if (!given.trimStart().startsWith('{') && !/FREQ=/i.test(given) && existsSync(given)) text = readFileSync(given, 'utf8');
  text = text.trim();
  if (text.startsWith('{')) {
    let def: unknown;
    try {
      def = JSON.parse(text);
    } catch (e) {
      throw new UsageError(`the rule is not valid JSON: ${e instanceof Error ? e.message : String(e)}`);
    }
    return defineRule(def as RuleDefinition);
  }
  if (/FREQ=/i.test(text)) {
    const start = optionString(args, 'start');
    const zone = optionString(args, 'zone');
    return parseRecurrenceRule(text.replace(/\\n/g, '\n'), { ...(start !== undefined ? { start } : {}), ...(zone !== undefined ? { zone } : {}) });
  }
  throw new UsageError(`expected a JSON rule definition, RFC 5545 text (with FREQ=) or a file, got ${JSON.stringify(given)}`);
}

function countOption(args: ParsedArgs): number | undefined {
  const v = optionString(args, 'count');
  if (v === undefined) return undefined;
  if (!/^\d+$/.test(v) || Number(v) < 1 || Number(v) > 10_000_000) throw new UsageError(`--count: expected a whole number from 1 to 10000000, got ${JSON.stringify(v)}`);
  return Number(v);
}

const scheduleCommand: Command = {
  name: 'schedule',
  summary: 'List the dates or instants of a frequency rule (JSON or RFC 5545) between bounds',
  valueOptions: ['from', 'to', 'count', 'start', 'zone'],
  help: `Usage: kalends schedule <rule> --from <when> (--to <when> | --count <n>) [--end-inclusive] [--json]

Lists the occurrences of a rule in [--from, --to), or the first --count of them from --from.
Date rules print dates (YYYY-MM-DD) with their weekday; rules with a time of day print instants (RFC 3339, UTC).

${RULE_HELP}
  --from <when>        First date (YYYY-MM-DD) or instant (RFC 3339) to consider, inclusive. Required.
  --to <when>          End of the range, exclusive (add --end-inclusive to include it).
  --count <n>          Instead of --to: the first n occurrences from --from.
  --start <date>       DTSTART for a bare 'FREQ=...' rule.
  --zone <id>          Zone for a floating RFC 5545 DTSTART (a local time without TZID).
  --json               One JSON object per line.

Examples:
  kalends schedule '{"kind":"semi-monthly","days":[15,"last"]}' --from 2025-01-01 --to 2025-04-01
  kalends schedule '{"kind":"monthly","on":{"businessDay":"last"},"calendar":"us-federal"}' --from 2025-01-01 --count 3
  kalends schedule 'DTSTART;TZID=America/New_York:19970902T090000\\nRRULE:FREQ=DAILY;COUNT=10' --from 1997-09-01T00:00Z --count 100
`,
  async run(args, io) {
    rejectUnknownOptions(args, ['from', 'to', 'count', 'start', 'zone', 'end-inclusive']);
    const rule = await ruleArgument(args, io);
    const from = optionString(args, 'from');
    if (from === undefined) throw new UsageError('--from is required (a date YYYY-MM-DD or an RFC 3339 instant)');
    const to = optionString(args, 'to');
    const count = countOption(args);
    if ((to === undefined) === (count === undefined)) throw new UsageError('give exactly one of --to (end of the range) or --count (how many occurrences)');
    const values =
      to !== undefined
        ? listOccurrences(rule, from, to, { endInclusive: optionFlag(args, 'end-inclusive') })
        : [...iterateOccurrences(rule, from, { limit: count! })];
    const dates = rule.values === 'dates';
    const out = new RowWriter(io, optionFlag(args, 'json'), dates ? ['date', 'weekday'] : ['instant']);
    for (const v of values) out.write(dates ? { date: formatPlainDate(v), weekday: WEEKDAYS[weekdayOfDayNumber(v) - 1]! } : { instant: formatInstant(v) });
    out.end();
    return 0;
  },
};

const explainCommand: Command = {
  name: 'explain-rule',
  summary: 'Explain a frequency rule (JSON or RFC 5545) in plain words',
  valueOptions: ['start', 'zone'],
  help: `Usage: kalends explain-rule <rule> [--start <date>] [--json]

Prints the rule in plain words, and its RFC 5545 text when it has one.

${RULE_HELP}
  --start <date>       DTSTART for a bare 'FREQ=...' rule, or where the RFC 5545 text of a rule without a start begins.
  --zone <id>          Zone for a floating RFC 5545 DTSTART.
  --json               One JSON object: kind, values, description, rfc5545 (or null).

Example:
  kalends explain-rule '{"kind":"weekly","weekdays":["friday"],"every":2,"anchor":"2025-01-03"}'
`,
  async run(args, io) {
    rejectUnknownOptions(args, ['start', 'zone']);
    const rule = await ruleArgument(args, io);
    const description = describeRule(rule);
    let rfc: string | null = null;
    try {
      const start = optionString(args, 'start');
      rfc = formatRecurrenceRule(rule, start !== undefined ? { start } : undefined);
    } catch {
      rfc = null;
    }
    if (optionFlag(args, 'json')) {
      io.stdout(`${JSON.stringify({ kind: rule.kind, values: rule.values, description, rfc5545: rfc })}\n`);
    } else {
      io.stdout(`${description}\n`);
      io.stdout(rfc === null ? '(no RFC 5545 form)\n' : `RFC 5545:\n${rfc}\n`);
    }
    return 0;
  },
};

/** Commands of this layer. */
export const commands: readonly Command[] = [scheduleCommand, explainCommand];
