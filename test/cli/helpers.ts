import type { CliIo } from '../../src/cli/kit.js';
import { runCli } from '../../src/cli/main.js';

/** Runs the CLI in-process with the given arguments and stdin text; returns exit code, stdout and stderr. */
export async function cli(argv: string[], stdin?: string, stderrIsTty = false): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: CliIo = {
    stdin: stdin === undefined ? undefined : (async function* () { yield stdin; })(),
    stdout: (t) => { out += t; },
    stderr: (t) => { err += t; },
    stderrIsTty,
  };
  const code = await runCli(argv, io);
  return { code, out, err };
}
