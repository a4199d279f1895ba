/**
 * Issue 13: every public function name fits the verb grammar of docs/design.md ("Verb grammar"). The forms are read
 * from that section's table itself, so the test and the page cannot disagree: `define…` is a prefix verb,
 * `…Bulk` the bulk suffix, `<out>From<in>` a conversion, `<noun>Of<Subject>` the query form, and
 * `temporal…From…` the conversion out to Temporal. A name that fits no form must be listed in EXCEPTIONS with its
 * reason; an exception that fits a form, or names no export, fails too (the list stays exact).
 *
 * The page's "Appendix: every export by verb" is generated here from the exports: the test fails when it differs,
 * and `KALENDS_WRITE_APPENDIX=1 npx vitest run test/docs/grammar.test.ts` rewrites it (keeping the page's final
 * link line last).
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import * as kalends from '../../src/index.js';
import * as tzdata from '../../src/tzdata/index.js';
import * as warehouse from '../../src/warehouse/files.js';
import { ROOT } from './markdown.js';

const MODULES: readonly (readonly [string, Readonly<Record<string, unknown>>])[] = [
  ['kalends', kalends],
  ['kalends/tzdata', tzdata],
  ['kalends/warehouse', warehouse],
];

/** Names that fit no form of the table, each with its reason. */
const EXCEPTIONS: Readonly<Record<string, string>> = {
  firstDayNumberAfterPeriod: 'the exclusive end of a period: the query form with "After" in place of "Of", so the end is unmistakable in the name (section "Verb grammar", period end names)',
  firstEpochMsAfterPeriod: 'the exclusive end of a period in instants, as firstDayNumberAfterPeriod',
  occurrenceDayNumberBulk: 'the bulk form of listOccurrenceDayNumbers; by the table it would be listOccurrenceDayNumbersBulk (a rename left to the recurrence work)',
  occurrenceEpochMsBulk: 'the bulk form of listOccurrenceEpochMs; by the table it would be listOccurrenceEpochMsBulk (a rename left to the recurrence work)',
  pinnedZoneIds: 'the pinned data\'s lookups, named after the data they return, as the rules source of zoneFromId reads them',
  pinnedZoneRules: 'as pinnedZoneIds',
  writeFilesAtomically: 'Node.js only: writes files, a side effect no pure function of the table has',
  writeWarehouseExport: 'Node.js only: writes files, as writeFilesAtomically',
};

const DESIGN = join(ROOT, 'docs/design.md');
const APPENDIX_TITLE = '## Appendix: every export by verb';

interface Form {
  /** The row's first cell as the page writes it. */
  readonly row: string;
  readonly fits: (name: string) => boolean;
  readonly bulk?: boolean;
}

/** The forms of the "Verb grammar" table, in its order. */
function formsOfDesign(page: string): Form[] {
  const section = page.slice(page.indexOf('## Verb grammar'), page.indexOf('\n## ', page.indexOf('## Verb grammar') + 1));
  const rows = section.split('\n').filter((l) => l.startsWith('| ') && !l.startsWith('| verb') && !l.startsWith('| ---'));
  const forms: Form[] = [];
  for (const line of rows) {
    const cells = line.split(' | ').map((c) => c.replace(/^\| |\s\|$/g, '').trim());
    const row = cells[0]!;
    // The series verbs are listed in the meaning cell.
    const tokens = [...(row === 'series verbs' ? cells[1]! : row).matchAll(/`([^`]+)`/g)].map((m) => m[1]!);
    const tests: ((name: string) => boolean)[] = [];
    let bulk = false;
    for (const t of tokens) {
      if (t === '…Bulk') bulk = true;
      else if (t === '<out>From<in>') tests.push((n) => /^[a-z][A-Za-z0-9]*From[A-Z][A-Za-z0-9]*$/.test(n));
      else if (t === '<noun>Of<Subject>') tests.push((n) => /^[a-z][A-Za-z0-9]*Of[A-Z][A-Za-z0-9]*$/.test(n));
      else if (t === 'temporal…From…') tests.push((n) => /^temporal[A-Z][A-Za-z0-9]*From[A-Z][A-Za-z0-9]*$/.test(n));
      else if (/^[a-z]+…$/.test(t)) {
        const verb = t.slice(0, -1);
        tests.push((n) => n === verb || new RegExp(`^${verb}[A-Z0-9]`).test(n));
      } else throw new Error(`docs/design.md, "Verb grammar": a form this test does not know: \`${t}\` (teach formsOfDesign)`);
    }
    forms.push({ row, fits: (n) => tests.some((f) => f(n)), bulk });
  }
  return forms;
}

