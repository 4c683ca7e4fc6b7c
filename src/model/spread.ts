// Where a part's spread comes from, as its file states it: the tolerance of its value (symmetric or not),
// how its value moves with temperature (an EIA dielectric code, an explicit `temperature` block or a
// coefficient `tc`), and optional spreads of its parasitics written after their values ("18m +50%/-30%").
// The analysis turns these into the extremes of each quantity (src/analysis/part-spread.ts).

import { Scalar, isScalar, type Node } from 'yaml';
import { isSignedSpread, parseBounds, splitValueAndSpread, type Bounds } from '../units/bounds.js';
import { decodeEiaDielectric, looksLikeEiaCode } from '../units/eia-dielectric.js';
import { formatPercent } from '../units/format.js';
import { parseQuantity } from '../units/parse.js';
import type { Dimension } from '../units/quantity.js';
import { formatCelsius, parseTemperature, parseTemperatureCoefficient } from '../units/temperature.js';
import type { SourcePosition } from './diagnostics.js';
import { Fields, readQuantity, scalarText } from './fields.js';

export type { Bounds } from '../units/bounds.js';

/** A span of temperatures, °C. */
export interface TemperatureRange {
  fromC: number;
  toC: number;
}

/**
 * How a part's value moves with temperature. `range`: at most `minus` below and `plus` above its value at
 * 25 °C anywhere in [fromC, toC] (an EIA class 2 code, or the part's own `temperature` block).
 * `coefficient`: a change of α·(T − 25 °C) with α anywhere in [lowPerK, highPerK] (an EIA class 1 code,
 * rated from −55 to 125 °C, or the part's `tc`, rated everywhere).
 */
export type TemperatureCharacteristic =
  | { kind: 'range'; fromC: number; toC: number; minus: number; plus: number; from: 'dielectric' | 'temperature'; code?: string; at: SourcePosition }
  | { kind: 'coefficient'; lowPerK: number; highPerK: number; rated?: TemperatureRange; from: 'dielectric' | 'tc'; code?: string; at: SourcePosition };

export interface PartSpread {
  /** The tolerance of the nominal value, as written (symmetric or not). */
  tolerance?: Bounds;
  temperature?: TemperatureCharacteristic;
  /** Spreads written after parasitic values, by parameter name (esr, esl, … ; rdc, r, l, c for a bead). */
  parasitics: Record<string, Bounds>;
}

/** The reference temperature of tolerances and temperature characteristics (common practice: 25 °C). */
export const REFERENCE_C = 25;

/** `tolerance`: "10%", "±10%", "+80%/-20%". A plain ratio keeps the messages of every other ratio field. */
export function readTolerance(root: Fields): Bounds | undefined {
  if (!root.has('tolerance')) return undefined;
  const node = root.valueNode('tolerance');
  const text = isScalar(node) && typeof node.value === 'string' ? node.value : undefined;
  if (text !== undefined && isSignedSpread(text)) {
    const parsed = parseBounds(text);
    if (!parsed.ok) {
      root.error('tolerance', parsed.message);
      return undefined;
    }
    return parsed.bounds;
  }
  const ratio = root.ratio('tolerance');
  if (ratio === undefined) return undefined;
  if (ratio >= 1) {
    root.error('tolerance', `a tolerance of ±${formatPercent(ratio)} would take the value to zero or below; write an asymmetric tolerance such as +${formatPercent(ratio)}/-20% if that is what the part is sold at`);
    return undefined;
  }
  return { minus: ratio, plus: ratio };
}

/** A three-character dielectric must be an EIA code; its temperature characteristic, when it is one. */
export function readDielectricCharacteristic(root: Fields, code: string): TemperatureCharacteristic | undefined {
  if (!looksLikeEiaCode(code)) return undefined;
  const decoded = decodeEiaDielectric(code);
  if (!decoded.ok) {
    root.error('dielectric', decoded.message);
    return undefined;
  }
  const d = decoded.dielectric;
  const at = root.position('dielectric');
  if (d.class === 2) return { kind: 'range', fromC: d.fromC, toC: d.toC, minus: d.minus, plus: d.plus, from: 'dielectric', code, at };
  return {
    kind: 'coefficient',
    lowPerK: d.coefficientPerK - d.tolerancePerK,
    highPerK: d.coefficientPerK + d.tolerancePerK,
    rated: { fromC: d.fromC, toC: d.toC },
    from: 'dielectric',
    code,
    at,
  };
}

