/**
 * The year's picture as markup (rows of fixed-size cells with the ARIA grid roles: fixed sizes keep the page's
 * layout cheap, so that a year redraws within a frame or a few), and keyboard navigation through it with a
 * roving tabindex: exactly one cell is in the tab order; the arrow keys, Home and End, Page Up and Page Down move
 * it; Enter or Space looks the cell's date up.
 */
import type { Cell, Row, YearView } from './year.js';
import { escapeHtml } from './dom.js';

/** The text marks drawn in cells (colour is never the only sign; the legend explains each). */
export const MARKS = { holiday: '◆', adjusted: '▲', unadjusted: '△' } as const;

const LEVEL_WORDS = { quarter: 'a row per quarter', period: 'a row per period', week: 'a row per week' } as const;

/** The cell's text marks, drawn by the stylesheet from `data-marks` (the accessible label says them in words). */
function cellMarks(cell: Cell): string {
  let m = '';
  if (cell.holidays.length > 0) m += MARKS.holiday;
  if (cell.marks.some((k) => k.kind === 'adjusted')) m += MARKS.adjusted;
  if (cell.marks.some((k) => k.kind === 'unadjusted')) m += MARKS.unadjusted;
  return m;
}

function cellHtml(cell: Cell, column: number, firstInRow: boolean): string {
  const classes = ['cell', cell.kind];
  if (cell.kind === 'day') {
    classes.push(cell.business ? 'business' : 'closed');
    if (cell.weekend) classes.push('weekend');
  }
  if (cell.holidays.length > 0) classes.push('holiday');
  if (cell.today) classes.push('today');
  if (cell.extraWeek) classes.push('extra-week');
  // A period that starts inside a row (rows of quarters, months of a year of weeks) gets a heavy left edge.
  if (cell.periodStart && !firstInRow) classes.push('period-start');
  if (cell.marks.length > 0) classes.push('marked');
  const label = escapeHtml(cell.label);
  const common = `role="gridcell" tabindex="-1" class="${classes.join(' ')}" data-col="${column}" data-day="${cell.kind === 'day' ? cell.date : ''}" aria-label="${label}" title="${label}"`;
  // One face per cell, its small texts (the month on the 1st, the marks) drawn from data attributes: few boxes to
  // lay out. The face is hidden from assistive technology; the cell's label says everything.
  const marks = cellMarks(cell);
  const extra = `${marks ? ` data-marks="${marks}"` : ''}`;
  if (cell.kind === 'day') {
    const month = cell.monthMark ? ` data-month="${escapeHtml(cell.monthMark)}"` : '';
    return `<div ${common} data-day-number="${cell.dayNumber}" data-business="${cell.business}" data-holiday="${escapeHtml(cell.holidays.join('; '))}"><span class="face" aria-hidden="true"${month}${extra}>${cell.dayOfMonth}</span></div>`;
  }
  return `<div ${common} data-day-number="${cell.dayNumber}" data-end-day-number="${cell.endDayNumber}" data-business-days="${cell.businessDays}" data-week="${escapeHtml(cell.weekLabel)}"><span class="face" aria-hidden="true" data-month="W${cell.index}"${extra}>${cell.businessDays}</span></div>`;
}

/** The last part of a canonical label, for a short tag: `FY2025-Q1` gives `Q1`. */
function shortLabel(label: string): string {
  return label.slice(label.lastIndexOf('-') + 1);
}

function rowHtml(row: Row): string {
  const classes = ['row'];
  if (row.quarterStart) classes.push('quarter-start');
  if (row.periodStart) classes.push('period-row-start');
  if (row.extraWeek) classes.push('extra-week-row');
  const tags: string[] = [];
  if (row.quarterStart) tags.push(`<span class="tag quarter-tag" title="${escapeHtml(row.quarterStart)} starts">${escapeHtml(shortLabel(row.quarterStart))}</span>`);
  if (row.periodStart) tags.push(`<span class="tag period-tag" title="${escapeHtml(row.periodStart)} starts">${escapeHtml(shortLabel(row.periodStart))}</span>`);
  if (row.extraWeek) tags.push('<span class="tag extra-tag" title="the 53rd week">53rd wk</span>');
  const days = row.end - row.first;
  const length = days % 7 === 0 ? `${days / 7} wk` : `${days} d`;
  const second = [row.peopleLabel, length].filter(Boolean).map((t) => escapeHtml(t!)).join(' · ');
  const head = `<div role="rowheader" class="row-head" data-first="${row.first}" data-end="${row.end}"><span class="row-label">${escapeHtml(row.label)}${tags.join('')}</span><span class="people">${second}</span></div>`;
  // Empty columns before the first day, so that weekdays line up (a class per width: the page allows no inline style).
  const pad = row.offset > 0 ? `<div class="pad pad-${row.offset}" aria-hidden="true"></div>` : '';
  let cells = '';
  row.cells.forEach((c, i) => {
    cells += cellHtml(c, row.offset + i, i === 0);
  });
  return `<div role="row" class="${classes.join(' ')}" data-label="${escapeHtml(row.label)}">${head}${pad}${cells}</div>`;
}

