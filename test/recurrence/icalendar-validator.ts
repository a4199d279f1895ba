/**
 * A validator of iCalendar objects written from the ABNF of RFC 5545, kept in the tests as the outside check of
 * `formatCalendar`. It checks: content lines and folding (section 3.1: CRLF, at most 75 octets, a continuation
 * starts with one space or tab), the `contentline` grammar (name, param, value; section 3.1), the value types
 * used (3.3.4 DATE, 3.3.5 DATE-TIME, 3.3.10 RECUR parts, 3.3.11 TEXT escapes, 3.3.14 UTC-OFFSET), and the
 * components (3.4 VCALENDAR with PRODID and VERSION; 3.6.1 VEVENT with UID, DTSTAMP and DTSTART; 3.6.5 VTIMEZONE
 * with TZID and at least one STANDARD or DAYLIGHT, each with DTSTART, TZOFFSETFROM and TZOFFSETTO). Returns the
 * faults, each naming the section it breaks; an empty list means valid.
 */
const NAME = /^[A-Za-z0-9-]+$/; // iana-token / x-name (3.1)
const DATE = /^\d{4}(0[1-9]|1[0-2])(0[1-9]|[12]\d|3[01])$/; // 3.3.4
const TIME = /^([01]\d|2[0-3])[0-5]\d([0-5]\d|60)Z?$/; // 3.3.12
const UTC_OFFSET = /^[+-]([01]\d|2[0-3])[0-5]\d([0-5]\d)?$/; // 3.3.14

/** 3.3.11: text = *(TSAFE-CHAR / ":" / DQUOTE / ESCAPED-CHAR); ESCAPED-CHAR = "\\" / "\;" / "\," / "\N" / "\n". */
function textFault(v: string): string | undefined {
  for (let i = 0; i < v.length; i++) {
    const c = v[i]!;
    if (c === '\\') {
      if (!'\\;,Nn'.includes(v[i + 1] ?? '')) return 'a backslash must start \\\\, \\;, \\, or \\n';
      i++;
    } else if (c === ',' || c === ';') return '"," and ";" must be escaped';
  }
  return undefined;
}

function dateTimeOk(v: string): boolean {
  const [d, t, ...rest] = v.split('T');
  return rest.length === 0 && t !== undefined && DATE.test(d!) && TIME.test(t);
}

interface Prop {
  name: string;
  params: Map<string, string>;
  value: string;
}

function parseLine(line: string, faults: string[], n: number): Prop | undefined {
  // contentline = name *(";" param ) ":" value CRLF; param values may be quoted (3.1).
  let i = 0;
  const name = /^[A-Za-z0-9-]+/.exec(line)?.[0];
  if (!name) {
    faults.push(`line ${n}: 3.1 contentline: expected a name, got ${JSON.stringify(line.slice(0, 20))}`);
    return undefined;
  }
  i = name.length;
  const params = new Map<string, string>();
  while (line[i] === ';') {
    const m = /^;([A-Za-z0-9-]+)=("[^"\x00-\x08\x0a-\x1f\x7f]*"|[^";:,\x00-\x08\x0a-\x1f\x7f]*)/.exec(line.slice(i));
    if (!m) {
      faults.push(`line ${n}: 3.1 param: expected NAME=VALUE after ";"`);
      return undefined;
    }
    params.set(m[1]!.toUpperCase(), m[2]!.replace(/^"|"$/g, ''));
    i += m[0].length;
  }
  if (line[i] !== ':') {
    faults.push(`line ${n}: 3.1 contentline: expected ":" after the name and parameters`);
    return undefined;
  }
  const value = line.slice(i + 1);
  if (/[\x00-\x08\x0a-\x1f\x7f]/.test(value)) faults.push(`line ${n}: 3.1 value: a control character`);
  return { name: name.toUpperCase(), params, value };
}

function checkValue(p: Prop, faults: string[], n: number): void {
  const type = p.params.get('VALUE');
  switch (p.name) {
    case 'DTSTART':
    case 'DTSTAMP':
    case 'RDATE':
    case 'EXDATE':
      for (const v of p.value.split(',')) {
        const ok = type === 'DATE' ? DATE.test(v) : dateTimeOk(v);
        if (!ok) faults.push(`line ${n}: 3.3.${type === 'DATE' ? 4 : 5} ${p.name}: ${JSON.stringify(v)} is not a ${type === 'DATE' ? 'DATE' : 'DATE-TIME'}`);
        if (p.params.has('TZID') && v.endsWith('Z')) faults.push(`line ${n}: 3.3.5 ${p.name}: a UTC time must not have a TZID`);
      }
      if (p.name === 'DTSTAMP' && !p.value.endsWith('Z')) faults.push(`line ${n}: 3.8.7.2 DTSTAMP must be in UTC`);
      break;
    case 'TZOFFSETFROM':
    case 'TZOFFSETTO':
      if (!UTC_OFFSET.test(p.value) || /^-0000(00)?$/.test(p.value)) faults.push(`line ${n}: 3.3.14 ${p.name}: ${JSON.stringify(p.value)} is not a UTC-OFFSET`);
      break;
    case 'SUMMARY':
    case 'DESCRIPTION':
    case 'UID':
    case 'PRODID':
      {
        const f = textFault(p.value);
        if (f) faults.push(`line ${n}: 3.3.11 TEXT: ${f}`);
      }
      break;
    case 'RRULE': {
      const parts = p.value.split(';');
      const names = parts.map((x) => x.split('=')[0]);
      if (!parts.every((x) => /^[A-Z]+=[A-Za-z0-9,+-]+$/.test(x))) faults.push(`line ${n}: 3.3.10 RECUR: expected NAME=VALUE parts`);
      if (!/^(SECONDLY|MINUTELY|HOURLY|DAILY|WEEKLY|MONTHLY|YEARLY)$/.test(parts.find((x) => x.startsWith('FREQ='))?.slice(5) ?? '')) faults.push(`line ${n}: 3.3.10 RECUR: FREQ is required`);
      if (names.includes('COUNT') && names.includes('UNTIL')) faults.push(`line ${n}: 3.3.10 RECUR: COUNT and UNTIL together`);
      if (new Set(names).size !== names.length) faults.push(`line ${n}: 3.3.10 RECUR: a part occurs twice`);
      break;
    }
    default:
  }
}

