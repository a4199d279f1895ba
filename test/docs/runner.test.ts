/**
 * The docs runner itself (markdown.ts, ts-blocks.ts, sh-blocks.ts): it finds what a page states and fails, naming
 * the page and line, when the code does not give it. A runner that passed everything would make every docs check
 * one that cannot fail.
 */
import { describe, expect, it } from 'vitest';
import * as kalends from '../../src/index.js';
import { type Block, blocksOf, headingAnchor } from './markdown.js';
import { instrument, runTsBlock, valueOfStated } from './ts-blocks.js';
import { outputMatches, runShellBlock, shellSteps, tokenize } from './sh-blocks.js';

const ts = (text: string, line = 10): Block => ({ page: 'docs/x.md', line, lang: 'ts', noRun: undefined, file: undefined, text });
const sh = (text: string): Block => ({ page: 'docs/x.md', line: 20, lang: 'sh', noRun: undefined, file: undefined, text });
const run = (text: string, env = new Map<string, unknown>()) => runTsBlock(ts(text), env, { kalends });

describe('fenced blocks', () => {
  it('reads the language, a no-run reason and a file name, with the line of the first text line', () => {
    const page = ['# T', '', '```ts no-run: a sketch', 'x', '```', '```json file=a.json', '{}', '```', '```', 'plain', '```'].join('\n');
    const blocks = blocksOf('docs/t.md', page);
    expect(blocks.map((b) => [b.lang, b.noRun, b.file, b.line, b.text])).toEqual([
      ['ts', 'a sketch', undefined, 4, 'x'],
      ['json', undefined, 'a.json', 7, '{}'],
      ['', undefined, undefined, 10, 'plain'],
    ]);
    expect(() => blocksOf('docs/t.md', '```ts\nx')).toThrow('docs/t.md:1: the code block is never closed');
  });

  it('gives headings the anchors GitHub gives them', () => {
    expect(headingAnchor('Intraday rules and DST')).toBe('intraday-rules-and-dst');
    expect(headingAnchor('Business time (issue 16)')).toBe('business-time-issue-16');
    expect(headingAnchor('The `describe` command')).toBe('the-describe-command');
  });
});

describe('ts blocks', () => {
  it('splits a note from the value after ": " or " (", outside brackets and quotes', () => {
    expect(valueOfStated("5 (Friday; ISO 8601)")).toEqual({ value: '5', partial: false });
    expect(valueOfStated("{ a: 1, b: 'x: y' }: a note")).toEqual({ value: "{ a: 1, b: 'x: y' }", partial: false });
    expect(valueOfStated('Date.UTC(2025, 8, 7, 4): 01:00 local')).toEqual({ value: 'Date.UTC(2025, 8, 7, 4)', partial: false });
    expect(valueOfStated('{ sign: 1, hours: 2, ... }')).toEqual({ value: '{ sign: 1, hours: 2 }', partial: true });
  });

  it('checks each stated value and names the page line of the first that differs', () => {
    expect(run("import { dayNumberFromYmd } from 'kalends';\ndayNumberFromYmd(2025, 3, 14); // => 20161").checks).toBe(1);
    expect(() => run("import { dayNumberFromYmd } from 'kalends';\ndayNumberFromYmd(2025, 3, 14); // => 20162")).toThrow(
      /^docs\/x\.md:11: dayNumberFromYmd\(2025, 3, 14\): expected 20161 to deeply equal 20162/,
    );
  });

  it('reads a result on the next line, continued on lines indented after //, and a value stated for a const', () => {
    const text = [
      "import { formatPlainDate } from 'kalends';",
      'const n = 20133; // => 20133',
      "[formatPlainDate(n),",
      "  formatPlainDate(n + 1)];",
      "// => ['2025-02-14',",
      "//    '2025-02-15']",
    ].join('\n');
    expect(run(text).checks).toBe(2);
    expect(() => run(text.replace("'2025-02-15'", "'2025-02-16'"))).toThrow(/^docs\/x\.md:12:/);
  });

  it('checks a stated error: its class or a class it extends, and its message with ... for any text', () => {
    const call = "import { dayNumberFromYmd } from 'kalends';\ndayNumberFromYmd(2025, 2, 30);\n";
    expect(run(`${call}// throws KalendsRangeError: day: expected an integer from 1 to 28, got 30`).checks).toBe(1);
    expect(run(`${call}// throws RangeError: day: ...got 30`).checks).toBe(1);
    expect(() => run(`${call}// throws KalendsTypeError`)).toThrow(/docs\/x\.md:11: .*threw KalendsRangeError/s);
    expect(() => run(`${call}// throws KalendsRangeError: day: got 31`)).toThrow(/the page says\n {2}day: got 31/);
    expect(() => run("import { dayNumberFromYmd } from 'kalends';\ndayNumberFromYmd(2025, 2, 28); // throws RangeError")).toThrow(
      /returned 20147; the page says it throws/,
    );
  });

  it('refuses a result written without the convention, and a value-like comment after a declaration', () => {
    expect(instrument(ts("f(); // 5")).faults).toEqual(['docs/x.md:10: "// 5" states a result without the convention: write "// => value" or "// throws Error: message"']);
    expect(instrument(ts("f();\n// 'x'")).faults).toEqual(['docs/x.md:10: the comment after it states a result without the convention: write "// => value"']);
    expect(instrument(ts('const a = f(); // [1, 2]')).faults).toHaveLength(1);
    expect(instrument(ts('const a = f(); // the first step')).faults).toEqual([]);
  });

  it('fails on a name the page never imported, at its line, and carries declarations to the next block', () => {
    expect(() => run('const a = 1;\nformatPlainDate(a);')).toThrow('docs/x.md:11: ReferenceError: formatPlainDate is not defined');
    const env = new Map<string, unknown>();
    run("import { formatPlainDate } from 'kalends';\nconst d = 20133;", env);
    expect(run("formatPlainDate(d); // => '2025-02-14'", env).checks).toBe(1);
    expect(() => run("import { nothing } from 'elsewhere';")).toThrow(/import from "elsewhere"/);
  });
});