/** The caption and the inner markup of the year's grid. */
export function yearGridHtml(view: YearView, fiscalYearName: string): { caption: string; html: string } {
  const caption = `${view.label} of fiscal year "${fiscalYearName}"${view.peopleLabel ? ` (${view.peopleLabel})` : ''}: ${view.rows.length} rows, ${LEVEL_WORDS[view.rowLevel]}, a cell per ${view.cellLevel}`;
  const corner = { quarter: 'Quarter', period: 'Period', week: 'Week' }[view.rowLevel];
  const heads = view.columnHeads.map((h) => `<div role="columnheader" class="col-head" aria-label="${escapeHtml(h.full)}">${escapeHtml(h.text)}</div>`).join('');
  const html = `<div role="row" class="row head-row"><div role="columnheader" class="row-head">${corner}</div>${heads}</div>${view.rows.map(rowHtml).join('')}`;
  return { caption, html };
}

// ---- keyboard ------------------------------------------------------------------------------------------------

function cellRows(grid: HTMLElement): HTMLElement[][] {
  return Array.from(grid.querySelectorAll<HTMLElement>('[role="row"]'), (row) => Array.from(row.querySelectorAll<HTMLElement>('[role="gridcell"]'))).filter((r) => r.length > 0);
}

function place(rows: HTMLElement[][], cell: HTMLElement): [number, number] {
  for (let r = 0; r < rows.length; r++) {
    const c = rows[r]!.indexOf(cell);
    if (c >= 0) return [r, c];
  }
  return [0, 0];
}

/** The cell of row `r` nearest column `col`. */
function nearest(row: HTMLElement[], col: number): HTMLElement | undefined {
  let best: HTMLElement | undefined;
  let dist = Infinity;
  for (const c of row) {
    const d = Math.abs(Number(c.dataset['col']) - col);
    if (d < dist) {
      dist = d;
      best = c;
    }
  }
  return best;
}

/** Makes `cell` the one cell in the tab order, and focuses it when `focus`. */
export function rove(grid: HTMLElement, cell: HTMLElement, focus: boolean): void {
  for (const c of Array.from(grid.querySelectorAll<HTMLElement>('[role="gridcell"][tabindex="0"]'))) if (c !== cell) c.tabIndex = -1;
  cell.tabIndex = 0;
  if (focus) cell.focus();
}

/** The cell that holds day `dayNumber` (a day cell, or the week cell whose range holds it). */
export function cellOfDay(grid: HTMLElement, dayNumber: number): HTMLElement | undefined {
  for (const c of Array.from(grid.querySelectorAll<HTMLElement>('[role="gridcell"]'))) {
    const a = Number(c.dataset['dayNumber']);
    const b = c.dataset['endDayNumber'] === undefined ? a + 1 : Number(c.dataset['endDayNumber']);
    if (dayNumber >= a && dayNumber < b) return c;
  }
  return undefined;
}

/**
 * Wires the keys once on the grid (the rows inside may be replaced at will). `onPick` gets the first day of a
 * cell chosen with Enter, Space or a click.
 */
export function attachGridKeys(grid: HTMLElement, onPick: (dayNumber: number) => void): void {
  grid.addEventListener('keydown', (event) => {
    const cell = (event.target as HTMLElement).closest<HTMLElement>('[role="gridcell"]');
    if (!cell) return;
    const rows = cellRows(grid);
    const [r, c] = place(rows, cell);
    const row = rows[r]!;
    const col = Number(cell.dataset['col']);
    let next: HTMLElement | undefined;
    switch (event.key) {
      case 'ArrowRight':
        next = row[c + 1] ?? rows[r + 1]?.[0];
        break;
      case 'ArrowLeft':
        next = row[c - 1] ?? rows[r - 1]?.[rows[r - 1]!.length - 1];
        break;
      case 'ArrowDown':
        next = rows[r + 1] ? nearest(rows[r + 1]!, col) : undefined;
        break;
      case 'ArrowUp':
        next = rows[r - 1] ? nearest(rows[r - 1]!, col) : undefined;
        break;
      case 'PageDown':
        next = nearest(rows[Math.min(rows.length - 1, r + 4)]!, col);
        break;
      case 'PageUp':
        next = nearest(rows[Math.max(0, r - 4)]!, col);
        break;
      case 'Home':
        next = event.ctrlKey ? rows[0]?.[0] : row[0];
        break;
      case 'End': {
        const last = event.ctrlKey ? rows[rows.length - 1]! : row;
        next = last[last.length - 1];
        break;
      }
      case 'Enter':
      case ' ':
        event.preventDefault();
        onPick(Number(cell.dataset['dayNumber']));
        return;
      default:
        return;
    }
    event.preventDefault();
    if (next) rove(grid, next, true);
  });
  grid.addEventListener('click', (event) => {
    const cell = (event.target as HTMLElement).closest<HTMLElement>('[role="gridcell"]');
    if (!cell) return;
    rove(grid, cell, true);
    onPick(Number(cell.dataset['dayNumber']));
  });
}
