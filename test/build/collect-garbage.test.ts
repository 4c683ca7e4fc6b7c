// The collection a build asks for between runs of part pages and every so many chart jobs: it must free
// what is no longer reachable at once, without the process having been started with --expose-gc.

import { describe, expect, it } from 'vitest';
import { collectGarbage } from '../../src/build/collect-garbage.js';

describe('collectGarbage', () => {
  it('frees unreachable memory at once, in a process started without --expose-gc', () => {
    expect(process.execArgv).not.toContain('--expose-gc');
    collectGarbage();
    const before = process.memoryUsage().heapUsed;
    // About 80 MB of small objects, then dropped: V8 would keep them while memory is plentiful.
    let garbage: { n: number; s: string }[] | undefined = Array.from({ length: 1_000_000 }, (_, n) => ({ n, s: `row ${n}` }));
    const grown = process.memoryUsage().heapUsed;
    expect(grown - before).toBeGreaterThan(40e6);
    garbage = undefined;
    expect(garbage).toBeUndefined();
    collectGarbage();
    expect(process.memoryUsage().heapUsed - before).toBeLessThan(5e6);
  });
});