/** `temperature: {from: -55°C, to: 125°C, change: ±15%}`: the largest change over a range, the part's own data. */
export function readTemperatureBlock(root: Fields): TemperatureCharacteristic | undefined {
  const block = root.map('temperature');
  if (!block) return undefined;
  block.expect(['from', 'to', 'change'], ['from', 'to', 'change']);
  const range = readRange(block);
  const change = readBoundsField(block, 'change');
  if (!range || !change) return undefined;
  return { kind: 'range', ...range, ...change, from: 'temperature', at: root.position('temperature') };
}

/** `tc: 200ppm/K` (either sign), `tc: -150ppm/K`: a temperature coefficient of the value. */
export function readCoefficient(root: Fields): TemperatureCharacteristic | undefined {
  if (!root.has('tc')) return undefined;
  const text = scalarText(root.valueNode('tc'));
  const parsed = parseTemperatureCoefficient(text ?? '');
  if (!parsed.ok) {
    root.error('tc', parsed.message);
    return undefined;
  }
  return { kind: 'coefficient', lowPerK: parsed.lowPerK, highPerK: parsed.highPerK, from: 'tc', at: root.position('tc') };
}

/** `{from: -40°C, to: 85°C}`, from below to; for folio.yaml, plans and a part's `temperature` block. */
export function readRange(block: Fields): TemperatureRange | undefined {
  const fromC = readTemperatureField(block, 'from');
  const toC = readTemperatureField(block, 'to');
  if (fromC === undefined || toC === undefined) return undefined;
  if (!(toC > fromC)) {
    block.error('to', `expected a temperature above ${block.label('from')} (${formatCelsius(fromC)}), found ${formatCelsius(toC)}`);
    return undefined;
  }
  return { fromC, toC };
}

function readTemperatureField(block: Fields, name: string): number | undefined {
  if (!block.has(name)) return undefined;
  const parsed = parseTemperature(scalarText(block.valueNode(name)) ?? '');
  if (!parsed.ok) {
    block.error(name, parsed.message);
    return undefined;
  }
  return parsed.celsius;
}

function readBoundsField(block: Fields, name: string): Bounds | undefined {
  if (!block.has(name)) return undefined;
  const parsed = parseBounds(scalarText(block.valueNode(name)) ?? '');
  if (!parsed.ok) {
    block.error(name, parsed.message);
    return undefined;
  }
  return parsed.bounds;
}

/**
 * A parasitic value with an optional spread after it: "18m", "18m +50%/-30%", "0.45n ±10%". The value is
 * read as any quantity of its dimension; the spread is recorded under the parameter's name.
 */
export function readSpreadQuantity(fields: Fields, name: string, dim: Dimension, spreads: Record<string, Bounds>): number | undefined {
  if (!fields.has(name)) return undefined;
  const node = fields.valueNode(name);
  const split: { value: string; spread?: string } | undefined = isScalar(node) && typeof node.value === 'string' ? splitValueAndSpread(node.value) : undefined;
  if (split?.spread === undefined || !parseQuantity(split.value, dim).ok) return fields.quantity(name, dim);
  const bounds = parseBounds(split.spread);
  if (!bounds.ok) {
    fields.error(name, `${bounds.message} after the value`);
    return undefined;
  }
  // The value alone, checked like any other (range, sign), at the field's place.
  const alone = new Scalar(split.value);
  alone.range = node?.range;
  const value = readQuantity(fields.ctx, alone, fields.label(name), dim);
  if (value !== undefined) spreads[name] = bounds.bounds;
  return value;
}

/** The temperatures a characteristic is specified over; undefined when it holds at every temperature. */
export function ratedSpan(characteristic: TemperatureCharacteristic): TemperatureRange | undefined {
  return characteristic.kind === 'range' ? { fromC: characteristic.fromC, toC: characteristic.toC } : characteristic.rated;
}

/** Whether a characteristic specified over `rated` (undefined: everywhere) covers the operating temperatures. */
export function covers(rated: TemperatureRange | undefined, operating: TemperatureRange): boolean {
  return !rated || (rated.fromC <= operating.fromC && rated.toC >= operating.toC);
}

/** The library's (or a plan's) operating range a characteristic's rating does not cover: the warning, if any. */
export function coverageGap(characteristic: TemperatureCharacteristic, operating: TemperatureRange, where: string): string | undefined {
  const rated = ratedSpan(characteristic);
  if (!rated || covers(rated, operating)) return undefined;
  const what = characteristic.code !== undefined ? `${characteristic.code} is specified` : 'the stated change covers';
  return `${what} from ${formatCelsius(rated.fromC)} to ${formatCelsius(rated.toC)} only, not all of ${where} (${formatCelsius(operating.fromC)} to ${formatCelsius(operating.toC)}); beyond it the change is not known and its corners may be optimistic`;
}
