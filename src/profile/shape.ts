/**
 * @internal A small description language for JSON documents, and the two things made from one description: the
 * JSON Schema (draft 2020-12) that editors and other tools read, and the structural checks of the validator
 * (fields, kinds, enums, bounds, patterns, required fields), which record every fault with its dotted path in the
 * diagnostics kit's {@link Issues}. Checks a schema cannot state (a zone the runtime knows, a reference between
 * sections) are the validator's own, after this walk.
 *
 * @module
 */
import { describeValue } from '../errors.js';
import { type Issues, didYouMean, hasOwn, isRecord, joinPath } from '../diagnostics/index.js';

/** A description of one JSON value. */
export type Shape =
  | { readonly type: 'string'; readonly description: string; readonly maxLength?: number; readonly pattern?: string; readonly patternHint?: string }
  | { readonly type: 'enum'; readonly description: string; readonly values: readonly string[] }
  | { readonly type: 'const'; readonly description: string; readonly value: string }
  | { readonly type: 'integer'; readonly description: string; readonly min: number; readonly max: number }
  | {
      readonly type: 'object';
      readonly description: string;
      readonly fields: Readonly<Record<string, Shape>>;
      readonly required: readonly string[];
    }
  | {
      readonly type: 'map';
      readonly description: string;
      readonly keyPattern: string;
      readonly keyHint: string;
      readonly values: Shape;
      readonly minEntries?: number;
      readonly maxEntries: number;
    }
  | { readonly type: 'array'; readonly description: string; readonly items: Shape; readonly minItems?: number; readonly maxItems: number }
  | {
      /** Alternatives told apart by `pick` (their JSON kinds or their keys must not overlap). */
      readonly type: 'union';
      readonly description: string;
      readonly variants: readonly Shape[];
      /** The variant a value is meant to be, or a message saying what was expected. */
      readonly pick: (value: unknown) => number | string;
    }
  | {
      /** A definition checked by another layer's validator (a calendar, a frequency rule, hours): a JSON object. */
      readonly type: 'definition';
      readonly description: string;
      /** Fields the schema states for editors (the nested validator checks them again, and the rest). */
      readonly hintFields?: Readonly<Record<string, Shape>>;
      readonly required?: readonly string[];
    };

/** A JSON Schema object (draft 2020-12). */
export type JsonSchema = { readonly [key: string]: unknown };

/** The JSON Schema of a shape. */
export function schemaOfShape(shape: Shape): JsonSchema {
  const description = shape.description;
  switch (shape.type) {
    case 'string':
      return {
        type: 'string',
        description,
        minLength: 1,
        maxLength: shape.maxLength ?? 1000,
        ...(shape.pattern ? { pattern: shape.pattern } : {}),
      };
    case 'enum':
      return { description, enum: [...shape.values] };
    case 'const':
      return { description, const: shape.value };
    case 'integer':
      return { type: 'integer', description, minimum: shape.min, maximum: shape.max };
    case 'object': {
      const properties: Record<string, JsonSchema> = {};
      for (const [k, v] of Object.entries(shape.fields)) properties[k] = schemaOfShape(v);
      return { type: 'object', description, properties, required: [...shape.required], additionalProperties: false };
    }
    case 'map':
      return {
        type: 'object',
        description,
        propertyNames: { pattern: shape.keyPattern },
        additionalProperties: schemaOfShape(shape.values),
        ...(shape.minEntries ? { minProperties: shape.minEntries } : {}),
        maxProperties: shape.maxEntries,
      };
    case 'array':
      return {
        type: 'array',
        description,
        items: schemaOfShape(shape.items),
        ...(shape.minItems ? { minItems: shape.minItems } : {}),
        maxItems: shape.maxItems,
      };
    case 'union':
      return { description, anyOf: shape.variants.map(schemaOfShape) };
    case 'definition': {
      const properties: Record<string, JsonSchema> = {};
      for (const [k, v] of Object.entries(shape.hintFields ?? {})) properties[k] = schemaOfShape(v);
      return {
        type: 'object',
        description,
        ...(shape.hintFields ? { properties } : {}),
        ...(shape.required?.length ? { required: [...shape.required] } : {}),
      };
    }
  }
}

function codePointCount(text: string, max: number): number {
  if (text.length <= max) return text.length; // never more code points than UTF-16 units
  let n = 0;
  for (const _ of text) if (++n > max) break;
  return n;
}

function listOf(values: readonly string[]): string {
  return values.map((v) => JSON.stringify(v)).join(', ');
}

/**
 * Checks `value` against `shape`, recording each fault at its path. Returns true when the value (and everything
 * inside it) fits. Never throws.
 */
