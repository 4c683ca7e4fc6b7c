// The figures of a part that a change can move, and how far they moved: SRF, the usable band's edges, the
// resistance at the SRF (ESR at SRF for a capacitor) and the effective value at the band's middle.

import { impedanceAt } from '../circuit/impedance.js';
import type { PartAnalysis } from '../analysis/part-figures.js';

export const FIGURE_NAMES = ['srfHz', 'bandFromHz', 'bandToHz', 'esrAtSrfOhm', 'effectiveAtBandMiddle'] as const;
export type FigureName = (typeof FIGURE_NAMES)[number];

export type PartFigures = Record<FigureName, number | null> & {
  /** Where effectiveAtBandMiddle is taken: the geometric middle of the usable band, Hz (null without a band). */
  bandMiddleHz: number | null;
  /** Unit of effectiveAtBandMiddle: F, H or Ω (null when the part's kind has no effective value). */
  effectiveUnit: 'F' | 'H' | 'Ω' | null;
};

export interface FigureChange {
  before: number | null;
  after: number | null;
  /** (after − before) / |before| × 100, or null when either is missing or before is zero. */
  changePercent: number | null;
}

/**
 * Relative change below which a figure has not moved. Figures are refined to 1e-9 relative (root finding),
 * so two analyses of models that differ only in a field that does not touch a figure agree far closer.
 */
export const MOVE_THRESHOLD = 1e-6;

/** The movable figures of an analysed part, in SI units. */
export function movableFigures(a: PartAnalysis): PartFigures {
  const band = a.usableBand;
  const middle = band ? Math.sqrt(band.fromHz * band.toHz) : null;
  let effective: number | null = null;
  let effectiveUnit: PartFigures['effectiveUnit'] = null;
  if (middle !== null) {
    const [re, im] = impedanceAt(a.part.network, middle);
    const omega = 2 * Math.PI * middle;
    // C_eff = −1/(ωX), L_eff = X/ω (Alexander & Sadiku, ch. 9); a resistor's effective value is |Z|.
    if (a.part.behavesAs === 'capacitor' && im < 0) [effective, effectiveUnit] = [-1 / (omega * im), 'F'];
    else if (a.part.behavesAs === 'inductor' && im > 0) [effective, effectiveUnit] = [im / omega, 'H'];
    else if (a.part.behavesAs === 'resistor') [effective, effectiveUnit] = [Math.hypot(re, im), 'Ω'];
  }
  return {
    srfHz: a.selfResonance?.frequencyHz ?? null,
    bandFromHz: band?.fromHz ?? null,
    bandToHz: band?.toHz ?? null,
    esrAtSrfOhm: a.selfResonance?.impedanceOhm ?? null,
    effectiveAtBandMiddle: effective,
    bandMiddleHz: middle,
    effectiveUnit,
  };
}

export function figureChange(before: number | null, after: number | null): FigureChange {
  const changePercent = before !== null && after !== null && before !== 0 ? ((after - before) / Math.abs(before)) * 100 : null;
  return { before, after, changePercent };
}

function moved(before: number | null, after: number | null): boolean {
  if (before === null || after === null) return before !== after;
  return Math.abs(after - before) > MOVE_THRESHOLD * Math.max(Math.abs(before), Math.abs(after));
}

/** The figures that moved between two analyses of one part, by name, in FIGURE_NAMES order. */
export function movedFigures(before: PartFigures, after: PartFigures): Partial<Record<FigureName, FigureChange>> {
  const out: Partial<Record<FigureName, FigureChange>> = {};
  for (const name of FIGURE_NAMES) if (moved(before[name], after[name])) out[name] = figureChange(before[name], after[name]);
  return out;
}
