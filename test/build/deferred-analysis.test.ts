// A part's analysis made on first use: a build that only lists a part never analyses it, and one that reads
// several figures of it analyses it once.

import { describe, expect, it } from 'vitest';
import { DeferredAnalysis } from '../../src/build/deferred-analysis.js';
import { analysePart, type PartAnalysis } from '../../src/analysis/part-figures.js';
import { loadLibrary } from '../../src/model/library.js';
import { REPO } from '../site-helpers.js';

describe('DeferredAnalysis', () => {
  it('analyses its part when a figure is first read, once, and gives the analysis\'s own figures', () => {
    const { library } = loadLibrary(REPO);
    const part = library!.parts[0];
    const { sweep, within, temperature } = library!.settings;
    let made = 0;
    const deferred = new DeferredAnalysis(part, (p) => {
      made++;
      return analysePart(p, sweep, within, temperature);
    });
    expect(deferred.part).toBe(part);
    expect(made).toBe(0);
    const direct: PartAnalysis = analysePart(part, sweep, within, temperature);
    expect(deferred.selfResonance).toEqual(direct.selfResonance);
    expect(deferred.usableBand).toEqual(direct.usableBand);
    expect(Array.from(deferred.z.re)).toEqual(Array.from(direct.z.re));
    expect(made).toBe(1);
  });
});
