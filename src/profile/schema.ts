/**
 * @internal The JSON Schema (draft 2020-12) of calendar profiles, made from the same description as the
 * validator's structural checks. `scripts/build-profile-schema.ts` writes it to `schema/profile.schema.json`
 * (the package's `kalends/profile.schema.json`), and a test regenerates it and compares.
 *
 * @module
 */
import { PROFILE_SHAPE } from './document.js';
import { type JsonSchema, schemaOfShape } from './shape.js';

/** The profile's JSON Schema as an object. */
export function profileJsonSchema(): JsonSchema {
  return {
    $schema: 'https://json-schema.org/draft/2020-12/schema',
    title: 'kalends calendar profile',
    ...schemaOfShape(PROFILE_SHAPE),
  };
}

/** The schema file's text: two-space indented JSON and a final newline. */
export function profileJsonSchemaText(): string {
  return `${JSON.stringify(profileJsonSchema(), null, 2)}\n`;
}
