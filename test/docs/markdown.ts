/**
 * The documentation pages and their fenced code blocks, as the docs tests read them: README.md and every
 * docs/*.md (the generated API reference under docs/api/ is not a page of ours).
 *
 * A block's info string is its language, optionally followed by one of:
 * - `no-run: <reason>`: the block is shown but not run (a sketch, a shape, a command that needs files the
 *   repository does not hold); the reason is required, and the runner counts such blocks;
 * - `file=<name>`: a JSON block whose text the shell blocks after it on the same page find as the file `<name>`.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export const ROOT = fileURLToPath(new URL('../../', import.meta.url));

/** A fenced code block: `line` is the page line (1-based) of the block's first text line. */
export interface Block {
  readonly page: string;
  readonly line: number;
  readonly lang: string;
  readonly noRun: string | undefined;
  readonly file: string | undefined;
  readonly text: string;
}

/** The pages, as paths from the repository root: README.md first, then docs/*.md in name order. */
export function docPages(): string[] {
  const docs = readdirSync(`${ROOT}docs`)
    .filter((n) => n.endsWith('.md'))
    .sort()
    .map((n) => `docs/${n}`);
  return ['README.md', ...docs];
}

export function readPage(page: string): string {
  return readFileSync(`${ROOT}${page}`, 'utf8');
}

/** The page's fenced blocks (fences start at the line's first column, as on every page). */
export function blocksOf(page: string, text = readPage(page)): Block[] {
  const lines = text.split('\n');
  const blocks: Block[] = [];
  for (let i = 0; i < lines.length; i++) {
    const open = /^```(.*)$/.exec(lines[i]!);
    if (!open) continue;
    const info = open[1]!.trim();
    const close = lines.findIndex((l, j) => j > i && l === '```');
    if (close < 0) throw new Error(`${page}:${i + 1}: the code block is never closed`);
    const m = /^(\w*)(?:\s+(?:no-run:\s*(.*)|file=(\S+)))?$/.exec(info);
    if (!m) throw new Error(`${page}:${i + 1}: unreadable info string "${info}" (write a language, then "no-run: <reason>" or "file=<name>")`);
    blocks.push({
      page,
      line: i + 2,
      lang: m[1]!,
      noRun: m[2] === undefined ? undefined : m[2].trim(),
      file: m[3],
      text: lines.slice(i + 1, close).join('\n'),
    });
    i = close;
  }
  return blocks;
}

/** The page's text outside fenced blocks (fenced lines blanked, so line numbers stay). */
export function proseOf(text: string): string {
  let inBlock = false;
  return text
    .split('\n')
    .map((l) => {
      if (l.startsWith('```')) {
        inBlock = !inBlock;
        return '';
      }
      return inBlock ? '' : l;
    })
    .join('\n');
}

/**
 * The anchor GitHub gives a heading: lower case, punctuation other than hyphens and underscores dropped, each
 * space a hyphen.
 */
export function headingAnchor(heading: string): string {
  return heading
    .trim()
    .toLowerCase()
    .replace(/`/g, '')
    .replace(/[^\p{L}\p{N} _-]/gu, '')
    .replace(/ /g, '-');
}

/** The anchors of a page's headings (a repeated heading gets -1, -2, ... as on GitHub). */
export function anchorsOf(text: string): Set<string> {
  const seen = new Map<string, number>();
  const anchors = new Set<string>();
  for (const line of proseOf(text).split('\n')) {
    const h = /^#{1,6}\s+(.*)$/.exec(line);
    if (!h) continue;
    const base = headingAnchor(h[1]!);
    const n = seen.get(base) ?? 0;
    seen.set(base, n + 1);
    anchors.add(n === 0 ? base : `${base}-${n}`);
  }
  return anchors;
}
