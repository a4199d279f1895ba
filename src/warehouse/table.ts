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
  | {
      /** The column's name (a SQL identifier). */
      readonly name: string;
      /** `int32`, or `date` for day numbers. */
      readonly type: 'int32' | 'date';
      /** One value per row. */
      readonly values: Int32Array;
      /** 1 for a row that holds a value, 0 for SQL NULL; absent when every row holds one. */
      readonly valid?: Uint8Array;
      /** What the column holds, for the SQL file's comments. */
      readonly description: string;
    }
  | {
      /** The column's name (a SQL identifier). */
      readonly name: string;
      /** `int64`: epoch milliseconds. */
      readonly type: 'int64';
      /** One value per row, each an integer. */
      readonly values: Float64Array;
      /** 1 for a row that holds a value, 0 for SQL NULL; absent when every row holds one. */
      readonly valid?: Uint8Array;
      /** What the column holds, for the SQL file's comments. */
      readonly description: string;
    }
  | {
      /** The column's name (a SQL identifier). */
      readonly name: string;
      /** `boolean`. */
      readonly type: 'boolean';
      /** One value per row: 1 for true, 0 for false. */
      readonly values: Uint8Array;
      /** 1 for a row that holds a value, 0 for SQL NULL; absent when every row holds one. */
      readonly valid?: Uint8Array;
      /** What the column holds, for the SQL file's comments. */
      readonly description: string;
    }
  | {
      /** The column's name (a SQL identifier). */
      readonly name: string;
      /** `string`. */
      readonly type: 'string';
      /** One value per row; null is SQL NULL. */
      readonly values: readonly (string | null)[];
      /** What the column holds, for the SQL file's comments. */
      readonly description: string;
    };

/** A table for a warehouse: a name (a SQL identifier), its rows' count and its columns, all of that length. */
export interface WarehouseTable {
  /** The table's name (a SQL identifier). */
  readonly name: string;
  /** The number of rows. */
  readonly rowCount: number;
  /** The columns, each of `rowCount` values. */
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