/** The row of the table a name fits (a …Bulk name fits the bulk row when its base fits another), or undefined. */
function rowOf(forms: readonly Form[], name: string): string | undefined {
  const bulk = forms.find((f) => f.bulk);
  if (bulk && name.endsWith('Bulk')) {
    const base = name.slice(0, -'Bulk'.length);
    return forms.some((f) => !f.bulk && fitsFirst(forms, f, base)) ? bulk.row : undefined;
  }
  return forms.find((f) => !f.bulk && fitsFirst(forms, f, name))?.row;
}

/** Prefix verbs and `temporal…From…` come before the general `<out>From<in>` and `<noun>Of<Subject>` forms. */
function fitsFirst(forms: readonly Form[], f: Form, name: string): boolean {
  if (!f.fits(name)) return false;
  const general = (r: string) => r === '`<out>From<in>`' || r === '`<noun>Of<Subject>`';
  if (!general(f.row)) return true;
  return !forms.some((g) => !g.bulk && !general(g.row) && g.fits(name));
}

/** Every public function (classes are not verbs), with the subpath for those outside `kalends`. */
function publicFunctions(): { readonly name: string; readonly module: string }[] {
  const list: { name: string; module: string }[] = [];
  for (const [module, exports] of MODULES) {
    for (const [name, value] of Object.entries(exports)) if (typeof value === 'function' && /^[a-z]/.test(name)) list.push({ name, module });
  }
  return list.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
}

function appendix(forms: readonly Form[]): string {
  const fns = publicFunctions();
  const show = (f: { name: string; module: string }) => (f.module === 'kalends' ? `\`${f.name}\`` : `\`${f.name}\` (${f.module})`);
  const lines = [
    APPENDIX_TITLE,
    '',
    'Generated from the exports by `test/docs/grammar.test.ts`, which fails when this list differs from them (rewrite it',
    'with `KALENDS_WRITE_APPENDIX=1 npx vitest run test/docs/grammar.test.ts`). Each public function, by the row of the',
    `"Verb grammar" table its name fits; ${fns.length} functions in all.`,
    '',
    '| verb | exports |',
    '| --- | --- |',
  ];
  for (const f of forms) {
    const names = fns.filter((x) => rowOf(forms, x.name) === f.row);
    if (names.length > 0) lines.push(`| ${f.row} | ${names.map(show).join(', ')} |`);
  }
  lines.push('', 'Exceptions, each with its reason:', '');
  for (const x of fns.filter((x) => rowOf(forms, x.name) === undefined)) lines.push(`- ${show(x)}: ${EXCEPTIONS[x.name] ?? '(no reason given)'}.`);
  return `${lines.join('\n')}\n`;
}

/** The page with its appendix replaced by `text` (or added before the final link line). */
function withAppendix(page: string, text: string): string {
  const lines = page.trimEnd().split('\n');
  const last = lines.pop()!;
  let body = lines.join('\n').trimEnd();
  const at = body.indexOf(APPENDIX_TITLE);
  if (at >= 0) body = body.slice(0, at).trimEnd();
  return `${body}\n\n${text}\n${last}\n`;
}

describe('the verb grammar (docs/design.md, "Verb grammar"; issue 13)', () => {
  const page = readFileSync(DESIGN, 'utf8');
  const forms = formsOfDesign(page);

  it('reads the forms from the page: a construct verb, the query form, conversions, the bulk suffix and the series verbs', () => {
    const rows = forms.map((f) => f.row);
    for (const r of ['`define…`', '`<out>From<in>`', '`…Bulk`', '`<noun>Of<Subject>`', 'series verbs']) expect(rows).toContain(r);
    expect(forms.find((f) => f.row === '`define…`')!.fits('defineRule')).toBe(true);
    expect(forms.find((f) => f.row === '`define…`')!.fits('defined')).toBe(false);
    expect(forms.find((f) => f.row === 'series verbs')!.fits('bucketSeries')).toBe(true);
  });

  it('every public function fits a row of the table, or is an exception with its reason', () => {
    const misfits = publicFunctions().filter((f) => rowOf(forms, f.name) === undefined && !Object.prototype.hasOwnProperty.call(EXCEPTIONS, f.name));
    expect(misfits.map((f) => `${f.module} exports ${f.name}, which fits no row of the "Verb grammar" table in docs/design.md: rename it, or list it in EXCEPTIONS with a reason`)).toEqual([]);
  });

  it('the exceptions are exact: each names an export that fits no row', () => {
    const names = new Set(publicFunctions().map((f) => f.name));
    const stale = Object.keys(EXCEPTIONS).filter((n) => !names.has(n) || rowOf(forms, n) !== undefined);
    expect(stale).toEqual([]);
  });

  it('the appendix "every export by verb" is the one the exports give, and the final link line stays last', () => {
    const expected = withAppendix(page, appendix(forms));
    if (process.env['KALENDS_WRITE_APPENDIX'] === '1' && expected !== page) writeFileSync(DESIGN, expected);
    else expect(page).toBe(expected);
    expect(page.trimEnd().split('\n').at(-1)).toMatch(/^\[All documentation\]/);
  });
});
