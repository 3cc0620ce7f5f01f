// Bounded caches for the render: results of pure work kept for the last `max` distinct keys, the
// oldest dropped first, so a long `serve` session cannot grow one without limit. Only for results
// that callers never change (strings, arrays they copy before adding to).

/** A cache: `cached(key, make)` gives the result kept for `key`, else makes, keeps and gives it. */
export function boundedCache<R>(max: number): (key: string, make: () => R) => R {
  const cache = new Map<string, R>();
  return (key, make) => {
    let r = cache.get(key);
    if (r === undefined) {
      r = make();
      if (cache.size >= max) cache.delete(cache.keys().next().value!);
      cache.set(key, r);
    }
    return r;
  };
}
