// A record built from names a file gives keeps "__proto__" as an own field, as Object.fromEntries does.
import { describe, expect, it } from 'vitest';
import { setOwn } from '../../src/model/own-field.js';

describe('setOwn', () => {
  it('makes "__proto__" an own field and leaves the prototype alone, as Object.fromEntries does', () => {
    const cell = { text: '32' };
    const out: Record<string, unknown> = {};
    setOwn(out, 'rating_a', '16');
    setOwn(out, '__proto__', cell);
    const reference = Object.fromEntries([['rating_a', '16'], ['__proto__', cell]]);
    expect(Object.getPrototypeOf(out)).toBe(Object.prototype);
    expect(Object.keys(out)).toEqual(Object.keys(reference));
    expect(Object.getOwnPropertyDescriptor(out, '__proto__')).toEqual(Object.getOwnPropertyDescriptor(reference, '__proto__'));
    expect((out as { text?: unknown }).text).toBeUndefined(); // the cell did not become the prototype
  });
});
