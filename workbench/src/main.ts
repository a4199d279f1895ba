/**
 * The workbench page: load a profile (the demo company's, a file, or text typed in), check it as it changes, and
 * draw the chosen fiscal year; show a rule's schedule on it, look a date or instant up, export the year. The page
 * state lives here; year.ts, grid.ts, schedule.ts, lookup.ts and faults.ts do the work.
 *
 * For tests and reproducible pictures, `?today=YYYY-MM-DD` sets the day marked as today (otherwise today in the
 * profile's zone). After each drawing the body carries `data-render-seq` (a count) and `data-render-ms` (the time
 * from the change to the painted page), and the console says the same.
 */
import { type Profile, dayNumberFromEpochMs, dayNumberFromYmd, dimensionTableFromProfile, formatPlainDate, formatTableCsv, parsePlainDate } from 'kalends';
import demoText from '../../examples/otterbrook.profile.json?raw';
import { byId, escapeHtml, saveText } from './dom.js';
import { type Fault, placeOfPath, readProfileText } from './faults.js';
import { attachGridKeys, cellOfDay, rove, yearGridHtml } from './grid.js';
import { lookupHtml, readSubject } from './lookup.js';
import { type RuleSchedule, isRuleOfDates, marksOfSchedule, scheduleOfRule } from './schedule.js';
import { type CellLevel, type RowLevel, type YearView, buildYearView, calendarNamesOf, unitsOfFiscalYear } from './year.js';

const el = {
  useDemo: byId('use-demo', HTMLButtonElement),
  openFile: byId('open-file', HTMLInputElement),
  text: byId('profile-text', HTMLTextAreaElement),
  status: byId('profile-status', HTMLParagraphElement),
  faults: byId('faults', HTMLOListElement),
  controls: byId('year-controls', HTMLFormElement),
  fiscalYear: byId('fiscal-year', HTMLSelectElement),
  year: byId('year', HTMLSelectElement),
  previous: byId('year-previous', HTMLButtonElement),
  next: byId('year-next', HTMLButtonElement),
  calendar: byId('calendar', HTMLSelectElement),
  rule: byId('rule', HTMLSelectElement),
  summary: byId('year-summary', HTMLParagraphElement),
  note: byId('year-note', HTMLParagraphElement),
  grid: byId('year-grid', HTMLDivElement),
  gridCaption: byId('grid-caption', HTMLParagraphElement),
  schedulePanel: byId('schedule-panel', HTMLElement),
  schedule: byId('schedule', HTMLDivElement),
  lookupForm: byId('lookup-form', HTMLFormElement),
  lookupText: byId('lookup-text', HTMLInputElement),
  lookupZone: byId('lookup-zone', HTMLInputElement),
  zoneIds: byId('zone-ids', HTMLDataListElement),
  lookupResult: byId('lookup-result', HTMLDivElement),
  exportCsv: byId('export-csv', HTMLButtonElement),
  print: byId('print-year', HTMLButtonElement),
};

interface State {
  /** The last profile that was valid (the picture keeps showing it while the text has faults). */
  profile: Profile | undefined;
  faults: readonly Fault[];
  fiscalYear: string;
  ordinal: number;
  rows: RowLevel;
  cells: CellLevel;
  calendar: string;
  rule: string;
  /** The day whose cell holds the roving tab stop. */
  focusDay: number | undefined;
  view: YearView | undefined;
  lookedUp: boolean;
}

const state: State = { profile: undefined, faults: [], fiscalYear: '', ordinal: 0, rows: 'period', cells: 'day', calendar: '', rule: '', focusDay: undefined, view: undefined, lookedUp: false };

const TODAY_PARAM = new URLSearchParams(location.search).get('today');

/** Today in the profile's zone, or the day `?today=` names. */
function todayOf(profile: Profile): number {
  return TODAY_PARAM ? parsePlainDate(TODAY_PARAM) : dayNumberFromEpochMs(profile.zone, Date.now());
}

// ---- measuring: from a change to the painted page -----------------------------------------------------------

let renderSeq = 0;

