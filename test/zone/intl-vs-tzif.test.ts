/**
 * The Intl-derived tables against IANA TZif data: the vendored fixtures (tz 2025b) at random instants
 * 1900-2100 and at every transition ±1 s, and the Intl search itself driven by TZif data (to prove that it finds
 * transitions 3.99 days apart). Differences between the runtime's tz release and the fixtures' are printed and
 * must equal the list below, with reasons; nothing is skipped silently.
 */
import { describe, expect, it } from 'vitest';
import { listTransitions, offsetSecondsFromEpochMs, wallMsFromEpochMs, zoneFromId } from '../../src/zone/index.js';
import type { Zone } from '../../src/zone/index.js';
import { CHUNK_MS, INTL_STEP_MS, IntlEngine } from '../../src/zone/engine.js';
import { engineOf } from '../../src/zone/zone.js';
import { seededRandom } from '../../bench/harness.js';
import { FIXTURE_ZONES, SEED, fixtureZone } from './helpers.js';
import { note } from '../note.js';
import { dayOfPacked, monthOfPacked, packedYmdUnchecked, yearOfPacked } from '../../src/civil/gregorian.js';

const RUNTIME_TZ = process.versions.tz;

/**
 * Known differences between Node 20's Intl data (tz 2025c, default build) and the fixtures (tz 2025b, Debian's
 * build with backzone), measured on this machine. Each entry: the zone, the last instant where a difference
 * may occur, and the reason.
 */
const KNOWN_FIXTURE_DIFFERENCES: Record<string, { readonly before: number; readonly reason: string }> = {
  'Europe/Amsterdam': {
    before: Date.UTC(1947, 0, 1),
    reason: 'backzone keeps Amsterdam Mean Time (+00:19:32, later +00:20) and Dutch summer times to 1945; the default build makes Europe/Amsterdam a link to Europe/Brussels',
  },
  'Africa/Freetown': {
    before: Date.UTC(1942, 0, 1),
    reason: "backzone keeps Sierra Leone's half-hour summer times of 1935-1941; the default build makes Africa/Freetown a link to Africa/Abidjan",
  },
};

function compare(id: string, intl: Zone, tzif: Zone, instants: Iterable<number>): number[] {
  const bad: number[] = [];
  for (const t of instants) if (offsetSecondsFromEpochMs(intl, t) !== offsetSecondsFromEpochMs(tzif, t)) bad.push(t);
  return bad;
}

describe(`Intl (tz ${RUNTIME_TZ}) against the TZif fixtures (IANA tz 2025b)`, () => {
  const found: Record<string, number[]> = {};
  for (const id of FIXTURE_ZONES) {
    it(`${id}: random instants 1900-2100 and every transition ±1 s since 1800`, () => {
      const intl = zoneFromId(id);
      const tzif = fixtureZone(id);
      const rnd = seededRandom(SEED + id.length);
      const lo = Date.UTC(1900, 0, 1);
      const hi = Date.UTC(2100, 0, 1);
      const instants: number[] = [];
      for (let i = 0; i < 2000; i++) instants.push(Math.floor(lo + rnd() * (hi - lo)));
      for (const z of [tzif, intl]) {
        for (const t of listTransitions(z, Date.UTC(1800, 0, 1), Date.UTC(2101, 0, 1))) instants.push(t.epochMs - 1000, t.epochMs - 1, t.epochMs, t.epochMs + 1000);
      }
      const bad = compare(id, intl, tzif, instants);
      if (bad.length > 0) {
        found[id] = bad;
        const years = [...new Set(bad.map((t) => new Date(t).getUTCFullYear()))].sort((a, b) => a - b);
        note(`[zone] ${id}: Intl tz ${RUNTIME_TZ} differs from TZif 2025b at ${bad.length} checked instants in ${years[0]}..${years[years.length - 1]}`);
      }
      const known = KNOWN_FIXTURE_DIFFERENCES[id];
      if (RUNTIME_TZ === '2025c') {
        if (known) {
          expect(bad.length, `${id}: the known difference (${known.reason}) is gone; update the list`).toBeGreaterThan(0);
          expect(Math.max(...bad), `${id}: differences past ${new Date(known.before).toISOString()}`).toBeLessThan(known.before);
        } else expect(bad, `${id}: unexpected differences`).toEqual([]);
      } else {
        // Another runtime release: report, and hold the data since 1970 to agreement except listed zones.
        if (!known) expect(bad.filter((t) => t >= 0), `${id}: differences since 1970 with tz ${RUNTIME_TZ}`).toEqual([]);
      }
    });
  }
});

/**
 * A stand-in for Intl.DateTimeFormat that formats from TZif data in the same en-US pattern, so that the Intl
 * search runs on the fixtures' history, including the backzone's Africa/Freetown changes of 1939, 3.99 days
 * apart: the closest pair since 1800 in the whole tz database (measured in test/zone/system-sweep.test.ts).
 */
function tzifFormatter(z: Zone): Intl.DateTimeFormat {
  return {
    format(t: number): string {
      const wall = wallMsFromEpochMs(z, t);
      const dn = Math.floor(wall / 86_400_000);
      const p = packedYmdUnchecked(dn);
      const year = yearOfPacked(p);
      const ms = wall - dn * 86_400_000;
      const era = year <= 0 ? 'BC' : 'AD';
      const y = year <= 0 ? 1 - year : year;
      const two = (v: number) => String(v).padStart(2, '0');
      return `${monthOfPacked(p)}/${dayOfPacked(p)}/${y} ${era}, ${two(Math.floor(ms / 3_600_000))}:${two(Math.floor(ms / 60_000) % 60)}:${two(Math.floor(ms / 1000) % 60)}`;
    },
  } as unknown as Intl.DateTimeFormat;
}

describe('the Intl search finds every transition, even close ones (driven by TZif data)', () => {
  it('the step is at most 2 days, below the closest pair of changes in the tz database (3.99 days)', () => {
    expect(INTL_STEP_MS).toBeLessThanOrEqual(2 * 86_400_000);
  });

  for (const id of ['Africa/Freetown', 'Africa/Casablanca', 'Europe/Amsterdam', 'Australia/Lord_Howe', 'America/Nuuk']) {
    it(`${id}: the search over 1800-2100 reproduces the TZif transitions exactly`, () => {
      const tzif = fixtureZone(id);
      const engine = new IntlEngine(tzifFormatter(tzif));
      const at: number[] = [];
      const after: number[] = [];
      engine.collect(Date.UTC(1800, 0, 1), Date.UTC(2100, 0, 1), at, after);
      const expected = listTransitions(tzif, Date.UTC(1800, 0, 1), Date.UTC(2100, 0, 1));
      expect(at).toEqual(expected.map((t) => t.epochMs));
      expect(after).toEqual(expected.map((t) => t.offsetAfterSeconds));
      if (id === 'Africa/Freetown') {
        // Sierra Leone, 1939 (backzone): two changes 3.99 days apart, both found.
        const gaps = expected.slice(1).map((t, i) => t.epochMs - expected[i]!.epochMs);
        expect(Math.min(...gaps) / 86_400_000).toBeCloseTo(3.986, 2);
      }
    });
  }

  it('compiles lazily: one query compiles one chunk of one year', () => {
    const z = zoneFromId('America/Chicago');
    const e = engineOf(z);
    const before = e.chunks.size;
    offsetSecondsFromEpochMs(z, Date.UTC(2031, 5, 1));
    expect(e.chunks.size - before).toBeLessThanOrEqual(1);
    expect(CHUNK_MS).toBe(31_556_952_000);
  });
});
