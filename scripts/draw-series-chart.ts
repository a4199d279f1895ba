/**
 * Writes docs/img/series-fiscal-weeks.svg: the demo's invented shop sales by fiscal week of the 4-5-4 retail
 * calendar with a 4-week rolling mean, rendered in Node by vega-lite and vega (the chart code is in
 * examples/sections/series.ts, shared with the demo).
 *
 * Run: npx esbuild scripts/draw-series-chart.ts --bundle --platform=node --format=esm \
 *        --external:vega --external:vega-lite --outfile=.build/draw-series-chart.mjs && node .build/draw-series-chart.mjs
 * (from the repository root; vega and vega-lite are dev dependencies).
 */
import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { salesChartSvg } from '../examples/sections/series.js';

const file = resolve('docs/img/series-fiscal-weeks.svg');
writeFileSync(file, await salesChartSvg());
console.log(`wrote ${file}`);