/** After the next frame is painted, records how long the change took since `t0`. */
function measure(t0: number, reason: string): void {
  requestAnimationFrame(() => {
    const channel = new MessageChannel();
    channel.port1.onmessage = () => {
      const ms = performance.now() - t0;
      renderSeq++;
      document.body.dataset['renderMs'] = ms.toFixed(1);
      document.body.dataset['renderReason'] = reason;
      document.body.dataset['renderSeq'] = String(renderSeq);
      console.info(`[workbench] ${reason}: ${ms.toFixed(1)} ms from the change to the painted page`);
    };
    channel.port2.postMessage(null);
  });
}

// ---- the profile ------------------------------------------------------------------------------------------

function showFaults(faults: readonly Fault[]): void {
  el.faults.hidden = faults.length === 0;
  el.faults.innerHTML = faults
    .map((f, i) => `<li class="fault"><button type="button" class="fault-path" data-index="${i}" title="Take the cursor to this place in the text">${escapeHtml(f.path)}</button> <span class="fault-message">${escapeHtml(f.message)}</span></li>`)
    .join('');
}

function describeProfile(p: Profile): string {
  const count = (o: object, one: string, many: string) => `${Object.keys(o).length} ${Object.keys(o).length === 1 ? one : many}`;
  return `${p.name}: ${count(p.fiscalYears, 'fiscal year', 'fiscal years')}, ${count(p.units, 'unit', 'units')}, ${count(p.calendars, 'calendar', 'calendars')}, ${count(p.rules, 'rule', 'rules')}, ${count(p.hours, 'set of opening hours', 'sets of opening hours')}; zone ${p.zone.id}.`;
}

/** Reads the text, keeps a valid profile, shows the faults of an invalid one, and draws. `source` names a file read. */
function applyText(reason: string, source?: string): void {
  const t0 = performance.now();
  const reading = readProfileText(el.text.value);
  if (reading.ok) {
    const before = state.profile;
    state.profile = reading.profile;
    state.faults = [];
    el.status.textContent = `Valid profile${source ? ` (from ${source})` : ''}. ${describeProfile(reading.profile)}`;
    el.status.className = 'status ok';
    adoptChoices(reading.profile, before);
  } else {
    state.faults = reading.faults;
    el.status.textContent = `${reading.faults.length} fault${reading.faults.length === 1 ? '' : 's'} in the profile, each at its path below.${state.profile ? ' The picture still shows the last valid profile.' : ''}`;
    el.status.className = 'status faulty';
  }
  showFaults(state.faults);
  draw();
  measure(t0, reason);
}

/** Keeps the choices that still make sense for a new profile, and picks defaults for the rest. */
function adoptChoices(p: Profile, before: Profile | undefined): void {
  const fiscalYears = Object.keys(p.fiscalYears);
  // A new fiscal year (the first profile, or the one drawn is gone): a 52/53-week year first, at today.
  const newYear = !before || !fiscalYears.includes(state.fiscalYear);
  if (newYear) state.fiscalYear = fiscalYears.find((n) => 'yearEnd' in (p.definition.fiscalYears?.[n] ?? {})) ?? fiscalYears[0] ?? '';
  const calendars = calendarNamesOf(p);
  if (!calendars.includes(state.calendar)) state.calendar = calendars[0] ?? '';
  if (state.rule !== '' && !(Object.prototype.hasOwnProperty.call(p.rules, state.rule) && isRuleOfDates(p, state.rule))) state.rule = '';
  if (!state.fiscalYear) return;
  state.ordinal = clampOrdinal(p, newYear ? p.fiscalYears[state.fiscalYear]!.ordinalFromDayNumber(todayOf(p)) : state.ordinal);
}

// ---- choices ----------------------------------------------------------------------------------------------

/** The fiscal years the chosen calendar covers whole: [min, max] ordinals. */
function ordinalBounds(p: Profile): [number, number] {
  const fy = p.fiscalYears[state.fiscalYear]!;
  const cal = p.calendars[state.calendar];
  const firstYear = Math.max(cal?.firstYear ?? 1900, 1600);
  const lastYear = Math.min(cal?.lastYear ?? 2200, 9998);
  const lo = dayNumberFromYmd(firstYear, 1, 1);
  const hi = dayNumberFromYmd(lastYear, 12, 31) + 1;
  let min = fy.ordinalFromDayNumber(lo);
  if (fy.firstDayNumberFromOrdinal(min) < lo) min++;
  let max = fy.ordinalFromDayNumber(hi - 1);
  if (fy.firstDayNumberFromOrdinal(max + 1) > hi) max--;
  return [min, max];
}

