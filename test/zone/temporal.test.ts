/**
 * Local -> instant and instant -> local against the reference Temporal polyfill (@js-temporal/polyfill,
 * ZonedDateTime.from with each disambiguation of ECMA-262 Temporal, `ToTemporalDisambiguation`; and
 * Instant.toZonedDateTimeISO). Both read the runtime's Intl data, so they must agree exactly, inside gaps and
 * overlaps too.
 */
import { describe, expect, it } from 'vitest';
import { Temporal } from '@js-temporal/polyfill';
import {
  type Disambiguation,
  epochMsFromWallMs,
  listTransitions,
  nextTransition,
  previousTransition,
  resolveWallMs,
  wallFieldsFromEpochMs,
  WallTimeRejectedError,
} from '../../src/zone/index.js';
import { seededRandom } from '../../bench/harness.js';
import { ISSUE_ZONES, SEED } from './helpers.js';
import { dayOfPacked, monthOfPacked, packedYmdUnchecked, yearOfPacked } from '../../src/civil/gregorian.js';

const MODES: readonly Disambiguation[] = ['compatible', 'earlier', 'later', 'reject'];
const ZONES = [...ISSUE_ZONES, 'America/Santiago', 'America/Havana', 'Asia/Beirut', 'Europe/Moscow', 'America/Los_Angeles'];

function fieldsOfWall(wall: number) {
  const dn = Math.floor(wall / 86_400_000);
  const p = packedYmdUnchecked(dn);
  const ms = wall - dn * 86_400_000;
  return {
    year: yearOfPacked(p),
    month: monthOfPacked(p),
    day: dayOfPacked(p),
    hour: Math.floor(ms / 3_600_000),
    minute: Math.floor(ms / 60_000) % 60,
    second: Math.floor(ms / 1000) % 60,
    millisecond: ms % 1000,
  };
}

function reference(zone: string, wall: number, mode: Disambiguation): number | 'throws' {
  try {
    return Temporal.ZonedDateTime.from({ timeZone: zone, ...fieldsOfWall(wall) }, { disambiguation: mode }).epochMilliseconds;
  } catch (e) {
    if (e instanceof RangeError) return 'throws';
    throw e;
  }
}

function ours(zone: string, wall: number, mode: Disambiguation): number | 'throws' {
  try {
    return epochMsFromWallMs(zone, wall, mode);
  } catch (e) {
    if (e instanceof WallTimeRejectedError) return 'throws';
    throw e;
  }
}

describe('local -> instant equals @js-temporal/polyfill ZonedDateTime.from, each disambiguation', () => {
  for (const zone of ZONES) {
    it(zone, () => {
      const rnd = seededRandom(SEED + zone.length * 7);
      const walls: number[] = [];
      // Around transitions (inside gaps and overlaps, and just outside them), 1900-2040.
      const ts = listTransitions(zone, Date.UTC(1900, 0, 1), Date.UTC(2040, 0, 1));
      const picked = ts.length <= 24 ? ts : Array.from({ length: 24 }, () => ts[Math.floor(rnd() * ts.length)]!);
      for (const t of picked) {
        const localBefore = t.epochMs + t.offsetBeforeSeconds * 1000;
        const width = Math.abs(t.offsetAfterSeconds - t.offsetBeforeSeconds) * 1000;
        walls.push(localBefore, localBefore - 1, localBefore + width, localBefore + width - 1);
        for (let i = 0; i < 4; i++) walls.push(localBefore - width + Math.floor(rnd() * 3 * width / 1000) * 1000);
      }
      // Random local date-times 1900-2100.
      for (let i = 0; i < 40; i++) walls.push(Math.floor((Date.UTC(1900, 0, 1) + rnd() * (Date.UTC(2100, 0, 1) - Date.UTC(1900, 0, 1))) / 1000) * 1000);
      let gaps = 0;
      let overlaps = 0;
      for (const wall of walls) {
        const kind = resolveWallMs(zone, wall).kind;
        if (kind === 'gap') gaps++;
        if (kind === 'overlap') overlaps++;
        for (const mode of MODES) expect(ours(zone, wall, mode), `${zone} ${new Date(wall).toISOString()} ${mode}`).toBe(reference(zone, wall, mode));
      }
      if (ts.length > 0) expect(gaps + overlaps, `${zone}: the sample reaches gaps or overlaps`).toBeGreaterThan(0);
    });
  }
});

describe('instant -> local equals @js-temporal/polyfill Instant.toZonedDateTimeISO', () => {
  for (const zone of ZONES) {
    it(zone, () => {
      const rnd = seededRandom(SEED + zone.length * 13);
      for (let i = 0; i < 150; i++) {
        const t = Math.floor(Date.UTC(1850, 0, 1) + rnd() * (Date.UTC(2150, 0, 1) - Date.UTC(1850, 0, 1)));
        const z = Temporal.Instant.fromEpochMilliseconds(t).toZonedDateTimeISO(zone);
        const f = wallFieldsFromEpochMs(zone, t);
        expect([f.year, f.month, f.day, f.hour, f.minute, f.second, f.millisecond, f.offsetSeconds * 1e9], `${zone} ${t}`).toEqual([
          z.year, z.month, z.day, z.hour, z.minute, z.second, z.millisecond, z.offsetNanoseconds,
        ]);
        expect(f.weekday).toBe(z.dayOfWeek);
      }
    });
  }
});

describe('next and previous transition equal @js-temporal/polyfill getTimeZoneTransition', () => {
  for (const zone of ['America/New_York', 'Australia/Lord_Howe', 'Africa/Casablanca', 'Pacific/Apia', 'Asia/Kolkata']) {
    it(zone, () => {
      const rnd = seededRandom(SEED + zone.length);
      for (let i = 0; i < 12; i++) {
        const t = Math.floor(Date.UTC(1900, 0, 1) + rnd() * (Date.UTC(2060, 0, 1) - Date.UTC(1900, 0, 1)));
        const z = Temporal.Instant.fromEpochMilliseconds(t).toZonedDateTimeISO(zone);
        const n = z.getTimeZoneTransition('next');
        const p = z.getTimeZoneTransition('previous');
        expect(nextTransition(zone, t)?.epochMs ?? null, `${zone} next after ${t}`).toBe(n ? n.epochMilliseconds : null);
        expect(previousTransition(zone, t)?.epochMs ?? null, `${zone} previous before ${t}`).toBe(p ? p.epochMilliseconds : null);
      }
    });
  }
});
