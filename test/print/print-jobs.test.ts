// The date printed in a PDF's footer: SOURCE_DATE_EPOCH (seconds since 1970-01-01 UTC) when it is set, as the
// reproducible-builds.org specification of that variable asks, else the time of the build.

import { describe, expect, it } from 'vitest';
import { buildDate } from '../../src/print/print-jobs.js';

describe('buildDate', () => {
  it('reads SOURCE_DATE_EPOCH as seconds', () => {
    // 1,764,676,800 s = 2025-12-02T12:00:00Z (20,424 days of 86,400 s, plus 12 h).
    expect(buildDate({ SOURCE_DATE_EPOCH: '1764676800' }).toISOString()).toBe('2025-12-02T12:00:00.000Z');
    expect(buildDate({ SOURCE_DATE_EPOCH: '0' }).toISOString()).toBe('1970-01-01T00:00:00.000Z');
  });

  it('takes the time of the build when the variable is unset, empty or not a number', () => {
    for (const env of [{}, { SOURCE_DATE_EPOCH: '' }, { SOURCE_DATE_EPOCH: 'yesterday' }]) {
      const before = Date.now();
      const date = buildDate(env).getTime();
      expect(date).toBeGreaterThanOrEqual(before);
      expect(date).toBeLessThanOrEqual(Date.now());
    }
  });
});