function clampOrdinal(p: Profile, ordinal: number): number {
  const [min, max] = ordinalBounds(p);
  return Math.min(max, Math.max(min, ordinal));
}

function options(select: HTMLSelectElement, items: readonly { value: string; text: string; disabled?: boolean }[], selected: string): void {
  select.innerHTML = items.map((i) => `<option value="${escapeHtml(i.value)}"${i.disabled ? ' disabled' : ''}${i.value === selected ? ' selected' : ''}>${escapeHtml(i.text)}</option>`).join('');
}

function radios(name: string): HTMLInputElement[] {
  return Array.from(el.controls.querySelectorAll<HTMLInputElement>(`input[name="${name}"]`));
}

/** Fills the controls from the profile and the state; levels the year cannot draw are disabled, with the reason. */
function syncControls(p: Profile): string[] {
  const notes: string[] = [];
  options(el.fiscalYear, Object.keys(p.fiscalYears).map((n) => ({ value: n, text: n })), state.fiscalYear);
  const fy = p.fiscalYears[state.fiscalYear]!;
  const [min, max] = ordinalBounds(p);
  const around: { value: string; text: string }[] = [];
  for (let o = Math.max(min, state.ordinal - 12); o <= Math.min(max, state.ordinal + 12); o++) around.push({ value: String(o), text: fy.formatOrdinal(o) });
  options(el.year, around, String(state.ordinal));
  el.previous.disabled = state.ordinal <= min;
  el.next.disabled = state.ordinal >= max;
  options(el.calendar, calendarNamesOf(p).map((n) => ({ value: n, text: n === p.defaultCalendarName ? `${n} (default)` : n })), state.calendar);
  options(
    el.rule,
    [{ value: '', text: 'none' }, ...Object.keys(p.rules).map((n) => ({ value: n, text: isRuleOfDates(p, n) ? n : `${n} (instants: not drawn)`, disabled: !isRuleOfDates(p, n) }))],
    state.rule,
  );
  const units = unitsOfFiscalYear(p, state.fiscalYear);
  for (const r of radios('rows')) {
    const v = r.value as RowLevel;
    r.disabled = (v === 'quarter' && !units.quarter) || (v === 'period' && !units.period);
  }
  if ((state.rows === 'quarter' && !units.quarter) || (state.rows === 'period' && !units.period)) {
    notes.push(`Fiscal year "${state.fiscalYear}" has no week layout, so it has no quarters or periods: add "layout" to draw them.`);
    state.rows = 'week';
  }
  const weekCells = units.byWeeks && state.rows !== 'week';
  for (const r of radios('cells')) r.disabled = r.value === 'week' && !weekCells;
  if (state.cells === 'week' && !weekCells) {
    notes.push(units.byWeeks ? 'Rows of weeks are drawn a day per cell.' : `Fiscal year "${state.fiscalYear}" is made of calendar months, whose weeks do not fit its periods: it is drawn a day per cell.`);
    state.cells = 'day';
  }
  for (const r of radios('rows')) r.checked = r.value === state.rows;
  for (const r of radios('cells')) r.checked = r.value === state.cells;
  return notes;
}

// ---- drawing ----------------------------------------------------------------------------------------------

function scheduleHtml(s: RuleSchedule, view: YearView): string {
  const moved = s.occurrences.filter((o) => o.adjusted !== o.unadjusted).length;
  const caption = `${s.title} (rule "${s.name}") in ${view.label}: ${s.occurrences.length} date${s.occurrences.length === 1 ? '' : 's'}, ${moved} moved by the convention "${s.convention}"${s.calendarName ? ` on calendar "${s.calendarName}"` : ''}`;
  const rows = s.occurrences
    .map((o) => `<tr class="${o.adjusted === o.unadjusted ? 'kept' : 'moved'}" data-unadjusted="${formatPlainDate(o.unadjusted)}" data-adjusted="${formatPlainDate(o.adjusted)}"><th scope="row">${formatPlainDate(o.unadjusted)}</th><td>${formatPlainDate(o.adjusted)}</td><td>${o.adjusted === o.unadjusted ? 'no' : 'yes'}</td><td>${escapeHtml(o.why)}</td></tr>`)
    .join('');
  return `<table class="schedule"><caption>${escapeHtml(caption)}</caption><thead><tr><th scope="col">The rule's date</th><th scope="col">Adjusted date</th><th scope="col">Moved</th><th scope="col">Why it moved</th></tr></thead><tbody>${rows}</tbody></table>`;
}

