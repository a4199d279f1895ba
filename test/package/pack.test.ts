/**
 * What `npm pack` puts in the tarball: only the intended files (the built package, the profile schema, the docs
 * pages and their figures, README, CHANGELOG, LICENSE), every file that package.json's `exports` and `bin` name,
 * and every module that the ESM core imports (dist/ holds one ES module per source module, so a file left out of
 * the tarball would break an import). The list is `npm pack --dry-run --json` (npm CLI, "npm-pack"), after the
 * build that `npm test` runs first.
 */
import { describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { posix } from 'node:path';

const root = fileURLToPath(new URL('../../', import.meta.url));
const built = existsSync(`${root}dist/index.js`);

/** The paths of the files `npm pack` would put in the tarball. */
function packedFiles(): string[] {
  const out = execFileSync('npm', ['pack', '--dry-run', '--json', '--ignore-scripts'], { cwd: root, encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] });
  const [report] = JSON.parse(out) as { files: { path: string }[] }[];
  return report!.files.map((f) => f.path).sort();
}

/** Every path the file may be: the intended files of the package, by pattern. */
const INTENDED: readonly RegExp[] = [
  /^(package\.json|README\.md|CHANGELOG\.md|LICENSE)$/,
  /^schema\/profile\.schema\.json$/,
  /^docs\/[a-z0-9-]+\.md$/,
  /^docs\/img\/[a-z0-9-]+\.(svg|png)$/,
  /^dist\/([a-z0-9-]+\/)*[a-z0-9-]+\.(js|cjs|d\.ts|d\.cts)(\.map)?$/,
];

/** The relative module specifiers of an ES module's static imports and re-exports. */
function relativeImports(code: string): string[] {
  return [...code.matchAll(/\b(?:import|export)\s*(?:[^'"]*?\sfrom\s*)?["'](\.{1,2}\/[^"']+)["']/g)].map((m) => m[1]!);
}

describe.skipIf(!built && !process.env.CI)('npm pack', () => {
  const files = built ? packedFiles() : [];

  it('lists only intended files: no sources, tests, benchmarks, workbench, generated API pages or scratch files', () => {
    const unexpected = files.filter((f) => !INTENDED.some((p) => p.test(f)));
    expect(unexpected).toEqual([]);
    for (const f of files) expect(f, f).not.toMatch(/^(src|test|bench|examples|scripts|workbench|node_modules|\.build|\.tmp|docs\/api)\//);
  });

  it('holds every file that package.json exports and bin name', () => {
    const pkg = JSON.parse(readFileSync(`${root}package.json`, 'utf8')) as { exports: Record<string, unknown>; bin: Record<string, string>; main: string; module: string; types: string };
    const targets = new Set<string>([pkg.main, pkg.module, pkg.types, ...Object.values(pkg.bin)]);
    const walk = (v: unknown): void => {
      if (typeof v === 'string') targets.add(v);
      else if (v && typeof v === 'object') for (const x of Object.values(v)) walk(x);
    };
    walk(pkg.exports);
    expect(targets.size).toBeGreaterThan(10);
    for (const t of targets) expect(files, t).toContain(posix.normalize(t));
  });

  it('holds every module that the ESM entries import, transitively', () => {
    const seen = new Set<string>();
    const queue = ['dist/index.js', 'dist/tzdata.js', 'dist/warehouse.js'];
    while (queue.length > 0) {
      const f = queue.pop()!;
      if (seen.has(f)) continue;
      seen.add(f);
      expect(files, `${f} (imported)`).toContain(f);
      for (const spec of relativeImports(readFileSync(`${root}${f}`, 'utf8'))) queue.push(posix.join(posix.dirname(f), spec));
    }
    // The walk reached the modules of every layer, not only the entries.
    expect(seen.size).toBeGreaterThan(50);
  });
});
