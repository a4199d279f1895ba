/**
 * `understoodKeys` names the critical annotations a caller processes (RFC 9557 section 3.3: a recipient must
 * reject a critical annotation it does not understand). Issue 12: given as a string, it matched substrings
 * (`'knort-x'.includes('knort')`), so a critical key the caller never named was accepted. Only an array of
 * strings is accepted now.
 */
import { describe, expect, it } from 'vitest';
import { KalendsTypeError, parseInstant } from '../../src/index.js';

describe('understoodKeys', () => {
  it('a string (0.1 matched its substrings) or an array holding a non-string is a KalendsTypeError naming the option', () => {
    for (const bad of ['knort-x', ['knort', 1], { knort: true }]) {
      try {
        parseInstant('2022-07-08T00:14:07Z[!knort=blargel]', { understoodKeys: bad as never });
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(KalendsTypeError);
        expect((e as Error).message).toMatch(/^options\.understoodKeys(\[\d+\])?: expected an (array of annotation keys|annotation key)/);
      }
    }
  });

  it('an array naming the key accepts the critical annotation (the example of RFC 9557 section 3.3)', () => {
    expect(parseInstant('2022-07-08T00:14:07Z[!knort=blargel]', { understoodKeys: ['knort'] }).epochMs).toBe(Date.UTC(2022, 6, 8, 0, 14, 7));
  });
});
