// Bounded caches for the render: results of pure work kept for the keys used most lately, so a
// long `serve` session cannot grow one without limit. Only for results that callers never change
// (strings, arrays they copy before adding to).

/**
 * A cache: `cached(key, make)` gives the result kept for `key`, else makes, keeps and gives it.
 * Two generations of at most `max` keys each: when the young one is full it becomes the old one
 * and the former old one is dropped; a key found in the old one moves to the young one. So it
 * holds at most 2 × max results, and evicting costs nothing per call (deleting a Map's first key
 * one at a time makes every later `keys().next()` step over the deleted ones).
 */
export function boundedCache<R>(max: number): (key: string, make: () => R) => R {
  let young = new Map<string, R>();
  let old = new Map<string, R>();
  return (key, make) => {
    let r = young.get(key);
    if (r !== undefined) return r;
    r = old.get(key) ?? make();
    young.set(key, r);
    if (young.size >= max) {
      old = young;
      young = new Map();
    }
    return r;
  };
}
