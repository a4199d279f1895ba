/**
 * @internal The one "did you mean" helper. Suggestions go by spelling (edit distance, case-insensitive) and by
 * meaning (a table of common alternative words that maps each to one of our names). The work per call is
 * bounded: text longer than {@link MAX_SUGGEST_INPUT} characters gets no suggestion, and distances stop early.
 *
 * @module
 */

/** Received text longer than this gets no spelling suggestion (a 10 MB line must not cost seconds). */
export const MAX_SUGGEST_INPUT = 64;

/**
 * Levenshtein distance of two strings, with an early exit: any result above `limit` is reported as `limit + 1`.
 * Comparison is exact; callers lower-case first when case should not count.
 */
export function editDistance(a: string, b: string, limit: number): number {
  if (Math.abs(a.length - b.length) > limit) return limit + 1;
  let prev = new Array<number>(b.length + 1);
  let cur = new Array<number>(b.length + 1);
  for (let j = 0; j <= b.length; j++) prev[j] = j;
  for (let i = 1; i <= a.length; i++) {
    cur[0] = i;
    let rowMin = i;
    for (let j = 1; j <= b.length; j++) {
      const v = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + (a.charCodeAt(i - 1) === b.charCodeAt(j - 1) ? 0 : 1));
      cur[j] = v;
      if (v < rowMin) rowMin = v;
    }
    if (rowMin > limit) return limit + 1;
    const t = prev;
    prev = cur;
    cur = t;
  }
  return prev[b.length]!;
}

/** Options of {@link suggestNames}. */
export interface SuggestOptions {
  /**
   * Words that mean one of the valid names, by meaning rather than spelling (`std` and `stdev` mean `stddev`).
   * Keys are lower case; values must be among the valid names. Read as own properties only.
   */
  readonly synonyms?: Readonly<Record<string, string>> | undefined;
  /** Most suggestions to return (default 3). */
  readonly most?: number | undefined;
}

function normalized(text: string): string {
  return text.trim().toLowerCase().replace(/[\s_]+/g, '-');
}

/**
 * The valid names closest to `received`: first any synonym, then names within an edit distance of about a third of
 * the length (at least 2), nearest first. Returns `[]` for non-strings and for text over {@link MAX_SUGGEST_INPUT}
 * characters.
 */
export function suggestNames(received: unknown, valid: readonly string[], options: SuggestOptions = {}): string[] {
  if (typeof received !== 'string' || received.length === 0 || received.length > MAX_SUGGEST_INPUT) return [];
  const most = options.most ?? 3;
  const key = normalized(received);
  const out: string[] = [];
  const synonyms = options.synonyms;
  if (synonyms && Object.prototype.hasOwnProperty.call(synonyms, key)) {
    const s = synonyms[key]!;
    if (valid.includes(s)) out.push(s);
  }
  const compact = key.replace(/-/g, '');
  const limit = Math.max(2, Math.floor(key.length / 3));
  const scored: { name: string; d: number }[] = [];
  for (const name of valid) {
    if (out.includes(name)) continue;
    const lower = name.toLowerCase();
    let d = editDistance(key, lower, limit);
    const dc = editDistance(compact, lower.replace(/-/g, ''), limit);
    if (dc < d) d = dc;
    if (d <= limit) scored.push({ name, d });
  }
  scored.sort((x, y) => x.d - y.d || (x.name < y.name ? -1 : x.name > y.name ? 1 : 0));
  const best = scored[0]?.d;
  for (const s of scored) {
    if (out.length >= most) break;
    if (best !== undefined && s.d > best + 1) break;
    out.push(s.name);
  }
  return out.slice(0, most);
}

/**
 * A message suffix for {@link suggestNames}: `; did you mean "a" or "b"?`, or `''` when there is nothing close.
 */
export function didYouMean(received: unknown, valid: readonly string[], options?: SuggestOptions): string {
  const names = suggestNames(received, valid, options);
  return names.length > 0 ? `; did you mean ${names.map((n) => JSON.stringify(n)).join(' or ')}?` : '';
}
