/**
 * Runs the `kalends` commands of a page's `sh` blocks through the CLI in-process (`runCli`), and compares
 * what they print with what the page shows. Two forms:
 *
 * - a script: every line is a command (a trailing `\` continues it, `#` starts a comment); each must exit 0;
 * - a session: lines starting with `$ ` are commands, the lines after one, up to the next `$ `, are what it
 *   prints (standard error and standard output as a terminal shows them, in the order written; trailing blank
 *   lines ignored; a line `...` stands for any number of lines). A command that exits with a code other than 0
 *   must be followed by `$ echo $?` showing the code.
 *
 * A command is `kalends ...` (or `npx kalends ...`), optionally fed by `echo ... |` or `printf '...' |`. A block
 * with no `kalends` command (npm scripts, a generator) is not run and is counted as such; a block that calls
 * `kalends` in a form the runner cannot run must be marked `no-run: <reason>`.
 */
import { runCli } from '../../src/cli/main.js';
import type { CliIo } from '../../src/cli/kit.js';
import type { Block } from './markdown.js';

/** A command and what the page shows it printing (undefined in a script: not shown). */
export interface ShellStep {
  readonly line: number;
  readonly command: string;
  readonly output: readonly string[] | undefined;
}

type Token = { readonly word: string } | { readonly op: string };

/** The block's commands, continuation lines joined. */
export function shellSteps(block: Block): ShellStep[] {
  const lines = block.text.split('\n');
  const session = lines.some((l) => l.startsWith('$ '));
  const steps: ShellStep[] = [];
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!;
    if (session && !line.startsWith('$ ')) {
      if (line.trim() !== '') throw new Error(`${block.page}:${block.line + i}: a session's output must follow a "$ " command`);
      continue;
    }
    if (!session && (line.trim() === '' || line.trim().startsWith('#'))) continue;
    const first = i;
    let command = session ? line.slice(2) : line;
    while (command.endsWith('\\') && i + 1 < lines.length) command = command.slice(0, -1) + lines[++i]!;
    let output: string[] | undefined;
    if (session) {
      output = [];
      while (i + 1 < lines.length && !lines[i + 1]!.startsWith('$ ')) output.push(lines[++i]!);
      while (output.length > 0 && output[output.length - 1]!.trim() === '') output.pop();
    }
    steps.push({ line: block.line + first, command, output });
  }
  return steps;
}

/** Shell words and operators: single and double quotes, backslash escapes, `#` comments. */
export function tokenize(command: string): Token[] {
  const tokens: Token[] = [];
  let word = '';
  let inWord = false;
  const end = () => {
    if (inWord) tokens.push({ word });
    word = '';
    inWord = false;
  };
  for (let i = 0; i < command.length; i++) {
    const c = command[i]!;
    if (c === ' ' || c === '\t') end();
    else if (c === '#' && !inWord) break;
    else if (c === "'") {
      const close = command.indexOf("'", i + 1);
      if (close < 0) throw new Error(`unclosed single quote in: ${command}`);
      word += command.slice(i + 1, close);
      inWord = true;
      i = close;
    } else if (c === '"') {
      inWord = true;
      for (i++; i < command.length && command[i] !== '"'; i++) {
        if (command[i] === '\\' && '"\\$`'.includes(command[i + 1] ?? '')) i++;
        word += command[i];
      }
      if (i >= command.length) throw new Error(`unclosed double quote in: ${command}`);
    } else if (c === '\\') {
      word += command[++i] ?? '';
      inWord = true;
    } else if ('|&;<>'.includes(c)) {
      end();
      const two = command.slice(i, i + 2);
      const op = two === '||' || two === '&&' || two === '>>' ? two : c;
      tokens.push({ op });
      i += op.length - 1;
    } else {
      word += c;
      inWord = true;
    }
  }
  end();
  return tokens;
}

/** The stages of a pipeline, or the operator that makes it something the runner does not run. */
function stages(command: string): { stages: string[][] } | { unsupported: string } {
  const result: string[][] = [[]];
  for (const t of tokenize(command)) {
    if ('op' in t) {
      if (t.op !== '|') return { unsupported: `the operator ${t.op}` };
      result.push([]);
    } else result[result.length - 1]!.push(t.word);
  }
  return { stages: result };
}

function kalendsArgs(words: readonly string[]): string[] | undefined {
  if (words[0] === 'kalends') return words.slice(1);
  if (words[0] === 'npx' && words[1] === 'kalends') return words.slice(2);
  return undefined;
}

