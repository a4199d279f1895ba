/**
 * Generates src/tzdata/data.ts, the pinned tz data module, from the TZif files of the system's tz database.
 *
 *   npx esbuild scripts/build-tzdata.ts --bundle --platform=node --format=esm --outfile=/tmp/build-tzdata.mjs
 *   node /tmp/build-tzdata.mjs [zoneinfo dir, default $TZDIR or /usr/share/zoneinfo]   (from the repository root)
 *
 * The IANA tz database is in the public domain. The release is read from the first line of tzdata.zi
 * ("# version 2025b") or from +VERSION.
 *
 * Encoding (all integers are LEB128 varints; signed ones zigzag-encoded), per distinct rule set:
 *   offsets count, offsets (signed seconds), initial offset index, transition count,
 *   first transition time (signed seconds), then for each transition one varint
 *   (step * offsetsCount + offsetIndex) where step = delta/60*2 for whole minutes, delta*2+1 otherwise,
 *   then the tail rule (length, ASCII).
 * Only changes of the UTC offset are kept, and explicit transitions that the tail rule reproduces are dropped
 * (the generator checks that the result gives the same offsets as the file at every transition ±1 s).
 */
import { readFileSync, readdirSync, statSync, writeFileSync, existsSync } from 'node:fs';
import { join, relative } from 'node:path';
import { gzipSync } from 'node:zlib';
import { parseTzif } from '../src/zone/tzif.js';
import { posixTransitions } from '../src/zone/posix.js';
import { listTransitions, offsetSecondsFromEpochMs } from '../src/zone/query.js';
import { zoneFromRules, zoneFromTzif } from '../src/zone/zone.js';

const dir = process.argv[2] ?? process.env.TZDIR ?? '/usr/share/zoneinfo';
const SKIP = new Set(['right', 'posix', 'Factory', 'localtime', 'posixrules']);

function release(): string {
  const zi = join(dir, 'tzdata.zi');
  if (existsSync(zi)) {
    const m = /^# version (\S+)/.exec(readFileSync(zi, 'utf8'));
    if (m) return m[1]!;
  }
  const v = join(dir, '+VERSION');
  if (existsSync(v)) return readFileSync(v, 'utf8').trim();
  throw new Error(`no tz release found in ${dir} (tzdata.zi or +VERSION)`);
}

function walk(d: string, out: string[]): void {
  for (const name of readdirSync(d).sort()) {
    if (SKIP.has(name) && d === dir) continue;
    const p = join(d, name);
    const st = statSync(p);
    if (st.isDirectory()) walk(p, out);
    else if (st.isFile()) {
      const head = Buffer.alloc(4);
      const fd = readFileSync(p).subarray(0, 4);
      fd.copy(head);
      if (head.toString('latin1') === 'TZif') out.push(p);
    }
  }
}

class Writer {
  bytes: number[] = [];
  uint(v: number): void {
    if (!(v >= 0) || !Number.isInteger(v)) throw new Error(`bad varint ${v}`);
    while (v >= 128) {
      this.bytes.push((v % 128) + 128);
      v = Math.floor(v / 128);
    }
    this.bytes.push(v);
  }
  int(v: number): void {
    this.uint(v < 0 ? -2 * v - 1 : 2 * v);
  }
  ascii(s: string): void {
    this.uint(s.length);
    for (let i = 0; i < s.length; i++) this.bytes.push(s.charCodeAt(i));
  }
}

interface Rules {
  initial: number;
  times: number[];
  offsets: number[];
  tail: string;
}

function rulesOf(bytes: Uint8Array): Rules {
  const c = parseTzif(bytes);
  const initial = c.types[0]!.offsetSeconds;
  const times: number[] = [];
  const offsets: number[] = [];
  let state = initial;
  for (let i = 0; i < c.transitionsSeconds.length; i++) {
    const o = c.types[c.transitionTypes[i]!]!.offsetSeconds;
    if (o === state) continue;
    times.push(c.transitionsSeconds[i]!);
    offsets.push(o);
    state = o;
  }
  // Drop the explicit transitions at the end that the tail rule reproduces.
  if (c.footerRule && times.length > 0) {
    let keep = times.length;
    // Transition keep-1 can go when the rule, between transition keep-2 and it, changes exactly once: at it.
    while (keep > 1) {
      const from = times[keep - 2]! * 1000 + 1;
      const to = times[keep - 1]! * 1000 + 1;
      const at: number[] = [];
      const after: number[] = [];
      const before = posixTransitions(c.footerRule, from, to, at, after);
      if (before === offsets[keep - 2] && at.length === 1 && at[0] === times[keep - 1]! * 1000 && after[0] === offsets[keep - 1]) keep--;
      else break;
    }
    times.length = keep;
    offsets.length = keep;
  }
  return { initial, times, offsets, tail: c.footer };
}

