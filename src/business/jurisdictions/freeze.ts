import type { CalendarDefinition } from '../definition.js';

/** @internal Freezes a bundled definition and everything in it. */
export function deepFreezeDefinition(def: CalendarDefinition): CalendarDefinition {
  const walk = (v: unknown): void => {
    if (typeof v === 'object' && v !== null && !Object.isFrozen(v)) {
      Object.freeze(v);
      for (const x of Object.values(v)) walk(x);
    }
  };
  walk(def);
  return def;
}
