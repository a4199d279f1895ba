/**
 * Every code block of README.md and docs/*.md, run: `ts` blocks against the sources (imports of 'kalends' are
 * src/index.ts, 'kalends/warehouse' src/warehouse/files.ts, 'kalends/tzdata' src/tzdata/index.ts), checking each
 * result they state (the conventions are in ts-blocks.ts); `sh` blocks that call `kalends` through the CLI
 * in-process, comparing what they print with what the page shows (sh-blocks.ts). A failure names the page and
 * line. Blocks marked `no-run: <reason>` are counted, and must give a reason.
 *
 * The blocks run in a scratch directory that holds a link to examples/ (so `examples/...` paths read the
 * repository's files and exports are written to the scratch directory) and the page's `json file=<name>` blocks.
 *
 * The facts behind the values are named on the pages beside them; for the README's tour: US DST rules (Energy
 * Policy Act of 2005, section 110: 2025-03-09 and 2025-11-02), the US federal fiscal year (31 U.S.C. 1102), the NRF
 * 4-5-4 calendar (fiscal 2025 began 2025-02-02, from memory), US federal holidays (5 U.S.C. 6103 with the
 * observance rule for weekend holidays), ISDA 2006 Definitions section 4.12.
 */
import { mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import * as fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as JsTemporal from '@js-temporal/polyfill';
import * as TemporalPolyfill from 'temporal-polyfill';
import * as kalends from '../../src/index.js';
import * as warehouse from '../../src/warehouse/files.js';
import * as tzdata from '../../src/tzdata/index.js';
import { type Block, ROOT, blocksOf, docPages } from './markdown.js';
import { runTsBlock } from './ts-blocks.js';
import { callsKalends, runShellBlock } from './sh-blocks.js';

const MODULES: Record<string, unknown> = {
  kalends,
  'kalends/warehouse': warehouse,
  'kalends/tzdata': tzdata,
  '@js-temporal/polyfill': JsTemporal,
  'temporal-polyfill': TemporalPolyfill,
  'node:fs': fs,
  fs,
};

/** The languages a page may use; a `text` (or unlabelled) block holds no session to run. */
const LANGUAGES = new Set(['ts', 'sh', 'json', 'text', 'sql', '']);

type Kind = 'ts' | 'sh' | 'file' | 'not run' | 'not kalends' | 'shown';

function kindOf(block: Block): Kind {
  if (block.noRun !== undefined) return 'not run';
  if (block.lang === 'ts') return 'ts';
  if (block.lang === 'sh') return callsKalends(block) ? 'sh' : 'not kalends';
  if (block.file !== undefined) return 'file';
  return 'shown';
}

const pages = docPages().map((page) => ({ page, blocks: blocksOf(page) }));
const all = pages.flatMap((p) => p.blocks);

describe('the code blocks of the docs', () => {
  it('use known languages, give a reason for every block not run, and show no session outside an sh block', () => {
    const faults: string[] = [];
    for (const b of all) {
      const where = `${b.page}:${b.line - 1}`;
      if (!LANGUAGES.has(b.lang)) faults.push(`${where}: language "${b.lang}" (known: ${[...LANGUAGES].join(', ')})`);
      if (b.noRun === '') faults.push(`${where}: "no-run:" needs a reason`);
      if (b.file !== undefined && b.lang !== 'json') faults.push(`${where}: file=${b.file} on a ${b.lang} block (json only)`);
      if (b.lang !== 'sh' && /^\$ (npx )?kalends /m.test(b.text)) faults.push(`${where}: a kalends session in a ${b.lang || 'plain'} block: make it sh, so it runs`);
    }
    expect(faults).toEqual([]);
  });

  const count = (k: Kind) => all.filter((b) => kindOf(b) === k).length;
  it(`count ${count('ts')} ts and ${count('sh')} sh blocks that run, ${count('not run')} marked no-run, ${count('not kalends')} sh blocks that call no kalends command`, () => {
    // A floor under the counts, so that a runner that silently finds no blocks fails; and few blocks not run.
    expect(count('ts')).toBeGreaterThan(70);
    expect(count('sh')).toBeGreaterThan(8);
    expect(count('not run')).toBeLessThanOrEqual(Math.ceil((count('ts') + count('sh')) / 10));
  });
});

for (const { page, blocks } of pages) {
  const runnable = blocks.filter((b) => ['ts', 'sh', 'file'].includes(kindOf(b)));
  if (runnable.length === 0) continue;
  const notRun = blocks.filter((b) => kindOf(b) === 'not run').length;
  describe(`${page}: ${runnable.length} blocks run, ${notRun} marked no-run`, () => {
    const env = new Map<string, unknown>();
    const cwd = process.cwd();
    let scratch = '';
    beforeAll(() => {
      scratch = mkdtempSync(join(tmpdir(), 'kalends-docs-'));
      symlinkSync(join(ROOT, 'examples'), join(scratch, 'examples'), 'dir');
      process.chdir(scratch);
    });
    afterAll(() => {
      process.chdir(cwd);
      rmSync(scratch, { recursive: true, force: true });
    });
    for (const block of runnable) {
      const kind = kindOf(block);
      const title = `${kind} block at line ${block.line - 1}`;
      if (kind === 'file') {
        it(`${title} is the file ${block.file}`, () => {
          JSON.parse(block.text);
          writeFileSync(join(scratch, block.file!), block.text);
        });
      } else if (kind === 'ts') {
        it(`${title} runs and its results are as written`, () => {
          runTsBlock(block, env, MODULES);
        });
      } else {
        it(`${title} runs through the CLI and prints what the page shows`, async () => {
          await runShellBlock(block);
        });
      }
    }
  });
}
