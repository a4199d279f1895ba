/**
 * System sweep: every zone the runtime lists (ECMA-402 Intl.supportedValuesOf('timeZone')) against the system tz
 * database's TZif file (TZDIR, or /usr/share/zoneinfo), at every transition ±1 s from 1970 to 2038. The sweep is
 * restricted to 1970-2038 to keep it near 15 s on two cores (the full 1800-2100 sweep takes about 60 s); before
 * 1970 many zones differ on purpose (Debian builds with backzone), see test/zone/intl-vs-tzif.test.ts.
 * Skips with a message when the directory is missing.
 *
 * It also checks, over each file's whole history, the three facts the Intl search rests on (src/zone/engine.ts):
 * no transition before 1800, no two changes closer than the 2-day sampling step, and no explicit transition
 * after 2200 (from there the footer's yearly rule governs).
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { listTransitions, listZoneIds, offsetSecondsFromEpochMs, zoneFromId, zoneFromTzif } from '../../src/zone/index.js';
import { parseTzif } from '../../src/zone/tzif.js';
import { INTL_PERIODIC_FROM_MS, INTL_QUIET_BEFORE_MS, INTL_STEP_MS } from '../../src/zone/engine.js';
import { note } from '../note.js';

const DIR = process.env.TZDIR ?? '/usr/share/zoneinfo';
const HAVE = existsSync(join(DIR, 'America/New_York'));
const RUNTIME_TZ = process.versions.tz;

function systemRelease(): string | undefined {
  try {
    return /^# version (\S+)/.exec(readFileSync(join(DIR, 'tzdata.zi'), 'utf8'))?.[1];
  } catch {
    return undefined;
  }
}

/** Differences 1970-2038 between Intl tz 2025c and Debian's tz 2025b, measured on this machine. */
const KNOWN_SWEEP_DIFFERENCES: Record<string, string> = {
  'America/Tijuana': 'the two releases disagree on Baja California in 1970-1975 (2025c revised its 1950s-1970s history)',
};

if (!HAVE) note(`[zone] system sweep skipped: no tz database at ${DIR} (set TZDIR)`);

describe.skipIf(!HAVE)(`system sweep: Intl (tz ${RUNTIME_TZ}) against ${DIR} (tz ${systemRelease()})`, () => {
  it('every listed zone agrees at every transition ±1 s, 1970-2038, except the known list', () => {
    const start = Date.UTC(1970, 0, 1);
    const end = Date.UTC(2038, 0, 1);
    const differing: Record<string, number> = {};
    const missing: string[] = [];
    let checks = 0;
    for (const id of listZoneIds()) {
      const path = join(DIR, id);
      if (!existsSync(path)) {
        missing.push(id);
        continue;
      }
      const tzif = zoneFromTzif(new Uint8Array(readFileSync(path)), id);
      const intl = zoneFromId(id);
      let bad = 0;
      for (const z of [tzif, intl]) {
        for (const t of listTransitions(z, start, end)) {
          for (const dt of [-1000, 0, 1000]) {
            checks++;
            if (offsetSecondsFromEpochMs(intl, t.epochMs + dt) !== offsetSecondsFromEpochMs(tzif, t.epochMs + dt)) bad++;
          }
        }
      }
      if (bad > 0) differing[id] = bad;
    }
    note(`[zone] system sweep: ${listZoneIds().length} zones, ${checks} checks, differences: ${JSON.stringify(differing)}, missing files: ${JSON.stringify(missing)}`);
    expect(missing).toEqual([]);
    if (RUNTIME_TZ === '2025c' && systemRelease() === '2025b') {
      expect(Object.keys(differing).sort()).toEqual(Object.keys(KNOWN_SWEEP_DIFFERENCES).sort());
    } else if (RUNTIME_TZ === systemRelease()) {
      expect(differing).toEqual({});
    }
  });

  it('the facts the Intl search rests on hold for every file: first change after 1800, changes at least 2 days apart, none explicit after 2200', () => {
    let minGap = Infinity;
    let minGapAt = '';
    let first = Infinity;
    let last = -Infinity;
    for (const id of listZoneIds()) {
      const path = join(DIR, id);
      if (!existsSync(path)) continue;
      const bytes = new Uint8Array(readFileSync(path));
      const c = parseTzif(bytes);
      const real = Array.from(c.transitionsSeconds).filter((t) => t * 1000 > -8.64e15);
      if (real.length > 0) last = Math.max(last, real[real.length - 1]! * 1000);
      const ts = listTransitions(zoneFromTzif(bytes, id), -8.64e15, Date.UTC(2300, 0, 1));
      if (ts.length > 0) first = Math.min(first, ts[0]!.epochMs);
      for (let i = 1; i < ts.length; i++) {
        const g = ts[i]!.epochMs - ts[i - 1]!.epochMs;
        if (g < minGap) {
          minGap = g;
          minGapAt = `${id} ${new Date(ts[i]!.epochMs).toISOString()}`;
        }
      }
    }
    note(`[zone] tz data facts: first change ${new Date(first).toISOString()}, closest changes ${(minGap / 86_400_000).toFixed(2)} days (${minGapAt}), last explicit ${new Date(last).toISOString()}`);
    expect(first).toBeGreaterThan(INTL_QUIET_BEFORE_MS);
    expect(minGap).toBeGreaterThan(INTL_STEP_MS);
    expect(last).toBeLessThan(INTL_PERIODIC_FROM_MS);
  });
});
