/**
 * The workbench page (workbench/, docs/workbench.md) in a real browser: Debian's Chromium (/usr/bin/chromium),
 * driven by playwright-core with the zone browser test's flags (never a browser download). The page is built here
 * with vite (into a temporary folder) and served by a small static server on 127.0.0.1; `import 'kalends'` in the
 * page is the package's public entry (dist/, built by `npm test` first), or the sources when dist/ is missing or
 * older than src/.
 *
 * What the page shows is compared with the library's answers in Node, cell by cell: every day of 3 fiscal years
 * (its date, period, business-day state and holiday names), the rows of a 4-4-5 layout after an edit, a rule's
 * schedule against the warehouse layer's schedule table (another implementation of the same facts), a lookup, and
 * the CSV export against formatTableCsv. Weekends are also checked against ECMAScript's own weekday
 * (Date.prototype.getUTCDay, ECMA-262 section 21.4.4.13), outside the library. axe-core (a pinned dev dependency,
 * injected into the page) checks WCAG 2.1 A and AA, contrast included. Render times are logged, not asserted.
 * Without /usr/bin/chromium the test fails in CI (process.env.CI) and skips locally, with a message.
 */
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { extname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import {
  type Profile,
  calendarOfProfile,
  dayNumberFromEpochMs,
  dayNumberFromYmd,
  defineProfile,
  dimensionTableFromProfile,
  formatPeriod,
  formatPlainDate,
  formatTableCsv,
  isBusinessDay,
  listHolidays,
  listSubPeriods,
  lengthDaysOfPeriod,
  parsePlainDate,
  periodFromDayNumber,
  periodFromOrdinal,
  scheduleTableFromProfile,
  unitOfProfile,
} from '../../src/index.js';

const CHROMIUM = '/usr/bin/chromium';
const HAVE = existsSync(CHROMIUM);
const ROOT = fileURLToPath(new URL('../../', import.meta.url));
if (!HAVE && process.env.CI) throw new Error(`test/workbench/browser.test.ts: ${CHROMIUM} is missing; .ci/run installs it with apt-get install chromium`);
if (!HAVE) console.log(`[workbench] browser test skipped: ${CHROMIUM} is missing (apt-get install chromium)`);

/** The day the page marks as today (`?today=`), so that the picture and the screenshot do not depend on the run's date. */
const TODAY = '2025-11-26';
const DEMO_TEXT = readFileSync(join(ROOT, 'examples/otterbrook.profile.json'), 'utf8');

function newest(dir: string): number {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newest(p) : statSync(p).mtimeMs);
  }
  return t;
}

const TYPES: Readonly<Record<string, string>> = { '.html': 'text/html; charset=utf-8', '.js': 'text/javascript', '.css': 'text/css' };

/** Reads the width and height from a PNG's IHDR chunk (ISO/IEC 15948, section 11.2.2), after checking the signature. */
function pngSize(png: Buffer): { width: number; height: number } {
  expect([...png.subarray(0, 8)]).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
  expect(png.subarray(12, 16).toString('latin1')).toBe('IHDR');
  return { width: png.readUInt32BE(16), height: png.readUInt32BE(20) };
}

interface CellReading {
  day: string;
  business: string;
  holiday: string;
  label: string;
  row: string;
  today: boolean;
  marks: string;
}