function summaryOf(p: Profile, view: YearView, today: number): string {
  const parts = [`${view.label}${view.peopleLabel ? ` (${view.peopleLabel})` : ''} runs from ${formatPlainDate(view.first)} to ${formatPlainDate(view.end - 1)}`];
  if (view.weeks !== undefined) parts.push(`${view.weeks} weeks${view.weeks === 53 ? ' (the 53rd week is the last, framed with dashes)' : ''}`);
  else parts.push(`${view.end - view.first} days`);
  parts.push(`${view.businessDays} business days on calendar "${view.calendarName}"`);
  parts.push(`${view.holidayClosures} weekday${view.holidayClosures === 1 ? '' : 's'} closed by a holiday`);
  const todayText = today >= view.first && today < view.end ? `today is ${formatPlainDate(today)}` : `today (${formatPlainDate(today)}, ${p.zone.id}) is in ${p.fiscalYears[view.fiscalYear]!.formatOrdinal(p.fiscalYears[view.fiscalYear]!.ordinalFromDayNumber(today))}`;
  return `${parts.join(', ')}; ${todayText}.`;
}

function draw(): void {
  const p = state.profile;
  el.exportCsv.disabled = el.print.disabled = !p || !state.fiscalYear;
  if (!p) return;
  if (!state.fiscalYear) {
    el.summary.textContent = 'This profile has no fiscal years to draw: add a "fiscalYears" section.';
    el.grid.innerHTML = '';
    state.view = undefined;
    return;
  }
  const notes = syncControls(p);
  const today = todayOf(p);
  const unitsYear = p.fiscalYears[state.fiscalYear]!;
  const first = unitsYear.firstDayNumberFromOrdinal(state.ordinal);
  const end = unitsYear.firstDayNumberFromOrdinal(state.ordinal + 1);
  let schedule: RuleSchedule | undefined;
  try {
    schedule = state.rule ? scheduleOfRule(p, state.rule, first, end) : undefined;
  } catch (e) {
    notes.push(`The schedule cannot be drawn: ${e instanceof Error ? e.message : String(e)}`);
  }
  const hadFocus = el.grid.contains(document.activeElement);
  try {
    const view = buildYearView(p, { fiscalYear: state.fiscalYear, ordinal: state.ordinal, rows: state.rows, cells: state.cells, calendar: state.calendar, today, ...(schedule ? { marks: marksOfSchedule(schedule) } : {}) });
    state.view = view;
    const grid = yearGridHtml(view, state.fiscalYear);
    el.grid.className = `grid cells-${view.cellLevel}`;
    el.gridCaption.textContent = grid.caption;
    el.grid.innerHTML = grid.html;
    el.summary.textContent = summaryOf(p, view, today);
    const keep = state.focusDay !== undefined && state.focusDay >= first && state.focusDay < end ? state.focusDay : today >= first && today < end ? today : first;
    const cell = cellOfDay(el.grid, keep) ?? el.grid.querySelector<HTMLElement>('[role="gridcell"]');
    if (cell) rove(el.grid, cell, hadFocus);
  } catch (e) {
    state.view = undefined;
    el.grid.innerHTML = '';
    el.gridCaption.textContent = '';
    el.summary.textContent = '';
    notes.push(`This year cannot be drawn: ${e instanceof Error ? e.message : String(e)}`);
  }
  el.note.hidden = notes.length === 0;
  el.note.textContent = notes.join(' ');
  el.schedulePanel.hidden = !schedule || !state.view;
  el.schedule.innerHTML = schedule && state.view ? scheduleHtml(schedule, state.view) : '';
  if (state.lookedUp) lookUp();
}

// ---- lookup and export ------------------------------------------------------------------------------------

