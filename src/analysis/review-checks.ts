// What a review's checks need from the analysis: each rail's verdicts, as its plan page states them (the
// target at nominal and at the corners, and the load step). The warnings themselves (a review accepting a
// rail that fails any of them) are the model's:
// reviewWarnings(library.reviews, () => railVerdicts(library)) in src/model/review-consistency.ts.

import type { Library } from '../model/library.js';
import type { RailVerdict } from '../model/review-consistency.js';
import { analysePlan } from './plan-figures.js';

// One analysis per loaded library: `check`, the build's warnings and the review pages share it.
const verdictsByLibrary = new WeakMap<Library, ReadonlyMap<string, RailVerdict>>();

/** Every plan's verdicts, at the library's sweep density and operating temperatures (as its plan pages). */
export function railVerdicts(library: Library): ReadonlyMap<string, RailVerdict> {
  const known = verdictsByLibrary.get(library);
  if (known) return known;
  const verdicts = new Map<string, RailVerdict>();
  for (const plan of library.plans) {
    const f = analysePlan(plan, library.settings.sweep.perDecade, plan.placements, plan.warnings, { operating: library.settings.temperature });
    const t = f.transient;
    const c = f.corners && f.corners.method !== 'none' ? f.corners : null;
    verdicts.set(plan.rail, {
      rail: plan.rail,
      pass: f.pass,
      worstMarginDb: f.worstMarginDb,
      worstFrequencyHz: f.worstFrequencyHz,
      file: plan.source.path,
      loadStep: t ? { pass: t.pass, resolved: t.resolved, excursionV: Math.max(t.droopV, t.overshootV), budgetV: t.budgetV } : null,
      corners: c ? { pass: c.pass, worstMarginDb: c.worstMarginDb, worstFrequencyHz: c.worstFrequencyHz, evaluated: c.evaluated } : null,
    });
  }
  verdictsByLibrary.set(library, verdicts);
  return verdicts;
}
