// The usable band in words: the rule it was found by, and its edges. Two spellings of the edges, each in its
// own place: the figures table and the command line write "≤ 100 Hz to 7.15 MHz" (≤ and ≥ say the band runs
// on past the sweep's end), a chart's key and caption "up to 7.15 MHz".

import type { UsableBand } from '../analysis/band.js';
import { formatEngRange, formatPercent } from '../units/format.js';

/** "≤ 100 Hz to 7.15 MHz", or "none in the sweep". */
export function bandText(band: UsableBand | null): string {
  if (!band) return 'none in the sweep';
  const [from, to] = formatEngRange(band.fromHz, band.toHz, 'frequency');
  return `${band.fromIsSweepEnd ? '≤ ' : ''}${from} to ${band.toIsSweepEnd ? '≥ ' : ''}${to}`;
}

/** The rule a band was found by, for the figures table and the command line; undefined without a rule. */
export function bandRuleText(behavesAs: string | null | undefined, within: number | null | undefined): string | undefined {
  if (within !== undefined && within !== null) return `value within ${formatPercent(within)} of nominal`;
  return behavesAs === 'bead' ? 'resistive: R − Rdc ≥ |X|' : undefined;
}

/** What the band is, in a few words, for a chart's key and its description. */
export function bandCaption(behavesAs: string | undefined, within: number | undefined): string {
  if (behavesAs === 'bead') return 'absorbing band (R − Rdc ≥ |X|)';
  if (behavesAs === 'resistor' && within !== undefined) return `usable band (|Z − R|/R ≤ ${formatPercent(within)})`;
  if (within !== undefined) return `usable band (±${formatPercent(within)})`;
  return 'usable band';
}

/** "1.2 kHz – 7.11 MHz", "up to 7.11 MHz" (from the sweep start), "from 1.2 kHz", "whole sweep". */
export function bandRange(band: UsableBand): string {
  const [from, to] = formatEngRange(band.fromHz, band.toHz, 'Hz');
  if (band.fromIsSweepEnd && band.toIsSweepEnd) return 'whole sweep';
  if (band.fromIsSweepEnd) return `up to ${to}`;
  if (band.toIsSweepEnd) return `from ${from}`;
  return `${from} – ${to}`;
}
