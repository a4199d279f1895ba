/**
 * Error classes of the zone layer. Each extends one of the four kalends classes (see docs/design.md, "Errors"),
 * so `instanceof RangeError` / `SyntaxError` and the stable `code` keep working.
 *
 * @module
 */
import { KalendsRangeError, KalendsSyntaxError, describeValue } from '../errors.js';

/**
 * A zone id that neither the runtime's Intl nor the chosen rules source knows. `suggestions` holds the closest
 * valid ids by edit distance (at most three), also shown in the message.
 *
 * @example
 * ```ts
 * try { zoneFromId('Europe/Londn'); } catch (e) { (e as UnknownZoneError).suggestions; } // ['Europe/London']
 * ```
 */
export class UnknownZoneError extends KalendsRangeError {
  /** The closest valid ids by edit distance (at most three; empty when none is close). */
  readonly suggestions: readonly string[];
  constructor(name: string, id: unknown, suggestions: readonly string[], where = "the runtime's Intl time zone list") {
    const hint = suggestions.length > 0 ? `; did you mean ${suggestions.map((s) => JSON.stringify(s)).join(' or ')}?` : '';
    super(
      `${name}: unknown time zone ${describeValue(id)}; expected an IANA id from ${where}, "UTC", or a fixed offset like "+05:30"${hint}`,
      { code: 'unknown-zone', received: id },
    );
    this.name = 'UnknownZoneError';
    this.suggestions = Object.freeze([...suggestions]);
  }
}

/**
 * A local date-time that was rejected under `disambiguation: 'reject'` because the zone's clocks skipped it
 * (`code: 'skipped-time'`, `kind: 'gap'`) or showed it twice (`code: 'repeated-time'`, `kind: 'overlap'`).
 *
 * @example
 * ```ts
 * // 2025-03-09T02:30 did not happen in America/New_York:
 * try { epochMsFromWallMs('America/New_York', wallMs, 'reject'); } catch (e) { (e as WallTimeRejectedError).kind; } // 'gap'
 * ```
 */
export class WallTimeRejectedError extends KalendsRangeError {
  /** `'gap'` when the clocks skipped the wall time, `'overlap'` when they showed it twice. */
  readonly kind: 'gap' | 'overlap';
  /** The id of the zone. */
  readonly zoneId: string;
  constructor(message: string, kind: 'gap' | 'overlap', zoneId: string, wallMs: number) {
    super(message, { code: kind === 'gap' ? 'skipped-time' : 'repeated-time', received: wallMs });
    this.name = 'WallTimeRejectedError';
    this.kind = kind;
    this.zoneId = zoneId;
  }
}

/**
 * TZif bytes that break RFC 8536 (bad magic, counts past the end, unsorted transitions, a bad footer ...).
 * `position` is the byte offset where reading failed.
 *
 * @example
 * ```ts
 * try { zoneFromTzif(new Uint8Array(3)); } catch (e) { (e as CorruptTzifError).code; } // 'corrupt-tzif'
 * ```
 */
export class CorruptTzifError extends KalendsSyntaxError {
  constructor(message: string, position: number, received: unknown) {
    super(`bytes: corrupt TZif data at byte ${position}: ${message}`, { code: 'corrupt-tzif', received, position });
    this.name = 'CorruptTzifError';
  }
}
