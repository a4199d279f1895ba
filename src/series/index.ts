/**
 * Public surface of the series layer: columnar time-indexed values on typed arrays, bucketed into periods,
 * filled onto grids, rolled over windows, smoothed, lagged and joined. See docs/series.md.
 */
export {
  type Series,
  type InputOrder,
  type SeriesOptions,
  type RecordOptions,
  type PairOptions,
  type InstantLike,
  seriesFromColumns,
  seriesFromRecords,
  seriesFromPairs,
  columnOfSeries,
  seriesFromSeries,
  sliceSeries,
} from './series.js';
export { type QuantileMethod } from './numeric.js';
export { type AggregationName, type AggregationSpec, type Aggregation, AGGREGATION_NAMES } from './aggregate.js';
export {
  type EmptyPolicy,
  type MissingPolicy,
  type PeriodRange,
  type BucketOptions,
  type BucketTable,
  bucketSeries,
  seriesFromBuckets,
} from './bucket.js';
export { type BucketAccumulatorOptions, type BucketAccumulator, type BucketFinishOptions, defineBucketAccumulator } from './accumulate.js';
export { type CalendarSpan, type WindowSpec } from './rolling-window.js';
export { type RollingAggregationName } from './rolling-kernel.js';
export { type RollingAggregation, type RollOptions, type RollBulkOptions, rollSeries, rollBulk } from './rolling.js';
export { type SmoothOptions, type SmoothingForm, smoothSeries } from './smoothing.js';
export {
  type LagAmount,
  type LagOptions,
  type PeriodChangeOptions,
  type PeriodChange,
  lagSeries,
  leadSeries,
  periodChangeFromBuckets,
} from './lag.js';
export {
  type AsOfOptions,
  type JoinAsOfOptions,
  type AlignOptions,
  type AlignedTable,
  matchAsOf,
  joinAsOf,
  alignSeries,
} from './join.js';
export { type FillGrid, type FillMethod, type FillOptions, fillSeries } from './fill.js';
export { type RecurrenceGrid } from './grid.js';
