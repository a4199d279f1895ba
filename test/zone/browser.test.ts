/**
 * The built ESM bundle in a real browser: headless Chromium (Debian's `chromium` package at /usr/bin/chromium,
 * driven by playwright-core; never a browser download). Zone answers there must equal Node's for a sample of
 * zones and instants; both runtimes carry their own ICU tz data, so a difference is reported with the release.
 * Uses dist/index.js when it exists and is newer than src/ (npm test builds first), else bundles src/index.ts
 * with esbuild.
 * Without /usr/bin/chromium the test fails in CI (process.env.CI) and skips locally, with a message.
 */
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { build } from 'esbuild';
import * as kalends from '../../src/zone/index.js';
import { seededRandom } from '../../bench/harness.js';
import { SEED } from './helpers.js';
import { note } from '../note.js';

const CHROMIUM = '/usr/bin/chromium';
const HAVE = existsSync(CHROMIUM);
const ROOT = fileURLToPath(new URL('../../', import.meta.url));
if (!HAVE && process.env.CI) throw new Error(`test/zone/browser.test.ts: ${CHROMIUM} is missing; .ci/run installs it with apt-get install chromium`);
if (!HAVE) note(`[zone] browser test skipped: ${CHROMIUM} is missing (apt-get install chromium)`);

/** The newest modification time under `dir`: a dist/ older than the sources is stale and not used. */
function newestSource(dir: string): number {
  let newest = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    newest = Math.max(newest, e.isDirectory() ? newestSource(p) : statSync(p).mtimeMs);
  }
  return newest;
}

/** The runtime's own offset in seconds at `t`, from Intl's longOffset name ("GMT+05:30", "GMT-04:56:02", "GMT"). */
function rawIntlOffset(zone: string, t: number): number {
  const text = new Intl.DateTimeFormat('en-US', { timeZone: zone, timeZoneName: 'longOffset' }).format(t);
  const m = /GMT(?:([+-\u2212])(\d{2}):(\d{2})(?::(\d{2}))?)?/.exec(text);
  if (!m || m[1] === undefined) return 0;
  const v = Number(m[2]) * 3600 + Number(m[3]) * 60 + Number(m[4] ?? 0);
  return m[1] === '+' ? v : -v;
}

const ZONES = ['America/New_York', 'Europe/Dublin', 'Australia/Lord_Howe', 'Asia/Kolkata', 'Pacific/Apia', 'Africa/Casablanca', 'America/Santiago', 'Pacific/Chatham'];