/** Whether any command of the block is a `kalends` command. */
export function callsKalends(block: Block): boolean {
  return shellSteps(block).some((s) => {
    const p = stages(s.command);
    return 'stages' in p ? p.stages.some((words) => kalendsArgs(words) !== undefined) : /\bkalends\b/.test(s.command);
  });
}

/** printf's format with no arguments: backslash escapes and %%. */
function printfText(format: string): string {
  return format.replace(/\\(.)|%(.)/g, (_, esc: string | undefined, pct: string | undefined) => {
    if (pct !== undefined) {
      if (pct !== '%') throw new Error(`printf: the runner takes no conversions, got %${pct}`);
      return '%';
    }
    const map: Record<string, string> = { n: '\n', t: '\t', '\\': '\\', "'": "'", '"': '"' };
    if (!(esc! in map)) throw new Error(`printf: unknown escape \\${esc}`);
    return map[esc!]!;
  });
}

/** Runs the CLI in-process; `text` is standard error and standard output interleaved as written. */
export async function runKalends(argv: readonly string[], stdin: string | undefined): Promise<{ code: number; text: string }> {
  let text = '';
  const io: CliIo = {
    stdin: stdin === undefined ? undefined : (async function* () { yield stdin; })(),
    stdout: (t) => { text += t; },
    stderr: (t) => { text += t; },
    stderrIsTty: false,
  };
  const code = await runCli(argv, io);
  return { code, text };
}

/** Whether `actual` shows what the page shows (`...` lines match any lines; trailing spaces ignored). */
export function outputMatches(shown: readonly string[], actual: readonly string[]): boolean {
  const want = shown.map((l) => l.trimEnd());
  const got = actual.map((l) => l.trimEnd());
  const match = (i: number, j: number): boolean => {
    if (i === want.length) return j === got.length;
    if (want[i] === '...') {
      for (let k = j; k <= got.length; k++) if (match(i + 1, k)) return true;
      return false;
    }
    return j < got.length && want[i] === got[j] && match(i + 1, j + 1);
  };
  return match(0, 0);
}

/** Runs the block's steps in order; throws, naming the page and line, at the first that differs. */
export async function runShellBlock(block: Block): Promise<{ commands: number }> {
  const steps = shellSteps(block);
  let last: number | undefined;
  let commands = 0;
  for (let s = 0; s < steps.length; s++) {
    const step = steps[s]!;
    const where = `${block.page}:${step.line}: ${step.command}`;
    const parsed = stages(step.command);
    if ('unsupported' in parsed) throw new Error(`${where}\nthe docs runner cannot run ${parsed.unsupported}; mark the block "no-run: <reason>"`);
    const [head, ...rest] = parsed.stages;
    let result: { code: number; text: string };
    if (head![0] === 'echo' && head![1] === '$?' && rest.length === 0) {
      if (last === undefined) throw new Error(`${where}\nno command before it`);
      result = { code: 0, text: `${last}\n` };
    } else {
      const argv = kalendsArgs(parsed.stages[parsed.stages.length - 1]!);
      if (!argv || parsed.stages.length > 2) throw new Error(`${where}\nthe docs runner runs "kalends ..." fed at most by echo or printf; mark the block "no-run: <reason>"`);
      let stdin: string | undefined;
      if (parsed.stages.length === 2) {
        const [feeder, ...args] = head!;
        if (feeder === 'echo') stdin = `${args.join(' ')}\n`;
        else if (feeder === 'printf' && args.length === 1) stdin = printfText(args[0]!);
        else throw new Error(`${where}\nthe docs runner feeds a command from "echo ..." or "printf '...'" only`);
      }
      result = await runKalends(argv, stdin);
      commands++;
      const next = steps[s + 1];
      if (result.code !== 0 && (step.output === undefined || next?.command.trim() !== 'echo $?')) {
        throw new Error(`${where}\nexited with code ${result.code}${step.output === undefined ? '' : ' (show it with "$ echo $?")'}:\n${result.text}`);
      }
    }
    last = result.code;
    if (step.output !== undefined) {
      const actual = result.text.replace(/\n$/, '').split('\n');
      if (!(result.text === '' && step.output.length === 0) && !outputMatches(step.output, actual)) {
        throw new Error(`${where}\nprinted\n${result.text}\nthe page shows\n${step.output.join('\n')}`);
      }
    }
  }
  return { commands };
}
