/**
 * `npm test` prints vitest's own report and nothing else: tests print diagnostic lines only through note() of
 * test/note.ts (behind KALENDS_TEST_VERBOSE=1), never straight to the console or to the process's streams.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const TEST_DIR = fileURLToPath(new URL('./', import.meta.url));

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return name === 'fixtures' ? [] : sources(path);
    return path.endsWith('.ts') ? [path] : [];
  });
}

describe('quiet tests', () => {
  it('no test writes to the console or to stdout or stderr except through note()', () => {
    const files = sources(TEST_DIR).filter((p) => !p.endsWith('note.ts') && !p.endsWith('quiet.test.ts'));
    expect(files.length).toBeGreaterThan(50);
    const faults = files.flatMap((path) =>
      readFileSync(path, 'utf8')
        .split('\n')
        .flatMap((line, i) => (/\bconsole\.(log|info|warn|error|debug|table)\(|process\.(stdout|stderr)\.write\(/.test(line) ? [`${relative(TEST_DIR, path)}:${i + 1}`] : [])),
    );
    expect(faults).toEqual([]);
  });
});
