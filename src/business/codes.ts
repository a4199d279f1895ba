/**
 * @internal The small integer codes of holiday-rule kinds and observance shifts, and the tables from their
 * names in definitions. Shared by the validator (./holiday-rules.ts), the trusted compiler of the bundled
 * definitions (./trusted.ts) and the evaluator (./rules.ts, ./periodic.ts); kept apart from the validator so
 * that a program that only takes a bundled calendar by name does not bundle it.
 *
 * @module
 */
import type { ObservanceShift } from './definition.js';

/** Rule kinds as small integers. */
export const KIND_FIXED = 0;
export const KIND_NTH = 1;
export const KIND_ON_OR_AFTER = 2;
export const KIND_ON_OR_BEFORE = 3;
export const KIND_EASTER = 4;
export const KIND_RELATIVE = 5;

/** Observance shift codes (0 = stay). */
export const SHIFT_NONE = 0;
export const SHIFT_PREVIOUS = 1;
export const SHIFT_NEXT = 2;
export const SHIFT_NEAREST = 3;
export const SHIFT_SUBSTITUTE = 4;

/** Shift codes by their names in definitions. */
export const SHIFT_CODES: Readonly<Record<ObservanceShift, number>> = /* @__PURE__ */ Object.freeze({
  'previous-non-weekend-day': SHIFT_PREVIOUS,
  'next-non-weekend-day': SHIFT_NEXT,
  'nearest-non-weekend-day': SHIFT_NEAREST,
  'substitute-day': SHIFT_SUBSTITUTE,
});

/** Rule kind codes by their names in definitions. */
export const KIND_CODES: Readonly<Record<string, number>> = /* @__PURE__ */ Object.freeze({
  fixed: KIND_FIXED,
  'nth-weekday': KIND_NTH,
  'weekday-on-or-after': KIND_ON_OR_AFTER,
  'weekday-on-or-before': KIND_ON_OR_BEFORE,
  easter: KIND_EASTER,
  relative: KIND_RELATIVE,
});
