/**
 * Warehouse tables: named, typed columns over typed arrays, the form every export (CSV, JSON Lines, Parquet, SQL)
 * is written from.
 *
 * @module
 */

/** A column's type, as SQL engines and Parquet know it. */
export type WarehouseColumnType = 'int32' | 'int64' | 'boolean' | 'date' | 'string';

/**
 * One column. Values by type: `int32` and `date` (a day number) in an Int32Array, `int64` (epoch milliseconds) in
 * a Float64Array of integers, `boolean` in a Uint8Array of 0 and 1, `string` in an array of strings and nulls.
 * `valid` (when present) marks the rows that hold a value: 0 is SQL NULL.
 */
export type WarehouseColumn =
  | { readonly name: string; readonly type: 'int32' | 'date'; readonly values: Int32Array; readonly valid?: Uint8Array; readonly description: string }
  | { readonly name: string; readonly type: 'int64'; readonly values: Float64Array; readonly valid?: Uint8Array; readonly description: string }
  | { readonly name: string; readonly type: 'boolean'; readonly values: Uint8Array; readonly valid?: Uint8Array; readonly description: string }
  | { readonly name: string; readonly type: 'string'; readonly values: readonly (string | null)[]; readonly description: string };

/** A table for a warehouse: a name (a SQL identifier), its rows' count and its columns, all of that length. */
export interface WarehouseTable {
  readonly name: string;
  readonly rowCount: number;
  readonly columns: readonly WarehouseColumn[];
  /** What one row is, for the SQL file's comments. */
  readonly description: string;
}

/** @internal A SQL identifier from a profile name: lower case, hyphens to underscores. */
export function columnName(name: string): string {
  return name.replace(/-/g, '_');
}

/** @internal Whether row `i` of `column` holds a value. */
export function hasValue(column: WarehouseColumn, i: number): boolean {
  if (column.type === 'string') return column.values[i] !== null;
  return column.valid === undefined || column.valid[i] === 1;
}
