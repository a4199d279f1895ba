/**
 * Conformance of the built package (dist/), not only of the sources: the ESM and CJS entry points expose the same
 * names as src/index.ts, the declarations exist, the core carries no pinned tz data, and package.json keeps
 * its promises (no runtime dependencies, sideEffects false, an exports map). `npm test` builds before it runs.
 * The ESM core is one file per source module; "the core" below is everything dist/index.js reaches, bundled with
 * esbuild as a consumer's bundler would.
 */
import { describe, expect, it } from 'vitest';
import { createRequire } from 'node:module';
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { build } from 'esbuild';
import * as source from '../../src/index.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const dist = (f: string) => `${root}dist/${f}`;
const built = existsSync(dist('index.js'));

/** The ESM core as one text: dist/index.js and every module it imports, bundled (not minified). */
async function coreText(): Promise<string> {
  const out = await build({ entryPoints: [dist('index.js')], bundle: true, write: false, format: 'esm', platform: 'neutral', logLevel: 'silent' });
  return out.outputFiles[0]!.text;
}

describe.skipIf(!built && !process.env.CI)('built package', () => {
  it('ESM entry exports exactly the names of src/index.ts', async () => {
    const esm = (await import(pathToFileURL(dist('index.js')).href)) as Record<string, unknown>;
    expect(Object.keys(esm).sort()).toEqual(Object.keys(source).sort());
  });

  it('CJS entry exports exactly the names of src/index.ts', () => {
    const cjs = createRequire(import.meta.url)(dist('index.cjs')) as Record<string, unknown>;
    expect(Object.keys(cjs).filter((k) => k !== '__esModule').sort()).toEqual(Object.keys(source).sort());
  });

  it('ships declarations for both formats and a CLI with a shebang', () => {
    for (const f of ['index.d.ts', 'index.d.cts', 'tzdata.d.ts', 'warehouse.d.ts', 'warehouse.d.cts', 'cli.js']) expect(existsSync(dist(f))).toBe(true);
    expect(readFileSync(dist('cli.js'), 'utf8').startsWith('#!/usr/bin/env node')).toBe(true);
  });

  it('package.json: no runtime dependencies, sideEffects false, engines, exports for . and ./tzdata', () => {
    const pkg = JSON.parse(readFileSync(`${root}package.json`, 'utf8')) as Record<string, unknown>;
    expect(pkg.dependencies ?? {}).toEqual({});
    expect(pkg.sideEffects).toBe(false);
    expect((pkg.engines as Record<string, string>).node).toBe('>=20');
    expect(Object.keys(pkg.exports as object)).toEqual(expect.arrayContaining(['.', './tzdata', './warehouse', './profile.schema.json']));
  });

  it('kalends/warehouse (ESM and CJS) takes profiles made by the core entry: it imports the core by the package name, and bundles its Parquet writer', async () => {
    const esm = readFileSync(dist('warehouse.js'), 'utf8');
    expect(esm).toMatch(/from ['"]kalends['"]/);
    expect(esm).not.toMatch(/from ['"]hyparquet/);
    expect(readFileSync(dist('warehouse.cjs'), 'utf8')).toMatch(/require\(['"]kalends['"]\)/);
    const core = (await import(pathToFileURL(dist('index.js')).href)) as typeof source;
    const w = (await import(pathToFileURL(dist('warehouse.js')).href)) as { parquetFromTable(t: unknown): Uint8Array };
    const profile = core.defineProfile({ id: 'p', name: 'P', zone: 'UTC', week: 'iso', calendars: { c: 'us-federal' } });
    const bytes = w.parquetFromTable(core.dimensionTableFromProfile(profile, { start: '2025-01-01', end: '2025-02-01' }));
    // A Parquet file starts and ends with the magic "PAR1" (Apache Parquet format, "File Format").
    expect(new TextDecoder().decode(bytes.subarray(0, 4))).toBe('PAR1');
    expect(new TextDecoder().decode(bytes.subarray(bytes.length - 4))).toBe('PAR1');
  });

  it('the core (ESM modules and the CJS file) does not contain the Parquet writer, and the schema file ships at its subpath', async () => {
    const core = await coreText();
    expect(core).toMatch(/function dayNumberFromYmd\b/); // the bundle is the core
    expect(core).not.toMatch(/hyparquet|PAR1/);
    expect(readFileSync(dist('index.cjs'), 'utf8')).not.toMatch(/hyparquet|PAR1/);
    const pkg = JSON.parse(readFileSync(`${root}package.json`, 'utf8')) as { exports: Record<string, unknown>; files: string[] };
    expect(pkg.exports['./profile.schema.json']).toBe('./schema/profile.schema.json');
    expect(pkg.files).toContain('schema');
  });

  it('the core (ESM modules and the CJS file) does not contain the pinned tz data module', async () => {
    const pinned = readFileSync(dist('tzdata.js'), 'utf8');
    expect(pinned).toMatch(/TZDATA_RELEASE/);
    expect(await coreText()).not.toMatch(/TZDATA_RELEASE/);
    expect(readFileSync(dist('index.cjs'), 'utf8')).not.toMatch(/TZDATA_RELEASE/);
  });

  it('the ESM core is one module per source module, so that a bundler can leave out the modules a program does not import', () => {
    // One dist module for each source module of a layer the core exports (src/cli, src/tzdata and the Node-only
    // src/warehouse/files.ts are built as bundles of their own).
    for (const m of ['civil/gregorian.js', 'instant/text.js', 'zone/engine.js', 'period/units.js', 'business/jurisdictions/us-federal.js', 'series/bucket.js']) {
      expect(existsSync(dist(m)), m).toBe(true);
    }
    expect(readFileSync(dist('index.js'), 'utf8')).not.toMatch(/function /);
  });
});
