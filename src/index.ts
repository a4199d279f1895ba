/**
 * kalends: calendar-aware time indexing. This file is the public surface and nothing else; every export is
 * documented where it is defined.
 *
 * @module kalends
 */
export {
  type ErrorCode,
  type KalendsErrorFields,
  type KalendsErrorOptions,
  type DefinitionIssue,
  KalendsRangeError,
  KalendsTypeError,
  KalendsSyntaxError,
  DefinitionError,
} from './errors.js';
export * from './bounds.js';
export * from './civil/index.js';
export * from './instant/index.js';
export * from './zone/index.js';
export * from './period/index.js';
export * from './business/index.js';
export * from './daycount/index.js';
export * from './recurrence/index.js';
export * from './hours/index.js';
export * from './series/index.js';
export * from './profile/index.js';
export * from './warehouse/index.js';
