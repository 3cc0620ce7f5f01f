// The full collection between the parts of a large print (src/print/collect.ts) reaches V8's
// collector from a process started without --expose-gc, and frees what is no longer referenced.
import { describe, expect, it } from 'vitest';
import { collectGarbage } from '../../src/print/collect.js';

describe('collectGarbage', () => {
  it('frees unreferenced memory at once, in a process started without --expose-gc', () => {
    expect(process.execArgv.join(' ')).not.toContain('expose-gc'); // else the test would show nothing
    expect(collectGarbage()).toBe(true);
    const before = process.memoryUsage().heapUsed;
    // about 40 MB of objects that live long enough to reach the old generation, then let go
    let held: number[][] | null = Array.from({ length: 100 }, () => new Array<number>(50_000).fill(0.5));
    held = held.map((a) => a.map((x) => x + 1));
    const grown = process.memoryUsage().heapUsed;
    expect(grown - before).toBeGreaterThan(30 * 1_048_576);
    held = null;
    collectGarbage();
    const after = process.memoryUsage().heapUsed;
    expect(after - before).toBeLessThan(10 * 1_048_576);
  });
});
