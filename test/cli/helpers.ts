import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { CliIo } from '../../src/cli/kit.js';
import { runCli } from '../../src/cli/main.js';

/** Runs the CLI in-process with the given arguments and stdin text; returns exit code, stdout and stderr. */
export async function cli(
  argv: string[],
  stdin?: string | AsyncIterable<string | Uint8Array>,
  stderrIsTty = false,
): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: CliIo = {
    stdin: stdin === undefined ? undefined : typeof stdin === 'string' ? (async function* () { yield stdin; })() : stdin,
    stdout: (t) => { out += t; },
    stderr: (t) => { err += t; },
    stderrIsTty,
  };
  const code = await runCli(argv, io);
  return { code, out, err };
}

/** The built CLI (npm test builds it first; run `npx tsup --silent` before running these tests alone). */
export const DIST_CLI = fileURLToPath(new URL('../../dist/cli.js', import.meta.url));

/** A stack trace line, as Node prints them ("    at fn (file:line:col)"). */
export const STACK_LINE = /^\s+at .+[(:]/m;

/**
 * Runs dist/cli.js as a child process. `stdin` is written (with backpressure) and closed; `closeAfter` closes the
 * child's stdout after that many bytes have arrived, as `| head` does. Returns the exit code, the bytes of
 * stdout read and all of stderr.
 */
export function child(
  argv: string[],
  options: { stdin?: Iterable<string | Uint8Array>; closeAfter?: number } = {},
): Promise<{ code: number | null; signal: NodeJS.Signals | null; outBytes: number; out: string; err: string }> {
  if (!existsSync(DIST_CLI)) throw new Error(`${DIST_CLI} is missing: run npx tsup --silent first`);
  return new Promise((resolve, reject) => {
    const p = spawn(process.execPath, [DIST_CLI, ...argv], { stdio: ['pipe', 'pipe', 'pipe'] });
    let outBytes = 0;
    let out = '';
    let err = '';
    p.stdout.on('data', (b: Buffer) => {
      outBytes += b.length;
      if (out.length < 1_000_000) out += b.toString('utf8');
      if (options.closeAfter !== undefined && outBytes >= options.closeAfter) p.stdout.destroy();
    });
    p.stderr.on('data', (b: Buffer) => {
      err += b.toString('utf8');
    });
    p.on('error', reject);
    p.on('close', (code, signal) => resolve({ code, signal, outBytes, out, err }));
    p.stdin.on('error', () => {}); // the child may stop reading early (it stops after too many refused values)
    void (async () => {
      for (const chunk of options.stdin ?? []) {
        if (!p.stdin.write(chunk)) await new Promise((r) => p.stdin.once('drain', r));
        if (p.stdin.destroyed) return;
      }
      p.stdin.end();
    })();
  });
}
