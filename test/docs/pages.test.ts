/**
 * The documentation as a whole: every public function and constant is on some page, every page links back to
 * the README's table of pages and to the API reference, the table lists every page, every relative link finds its
 * file and heading, the options the pages give `kalends` commands exist, and the README keeps its opening shape.
 * The pages' code blocks are run by blocks.test.ts.
 */
import { existsSync } from 'node:fs';
import { dirname, join, normalize } from 'node:path';
import { describe, expect, it } from 'vitest';
import * as kalends from '../../src/index.js';
import * as warehouse from '../../src/warehouse/files.js';
import * as tzdata from '../../src/tzdata/index.js';
import { allCommands } from '../../src/cli/main.js';
import { PROFILE_OPTION } from '../../src/cli/kit.js';
import { ROOT, anchorsOf, blocksOf, docPages, proseOf, readPage } from './markdown.js';

const pages = docPages();
const texts = new Map(pages.map((p) => [p, readPage(p)]));
const docs = pages.filter((p) => p.startsWith('docs/'));

/** The API reference TypeDoc writes into docs/api/ (it may not be generated yet: the link test then waits for it). */
const API_ENTRY = 'api/index.html';
const API_PRESENT = existsSync(join(ROOT, 'docs/api'));

/** The line every docs page ends with. */
const FOOTER = `[All documentation](../README.md#documentation) · [API reference](${API_ENTRY})`;

describe('the public surface on the pages', () => {
  const surface: [string, Record<string, unknown>][] = [
    ['kalends', kalends],
    ['kalends/warehouse', warehouse],
    ['kalends/tzdata', tzdata],
  ];

  it('names every exported function, class and constant of kalends, kalends/warehouse and kalends/tzdata on some page', () => {
    const all = [...texts.values()].join('\n');
    const missing = surface.flatMap(([from, mod]) =>
      Object.keys(mod).filter((name) => !new RegExp(`\\b${name}\\b`).test(all)).map((name) => `${from}: ${name}`),
    );
    expect(Object.keys(kalends).length).toBeGreaterThan(200);
    expect(missing).toEqual([]);
  });
});

describe('links', () => {
  it(`every docs page ends with the line linking to the README's table and to the API reference`, () => {
    const faults = docs.filter((p) => texts.get(p)!.trimEnd().split('\n').pop() !== FOOTER);
    expect(faults).toEqual([]);
  });

  it("the README's documentation table lists every docs page", () => {
    const readme = texts.get('README.md')!;
    const table = readme.slice(readme.indexOf('## Documentation'));
    const missing = docs.filter((p) => !table.includes(`| [${p}](${p}) |`));
    expect(missing).toEqual([]);
  });

  it(`every relative link finds its file and heading (links into docs/api wait until it is generated: ${API_PRESENT ? 'it is' : 'it is not yet'})`, () => {
    const faults: string[] = [];
    let checked = 0;
    for (const [page, text] of texts) {
      const prose = proseOf(text).split('\n');
      prose.forEach((line, i) => {
        for (const m of line.matchAll(/\]\(([^)\s]+)\)/g)) {
          const target = m[1]!;
          if (/^[a-z]+:/i.test(target)) continue;
          const [path, anchor] = target.split('#') as [string, string | undefined];
          const file = path === '' ? page : normalize(join(dirname(page), path));
          checked++;
          if (file.startsWith('docs/api/') && !API_PRESENT) continue;
          if (!existsSync(join(ROOT, file))) {
            faults.push(`${page}:${i + 1}: ${target}: no file ${file}`);
            continue;
          }
          if (anchor !== undefined && file.endsWith('.md') && !anchorsOf(readPage(file)).has(anchor)) {
            faults.push(`${page}:${i + 1}: ${target}: no heading #${anchor} in ${file}`);
          }
        }
      });
    }
    expect(checked).toBeGreaterThan(60);
    expect(faults).toEqual([]);
  });
});

describe('the kalends commands the pages name', () => {
  it('give each command only options it has (the renamed ones aside)', () => {
    const faults: string[] = [];
    let checked = 0;
    for (const [page, text] of texts) {
      let renamed = false;
      proseOf(text)
        .split('\n')
        .forEach((line, i) => {
          if (/^#+ /.test(line)) renamed = /Renamed in/.test(line);
          if (renamed) return;
          for (const m of line.matchAll(/`(?:npx )?kalends ([a-z][a-z-]*)((?: [^`]*)?)`/g)) {
            const command = allCommands.find((c) => c.name === m[1]);
            if (!command) {
              if (!['help', '<command>'].includes(m[1]!)) faults.push(`${page}:${i + 1}: no command "${m[1]}"`);
              continue;
            }
            const names = new Set([...command.options, PROFILE_OPTION].map((o) => o.name).concat('help'));
            for (const o of m[2]!.matchAll(/--([a-z-]+)/g)) {
              checked++;
              if (!names.has(o[1]!)) faults.push(`${page}:${i + 1}: kalends ${command.name} has no option --${o[1]}`);
            }
          }
        });
    }
    expect(checked).toBeGreaterThan(0);
    expect(faults).toEqual([]);
  });
});

describe('the README', () => {
  const readme = texts.get('README.md')!;

  it('opens with one paragraph that states the job, then the set-up commands: install and demo, then the whole test suite', () => {
    const [title, intro, setUp] = readme.split('\n\n');
    expect(title).toBe('# kalends');
    expect(intro).toMatch(/^kalends is a TypeScript library /);
    expect(setUp).toBe('## Set up');
    const first = blocksOf('README.md', readme)[0]!;
    expect(first.lang).toBe('sh');
    // The two set-up commands come first, in order; the workbench command follows them (issue 18).
    expect(first.text.split('\n').map((l) => l.replace(/\s+#.*$/, ''))).toEqual(['npm ci && npm run demo', 'npm test', 'npm run workbench']);
  });

  it('says what the install-scripts warning of newer npm means and what .ci/run installs', () => {
    expect(readme).toMatch(/npm warn install-scripts/);
    expect(readme).toMatch(/esbuild/);
    expect(readme).toMatch(/optional dependenc/);
    expect(readme).toMatch(/chromium/);
  });
});

describe('the cautions and pictures particular pages carry', () => {
  it('docs/day-counts.md shows every convention at work and says contracts define their own', () => {
    const page = texts.get('docs/day-counts.md')!;
    for (const c of kalends.DAY_COUNT_CONVENTIONS) expect(page.includes(`yearFractionOfDays('${c}'`), c).toBe(true);
    expect(page).toMatch(/Contracts define their own conventions\. A confirmation, an agreement/);
    expect(page).toMatch(/defer to your legal documentation and to\s+>?\s*licensed professionals/);
  });

  it('docs/business-time.md says that hours and cut-offs are set by the institution, and shows the committed week picture', () => {
    const page = texts.get('docs/business-time.md')!;
    expect(page).toMatch(/Official opening hours, early closes and cut-off times are set by the institution/);
    expect(page).toMatch(/verify it against the institution's published hours/);
    expect(page).toContain('](img/hours-week.svg)');
  });
});
