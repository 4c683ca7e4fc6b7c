// A part's analysis made on first use, so that a build that carries a part over need not analyse it.

import type { PartAnalysis } from '../analysis/part-figures.js';
import type { Part } from '../model/part.js';

/**
 * A part's analysis, made the first time a figure of it is read: a chart maker needs only the part to find
 * its charts in the cache, and draws (reading the sweep) only when they are not there. A class, so that the
 * getters are the prototype's and a part that is never analysed costs one small object.
 */
export class DeferredAnalysis implements PartAnalysis {
  private made?: PartAnalysis;

  constructor(
    readonly part: Part,
    private readonly analyse: (part: Part) => PartAnalysis,
  ) {}

  private get a(): PartAnalysis {
    return (this.made ??= this.analyse(this.part));
  }

  get sweep() { return this.a.sweep; }
  get frequencies() { return this.a.frequencies; }
  get z() { return this.a.z; }
  get columns() { return this.a.columns; }
  get resolved() { return this.a.resolved; }
  get resolvedColumns() { return this.a.resolvedColumns; }
  get decades() { return this.a.decades; }
  get decadeEffective() { return this.a.decadeEffective; }
  get ratedImpedanceOhm() { return this.a.ratedImpedanceOhm; }
  get resonances() { return this.a.resonances; }
  get selfResonance() { return this.a.selfResonance; }
  get bandRule() { return this.a.bandRule; }
  get usableBand() { return this.a.usableBand; }
  get within() { return this.a.within; }
  get peakImpedance() { return this.a.peakImpedance; }
  get peakQuality() { return this.a.peakQuality; }
  get corners() { return this.a.corners; }
}
