/**
 * A zone's first scalar queries are answered by one Intl probe each, before any year of the zone is compiled
 * (src/zone/engine.ts, IntlEngine.offsetAt). Each such answer must equal the answer of temporal-polyfill
 * (ECMA-262 Temporal, ZonedDateTime offsetNanoseconds), including the milliseconds on either side of a transition
 * and instants that are not whole seconds; and the id must keep its case normalization without the list of ids.
 */
import { describe, expect, it } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { clearZoneCache, offsetSecondsFromEpochMs, zoneFromId } from '../../src/zone/index.js';

/** Offset changes from temporal-polyfill's own transition search (getTimeZoneTransition), near 2025. */
function transitionsNear(id: string): number[] {
  const out: number[] = [];
  let z = Temporal.Instant.fromEpochMilliseconds(Date.UTC(2024, 0, 1)).toZonedDateTimeISO(id);
  for (let k = 0; k < 4; k++) {
    const next = z.getTimeZoneTransition('next');
    if (!next) break;
    out.push(next.epochMilliseconds);
    z = next;
  }
  return out;
}

const referenceOffset = (id: string, ms: number): number => Temporal.Instant.fromEpochMilliseconds(ms).toZonedDateTimeISO(id).offsetNanoseconds / 1e9;

describe('first queries of a fresh zone (one probe each, no compiled year)', () => {
  for (const id of ['America/New_York', 'Europe/London', 'Australia/Lord_Howe', 'Asia/Kolkata', 'America/St_Johns']) {
    it(`${id}: agrees with temporal-polyfill around its transitions, every query on a fresh zone`, () => {
      const instants: number[] = [Date.UTC(2025, 6, 1, 12, 0, 0, 500), Date.UTC(1901, 0, 1), Date.UTC(2150, 5, 1, 0, 0, 0, 999)];
      for (const t of transitionsNear(id)) instants.push(t - 1001, t - 1000, t - 1, t, t + 1, t + 999, t + 1000);
      for (const ms of instants) {
        clearZoneCache();
        expect(offsetSecondsFromEpochMs(zoneFromId(id), ms), `${id} at ${new Date(ms).toISOString()}`).toBe(referenceOffset(id, ms));
      }
      // And the same instants in a row on one zone: the first 16 by probes, the rest from compiled years.
      clearZoneCache();
      const z = zoneFromId(id);
      for (const ms of [...instants, ...instants]) expect(offsetSecondsFromEpochMs(z, ms)).toBe(referenceOffset(id, ms));
    });
  }

  it('keeps the case normalization of ids, links included (ECMA-402 resolvedOptions().timeZone)', () => {
    clearZoneCache();
    expect(zoneFromId('america/new_york').id).toBe('America/New_York');
    expect(zoneFromId('ASIA/CALCUTTA').id).toBe(new Intl.DateTimeFormat('en-US', { timeZone: 'Asia/Calcutta' }).resolvedOptions().timeZone);
    expect(zoneFromId('Europe/Paris').id).toBe('Europe/Paris');
  });
});
