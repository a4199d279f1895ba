/**
 * Writes docs/img/hours-week.svg: one week of the demo's invented warehouse sessions in America/Chicago, with an
 * early close and the night shift across the end of DST, rendered in Node by vega-lite and vega (the chart code is
 * in examples/sections/hours.ts, shared with the demo).
 *
 * Run: npx esbuild scripts/draw-hours-chart.ts --bundle --platform=node --format=esm \
 *        --external:vega --external:vega-lite --outfile=.build/draw-hours-chart.mjs && node .build/draw-hours-chart.mjs
 * (from the repository root; vega and vega-lite are dev dependencies).
 */
import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { hoursChartSvg } from '../examples/sections/hours.js';

const file = resolve('docs/img/hours-week.svg');
writeFileSync(file, await hoursChartSvg());
console.log(`wrote ${file}`);
