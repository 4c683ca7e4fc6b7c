// What a part file's ratings and markings must agree with: a bead's model with its rated impedance, a
// marking code with the nominal value, a mains part's rating with its kind (AC or DC), a DC-bias table with
// the voltage rating; and the unit cost's range.

import type { Element } from '../circuit/element.js';
import { impedanceAt } from '../circuit/impedance.js';
import { formatEng, formatPercent } from '../units/format.js';
import { parseMarking } from '../units/marking.js';
import { parseQuantity, parseRatio } from '../units/parse.js';
import { NOMINAL_DIMENSION } from '../units/quantity.js';
import { inRange, rangeText } from '../units/ranges.js';
import { quote } from './diagnostics.js';
import { describeNode, scalarText, type Fields } from './fields.js';
import type { BiasPoint, PartKind } from './part.js';
import type { Bounds } from './spread.js';
import { formatVoltageRating, type VoltageRating } from './voltage-rating.js';
import { hypot } from '../circuit/hypot.js';

export const BEAD_RATING_TOLERANCE = 0.25;

/** How far the model's |Z| at the rated frequency is from the rated impedance: |Z|/nominal − 1. */
export function beadRatingDeviation(network: Element, nominal: number, ratedAtHz: number): number {
  const [re, im] = impedanceAt(network, ratedAtHz);
  return hypot(re, im) / nominal - 1;
}

/** A bead's model must reproduce its rating: |Z(at)| within the tolerance (else 25%) of nominal. */
export function checkBeadRating(root: Fields, network: Element, nominal: number, ratedAtHz: number, bounds: Bounds | undefined): void {
  const deviation = beadRatingDeviation(network, nominal, ratedAtHz);
  // The side of the tolerance the model lies on: below the rating the "minus" side, above it the "plus" side.
  const tolerance = bounds === undefined ? undefined : deviation < 0 ? bounds.minus : bounds.plus;
  const allowed = tolerance ?? BEAD_RATING_TOLERANCE;
  // A hair of slack for rounding: a model fitted exactly to the tolerance edge passes.
  if (!(Math.abs(deviation) > allowed * (1 + 1e-9))) return;
  const modelOhm = (1 + deviation) * nominal;
  const how = `${formatPercent(Math.abs(deviation))} ${deviation < 0 ? 'below' : 'above'}`;
  const side = bounds === undefined || bounds.minus === bounds.plus ? '±' : deviation < 0 ? '−' : '+';
  const limit = tolerance !== undefined ? `its ${side}${formatPercent(tolerance)} tolerance` : `±${formatPercent(BEAD_RATING_TOLERANCE)} (no tolerance given; common practice)`;
  root.warning(
    'nominal',
    `the model gives |Z| = ${formatEng(modelOhm, 'resistance')} at ${formatEng(ratedAtHz, 'frequency')}, ${how} the rated ${formatEng(nominal, 'resistance')}, outside ${limit}; fit the model to the rating or correct the rating`,
  );
}

/** Unit cost: any number from 0 to 1e9, so that the planner's sums over thousands of placements stay exact enough and finite. */
export function readCost(root: Fields): number | undefined {
  const cost = root.quantity('cost', 'ratio', { allowZero: true });
  if (cost === undefined || cost <= 1e9) return cost;
  root.error('cost', `expected a unit cost from 0 to 1e9, found ${quote(scalarText(root.valueNode('cost')) ?? '')}`);
  return undefined;
}

export function readMarking(root: Fields, kind: PartKind, nominal: number | undefined): string | undefined {
  const code = root.text('marking');
  if (code === undefined) return undefined;
  if (kind !== 'capacitor' && kind !== 'resistor' && kind !== 'inductor') {
    root.error('marking', `marking codes are read for capacitors, resistors and inductors, not for a ${kind}`);
    return undefined;
  }
  const parsed = parseMarking(code, kind);
  if (!parsed.ok) {
    root.error('marking', parsed.message);
    return undefined;
  }
  if (nominal !== undefined && Math.abs(parsed.value / nominal - 1) > 1e-9) {
    const unit = NOMINAL_DIMENSION[kind];
    root.error('marking', `${quote(code)} means ${formatEng(parsed.value, unit)}, but nominal is ${formatEng(nominal, unit)}`);
  }
  return code;
}

/**
 * A safety-class part is connected to the mains, whose voltage is alternating: a bare "310V" could be read as
 * a DC rating and understate its peak by √2, so each of its ratings must say AC or DC (IEC 60384-14 rates
 * these parts for the supply mains).
 */
export function checkSafetyRating(root: Fields, safetyClass: string, ratings: readonly VoltageRating[]): void {
  if (!root.has('voltage')) {
    root.error('safety', `a class ${safetyClass} capacitor (IEC 60384-14) needs its voltage rating with its kind, e.g. voltage: 310V AC`);
    return;
  }
  const bare = ratings.find((r) => !r.stated);
  if (bare) {
    const value = formatVoltageRating(bare);
    root.error('voltage', `a class ${safetyClass} capacitor (IEC 60384-14) is a mains part: say whether its rating is AC or DC, e.g. "${value.replace(/ /g, '')} AC" for the r.m.s. mains rating; found ${JSON.stringify(scalarText(root.valueNode('voltage')) ?? value)}`);
  }
}

export function readDcBias(root: Fields, ratingV: number | undefined): BiasPoint[] {
  const table = root.map('dc-bias');
  if (!table) return [];
  const points: BiasPoint[] = [];
  for (const key of table.keys) {
    const volts = parseQuantity(key, 'voltage');
    if (!volts.ok || volts.value < 0) {
      table.ctx.diagnostics.error(table.keyPosition(key), `dc-bias: expected a voltage (e.g. 3.3V) as the key, found ${quote(key)}`);
      continue;
    }
    if (volts.value > 0 && !inRange(volts.value, 'voltage')) {
      table.ctx.diagnostics.error(table.keyPosition(key), `dc-bias: expected a voltage of 0 V or ${rangeText('voltage')} as the key, found ${quote(key)}`);
      continue;
    }
    const node = table.valueNode(key);
    const fraction = parseRatio(scalarText(node));
    if (!fraction.ok || !(fraction.value > 0) || fraction.value > 1.2) {
      table.error(key, `expected the fraction of nominal capacitance kept at ${key}, above 0% and at most 120% (e.g. 65%), found ${describeNode(node)}`);
      continue;
    }
    if (points.length > 0 && volts.value <= points[points.length - 1].voltageV) {
      table.ctx.diagnostics.error(table.keyPosition(key), `dc-bias: voltages must increase down the table; ${key} comes after ${formatEng(points[points.length - 1].voltageV, 'voltage')}`);
      continue;
    }
    points.push({ voltageV: volts.value, fraction: fraction.value });
  }
  if (ratingV !== undefined && points.length > 0 && points[points.length - 1].voltageV > ratingV * 1.0000001) {
    root.warning('dc-bias', `the table goes beyond the voltage rating of ${formatEng(ratingV, 'voltage')}`);
  }
  return points;
}
