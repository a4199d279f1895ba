/**
 * The pinned data module (`kalends/tzdata`, src/tzdata): generated from the system's IANA TZif files, it must
 * give the same offsets as those files, carry their release, stay compact, and stay out of the core bundle.
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { build } from 'esbuild';
import { PINNED_TZDATA, TZDATA_RELEASE, pinnedZoneIds, pinnedZoneRules } from '../../src/tzdata/index.js';
import { UnknownZoneError, listTransitions, offsetSecondsFromEpochMs, zoneFromId, zoneFromRules, zoneFromTzif } from '../../src/zone/index.js';
import { FIXTURE_RELEASE, FIXTURE_ZONES, fixtureZone } from './helpers.js';
import { note } from '../note.js';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const DIR = process.env.TZDIR ?? '/usr/share/zoneinfo';

describe('pinned tz data (kalends/tzdata)', () => {
  it('records its release; the fixtures are the same release (2025b)', () => {
    expect(TZDATA_RELEASE).toMatch(/^\d{4}[a-z]$/);
    expect(TZDATA_RELEASE).toBe(FIXTURE_RELEASE);
    expect(zoneFromId('Europe/Dublin', { source: PINNED_TZDATA }).tzRelease).toBe(TZDATA_RELEASE);
  });

  it('the generated file stays compact (under 1 MB; sizes are stated in docs/zones.md)', () => {
    const text = readFileSync(join(ROOT, 'src/tzdata/data.ts'));
    note(`[zone] src/tzdata/data.ts: ${text.length} bytes, gzip ${gzipSync(text).length} bytes, ${pinnedZoneIds().length} ids`);
    expect(text.length).toBeLessThan(1_000_000);
    expect(pinnedZoneIds().length).toBeGreaterThan(500);
  });

  it('equals the vendored TZif fixtures at every transition ±1 s', () => {
    for (const id of FIXTURE_ZONES) {
      const pinned = zoneFromId(id, { source: PINNED_TZDATA });
      const f = fixtureZone(id);
      for (const t of listTransitions(f, -8.64e15, Date.UTC(2500, 0, 1))) {
        for (const dt of [-1000, 0, 1000]) expect(offsetSecondsFromEpochMs(pinned, t.epochMs + dt), id).toBe(offsetSecondsFromEpochMs(f, t.epochMs + dt));
      }
    }
  });

  it.skipIf(!existsSync(join(DIR, 'tzdata.zi')))(`equals every system TZif file in ${DIR} when that is the same release`, () => {
    const rel = /^# version (\S+)/.exec(readFileSync(join(DIR, 'tzdata.zi'), 'utf8'))?.[1];
    if (rel !== TZDATA_RELEASE) {
      note(`[zone] system tz ${rel} differs from the pinned ${TZDATA_RELEASE}; the per-file comparison is skipped`);
      return;
    }
    let checked = 0;
    for (const id of pinnedZoneIds()) {
      const path = join(DIR, id);
      if (!existsSync(path) || !statSync(path).isFile()) continue;
      const f = zoneFromTzif(new Uint8Array(readFileSync(path)), id);
      const p = zoneFromRules(pinnedZoneRules(id)!);
      const a = listTransitions(f, -8.64e15, Date.UTC(2200, 0, 1));
      expect(listTransitions(p, -8.64e15, Date.UTC(2200, 0, 1)), id).toEqual(a);
      checked++;
    }
    expect(checked).toBe(pinnedZoneIds().length);
  });

  it('unknown ids suggest pinned ids; lookups ignore case', () => {
    expect(() => zoneFromId('Europe/Dublinn', { source: PINNED_TZDATA })).toThrow(UnknownZoneError);
    expect(zoneFromId('europe/dublin', { source: PINNED_TZDATA }).id).toBe('Europe/Dublin');
    expect(pinnedZoneRules('Nowhere/Special')).toBeUndefined();
  });

  it('never enters the core bundle (src/index.ts does not import src/tzdata)', async () => {
    const result = await build({ entryPoints: [join(ROOT, 'src/index.ts')], bundle: true, write: false, metafile: true, format: 'esm', logLevel: 'silent' });
    const inputs = Object.keys(result.metafile.inputs);
    expect(inputs.some((p) => p.includes('src/zone/'))).toBe(true);
    expect(inputs.filter((p) => p.includes('src/tzdata/'))).toEqual([]);
  });
});
