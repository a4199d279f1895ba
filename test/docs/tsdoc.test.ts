/**
 * Every public function and class has TSDoc with an example (the project's documentation standard): for each
 * callable export of src/index.ts, its declaration in src/ must carry a doc comment containing `@example`.
 */
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import * as api from '../../src/index.js';

const srcDir = fileURLToPath(new URL('../../src/', import.meta.url));

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sources(path) : path.endsWith('.ts') ? [readFileSync(path, 'utf8')] : [];
  });
}

describe('TSDoc on the public surface', () => {
  const texts = sources(srcDir);
  const callables = Object.entries(api)
    .filter(([, v]) => typeof v === 'function')
    .map(([k]) => k);

  it('has a good number of public functions to check', () => {
    expect(callables.length).toBeGreaterThan(100);
  });

  it('every public function and class has a doc comment with an @example', () => {
    const faults: string[] = [];
    for (const name of callables) {
      const declaration = new RegExp(`(/\\*\\*(?:(?!\\*/)[\\s\\S])*?\\*/)\\s*export (?:abstract )?(?:function\\*?|class|const) ${name}\\b`);
      const bare = new RegExp(`export (?:abstract )?(?:function\\*?|class|const) ${name}\\b`);
      const text = texts.find((t) => bare.test(t));
      if (!text) {
        faults.push(`${name}: declaration not found`);
        continue;
      }
      const doc = declaration.exec(text)?.[1];
      if (!doc) faults.push(`${name}: no doc comment`);
      else if (!doc.includes('@example')) faults.push(`${name}: no @example`);
    }
    expect(faults).toEqual([]);
  });
});