describe.skipIf(!HAVE)('zone answers in headless Chromium equal Node', () => {
  let server: Server;
  let dir: string;
  let url: string;
  let browser: { close(): Promise<void>; newPage(): Promise<{ goto(u: string): Promise<unknown>; evaluate(script: string): Promise<unknown> }> };

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'kalends-browser-'));
    const dist = join(ROOT, 'dist/index.js');
    let code: string;
    if (existsSync(dist) && statSync(dist).mtimeMs >= newestSource(join(ROOT, 'src'))) code = readFileSync(dist, 'utf8');
    else {
      const out = await build({ entryPoints: [join(ROOT, 'src/index.ts')], bundle: true, write: false, format: 'esm', platform: 'browser', target: 'es2022', logLevel: 'silent' });
      code = out.outputFiles[0]!.text;
    }
    server = createServer((req, res) => {
      if (req.url === '/kalends.js') {
        res.writeHead(200, { 'content-type': 'text/javascript' });
        res.end(code);
      } else {
        res.writeHead(200, { 'content-type': 'text/html' });
        res.end('<!doctype html><title>kalends</title>');
      }
    });
    await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
    const port = (server.address() as { port: number }).port;
    url = `http://127.0.0.1:${port}/`;
    const { chromium } = await import('playwright-core');
    // A fresh profile directory: playwright takes it as launchPersistentContext's userDataDir (it refuses a
    // --user-data-dir argument to launch()).
    browser = (await chromium.launchPersistentContext(join(dir, 'profile'), {
      executablePath: CHROMIUM,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    })) as unknown as typeof browser;
  });

  afterAll(async () => {
    await browser?.close();
    await new Promise<void>((r) => (server ? server.close(() => r()) : r()));
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('offsets, local day numbers (bulk), local -> instant, and transitions', async () => {
    const rnd = seededRandom(SEED);
    const instants = Array.from({ length: 200 }, () => Math.floor(Date.UTC(1900, 0, 1) + rnd() * (Date.UTC(2060, 0, 1) - Date.UTC(1900, 0, 1))));
    const walls = instants.slice(0, 60).map((t) => Math.floor(t / 60_000) * 60_000);
    const nodeRaw = ZONES.map((zone) => instants.map((t) => rawIntlOffset(zone, t)));
    const expected = ZONES.map((zone) => ({
      zone,
      offsets: instants.map((t) => kalends.offsetSecondsFromEpochMs(zone, t)),
      days: Array.from(kalends.dayNumberFromEpochMsBulk(zone, Float64Array.from(instants))),
      resolved: walls.map((w) => [kalends.epochMsFromWallMs(zone, w, 'earlier'), kalends.epochMsFromWallMs(zone, w, 'later')]),
      transitions: kalends.listTransitions(zone, Date.UTC(2020, 0, 1), Date.UTC(2030, 0, 1)).map((t) => t.epochMs),
    }));
    const page = await browser.newPage();
    await page.goto(url);
    // Passed as text: vitest rewrites dynamic import() in functions it transforms. rawIntlOffset is repeated
    // there: the runtime's own Intl offset (ECMA-402 timeZoneName 'longOffset'), read independently of kalends.
    const script = `(async (a) => {
      const k = await import('/kalends.js');
      ${rawIntlOffset.toString()}
      return a.zones.map((zone) => ({
        zone,
        raw: a.instants.map((t) => rawIntlOffset(zone, t)),
        offsets: a.instants.map((t) => k.offsetSecondsFromEpochMs(zone, t)),
        days: Array.from(k.dayNumberFromEpochMsBulk(zone, Float64Array.from(a.instants))),
        resolved: a.walls.map((w) => [k.epochMsFromWallMs(zone, w, 'earlier'), k.epochMsFromWallMs(zone, w, 'later')]),
        transitions: k.listTransitions(zone, Date.UTC(2020, 0, 1), Date.UTC(2030, 0, 1)).map((t) => t.epochMs),
      }));
    })(${JSON.stringify({ zones: ZONES, instants, walls })})`;
    const got = (await page.evaluate(script)) as (typeof expected[number] & { raw: number[] })[];
    const agent = await page.evaluate('navigator.userAgent');
    const dataDiffs: string[] = [];
    ZONES.forEach((zone, zi) => {
      const g = got[zi]!;
      const e = expected[zi]!;
      // In the browser, kalends agrees with the browser's own Intl at every instant.
      expect(g.offsets, `${zone}: kalends vs the browser's Intl`).toEqual(g.raw);
      const differ = instants.map((t, i) => (nodeRaw[zi]![i] !== g.raw[i] ? t : -Infinity)).filter((t) => t !== -Infinity);
      if (differ.length > 0) {
        dataDiffs.push(`${zone}: ${differ.length} of ${instants.length} instants, ${new Date(Math.min(...differ)).toISOString().slice(0, 10)}..${new Date(Math.max(...differ)).toISOString().slice(0, 10)}`);
        // Releases since 2025 changed only recent and predicted rules of these zones.
        expect(Math.min(...differ), `${zone}: tz data differs before 2025`).toBeGreaterThanOrEqual(Date.UTC(2025, 0, 1));
        instants.forEach((t, i) => {
          if (nodeRaw[zi]![i] === g.raw[i]) expect(g.offsets[i], `${zone} ${t}`).toBe(e.offsets[i]);
        });
      } else {
        expect(g.offsets, zone).toEqual(e.offsets);
        expect(g.days, zone).toEqual(e.days);
        expect(g.resolved, zone).toEqual(e.resolved);
        expect(g.transitions, zone).toEqual(e.transitions);
      }
    });
    note(`[zone] browser ${agent} vs Node ${process.version} (tz ${process.versions.tz}): tz data differences: ${dataDiffs.length ? dataDiffs.join('; ') : 'none'}`);
    expect(dataDiffs.length, 'most sampled zones have the same data in both runtimes').toBeLessThanOrEqual(2);
  });
});
