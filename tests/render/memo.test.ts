// The render's bounded caches: a result is made once while its key is in use, and a cache never
// holds more than two generations of keys.
import { describe, expect, it } from 'vitest';
import { boundedCache } from '../../src/render/memo.js';

describe('boundedCache', () => {
  it('makes a result once while its key keeps being used', () => {
    const made: string[] = [];
    const cached = boundedCache<string>(4);
    const get = (k: string) => cached(k, () => (made.push(k), k.toUpperCase()));
    for (let round = 0; round < 3; round++) for (const k of ['a', 'b', 'c']) expect(get(k)).toBe(k.toUpperCase());
    expect(made).toEqual(['a', 'b', 'c']);
    // "a" used again between others: it moves to the young generation and survives them
    for (let i = 0; i < 12; i++) {
      get(`x${i}`);
      get('a');
    }
    expect(made.filter((k) => k === 'a')).toHaveLength(1);
  });

  it('forgets a key once two generations of other keys have come after it', () => {
    const made: string[] = [];
    const cached = boundedCache<number>(3);
    const get = (k: string) => cached(k, () => (made.push(k), made.length));
    get('first');
    for (let i = 0; i < 6; i++) get(`k${i}`);
    get('first');
    expect(made.filter((k) => k === 'first')).toHaveLength(2);
  });

  it('keeps a null result (a device without a band) as a result', () => {
    let calls = 0;
    const cached = boundedCache<null>(3);
    cached('none', () => (calls++, null));
    cached('none', () => (calls++, null));
    expect(calls).toBe(1);
  });
});
