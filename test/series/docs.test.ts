/**
 * Keeps docs/series.md honest: every `ts` code block runs against the source, and every statement written
 * `expression; // => value` is checked: the expression must deep-equal the value after the arrow (NaN equals
 * NaN). The facts behind the values are stated beside them on the page (US DST and federal holidays, the
 * NIST/SEMATECH smoothing example) or follow from the definitions the page gives.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import * as api from '../../src/index.js';

const page = readFileSync(fileURLToPath(new URL('../../docs/series.md', import.meta.url)), 'utf8');
const blocks = [...page.matchAll(/```ts\n([\s\S]*?)```/g)].map((m) => m[1]!);

/** The block as a function body: imports from 'kalends' become reads of `api`, checked lines push [line, got, want]. */
function runnable(block: string): { body: string; checks: number } {
  let checks = 0;
  const lines = block.split('\n').map((line) => {
    const imported = /^import \{([^}]*)\} from 'kalends';$/.exec(line);
    if (imported) return `const {${imported[1]}} = api;`;
    const checked = /^(.*);\s*\/\/ => (.*)$/.exec(line);
    if (checked) {
      checks++;
      return `results.push([${JSON.stringify(line)}, ${checked[1]}, (${checked[2]})]);`;
    }
    return line;
  });
  return { body: lines.join('\n'), checks };
}

describe('docs/series.md', () => {
  it('has runnable examples that check their results', () => {
    expect(blocks.length).toBeGreaterThanOrEqual(10);
    expect(blocks.every((b) => b.includes("from 'kalends';"))).toBe(true);
  });

  blocks.forEach((block, k) => {
    it(`block ${k + 1} runs and its results are as written`, () => {
      const { body, checks } = runnable(block);
      const results: [string, unknown, unknown][] = [];
      new Function('api', 'results', body)(api, results);
      expect(results.length).toBe(checks);
      expect(checks).toBeGreaterThan(0);
      for (const [line, got, want] of results) expect(got, line).toEqual(want);
    });
  });
});
