/**
 * Warehouse tables as text: CSV (RFC 4180, with a header row) and JSON Lines (one JSON object per row).
 *
 * @module
 */
import { KalendsTypeError, describeValue } from '../errors.js';
import { formatPlainDate } from './deps.js';
import { type WarehouseColumn, type WarehouseTable, hasValue } from './table.js';

/** @internal Throws unless `table` looks like a warehouse table. */
export function requireTable(table: unknown, name = 'table'): WarehouseTable {
  const t = table as WarehouseTable;
  if (typeof t !== 'object' || t === null || typeof t.name !== 'string' || !Array.isArray(t.columns) || typeof t.rowCount !== 'number') {
    throw new KalendsTypeError(`${name}: expected a warehouse table (from dimensionTableFromProfile, transitionTableFromZones or scheduleTableFromProfile), got ${describeValue(table)}`, {
      code: 'invalid-type',
      received: table,
    });
  }
  return t;
}

function csvText(s: string): string {
  return s === '' || /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** @internal A cell as text, or null for SQL NULL. */
function cellText(c: WarehouseColumn, i: number): string | null {
  if (!hasValue(c, i)) return null;
  switch (c.type) {
    case 'string':
      return c.values[i]!;
    case 'boolean':
      return c.values[i] === 1 ? 'true' : 'false';
    case 'date':
      return formatPlainDate(c.values[i]!);
    default:
      return String(c.values[i]!);
  }
}

/**
 * The table as CSV (RFC 4180): a header row of column names, then one line per row, `\n` line ends. NULL is an
 * empty field; an empty string is `""`; booleans are `true` and `false`; dates are ISO 8601 (`YYYY-MM-DD`).
 * DuckDB's and PostgreSQL's CSV readers take it as it is (see the SQL of {@link formatLoadSql}).
 *
 * @example
 * ```ts
 * formatTableCsv(dimensionTableFromProfile(profile, { start: '2026-01-01', end: '2026-01-02' })).split('\n')[0];
 * // 'day_number,calendar_date,iso_week_year,...'
 * ```
 */
export function formatTableCsv(table: WarehouseTable): string {
  const t = requireTable(table);
  const parts: string[] = [t.columns.map((c) => csvText(c.name)).join(',')];
  for (let i = 0; i < t.rowCount; i++) {
    let line = '';
    for (let k = 0; k < t.columns.length; k++) {
      const v = cellText(t.columns[k]!, i);
      if (k > 0) line += ',';
      if (v !== null) line += t.columns[k]!.type === 'string' ? csvText(v) : v;
    }
    parts.push(line);
  }
  return `${parts.join('\n')}\n`;
}

/**
 * The table as JSON Lines: one JSON object per row, keys in column order; dates as ISO 8601 text, instants
 * (`int64`) as numbers, NULL as null.
 *
 * @example
 * ```ts
 * formatTableJsonLines(transitionTableFromZones(['UTC'], 0, 86_400_000));
 * // '{"zone":"UTC","from_epoch_ms":0,"to_epoch_ms":86400000,"offset_seconds":0,"is_dst":false,"abbreviation":"UTC"}\n'
 * ```
 */
export function formatTableJsonLines(table: WarehouseTable): string {
  const t = requireTable(table);
  const lines: string[] = [];
  for (let i = 0; i < t.rowCount; i++) {
    const row: Record<string, string | number | boolean | null> = {};
    for (const c of t.columns) {
      if (!hasValue(c, i)) row[c.name] = null;
      else if (c.type === 'boolean') row[c.name] = c.values[i] === 1;
      else if (c.type === 'date') row[c.name] = formatPlainDate(c.values[i]!);
      else row[c.name] = c.values[i]!;
    }
    lines.push(JSON.stringify(row));
  }
  return lines.length === 0 ? '' : `${lines.join('\n')}\n`;
}