function encode(r: Rules): number[] {
  const w = new Writer();
  const distinct = [...new Set([r.initial, ...r.offsets])];
  w.uint(distinct.length);
  for (const o of distinct) w.int(o);
  w.uint(distinct.indexOf(r.initial));
  w.uint(r.times.length);
  let prev = 0;
  for (let i = 0; i < r.times.length; i++) {
    const t = r.times[i]!;
    const idx = distinct.indexOf(r.offsets[i]!);
    if (i === 0) {
      w.int(t);
      w.uint(idx);
    } else {
      const delta = t - prev;
      const step = delta % 60 === 0 ? (delta / 60) * 2 : delta * 2 + 1;
      w.uint(step * distinct.length + idx);
    }
    prev = t;
  }
  w.ascii(r.tail);
  return w.bytes;
}

const rel = release();
const files: string[] = [];
walk(dir, files);
const blobs: number[][] = [];
const blobIndex = new Map<string, number>();
const names: string[] = [];
let checked = 0;
for (const f of files) {
  const id = relative(dir, f);
  const bytes = new Uint8Array(readFileSync(f));
  const r = rulesOf(bytes);
  // Check: the compact rules give the file's offsets at every transition ±1 s and the same transitions 1800..2200.
  const full = zoneFromTzif(bytes, id);
  const compact = zoneFromRules({ id, initialOffsetSeconds: r.initial, transitionsSeconds: r.times, offsetsSeconds: r.offsets, tailRule: r.tail });
  const a = listTransitions(full, Date.UTC(1800, 0, 1), Date.UTC(2200, 0, 1));
  const b = listTransitions(compact, Date.UTC(1800, 0, 1), Date.UTC(2200, 0, 1));
  if (JSON.stringify(a) !== JSON.stringify(b)) throw new Error(`${id}: compact rules differ from the file`);
  for (const t of parseTzif(bytes).transitionsSeconds) {
    for (const d of [-1000, 0, 1000]) {
      const ms = t * 1000 + d;
      if (ms < -8.64e15 || ms > 8.64e15) continue;
      if (offsetSecondsFromEpochMs(full, ms) !== offsetSecondsFromEpochMs(compact, ms)) throw new Error(`${id}: offset differs at ${ms}`);
      checked++;
    }
  }
  const enc = encode(r);
  const key = enc.join(',');
  let k = blobIndex.get(key);
  if (k === undefined) {
    k = blobs.length;
    blobs.push(enc);
    blobIndex.set(key, k);
  }
  names.push(`${id}\t${k.toString(36)}`);
}
const w = new Writer();
w.uint(blobs.length);
for (const b of blobs) w.uint(b.length);
const all = Uint8Array.from([...w.bytes, ...blobs.flat()]);
const b64 = Buffer.from(all).toString('base64');
const out = `/* eslint-disable */
// Generated by scripts/build-tzdata.ts from ${dir} (IANA tz database release ${rel}). Do not edit.
// The tz database is in the public domain. ${names.length} ids, ${blobs.length} distinct rule sets, ${all.length} bytes packed.

/** The IANA tz database release of the pinned data. */
export const TZDATA_RELEASE = ${JSON.stringify(rel)};

/** "id<TAB>rule-set index (base 36)" lines. @internal */
export const PINNED_NAMES = ${JSON.stringify(names.join('\n'))};

/** The packed rule sets, base64. @internal */
export const PINNED_DATA = ${JSON.stringify(b64)};
`;
// Run from the repository root (the bundled script lives in /tmp).
const target = join(process.cwd(), 'src/tzdata/data.ts');
writeFileSync(target, out);
console.log(
  `wrote ${target}: tz ${rel}, ${names.length} ids, ${blobs.length} rule sets, packed ${all.length} B, file ${out.length} B, gzip ${gzipSync(out).length} B; ${checked} offsets checked`,
);
