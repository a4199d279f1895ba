import { defineConfig } from 'tsup';

/** What the bundled library files share (the CommonJS core and the pinned tz data). */
const bundled = { sourcemap: true, clean: false, treeshake: true, splitting: false, target: 'es2022', outDir: 'dist' } as const;

export default defineConfig([
  // The library as ES modules, one file per source module (not bundled), so that a consumer's bundler drops every
  // module a program does not import (package.json says `sideEffects: false`). The CLI, the pinned tz data and the
  // Node-only warehouse writer are built by the configurations below, so they are left out here.
  {
    entry: ['src/**/*.ts', '!src/cli/**', '!src/tzdata/**', '!src/warehouse/files.ts'],
    format: ['esm'],
    bundle: false,
    dts: { entry: { index: 'src/index.ts' } },
    sourcemap: true,
    clean: true,
    target: 'es2022',
    outDir: 'dist',
  },
  // The library for require(): one CommonJS file, and the pinned tz data (kalends/tzdata) in both formats: it is
  // one module, and the core never imports it. It imports the core by the package's own name (for the rules
  // compiler that its source carries), kept external, so that its zones are the core's own objects.
  { ...bundled, entry: { index: 'src/index.ts' }, format: ['cjs'], dts: true },
  { ...bundled, entry: { tzdata: 'src/tzdata/index.ts' }, format: ['esm', 'cjs'], dts: true, external: ['kalends'] },
  // kalends/warehouse (Node.js): file writers, with the pure-JavaScript Parquet writer bundled in (so that the
  // package keeps zero runtime dependencies). It imports the library by the package's own name (tsconfig paths
  // map it to src/index.ts here), kept external, so that profiles and tables made with `kalends` are the same
  // objects in it.
  {
    entry: { warehouse: 'src/warehouse/files.ts' },
    format: ['esm', 'cjs'],
    dts: true,
    sourcemap: true,
    clean: false,
    treeshake: true,
    splitting: false,
    target: 'node20',
    platform: 'node',
    outDir: 'dist',
    noExternal: ['hyparquet-writer', 'hyparquet'],
    external: ['kalends'],
  },
  // The CLI: one ESM file with a shebang. It uses the public surface only.
  {
    entry: { cli: 'src/cli/main.ts' },
    format: ['esm'],
    dts: false,
    sourcemap: false,
    clean: false,
    target: 'node20',
    platform: 'node',
    outDir: 'dist',
    banner: { js: '#!/usr/bin/env node' },
    // The CSV parser is bundled so that the package keeps zero runtime dependencies.
    noExternal: ['csv-parse', 'hyparquet-writer', 'hyparquet'],
  },
  // Demo and benchmarks: built for running here, never shipped (outside dist/).
  {
    entry: { 'examples/demo': 'examples/demo.ts', 'bench/run': 'bench/run.ts', 'bench/warehouse': 'bench/warehouse.ts' },
    format: ['esm'],
    dts: false,
    clean: true,
    target: 'node20',
    platform: 'node',
    outDir: '.build',
    external: ['vega', 'vega-lite', 'temporal-polyfill', '@js-temporal/polyfill', '@duckdb/node-api'],
  },
]);