describe.skipIf(!HAVE)('the workbench page in headless Chromium', () => {
  let server: Server;
  let dir: string;
  let origin: string;
  let context: BrowserContext;
  let page: Page;
  let jsBytes = 0;
  let jsGzipBytes = 0;
  const requests: string[] = [];
  const pageErrors: string[] = [];

  /** The page's profile text after `edit`, set in the editor; waits for the drawing it causes. */
  async function editProfile(edit: (text: string) => string): Promise<void> {
    const seq = Number(await page.evaluate('document.body.dataset.renderSeq ?? 0'));
    const text = edit(await page.inputValue('#profile-text'));
    await page.fill('#profile-text', text);
    await page.waitForFunction((s) => Number(document.body.dataset['renderSeq'] ?? 0) > s, seq);
  }

  /** Runs `action` (a control change) and waits for the drawing it causes. */
  async function redraw(action: () => Promise<unknown>): Promise<void> {
    const seq = Number(await page.evaluate('document.body.dataset.renderSeq ?? 0'));
    await action();
    await page.waitForFunction((s) => Number(document.body.dataset['renderSeq'] ?? 0) > s, seq);
  }

  async function chooseYear(fiscalYear: string, label: string): Promise<void> {
    if ((await page.inputValue('#fiscal-year')) !== fiscalYear) await redraw(() => page.selectOption('#fiscal-year', fiscalYear));
    const value = await page.$eval('#year', (s, l) => Array.from((s as HTMLSelectElement).options).find((o) => o.text === l)?.value, label);
    expect(value, `the year list offers ${label}`).toBeDefined();
    if ((await page.inputValue('#year')) !== value) await redraw(() => page.selectOption('#year', value!));
  }

  async function readCells(): Promise<CellReading[]> {
    return page.$$eval('#year-grid [role="gridcell"]', (cells) =>
      cells.map((c) => {
        const e = c as HTMLElement;
        return {
          day: e.dataset['day'] ?? '',
          business: e.dataset['business'] ?? '',
          holiday: e.dataset['holiday'] ?? '',
          label: e.getAttribute('aria-label') ?? '',
          row: e.closest('[role="row"]')?.getAttribute('data-label') ?? '',
          today: e.classList.contains('today'),
          marks: e.querySelector('.face')?.getAttribute('data-marks') ?? '',
        };
      }),
    );
  }

  async function readRows(): Promise<{ label: string; days: number }[]> {
    return page.$$eval('#year-grid [role="rowheader"][data-first]', (heads) =>
      heads.map((h) => ({ label: h.closest('[role="row"]')!.getAttribute('data-label')!, days: Number((h as HTMLElement).dataset['end']) - Number((h as HTMLElement).dataset['first']) })),
    );
  }

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'kalends-workbench-'));
    const out = join(dir, 'page');
    const { build } = await import('vite');
    const { publicEntry, workbenchConfig } = await import('../../workbench/vite.config.js');
    const dist = publicEntry();
    const fresh = existsSync(dist) && statSync(dist).mtimeMs >= newest(join(ROOT, 'src'));
    if (!fresh) console.log(`[workbench] ${dist} is missing or older than src/: the page is built from the sources`);
    await build({ ...workbenchConfig(fresh ? dist : join(ROOT, 'src/index.ts'), out), configFile: false, logLevel: 'error' });
    for (const f of readdirSync(join(out, 'assets'))) {
      if (!f.endsWith('.js')) continue;
      const code = readFileSync(join(out, 'assets', f));
      jsBytes += code.length;
      jsGzipBytes += gzipSync(code, { level: 9 }).length;
    }
    server = createServer((req, res) => {
      const path = join(out, decodeURIComponent(new URL(req.url ?? '/', 'http://local').pathname).replace(/\/$/, '/index.html'));
      if (!path.startsWith(out) || !existsSync(path) || statSync(path).isDirectory()) {
        res.writeHead(404);
        res.end();
        return;
      }
      res.writeHead(200, { 'content-type': TYPES[extname(path)] ?? 'application/octet-stream' });
      res.end(readFileSync(path));
    });
    await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
    origin = `http://127.0.0.1:${(server.address() as { port: number }).port}`;
    const { chromium } = await import('playwright-core');
    context = await chromium.launchPersistentContext(join(dir, 'profile'), {
      executablePath: CHROMIUM,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
      viewport: { width: 1600, height: 1200 },
      acceptDownloads: true,
    });
    page = await context.newPage();
    page.on('request', (r) => requests.push(r.url()));
    page.on('pageerror', (e) => pageErrors.push(e.message));
    await page.goto(`${origin}/?today=${TODAY}`);
  });

  afterAll(async () => {
    await context?.close();
    await new Promise<void>((r) => (server ? server.close(() => r()) : r()));
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('loads the demo company\'s profile', async () => {
    expect(await page.textContent('#profile-status')).toContain('No profile yet');
    // A file opened from disk is read in the page (a small profile: one fiscal year of months, one bundled calendar).
    const small = { id: 'small', name: 'A small invented profile', zone: 'Europe/Dublin', week: 'iso', fiscalYears: { main: { start: { month: 4, day: 6 }, naming: 'start-year' } }, calendars: { bank: 'england-and-wales' } };
    await redraw(() => page.setInputFiles('#open-file', { name: 'small.profile.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(small, null, 2)) }));
    expect(await page.textContent('#profile-status')).toContain('A small invented profile');
    expect(await page.inputValue('#fiscal-year')).toBe('main');
    expect((await readRows()).length).toBe(12); // a row per fiscal month
    await redraw(() => page.click('#use-demo'));
    expect(await page.inputValue('#profile-text')).toBe(DEMO_TEXT);
    expect(await page.textContent('#profile-status')).toContain('Valid profile');
    // The demo's retail year is drawn first (a 52/53-week year), the one that holds today.
    expect(await page.inputValue('#fiscal-year')).toBe('retail');
    expect(await page.$eval('#year', (s) => (s as HTMLSelectElement).selectedOptions[0]!.text)).toBe('FY2025');
  });

  it('draws 3 fiscal years day by day exactly as the library answers in Node: 0 mismatches', async () => {
    const profile = defineProfile(DEMO_TEXT);
    const calendar = calendarOfProfile(profile);
    const retail = profile.fiscalYears['retail']!;
    const period = unitOfProfile(profile, 'retail-period');
    const mismatches: string[] = [];
    let checked = 0;
    const weeksOf: Record<string, number> = {};
    // FY2023 of a 4-5-4 year ending on the Saturday nearest 31 January has 53 weeks (from memory; the library's
    // own count, end - start = 371 days, is asserted below and drawn as the 53rd week).
    for (const label of ['FY2022', 'FY2023', 'FY2024']) {
      await chooseYear('retail', label);
      const fy = retail.parseOrdinal(label);
      const first = retail.firstDayNumberFromOrdinal(fy);
      const end = retail.firstDayNumberFromOrdinal(fy + 1);
      weeksOf[label] = (end - first) / 7;
      const cells = await readCells();
      expect(cells.length, label).toBe(end - first);
      cells.forEach((cell, i) => {
        const d = first + i;
        const date = formatPlainDate(d);
        const holidays = listHolidays(calendar, d, d + 1).map((h) => h.name);
        const business = isBusinessDay(calendar, d);
        const periodLabel = formatPeriod(periodFromDayNumber(period, d));
        const extra = end - first === 371 && d >= end - 7;
        const problems: string[] = [];
        if (cell.day !== date) problems.push(`date ${cell.day}`);
        if (cell.business !== String(business)) problems.push(`business ${cell.business}`);
        if (cell.holiday !== holidays.join('; ')) problems.push(`holiday "${cell.holiday}"`);
        if (cell.row !== periodLabel) problems.push(`row ${cell.row}`);
        if (!cell.label.includes(date) || !cell.label.includes(periodLabel)) problems.push(`label without date or period: ${cell.label}`);
        if (!cell.label.includes(business ? ': business day' : ': closed')) problems.push(`label state: ${cell.label}`);
        for (const h of holidays) if (!cell.label.includes(h)) problems.push(`label without holiday ${h}`);
        if (cell.label.includes('53rd week') !== extra) problems.push(`53rd week: ${cell.label}`);
        if (cell.today !== (date === TODAY) || cell.label.includes('today') !== (date === TODAY)) problems.push('today');
        // Outside the library: the us-federal weekend is Saturday and Sunday by ECMAScript's own weekday.
        const utcDay = new Date(d * 86_400_000).getUTCDay();
        if ((utcDay === 0 || utcDay === 6) && (business || !cell.label.includes('weekend'))) problems.push('weekend by getUTCDay');
        if (problems.length > 0) mismatches.push(`${label} ${date}: ${problems.join('; ')}`);
        checked++;
      });
    }
    console.log(`[workbench] ${checked} day cells of FY2022-FY2024 (retail) compared with the library in Node: ${mismatches.length} mismatches`);
    expect(mismatches).toEqual([]);
    expect(weeksOf).toEqual({ FY2022: 52, FY2023: 53, FY2024: 52 });
    expect(await page.locator('#year-summary').textContent()).toContain('52 weeks');
  });

  it('draws a year of months, and a year by weeks with a cell per week, as the library counts them', async () => {
    const profile = defineProfile(DEMO_TEXT);
    const calendar = calendarOfProfile(profile);
    // The wholesale year (October to September, named by its end year): a row per fiscal month.
    await chooseYear('wholesale', 'FY2026');
    const month = unitOfProfile(profile, 'fiscal-month');
    const cells = await readCells();
    const first = dayNumberFromYmd(2025, 10, 1);
    expect(cells.map((c) => c.day)).toEqual(Array.from({ length: 365 }, (_, i) => formatPlainDate(first + i)));
    expect(cells.map((c) => c.row)).toEqual(cells.map((_, i) => formatPeriod(periodFromDayNumber(month, first + i))));
    expect(cells.map((c) => c.business)).toEqual(cells.map((_, i) => String(isBusinessDay(calendar, first + i))));
    // Back to retail FY2023, a cell per week: 53 weeks, each with its business days.
    await chooseYear('retail', 'FY2023');
    await redraw(() => page.check('input[name="cells"][value="week"]'));
    const weeks = await page.$$eval('#year-grid [role="gridcell"]', (c) => c.map((e) => [(e as HTMLElement).dataset['week'], Number((e as HTMLElement).dataset['businessDays'])]));
    const week = unitOfProfile(profile, 'retail-week');
    const fy = profile.fiscalYears['retail']!.parseOrdinal('FY2023');
    const w0 = week.ordinalFromDayNumber(profile.fiscalYears['retail']!.firstDayNumberFromOrdinal(fy));
    expect(weeks).toEqual(
      Array.from({ length: 53 }, (_, i) => {
        const a = week.firstDayNumberFromOrdinal(w0 + i);
        let n = 0;
        for (let d = a; d < a + 7; d++) if (isBusinessDay(calendar, d)) n++;
        return [week.formatOrdinal(w0 + i), n];
      }),
    );
    expect(await page.locator('#year-grid .extra-week').count()).toBe(1);
    await redraw(() => page.check('input[name="cells"][value="day"]'));
  });

  it('shows a fault at its path as the profile is edited, keeps the last valid picture, and takes the cursor there', async () => {
    await chooseYear('retail', 'FY2024');
    const before = await readRows();
    await editProfile((t) => t.replace('"layout": "4-5-4"', '"layout": "4-4-4"'));
    expect(await page.textContent('#profile-status')).toContain('fault');
    const faults = await page.$$eval('#faults li', (items) => items.map((li) => [li.querySelector('.fault-path')!.textContent, li.querySelector('.fault-message')!.textContent]));
    expect(faults.map((f) => f[0])).toEqual(['fiscalYears.retail.layout']);
    expect(faults[0]![1]).toContain('"4-4-5"');
    expect(await readRows()).toEqual(before); // the last valid profile stays drawn
    await page.click('#faults .fault-path');
    const text = await page.inputValue('#profile-text');
    const caret = await page.$eval('#profile-text', (t) => (t as HTMLTextAreaElement).selectionStart);
    expect(text.slice(caret).startsWith('"layout"')).toBe(true);
    expect(caret).toBeGreaterThan(text.indexOf('"retail"'));
    // A JSON fault is shown with its line and column.
    await editProfile((t) => t.replace('"week": "iso",', '"week": "iso"'));
    expect(await page.$$eval('#faults .fault-path', (b) => b.map((e) => e.textContent))).toEqual(['(JSON text)']);
    // V8 reports the token after the missing comma: "fiscalYears", on line 7 of the demo's text.
    const broken = await page.inputValue('#profile-text');
    const line = broken.slice(0, broken.indexOf('"fiscalYears"')).split('\n').length;
    expect(line).toBe(7);
    expect(await page.locator('#faults .fault-message').textContent()).toMatch(new RegExp(`line ${line}\\b`));
    await editProfile((t) => t.replace('"week": "iso"', '"week": "iso",'));
  });

  it('fixed to a 4-4-5 layout, the periods change as the library lays them out', async () => {
    const rows454 = await readRows();
    await editProfile((t) => t.replace('"layout": "4-4-4"', '"layout": "4-4-5"'));
    expect(await page.textContent('#profile-status')).toContain('Valid profile');
    expect(await page.locator('#faults li').count()).toBe(0);
    const rows445 = await readRows();
    const expected = (text: string, label: string) => {
      const p = defineProfile(text);
      const fy = p.fiscalYears['retail']!;
      return listSubPeriods(periodFromOrdinal(fy, fy.parseOrdinal(label)), unitOfProfile(p, 'retail-period')).map((q) => ({ label: formatPeriod(q), days: lengthDaysOfPeriod(q) }));
    };
    const text445 = await page.inputValue('#profile-text');
    expect(rows454).toEqual(expected(DEMO_TEXT, 'FY2024'));
    expect(rows445).toEqual(expected(text445, 'FY2024'));
    // 4-5-4 is 4, 5, 4 weeks in each quarter; 4-4-5 is 4, 4, 5 (a 52-week year: 28, 35, 28 and 28, 28, 35 days).
    expect(rows454.map((r) => r.days)).toEqual([28, 35, 28, 28, 35, 28, 28, 35, 28, 28, 35, 28]);
    expect(rows445.map((r) => r.days)).toEqual([28, 28, 35, 28, 28, 35, 28, 28, 35, 28, 28, 35]);
    // The 53-week FY2023: the extra week goes to the last period (extraWeek "last-period"): 6 weeks.
    await chooseYear('retail', 'FY2023');
    expect((await readRows()).map((r) => r.days)).toEqual(expected(text445, 'FY2023').map((r) => r.days));
    expect((await readRows()).at(-1)!.days).toBe(42);
    expect(await page.locator('#year-grid .extra-week').count()).toBe(7);
  });

  it('draws a rule\'s schedule, unadjusted against adjusted, as the warehouse schedule table says', async () => {
    await chooseYear('retail', 'FY2025');
    await redraw(() => page.selectOption('#rule', 'supplier-payments'));
    const profile = defineProfile(await page.inputValue('#profile-text'));
    const fy = profile.fiscalYears['retail']!;
    const o = fy.parseOrdinal('FY2025');
    const start = fy.firstDayNumberFromOrdinal(o);
    const end = fy.firstDayNumberFromOrdinal(o + 1);
    const table = scheduleTableFromProfile(profile, { start, end });
    const col = (name: string) => table.columns.find((c) => c.name === name)!.values as ArrayLike<unknown>;
    const expected: [string, string, string | null][] = [];
    for (let i = 0; i < table.rowCount; i++) {
      if (col('rule_name')[i] !== 'supplier-payments') continue;
      expected.push([formatPlainDate(col('unadjusted_date')[i] as number), formatPlainDate(col('adjusted_date')[i] as number), col('moved_because_detail')[i] as string | null]);
    }
    const rows = await page.$$eval('#schedule tbody tr', (trs) => trs.map((tr) => [(tr as HTMLElement).dataset['unadjusted'], (tr as HTMLElement).dataset['adjusted'], (tr as HTMLTableRowElement).cells[3]!.textContent]));
    expect(rows.map((r) => [r[0], r[1]])).toEqual(expected.map((e) => [e[0], e[1]]));
    expect(expected.some((e) => e[0] !== e[1])).toBe(true);
    expected.forEach(([u, a, detail], i) => {
      const why = rows[i]![2] ?? '';
      if (u === a) expect(why).toBe('');
      else expect(why.toLowerCase()).toContain(detail!.toLowerCase()); // the holiday's name, or the weekday
    });
    // The adjusted dates carry ▲ in the picture, the dates they moved from △, and their labels say so.
    const cells = await readCells();
    for (const [u, a] of expected) {
      const at = cells.find((c) => c.day === a);
      if (at) expect(at.marks, a).toContain('▲');
      if (u !== a) {
        const from = cells.find((c) => c.day === u);
        if (from) expect(from.marks + from.label, u).toMatch(/△.*moved to/);
      }
    }
  });

  it('looks up an instant: labels in every unit, business-day facts, local time, opening hours', async () => {
    await page.fill('#lookup-text', '2025-11-26T17:30:00-06:00');
    await page.click('#lookup-form button[type="submit"]');
    const profile = defineProfile(await page.inputValue('#profile-text'));
    const d = parsePlainDate('2025-11-26');
    const units = await page.$$eval('.lookup-units tbody tr', (trs) => trs.map((tr) => [(tr as HTMLTableRowElement).cells[0]!.textContent, (tr as HTMLTableRowElement).cells[1]!.textContent]));
    expect(units).toEqual([['week', formatPeriod(periodFromDayNumber(profile.week, d))], ...Object.entries(profile.units).map(([n, u]) => [n, formatPeriod(periodFromDayNumber(u, d))])]);
    const facts = await page.locator('#lookup-result .facts').textContent();
    expect(facts).toContain('2025-11-26T23:30:00Z');
    expect(facts).toContain('2025-11-26T17:30:00-06:00');
    const business = await page.$$eval('.lookup-business tbody tr', (trs) => trs.map((tr) => Array.from((tr as HTMLTableRowElement).cells, (c) => c.textContent)));
    expect(business.find((r) => r[0]!.startsWith('company'))!.slice(1, 2)).toEqual(['business day']);
    // The next business day of the company calendar skips Thanksgiving Day (27th) and the company's shutdown (28th).
    expect(business.find((r) => r[0]!.startsWith('company'))![5]).toBe('2025-12-01');
    const hours = await page.$$eval('.lookup-hours tbody tr', (trs) => trs.map((tr) => Array.from((tr as HTMLTableRowElement).cells, (c) => c.textContent)));
    expect(hours.find((r) => r[0] === 'payments-office')![2]).toBe('payments: value date 2025-11-28');
    // A local time the clocks skipped (America/Chicago, 2026-03-08 02:30; DST starts at 02:00, Energy Policy Act of 2005).
    await page.fill('#lookup-text', '2026-03-08T02:30');
    await page.fill('#lookup-zone', 'America/Chicago');
    await page.click('#lookup-form button[type="submit"]');
    expect(await page.locator('#lookup-result .facts').textContent()).toContain('skipped');
    await page.fill('#lookup-zone', '');
  });

  it('moves through the year with the keyboard: one tab stop, arrows, Home, End, Enter', async () => {
    const stops = () => page.$$eval('#year-grid [role="gridcell"][tabindex="0"]', (c) => c.map((e) => (e as HTMLElement).dataset['day']));
    expect(await stops()).toEqual([TODAY]); // the tab stop starts on today
    await page.focus('#year-grid [role="gridcell"][tabindex="0"]');
    const focused = () => page.evaluate(() => (document.activeElement as HTMLElement).dataset['day']);
    await page.keyboard.press('ArrowRight');
    expect(await focused()).toBe('2025-11-27');
    await page.keyboard.press('ArrowDown'); // the same column in the next period: 25 days after its start, 30 November
    expect(await focused()).toBe('2025-12-25');
    await page.keyboard.press('Home');
    expect(await focused()).toBe('2025-11-30');
    await page.keyboard.press('ArrowLeft'); // back across the row boundary to the previous period's last day
    expect(await focused()).toBe('2025-11-29');
    await page.keyboard.press('End');
    expect(await focused()).toBe('2025-11-29');
    await page.keyboard.press('Enter');
    expect(await page.inputValue('#lookup-text')).toBe('2025-11-29');
    expect(await stops()).toEqual(['2025-11-29']);
  });

  it('passes axe-core\'s WCAG 2.1 A and AA checks, contrast included', async () => {
    const require = createRequire(import.meta.url);
    await page.evaluate(readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8'));
    const result = (await page.evaluate(`axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } })
      .then((r) => ({ version: axe.version, violations: r.violations.map((v) => ({ id: v.id, nodes: v.nodes.length, target: v.nodes[0] && v.nodes[0].target })), passes: r.passes.map((p) => p.id), incomplete: r.incomplete.map((i) => i.id) }))`)) as {
      version: string;
      violations: { id: string }[];
      passes: string[];
      incomplete: string[];
    };
    console.log(`[workbench] axe-core ${result.version}: ${result.violations.length} violations, ${result.passes.length} rules passed (color-contrast ${result.passes.includes('color-contrast') ? 'passed' : 'not passed'}), incomplete: ${result.incomplete.join(', ') || 'none'}`);
    expect(result.violations).toEqual([]);
    expect(result.passes).toContain('color-contrast');
  });

  it('exports the year as the warehouse layer\'s CSV, and prints the year without the controls', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#export-csv')]);
    const csv = readFileSync((await download.path())!, 'utf8');
    const profile: Profile = defineProfile(await page.inputValue('#profile-text'));
    const fy = profile.fiscalYears['retail']!;
    const o = fy.parseOrdinal('FY2025');
    expect(download.suggestedFilename()).toBe('otterbrook-retail-FY2025.csv');
    expect(csv).toBe(formatTableCsv(dimensionTableFromProfile(profile, { start: fy.firstDayNumberFromOrdinal(o), end: fy.firstDayNumberFromOrdinal(o + 1), calendar: 'company' })));
    await page.emulateMedia({ media: 'print' });
    expect(await page.$eval('#profile-panel', (e) => getComputedStyle(e).display)).toBe('none');
    expect(await page.$eval('#year-controls', (e) => getComputedStyle(e).display)).toBe('none');
    expect(await page.$eval('#year-grid', (e) => getComputedStyle(e).display)).not.toBe('none');
    await page.emulateMedia({ media: 'screen' });
  });

  it('marks the real today in the profile\'s zone without ?today', async () => {
    const other = await context.newPage();
    try {
      const before = dayNumberFromEpochMs('America/Chicago', Date.now());
      await other.goto(`${origin}/`);
      await other.click('#use-demo');
      await other.waitForFunction(() => document.body.dataset['renderSeq'] === '1');
      const after = dayNumberFromEpochMs('America/Chicago', Date.now());
      const today = await other.$eval('#year-grid .today', (e) => (e as HTMLElement).dataset['day']);
      expect([formatPlainDate(before), formatPlainDate(after)]).toContain(today);
    } finally {
      await other.close();
    }
  });

  it('renders a year day by day within a frame or a few after a profile change (measured, not asserted); nothing leaves the page', async () => {
    // Back to the demo profile, its retail FY2025 drawn a day per cell with the supplier payments on it.
    await editProfile(() => DEMO_TEXT);
    await chooseYear('retail', 'FY2025');
    const times: number[] = [];
    for (let i = 0; i < 8; i++) {
      await editProfile((t) => (i % 2 === 0 ? t.replace('"layout": "4-5-4"', '"layout": "4-4-5"') : t.replace('"layout": "4-4-5"', '"layout": "4-5-4"')));
      expect(await page.$eval('body', (b) => (b as HTMLElement).dataset['renderReason'])).toBe('profile edited');
      times.push(Number(await page.$eval('body', (b) => (b as HTMLElement).dataset['renderMs'])));
    }
    const sorted = [...times].sort((a, b) => a - b);
    console.log(
      `[workbench] a profile edit to the painted year (day level, 365 cells, schedule on): median ${sorted[sorted.length >> 1]} ms, fastest ${sorted[0]} ms, slowest ${sorted.at(-1)} ms over ${times.length} edits (${times.join(', ')}); page JavaScript with the library ${(jsBytes / 1024).toFixed(1)} KiB minified, ${(jsGzipBytes / 1024).toFixed(1)} KiB min+gz`,
    );
    expect(times.every((t) => t > 0)).toBe(true);
    expect(pageErrors).toEqual([]);
    const outside = requests.filter((u) => !u.startsWith(`${origin}/`) && !u.startsWith('data:') && !u.startsWith('blob:'));
    expect(outside).toEqual([]);
  });

  it('takes the screenshot docs/workbench.md shows (checked for its structure, not its pixels)', async () => {
    await page.fill('#lookup-text', '2025-11-26T17:30:00-06:00');
    await page.click('#lookup-form button[type="submit"]');
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    await page.$eval('#profile-text', (t) => (t.scrollTop = 0));
    await page.evaluate(() => window.scrollTo(0, 0));
    const png = await page.screenshot();
    const size = pngSize(png);
    expect(size).toEqual({ width: 1600, height: 1200 });
    // The structure the picture shows: a valid profile, 12 period rows, the schedule's marks, today.
    expect(await page.textContent('#profile-status')).toContain('Valid profile');
    expect(await readRows()).toHaveLength(12);
    expect(await page.locator('#year-grid .marked').count()).toBeGreaterThan(20);
    expect(await page.locator('#year-grid .today').count()).toBe(1);
    const committed = join(ROOT, 'docs/img/workbench.png');
    if (process.env['KALENDS_WRITE_SCREENSHOT']) writeFileSync(committed, png);
    // The committed picture is a PNG of the same size (regenerate it with KALENDS_WRITE_SCREENSHOT=1).
    expect(pngSize(readFileSync(committed))).toEqual(size);
    expect(readFileSync(join(ROOT, 'docs/workbench.md'), 'utf8')).toContain('img/workbench.png');
  });
});
