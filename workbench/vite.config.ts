/**
 * The workbench page's build (vite). `import 'kalends'` in the page resolves to the package's public entry as
 * package.json's `exports` names it (the built ESM bundle, `dist/index.js` today): the page runs the library a
 * browser user would install, through its public surface only, and the size it reports is that of the shipped
 * code. `npm run workbench` builds the library first; the browser test passes the sources instead when dist/ is
 * missing or older than src/ (see test/workbench/browser.test.ts).
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { type UserConfig, defineConfig } from 'vite';

const HERE = fileURLToPath(new URL('.', import.meta.url));
const ROOT = resolve(HERE, '..');

/** The file that `import 'kalends'` names for a browser: package.json exports['.'], by its import condition. */
export function publicEntry(): string {
  const pkg = JSON.parse(readFileSync(resolve(ROOT, 'package.json'), 'utf8')) as { exports?: Record<string, unknown> };
  let target: unknown = pkg.exports?.['.'];
  while (typeof target === 'object' && target !== null) {
    const conditions = target as Record<string, unknown>;
    target = conditions['browser'] ?? conditions['import'] ?? conditions['default'];
  }
  if (typeof target !== 'string') throw new Error('workbench/vite.config.ts: package.json has no exports["."] entry for browsers (import or default)');
  return resolve(ROOT, target);
}

/** Where `npm run workbench` writes the page (never shipped: .build/ is ignored by git and by the package). */
export const WORKBENCH_OUT_DIR = resolve(ROOT, '.build/workbench');

/** The page's vite configuration; `entry` is the file `import 'kalends'` resolves to. */
export function workbenchConfig(entry: string = publicEntry(), outDir: string = WORKBENCH_OUT_DIR): UserConfig {
  return {
    root: HERE,
    base: './',
    resolve: { alias: [{ find: /^kalends$/, replacement: entry }] },
    build: {
      outDir,
      emptyOutDir: true,
      target: 'es2022',
      // No inline script: the page's Content-Security-Policy allows scripts from the page's own origin only.
      modulePreload: { polyfill: false },
    },
    preview: { host: '127.0.0.1', port: 4178 },
    server: { host: '127.0.0.1' },
  };
}

export default defineConfig(workbenchConfig());
