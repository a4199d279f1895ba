/**
 * Public surface of the warehouse layer: a profile's calendar as tables for SQL engines (the calendar dimension,
 * zone offset periods, schedules), as CSV and JSON Lines, with the SQL that loads and queries them. Parquet files
 * are written by the `kalends/warehouse` subpath (Node.js), which bundles a Parquet writer.
 */
export { type WarehouseColumnType, type WarehouseColumn, type WarehouseTable } from './table.js';
export { type ExportRangeOptions, dimensionTableFromProfile } from './dimension.js';
export { transitionTableFromZones } from './transitions.js';
export { scheduleTableFromProfile } from './schedules.js';
export { formatTableCsv, formatTableJsonLines } from './text.js';
export { type SqlDialect, type LoadFormat, type LoadSqlOptions, type ExampleQueriesOptions, formatLoadSql, formatExampleQueriesSql } from './sql.js';