function lookUp(): void {
  const p = state.profile;
  if (!p) {
    el.lookupResult.innerHTML = '<p class="error">Load a profile first.</p>';
    return;
  }
  try {
    el.lookupResult.innerHTML = lookupHtml(p, readSubject(el.lookupText.value, el.lookupZone.value, p));
  } catch (e) {
    el.lookupResult.innerHTML = `<p class="error">${escapeHtml(e instanceof Error ? e.message : String(e))}</p>`;
  }
  state.lookedUp = true;
}

function exportCsv(): void {
  const p = state.profile;
  const view = state.view;
  if (!p || !view) return;
  const table = dimensionTableFromProfile(p, { start: view.first, end: view.end, calendar: state.calendar });
  saveText(`${p.id}-${view.fiscalYear}-${view.label}.csv`, formatTableCsv(table), 'text/csv');
}

// ---- events -----------------------------------------------------------------------------------------------

let pending: ReturnType<typeof setTimeout> | undefined;
el.text.addEventListener('input', () => {
  clearTimeout(pending);
  pending = setTimeout(() => applyText('profile edited'), 200);
});
el.useDemo.addEventListener('click', () => {
  el.text.value = demoText;
  applyText('demo profile loaded');
});
el.openFile.addEventListener('change', async () => {
  const file = el.openFile.files?.[0];
  if (!file) return;
  el.text.value = await file.text();
  el.openFile.value = ''; // the text box holds it now; the same file can be opened again
  applyText('file opened', file.name);
});
el.faults.addEventListener('click', (event) => {
  const button = (event.target as HTMLElement).closest<HTMLButtonElement>('button.fault-path');
  if (!button) return;
  const fault = state.faults[Number(button.dataset['index'])];
  const at = fault ? placeOfPath(el.text.value, fault.path) : undefined;
  el.text.focus();
  if (at !== undefined) el.text.setSelectionRange(at, at);
});

function redraw(reason: string, change: () => void): void {
  const t0 = performance.now();
  change();
  draw();
  measure(t0, reason);
}

el.fiscalYear.addEventListener('change', () =>
  redraw('fiscal year chosen', () => {
    const p = state.profile!;
    const view = state.view;
    state.fiscalYear = el.fiscalYear.value;
    // Keep the day the reader was at: the focused cell, else today when it is in view, else the year's first day.
    const today = todayOf(p);
    const anchor = state.focusDay ?? (!view || (today >= view.first && today < view.end) ? today : view.first);
    state.ordinal = clampOrdinal(p, p.fiscalYears[state.fiscalYear]!.ordinalFromDayNumber(anchor));
  }),
);
el.year.addEventListener('change', () => redraw('year chosen', () => (state.ordinal = Number(el.year.value))));
el.previous.addEventListener('click', () => redraw('previous year', () => (state.ordinal -= 1)));
el.next.addEventListener('click', () => redraw('next year', () => (state.ordinal += 1)));
el.calendar.addEventListener('change', () =>
  redraw('calendar chosen', () => {
    state.calendar = el.calendar.value;
    state.ordinal = clampOrdinal(state.profile!, state.ordinal); // within the years the calendar covers
  }),
);
el.rule.addEventListener('change', () => redraw('schedule chosen', () => (state.rule = el.rule.value)));
for (const r of radios('rows')) r.addEventListener('change', () => redraw('rows chosen', () => (state.rows = r.value as RowLevel)));
for (const r of radios('cells')) r.addEventListener('change', () => redraw('cells chosen', () => (state.cells = r.value as CellLevel)));
el.controls.addEventListener('submit', (event) => event.preventDefault());

el.grid.addEventListener('focusin', (event) => {
  const day = (event.target as HTMLElement).dataset['dayNumber'];
  if (day !== undefined) state.focusDay = Number(day);
});
attachGridKeys(el.grid, (dayNumber) => {
  state.focusDay = dayNumber;
  el.lookupText.value = formatPlainDate(dayNumber);
  lookUp();
});
el.lookupForm.addEventListener('submit', (event) => {
  event.preventDefault();
  lookUp();
});
el.exportCsv.addEventListener('click', exportCsv);
el.print.addEventListener('click', () => window.print());

// Zone ids for the lookup's zone field, from the runtime (no request: Intl knows them).
el.zoneIds.innerHTML = (Intl as { supportedValuesOf?: (key: string) => string[] }).supportedValuesOf?.('timeZone').map((z) => `<option value="${escapeHtml(z)}"></option>`).join('') ?? '';
