/** Shared by the profile tests: the demo profile document, and the faults defineProfile reports for a document. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { DefinitionError, defineProfile } from '../../src/index.js';

/** The demo profile (examples/otterbrook.profile.json), parsed. */
export const demo = JSON.parse(readFileSync(fileURLToPath(new URL('../../examples/otterbrook.profile.json', import.meta.url)), 'utf8')) as Record<string, any>;

/** A deep copy of the demo profile, to break. */
export const copy = () => JSON.parse(JSON.stringify(demo)) as Record<string, any>;

/** Every fault defineProfile reports for `doc` (none when it compiles). */
export function issuesOf(doc: unknown): { path: string; message: string }[] {
  try {
    defineProfile(doc as never);
  } catch (e) {
    if (e instanceof DefinitionError) return e.issues.map((i) => ({ path: i.path, message: i.message }));
    throw e;
  }
  return [];
}
