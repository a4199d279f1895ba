/** Shared fixtures and helpers of the zone tests. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { zoneFromTzif } from '../../src/zone/index.js';
import type { Zone } from '../../src/zone/index.js';

export const SEED = 20261203;

/** The 16 zones that issue 3 names, plus four with notable history (see test/fixtures/tzif/README.md). */
export const ISSUE_ZONES = [
  'America/New_York',
  'Europe/London',
  'Europe/Dublin',
  'Australia/Lord_Howe',
  'Pacific/Apia',
  'Asia/Kolkata',
  'Asia/Kathmandu',
  'America/St_Johns',
  'Pacific/Chatham',
  'Africa/Casablanca',
  'America/Sao_Paulo',
  'Europe/Amsterdam',
  'Antarctica/Troll',
  'America/Nuuk',
  'Asia/Tehran',
  'Pacific/Kiritimati',
] as const;
export const EXTRA_ZONES = ['Africa/Freetown', 'America/Santiago', 'America/Havana', 'Asia/Beirut'] as const;
export const FIXTURE_ZONES = [...ISSUE_ZONES, ...EXTRA_ZONES];

/** The tz release of the fixtures (test/fixtures/tzif/README.md). */
export const FIXTURE_RELEASE = '2025b';

export function fixturePath(id: string): string {
  return fileURLToPath(new URL(`../fixtures/tzif/${id}`, import.meta.url));
}

export function fixtureBytes(id: string): Uint8Array {
  return new Uint8Array(readFileSync(fixturePath(id)));
}

const fixtureZones = new Map<string, Zone>();
/** The zone compiled from the vendored TZif file (IANA tz 2025b). */
export function fixtureZone(id: string): Zone {
  let z = fixtureZones.get(id);
  if (!z) {
    z = zoneFromTzif(fixtureBytes(id), id, { tzRelease: FIXTURE_RELEASE });
    fixtureZones.set(id, z);
  }
  return z;
}

export const HOUR = 3_600_000;
export const DAY = 86_400_000;

/** Writes TZif bytes (RFC 8536 section 3) for hand-made test files. */
export function buildTzif(spec: {
  version: 1 | 2 | 3 | 4;
  times: number[];
  typeIndexes: number[];
  types: { utoff: number; isdst: 0 | 1; desig: number }[];
  chars: string;
  leaps?: { occurrence: number; correction: number }[];
  footer?: string;
}): Uint8Array {
  const out: number[] = [];
  const u32 = (v: number) => out.push((v >>> 24) & 255, (v >>> 16) & 255, (v >>> 8) & 255, v & 255);
  const i64 = (v: number) => {
    const hi = Math.floor(v / 4294967296);
    u32(hi >>> 0);
    u32((v - hi * 4294967296) >>> 0);
  };
  const leaps = spec.leaps ?? [];
  const header = (versionByte: number) => {
    out.push(0x54, 0x5a, 0x69, 0x66, versionByte, ...new Array(15).fill(0));
    for (const v of [0, 0, leaps.length, spec.times.length, spec.types.length, spec.chars.length]) u32(v);
  };
  const block = (size: 4 | 8) => {
    for (const t of spec.times) (size === 4 ? u32(t >>> 0) : i64(t));
    out.push(...spec.typeIndexes);
    for (const t of spec.types) {
      u32(t.utoff >>> 0);
      out.push(t.isdst, t.desig);
    }
    for (let i = 0; i < spec.chars.length; i++) out.push(spec.chars.charCodeAt(i));
    for (const l of leaps) {
      if (size === 4) u32(l.occurrence >>> 0);
      else i64(l.occurrence);
      u32(l.correction >>> 0);
    }
  };
  const vb = spec.version === 1 ? 0 : 0x30 + spec.version;
  header(vb);
  block(4);
  if (spec.version >= 2) {
    header(vb);
    block(8);
    const f = `\n${spec.footer ?? ''}\n`;
    for (let i = 0; i < f.length; i++) out.push(f.charCodeAt(i));
  }
  return Uint8Array.from(out);
}