export function checkShape(value: unknown, shape: Shape, path: string, issues: Issues): boolean {
  const at = path === '' ? '(profile)' : path;
  switch (shape.type) {
    case 'string': {
      const max = shape.maxLength ?? 1000;
      // Lengths count code points, as JSON Schema's minLength and maxLength do.
      if (typeof value !== 'string' || value.length === 0 || codePointCount(value, max) > max) {
        issues.add(at, `expected a non-empty string of at most ${max} characters, got ${describeValue(value)}`);
        return false;
      }
      if (shape.pattern && !new RegExp(shape.pattern, 'u').test(value)) {
        issues.add(at, `expected ${shape.patternHint ?? `text matching ${shape.pattern}`}, got ${describeValue(value)}`);
        return false;
      }
      return true;
    }
    case 'enum':
      if (typeof value !== 'string' || !shape.values.includes(value)) {
        issues.add(at, `expected one of ${listOf(shape.values)}, got ${describeValue(value)}${didYouMean(value, shape.values)}`);
        return false;
      }
      return true;
    case 'const':
      if (value !== shape.value) {
        issues.add(at, `expected ${JSON.stringify(shape.value)}, got ${describeValue(value)}`);
        return false;
      }
      return true;
    case 'integer':
      if (typeof value !== 'number' || !Number.isInteger(value) || value < shape.min || value > shape.max) {
        issues.add(at, `expected an integer from ${shape.min} to ${shape.max}, got ${describeValue(value)}`);
        return false;
      }
      return true;
    case 'object': {
      if (!isRecord(value)) {
        issues.add(at, `expected an object (${shape.description}), got ${describeValue(value)}`);
        return false;
      }
      let ok = true;
      const allowed = Object.keys(shape.fields);
      for (const key of Object.keys(value)) {
        if (!allowed.includes(key)) {
          issues.add(joinPath(path, key), `unknown field${didYouMean(key, allowed)}; valid fields here are ${listOf(allowed)}`);
          ok = false;
        }
      }
      for (const key of shape.required) {
        if (!hasOwn(value, key)) {
          issues.add(joinPath(path, key), `required: ${shape.fields[key]!.description}`);
          ok = false;
        }
      }
      for (const [key, sub] of Object.entries(shape.fields)) {
        if (hasOwn(value, key) && !checkShape(value[key], sub, joinPath(path, key), issues)) ok = false;
      }
      return ok;
    }
    case 'map': {
      if (!isRecord(value)) {
        issues.add(at, `expected an object of named entries (${shape.description}), got ${describeValue(value)}`);
        return false;
      }
      const keys = Object.keys(value);
      if (keys.length < (shape.minEntries ?? 0) || keys.length > shape.maxEntries) {
        issues.add(at, `expected ${shape.minEntries ?? 0} to ${shape.maxEntries} entries, got ${keys.length}`);
        return false;
      }
      let ok = true;
      const re = new RegExp(shape.keyPattern, 'u');
      for (const key of keys) {
        const p = joinPath(path, key);
        if (!re.test(key)) {
          issues.add(p, `the name ${JSON.stringify(key)} is not allowed: ${shape.keyHint}`);
          ok = false;
          continue;
        }
        if (!checkShape(value[key], shape.values, p, issues)) ok = false;
      }
      return ok;
    }
    case 'array': {
      if (!Array.isArray(value)) {
        issues.add(at, `expected an array (${shape.description}), got ${describeValue(value)}`);
        return false;
      }
      if (value.length < (shape.minItems ?? 0) || value.length > shape.maxItems) {
        issues.add(at, `expected ${shape.minItems ?? 0} to ${shape.maxItems} items, got ${value.length}`);
        return false;
      }
      let ok = true;
      for (let i = 0; i < value.length; i++) {
        if (!(i in value)) {
          issues.add(`${path}[${i}]`, 'expected a value, got a hole');
          ok = false;
        } else if (!checkShape(value[i], shape.items, `${path}[${i}]`, issues)) ok = false;
      }
      return ok;
    }
    case 'union': {
      const picked = shape.pick(value);
      if (typeof picked === 'string') {
        issues.add(at, `${picked}, got ${describeValue(value)}`);
        return false;
      }
      return checkShape(value, shape.variants[picked]!, path, issues);
    }
    case 'definition': {
      if (!isRecord(value)) {
        issues.add(at, `expected an object (${shape.description}), got ${describeValue(value)}`);
        return false;
      }
      let ok = true;
      for (const key of shape.required ?? []) {
        if (!hasOwn(value, key)) {
          issues.add(joinPath(path, key), `required: ${shape.hintFields?.[key]?.description ?? 'a value'}`);
          ok = false;
        }
      }
      for (const [key, sub] of Object.entries(shape.hintFields ?? {})) {
        if (hasOwn(value, key) && !checkShape(value[key], sub, joinPath(path, key), issues)) ok = false;
      }
      return ok;
    }
  }
}