const REQUIRED: Record<string, string[]> = {
  VCALENDAR: ['PRODID', 'VERSION'], // 3.6
  VEVENT: ['UID', 'DTSTAMP', 'DTSTART'], // 3.6.1 (DTSTART: required when there is no METHOD)
  VTIMEZONE: ['TZID'], // 3.6.5
  STANDARD: ['DTSTART', 'TZOFFSETFROM', 'TZOFFSETTO'], // 3.6.5
  DAYLIGHT: ['DTSTART', 'TZOFFSETFROM', 'TZOFFSETTO'],
};
const PARENTS: Record<string, string | undefined> = { VCALENDAR: undefined, VEVENT: 'VCALENDAR', VTIMEZONE: 'VCALENDAR', STANDARD: 'VTIMEZONE', DAYLIGHT: 'VTIMEZONE' };

/** The faults of an iCalendar object; [] when it is valid by the rules above. */
export function validateCalendar(text: string): string[] {
  const faults: string[] = [];
  if (!text.endsWith('\r\n')) faults.push('3.1: the last content line must end in CRLF');
  if (/(^|[^\r])\n/.test(text) || /\r(?!\n)/.test(text)) faults.push('3.1: lines must be delimited by CRLF');
  const physical = text.replace(/\r\n$/, '').split('\r\n');
  const lines: string[] = [];
  physical.forEach((l, i) => {
    if (new TextEncoder().encode(l).length > 75) faults.push(`line ${i + 1}: 3.1: longer than 75 octets`);
    if (l.startsWith(' ') || l.startsWith('\t')) {
      if (lines.length === 0) faults.push(`line ${i + 1}: 3.1: a continuation line with nothing to continue`);
      else lines[lines.length - 1] += l.slice(1);
    } else lines.push(l);
  });
  const stack: { name: string; props: Set<string>; children: string[] }[] = [];
  let seenCalendar = false;
  lines.forEach((line, i) => {
    const n = i + 1;
    const p = parseLine(line, faults, n);
    if (!p) return;
    if (!NAME.test(p.name)) faults.push(`line ${n}: 3.1 name`);
    if (p.name === 'BEGIN') {
      const comp = p.value.toUpperCase();
      if (!(comp in PARENTS)) faults.push(`line ${n}: 3.6: unknown component ${comp}`);
      else if (PARENTS[comp] !== stack[stack.length - 1]?.name) faults.push(`line ${n}: 3.6: ${comp} must be inside ${PARENTS[comp] ?? 'nothing'}`);
      if (comp === 'VCALENDAR') {
        if (seenCalendar || stack.length > 0) faults.push(`line ${n}: 3.4: a second VCALENDAR`);
        seenCalendar = true;
      }
      stack[stack.length - 1]?.children.push(comp);
      stack.push({ name: comp, props: new Set(), children: [] });
      return;
    }
    if (p.name === 'END') {
      const top = stack.pop();
      if (!top || top.name !== p.value.toUpperCase()) {
        faults.push(`line ${n}: 3.6: END:${p.value} does not close ${top?.name ?? 'anything'}`);
        return;
      }
      for (const r of REQUIRED[top.name] ?? []) if (!top.props.has(r)) faults.push(`line ${n}: 3.6: ${top.name} lacks ${r}`);
      if (top.name === 'VTIMEZONE' && !top.children.some((c) => c === 'STANDARD' || c === 'DAYLIGHT')) faults.push(`line ${n}: 3.6.5: VTIMEZONE needs a STANDARD or DAYLIGHT part`);
      if (top.name === 'VCALENDAR' && top.children.length === 0) faults.push(`line ${n}: 3.6: VCALENDAR needs a component`);
      return;
    }
    const top = stack[stack.length - 1];
    if (!top) {
      faults.push(`line ${n}: 3.4: a property outside VCALENDAR`);
      return;
    }
    if (top.props.has(p.name) && ['UID', 'DTSTAMP', 'DTSTART', 'PRODID', 'VERSION', 'TZID', 'TZOFFSETFROM', 'TZOFFSETTO', 'SUMMARY'].includes(p.name)) {
      faults.push(`line ${n}: 3.6: ${p.name} must not occur more than once in ${top.name}`);
    }
    top.props.add(p.name);
    if (p.name === 'VERSION' && p.value !== '2.0') faults.push(`line ${n}: 3.7.4 VERSION must be 2.0`);
    checkValue(p, faults, n);
  });
  if (stack.length > 0) faults.push(`3.6: ${stack.map((s) => s.name).join(', ')} not closed`);
  if (!seenCalendar) faults.push('3.4: no VCALENDAR');
  return faults;
}
