/**
 * src/series/deps.ts is the series layer's only door to the layers below it (issue 13): no other file of the layer
 * imports instant, zone, period, business or recurrence (docs/design.md, "Layers"), and no file imports a layer
 * that comes after series. The shared modules under every layer (errors, bounds, diagnostics) are imported
 * directly.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const DIR = join(__dirname, '..', '..', 'src', 'series');
const LOWER = ['civil', 'instant', 'zone', 'period', 'business', 'daycount', 'recurrence', 'tzdata'];
const SHARED = ['../errors.js', '../bounds.js', '../diagnostics/index.js'];

function importsOf(file: string): string[] {
  const text = readFileSync(join(DIR, file), 'utf8');
  return [...text.matchAll(/(?:^|\n)\s*(?:import|export)\b[^;]*?\bfrom\s+'([^']+)'/g)].map((m) => m[1]!);
}

describe('the series layer imports the lower layers through deps.ts only', () => {
  const files = readdirSync(DIR).filter((f) => f.endsWith('.ts'));

  it('finds the imports it checks (the reader is not blind)', () => {
    expect(importsOf('deps.ts')).toEqual(expect.arrayContaining(['../zone/index.js', '../period/index.js', '../business/index.js', '../recurrence/index.js', '../instant/index.js']));
  });

  for (const file of files.filter((f) => f !== 'deps.ts')) {
    it(`${file} imports only the layer's own modules and the shared ones`, () => {
      for (const from of importsOf(file)) {
        if (from.startsWith('./')) continue;
        expect(SHARED, `${file} imports ${from}`).toContain(from);
      }
    });
  }

  it('deps.ts itself imports only lower layers and the shared modules', () => {
    for (const from of importsOf('deps.ts')) {
      const layer = /^\.\.\/([a-z]+)\//.exec(from)?.[1];
      expect(layer === undefined ? SHARED.includes(from) : LOWER.includes(layer), from).toBe(true);
    }
  });
});
