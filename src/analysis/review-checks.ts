// What a review's checks need from the analysis: each rail's verdict, as its plan page states it. The
// warnings themselves (a review accepting a rail that fails its target) are the model's:
// reviewWarnings(library.reviews, () => railVerdicts(library)) in src/model/review-consistency.ts.

import type { Library } from '../model/library.js';
import type { RailVerdict } from '../model/review-consistency.js';
import { analysePlan } from './plan-figures.js';

// One analysis per loaded library: `check`, the build's warnings and the review pages share it.
const verdictsByLibrary = new WeakMap<Library, ReadonlyMap<string, RailVerdict>>();

/** Every plan's verdict, at the library's sweep density (the one its plan pages use). */
export function railVerdicts(library: Library): ReadonlyMap<string, RailVerdict> {
  const known = verdictsByLibrary.get(library);
  if (known) return known;
  const verdicts = new Map<string, RailVerdict>();
  for (const plan of library.plans) {
    // The impedance verdict only: the load step is not read here.
    const f = analysePlan(plan, library.settings.sweep.perDecade, plan.placements, plan.warnings, { loadStep: false });
    verdicts.set(plan.rail, { rail: plan.rail, pass: f.pass, worstMarginDb: f.worstMarginDb, worstFrequencyHz: f.worstFrequencyHz, file: plan.source.path });
  }
  verdictsByLibrary.set(library, verdicts);
  return verdicts;
}
