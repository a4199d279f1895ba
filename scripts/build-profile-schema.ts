/**
 * Writes schema/profile.schema.json (published as `kalends/profile.schema.json`) from the profile's one field
 * description. Run after changing src/profile/document.ts: `npx esbuild scripts/build-profile-schema.ts --bundle
 * --platform=node --format=esm --outfile=/tmp/schema.mjs && node /tmp/schema.mjs`. test/profile/schema.test.ts
 * fails when the committed file and the description drift apart.
 */
import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { profileJsonSchemaText } from '../src/profile/schema.js';

// Run from the repository's root (the bundled script may live anywhere).
const target = resolve(process.cwd(), 'schema/profile.schema.json');
writeFileSync(target, profileJsonSchemaText());
console.log(`wrote ${target}`);
