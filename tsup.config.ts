import { defineConfig } from 'tsup';

export default defineConfig([
  // The library: ESM + CJS with declarations, one entry per public subpath.
  {
    entry: { index: 'src/index.ts', tzdata: 'src/tzdata/index.ts' },
    format: ['esm', 'cjs'],
    dts: true,
    sourcemap: true,
    clean: true,
    treeshake: true,
    splitting: false,
    target: 'es2022',
    outDir: 'dist',
  },
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
