#!/usr/bin/env bash
# Packs kalends, installs the tarball into an empty project as a user would, then imports it (ESM), requires
# it (CJS) and runs its CLI. Assumes `npm run build` has run.
set -euo pipefail
cd "$(dirname "$0")/.."
root=$(pwd)
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
tarball=$(npm pack --silent --pack-destination "$work" | tail -n 1)
cd "$work"
npm init -y >/dev/null
npm install --no-audit --no-fund "./$tarball" >/dev/null
cat > esm.mjs <<'JS'
import { dayNumberFromYmd, isoWeekDateFromDayNumber } from 'kalends';
const w = isoWeekDateFromDayNumber(dayNumberFromYmd(2008, 12, 29));
if (w.weekYear !== 2009 || w.week !== 1) throw new Error('ESM import gave a wrong ISO week');
console.log('ESM import ok');
JS
cat > cjs.cjs <<'JS'
const k = require('kalends');
if (k.dayNumberFromYmd(1970, 1, 2) !== 1) throw new Error('CJS require gave a wrong day number');
console.log('CJS require ok');
JS
cat > subpaths.mjs <<'JS'
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { defineProfile, dimensionTableFromProfile } from 'kalends';
import { parquetFromTable } from 'kalends/warehouse';
const require = createRequire(import.meta.url);
const schema = JSON.parse(readFileSync(require.resolve('kalends/profile.schema.json'), 'utf8'));
if (schema.$schema !== 'https://json-schema.org/draft/2020-12/schema') throw new Error('kalends/profile.schema.json is not the profile schema');
const profile = defineProfile({ id: 'check', name: 'Check', zone: 'UTC', week: 'iso', calendars: { c: 'us-federal' } });
const bytes = parquetFromTable(dimensionTableFromProfile(profile, { start: '2025-01-01', end: '2025-01-08' }));
if (new TextDecoder().decode(bytes.subarray(0, 4)) !== 'PAR1') throw new Error('kalends/warehouse wrote no Parquet file');
const { parquetFromTable: fromCjs } = require('kalends/warehouse');
if (typeof fromCjs !== 'function') throw new Error('kalends/warehouse has no CJS entry');
console.log('subpaths ok (kalends/warehouse, kalends/profile.schema.json)');
JS
# The declarations as a TypeScript user sees them (module node16, ESM and CJS files): the subpaths' types fit the
# core's (kalends/tzdata's rules source is what zoneFromId takes), with the TypeScript of this repository.
cat > types.mts <<'TS'
import { zoneFromId, offsetSecondsFromEpochMs, dayNumberFromYmd } from 'kalends';
import { PINNED_TZDATA, TZDATA_RELEASE } from 'kalends/tzdata';
import { parquetFromTable } from 'kalends/warehouse';
const zone = zoneFromId('Europe/Dublin', { source: PINNED_TZDATA });
const offset: number = offsetSecondsFromEpochMs(zone, dayNumberFromYmd(2025, 7, 1) * 86_400_000);
const release: string = TZDATA_RELEASE;
export { offset, release, parquetFromTable };
TS
cat > types.cts <<'TS'
import kalends = require('kalends');
import tzdata = require('kalends/tzdata');
export const zone = kalends.zoneFromId('Europe/Dublin', { source: tzdata.PINNED_TZDATA });
TS
"$root/node_modules/.bin/tsc" --noEmit --strict --module node16 --moduleResolution node16 --target es2022 --types node --typeRoots "$root/node_modules/@types" types.mts types.cts
echo 'TypeScript (node16, ESM and CJS) ok'
node esm.mjs
node cjs.cjs
node subpaths.mjs
npx --no-install kalends help >/dev/null && echo 'CLI ok'
if [ -f "$root/scripts/consumer-extra.mjs" ]; then cp "$root/scripts/consumer-extra.mjs" . && node consumer-extra.mjs; fi