describe('sh blocks', () => {
  it('reads shell words, quotes, escapes, pipes and comments', () => {
    expect(tokenize(`printf 'a,b\\n1' | kalends bucket --unit "month" x\\ y # note`)).toEqual([
      { word: 'printf' }, { word: 'a,b\\n1' }, { op: '|' }, { word: 'kalends' }, { word: 'bucket' }, { word: '--unit' },
      { word: 'month' }, { word: 'x y' },
    ]);
    expect(shellSteps(sh('$ kalends a \\\n    --b\nout 1\n\n$ echo $?\n0'))).toEqual([
      { line: 20, command: 'kalends a     --b', output: ['out 1'] },
      { line: 24, command: 'echo $?', output: ['0'] },
    ]);
  });

  it('matches shown output line by line, ... standing for any lines, trailing spaces aside', () => {
    expect(outputMatches(['a', '...', 'd'], ['a', 'b', 'c', 'd  '])).toBe(true);
    expect(outputMatches(['a', '...'], ['a'])).toBe(true);
    expect(outputMatches(['a', 'd'], ['a', 'b', 'd'])).toBe(false);
  });

  it('runs kalends in-process, compares what it prints and wants a failing exit code shown', async () => {
    await expect(runShellBlock(sh('$ kalends describe 2025-02-14 --json\n{"input":"2025-02-14",...'))).rejects.toThrow(/printed\n\{"input":"2025-02-14"/);
    const day = '{"input":"2025-02-14","kind":"date","utc":null,"epochMs":null,"local":null,"offset":null,"zoneAnnotation":null,"leapSecond":null,"date":"2025-02-14","weekday":"Friday","weekdayNumber":5,"isoWeek":"2025-W07-5","dayOfYear":45,"dayNumber":20133,"leapYear":false,"daysInMonth":28}';
    expect(await runShellBlock(sh(`$ kalends describe 2025-02-14 --json\n${day}`))).toEqual({ commands: 1 });
    await expect(runShellBlock(sh('kalends describe 2025-02-30'))).rejects.toThrow(/docs\/x\.md:20: kalends describe 2025-02-30\nexited with code 1/);
    expect(await runShellBlock(sh('$ kalends describe 2025-02-30\n...\n$ echo $?\n1'))).toEqual({ commands: 1 });
    await expect(runShellBlock(sh('kalends describe 2025-02-14 > out.txt'))).rejects.toThrow(/cannot run the operator >/);
  });
});
