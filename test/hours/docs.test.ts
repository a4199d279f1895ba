/**
 * Keeps docs/business-time.md honest: every `ts` code block runs against the source, and every statement written
 * `expression; // => value` is checked: the expression must deep-equal the value after the arrow. The expected
 * values rest on the facts named in the page (US and UK holidays by 5 U.S.C. 6103 and the gov.uk bank holiday
 * list; DST dates by the Energy Policy Act of 2005 and the Summer Time Order 2002).
 */
import { describe, expect, it } from 'vitest';
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import * as api from '../../src/index.js';

const page = readFileSync(fileURLToPath(new URL('../../docs/business-time.md', import.meta.url)), 'utf8');
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

describe('docs/business-time.md', () => {
  it('has runnable examples that check their results', () => {
    expect(blocks.length).toBeGreaterThanOrEqual(4);
    expect(blocks.reduce((n, b) => n + runnable(b).checks, 0)).toBeGreaterThanOrEqual(12);
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

  it('says that hours and cut-offs are set by the institution, and shows the committed week picture', () => {
    expect(page).toMatch(/Official opening hours, early closes and cut-off times are set by the institution/);
    expect(page).toMatch(/verify it against the institution's published hours/);
    expect(page).toContain('](img/hours-week.svg)');
    expect(existsSync(fileURLToPath(new URL('../../docs/img/hours-week.svg', import.meta.url)))).toBe(true);
  });
});
