/**
 * @internal The diagnostics kit: one issue collector with field readers, one "did you mean" helper, the argument
 * checks (options objects, enums, limits, instants, day numbers, bulk inputs, output arrays) and one reader for
 * period ranges. Every layer builds its checks on this kit; it imports nothing but `errors.ts` and `bounds.ts`.
 *
 * @module
 */
export * from './suggest.js';
export * from './issues.js';
export * from './arguments.js';
export * from './range.js';
