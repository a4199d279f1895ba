/**
 * Keeps docs/day-counts.md honest: every `ts` code block runs against the source, and every statement written
 * `expression; // => value` is checked: the expression must deep-equal the value after the arrow.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import * as api from '../../src/index.js';

const page = readFileSync(fileURLToPath(new URL('../../docs/day-counts.md', import.meta.url)), 'utf8');
const blocks = [...page.matchAll(/```ts\n([\s\S]*?)```/g)].map((m) => m[1]!);

/** The block as a function body: imports from 'kalends' become reads of `api`, checked lines push [got, want]. */
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

describe('docs/day-counts.md', () => {
  it('has a runnable example for every convention, and checks its results', () => {
    expect(blocks.length).toBeGreaterThanOrEqual(11);
    for (const c of api.DAY_COUNT_CONVENTIONS) expect(page.includes(`yearFractionOfDays('${c}'`), c).toBe(true);
  });

  blocks.forEach((block, k) => {
    it(`block ${k + 1} runs and its results are as written`, () => {
      const { body, checks } = runnable(block);
      const results: [string, unknown, unknown][] = [];
      new Function('api', 'results', body)(api, results);
      expect(results.length).toBe(checks);
      for (const [line, got, want] of results) expect(got, line).toEqual(want);
    });
  });

  it('carries the caution that contracts define their own conventions', () => {
    expect(page).toMatch(/Contracts define their own conventions\. A confirmation, an agreement/);
    expect(page).toMatch(/defer to your legal documentation and to\s+>?\s*licensed professionals/);
  });
});
