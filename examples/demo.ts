/**
 * `npm run demo`: the whole job on the invented company's data, one section per capability.
 */
import { COMPANY } from './scenario.js';
import { section as civil } from './sections/civil.js';
import { section as instant } from './sections/instant.js';
import { section as zone } from './sections/zone.js';
import { section as period } from './sections/period.js';
import { section as business } from './sections/business.js';
import { section as recurrence } from './sections/recurrence.js';
import { section as series } from './sections/series.js';
import { section as hours } from './sections/hours.js';
import { section as profile } from './sections/profile.js';

/** One part of the demo. `print` writes a line. */
export interface DemoSection {
  readonly title: string;
  run(print: (line: string) => void): void | Promise<void>;
}

const sections: readonly DemoSection[] = [civil, instant, zone, period, business, recurrence, series, hours, profile];

async function main(): Promise<void> {
  console.log(`kalends demo: ${COMPANY}`);
  for (const s of sections) {
    console.log(`\n=== ${s.title}`);
    await s.run((line) => console.log(line));
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exitCode = 1;
});
