/**
 * Diagnostic lines of the tests: what a sweep compared, which tz data differed, how large the pinned data is,
 * why a test was skipped. They are printed only with KALENDS_TEST_VERBOSE=1 (`KALENDS_TEST_VERBOSE=1 npm test`),
 * so that `npm test` prints vitest's own report and nothing else. Every fact a test relies on is asserted by the
 * test; these lines only show it.
 */
export const VERBOSE = process.env.KALENDS_TEST_VERBOSE === '1';

/** Prints one diagnostic line when KALENDS_TEST_VERBOSE=1. */
export function note(line: string): void {
  if (VERBOSE) console.log(line);
}
