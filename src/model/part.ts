// The part file: one passive part, its nominal value and the parasitics that make it real.

import { isMap, isSeq, type Node, type YAMLMap } from 'yaml';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../circuit/element.js';
import { parseMarking } from '../units/marking.js';
import { formatEng, formatPercent } from '../units/format.js';
import { impedanceAt } from '../circuit/impedance.js';
import { parseQuantity, parseRatio } from '../units/parse.js';
import { NOMINAL_DIMENSION as NOMINAL_BY_BEHAVIOUR, type Dimension } from '../units/quantity.js';
import { inRange, rangeText } from '../units/ranges.js';
import { quote, type SourcePosition } from './diagnostics.js';
import { Fields, describeNode, expectationInBrackets, nearMiss, readQuantity, scalarText, type ReadContext } from './fields.js';
import { MAX_ID_LENGTH } from './page-names.js';
import { positionOf, type SourceFile } from './source.js';
import { formatVoltageRating, readVoltageRatings, type VoltageRating } from './voltage-rating.js';
import { readCoefficient, readDielectricCharacteristic, readSpreadQuantity, readTemperatureBlock, readTolerance, type Bounds, type PartSpread } from './spread.js';
import { readMeasurementEntries, type MeasurementEntry } from './measurement-entry.js';

export const PART_KINDS = ['capacitor', 'inductor', 'resistor', 'bead', 'network'] as const;
export type PartKind = (typeof PART_KINDS)[number];
export const BEHAVIOURS = ['capacitor', 'inductor', 'resistor', 'bead'] as const;
export type Behaviour = (typeof BEHAVIOURS)[number];

/** The dimension of a nominal value, by the kind the part behaves as. */
export const NOMINAL_DIMENSION: Readonly<Record<Behaviour, Dimension>> = NOMINAL_BY_BEHAVIOUR;

// At least one letter or digit: an id names a folder of the site, so "." and ".." must not be ids.
export const ID_PATTERN = /^(?=.*[A-Za-z0-9])[A-Za-z0-9._-]+$/;

/** Parasitic fields by kind, with their dimension, in the order pages list them. */
export const PARASITICS: Readonly<Record<'capacitor' | 'inductor' | 'resistor', Readonly<Record<string, Dimension>>>> = {
  capacitor: { esr: 'resistance', esl: 'inductance', epr: 'resistance' },
  inductor: { dcr: 'resistance', cp: 'capacitance', rp: 'resistance' },
  resistor: { ls: 'inductance', cp: 'capacitance' },
};

export const BEAD_MODEL: Readonly<Record<string, Dimension>> = { rdc: 'resistance', r: 'resistance', l: 'inductance', c: 'capacitance' };

/** Safety classes of capacitors across the mains (IEC 60384-14). */
export const SAFETY_CLASSES = ['X1', 'X2', 'X3', 'Y1', 'Y2', 'Y3', 'Y4'] as const;

/** A capacitance retained at a DC bias: fraction of nominal at a voltage. */
export interface BiasPoint {
  voltageV: number;
  fraction: number;
}

export interface Part {
  id: string;
  kind: PartKind;
  /** The kind whose usable-band rule applies; undefined for a network that declares none. */
  behavesAs?: Behaviour;
  title: string;
  /** Nominal value in F, H or Ω; for a bead, its rated impedance at `ratedAtHz`. */
  nominal?: number;
  ratedAtHz?: number;
  marking?: string;
  /** The tolerance of the nominal value; for an asymmetric one ("+80%/-20%") its larger side. */
  tolerance?: number;
  /** Where the part's spread comes from: tolerance as written, temperature characteristic, parasitic spreads. */
  spread: PartSpread;
  /** The voltage ratings as written (at most one DC and one AC), for pages. */
  voltageRatings: VoltageRating[];
  /** The DC voltage rating, V: a bare "16V" or "400V DC". Undefined for a part rated in AC alone. */
  voltageV?: number;
  /** The AC voltage rating, V r.m.s. ("310V AC"), as mains parts are rated. */
  voltageAcV?: number;
  currentA?: number;
  powerW?: number;
  package?: string;
  dielectric?: string;
  safetyClass?: string;
  /** Named parameter values in SI units, as written in the file (esr, esl, ... or rdc, r, l, c). */
  parameters: Record<string, number>;
  /** The model as an element tree. */
  network: Element;
  /** Usable-band criterion from the part file; the library default applies when absent. */
  within?: number;
  dcBias: BiasPoint[];
  /** Mounting inductance this part gets when a rail plan does not say (its pads, vias or leads), H. */
  mountingH?: number;
  cost?: number;
  tags: string[];
  notes?: string;
  /** Measurements of the part (files under measurements/), in the order written. */
  measurements: MeasurementEntry[];
  source: SourceFile;
  /** Where the id is written, for messages about this part. */
  at: SourcePosition;
}

const COMMON_FIELDS = ['id', 'kind', 'title', 'nominal', 'marking', 'tolerance', 'voltage', 'current', 'power', 'package', 'tags', 'notes', 'band', 'cost', 'measurements'];
const FIELDS_BY_KIND: Readonly<Record<PartKind, readonly string[]>> = {
  capacitor: [...COMMON_FIELDS, 'dielectric', 'safety', 'parasitics', 'dc-bias', 'mounting', 'temperature', 'tc'],
  inductor: [...COMMON_FIELDS, 'parasitics', 'temperature', 'tc'],
  resistor: [...COMMON_FIELDS, 'parasitics', 'temperature', 'tc'],
  bead: [...COMMON_FIELDS, 'at', 'model'],
  network: [...COMMON_FIELDS, 'dielectric', 'behaves-as', 'network', 'dc-bias', 'mounting', 'temperature', 'tc'],
};

/** What the one required field (besides id and kind) of each kind holds, for "missing field" messages. */
const REQUIRED_HINT: Readonly<Record<PartKind, string>> = {
  capacitor: expectationInBrackets('capacitance'),
  inductor: expectationInBrackets('inductance'),
  resistor: expectationInBrackets('resistance'),
  bead: 'its model, e.g. model: {rdc: 50m, r: 600, l: 1.2u, c: 1.5p}',
  network: 'its element tree, e.g. network: {series: [{r: 5m}, {l: 1n}, {c: 10u}]}',
};

/** Read one part file. Returns undefined when the file has errors (all of them reported). */
export function readPart(ctx: ReadContext): Part | undefined {
  const { source, diagnostics } = ctx;
  const before = diagnostics.errorCount;
  const contents = source.document.contents as Node | null;
  if (contents === null || !isMap(contents)) {
    const found = contents === null ? 'the file has no content' : `found ${describeNode(contents)}`;
    diagnostics.error(positionOf(source, contents), `expected one part: a mapping of fields such as "id: ...", "kind: ...", "nominal: ..."; ${found}`);
    return undefined;
  }
  const root = new Fields(ctx, contents as YAMLMap<Node, Node | null>, '');

  const id = root.text('id', { required: true, maxLength: MAX_ID_LENGTH, pattern: ID_PATTERN, patternHint: 'an id of letters, digits, ".", "_" and "-" only', describe: 'a unique id of letters, digits, ".", "_" and "-", e.g. CAP-0402-100N' });
  const kindText = root.text('kind', { required: true, describe: `one of ${PART_KINDS.join(', ')}` });
  let kind: PartKind | undefined;
  if (kindText !== undefined) {
    if ((PART_KINDS as readonly string[]).includes(kindText)) kind = kindText as PartKind;
    else {
      const guess = nearMiss(kindText, PART_KINDS);
      root.error('kind', `expected one of ${PART_KINDS.join(', ')}, found ${quote(kindText)}${guess ? `; did you mean "${guess}"?` : ''}`);
    }
  }
  if (!kind) {
    root.expect([...new Set(Object.values(FIELDS_BY_KIND).flat())]);
    return undefined;
  }
  // id and kind are reported above when missing.
  const required = kind === 'network' ? 'network' : kind === 'bead' ? 'model' : 'nominal';
  root.expect(FIELDS_BY_KIND[kind], [required], () => REQUIRED_HINT[kind]);

  const behavesAs = kind === 'network' ? (root.text('behaves-as', { oneOf: BEHAVIOURS }) as Behaviour | undefined) : (kind as Behaviour);
  const nominalDimension: Dimension | undefined = behavesAs ? NOMINAL_DIMENSION[behavesAs] : undefined;
  let nominal: number | undefined;
  if (nominalDimension) nominal = root.quantity('nominal', nominalDimension);
  else if (root.has('nominal') && !root.has('behaves-as')) {
    // The value is not wrong, the field is out of place: point at the key.
    root.ctx.diagnostics.error(root.keyPosition('nominal'), `nominal: a network's nominal value needs "behaves-as" (one of ${BEHAVIOURS.join(', ')}) to say what it is; add behaves-as or remove nominal`);
  }
  if (kind === 'network' && behavesAs && behavesAs !== 'bead' && nominal === undefined && !root.has('nominal')) {
    root.error(undefined, `missing field "nominal" (a network that behaves as a ${behavesAs} needs its nominal value for the usable band)`);
  }

  const tolerance = readTolerance(root);
  const spread: PartSpread = { tolerance, parasitics: {} };
  const part: Partial<Part> = {
    id,
    kind,
    behavesAs,
    nominal,
    title: root.text('title') ?? id,
    tolerance: tolerance ? Math.max(tolerance.minus, tolerance.plus) : undefined,
    spread,
    voltageRatings: readVoltageRatings(root),
    currentA: root.quantity('current', 'current'),
    powerW: root.quantity('power', 'power'),
    package: root.text('package'),
    tags: root.textList('tags'),
    notes: root.text('notes'),
    cost: readCost(root),
    measurements: readMeasurementEntries(root),
    dcBias: [],
    source,
    at: root.position('id'),
  };

  part.voltageV = part.voltageRatings!.find((r) => r.kind === 'DC')?.volts;
  part.voltageAcV = part.voltageRatings!.find((r) => r.kind === 'AC')?.volts;

  if (root.has('marking')) part.marking = readMarking(root, kind, nominal);
  if (kind === 'capacitor' || kind === 'network') {
    part.dielectric = root.text('dielectric');
    if (part.dielectric !== undefined) spread.temperature = readDielectricCharacteristic(root, part.dielectric);
  }
  if (root.has('temperature') && root.has('tc')) root.error('tc', 'give the temperature characteristic once: either "temperature" (a change over a range) or "tc" (a coefficient), not both');
  // The part's own statement is more specific than its dielectric's class.
  else if (kind !== 'bead') spread.temperature = readTemperatureBlock(root) ?? readCoefficient(root) ?? spread.temperature;
  // No "did you mean" here: a guessed class could name a stricter or weaker rating than the part has.
  if (kind === 'capacitor') part.safetyClass = root.text('safety', { oneOf: SAFETY_CLASSES, suggest: false });
  if (part.safetyClass) checkSafetyRating(root, part.safetyClass, part.voltageRatings!);
  if (root.has('dc-bias')) {
    if (behavesAs !== 'capacitor') root.error('dc-bias', 'a DC-bias table applies to capacitors only');
    else part.dcBias = readDcBias(root, part.voltageV);
  }

  // Other kinds are told the field is unknown to them (expect above).
  if (root.has('mounting') && (kind === 'capacitor' || kind === 'network')) {
    if (behavesAs !== 'capacitor') root.error('mounting', 'a mounting inductance applies to capacitors placed on rails only; this network does not behave as a capacitor');
    else part.mountingH = root.quantity('mounting', 'inductance', { allowZero: true });
  }

  const band = root.map('band');
  if (band) {
    band.expect(['within']);
    part.within = band.ratio('within');
  }

  const built = buildNetwork(root, kind, nominal, spread.parasitics);
  if (built) {
    part.parameters = built.parameters;
    part.network = built.network;
  }
  if (kind === 'bead') {
    part.ratedAtHz = root.quantity('at', 'frequency');
    if (root.has('nominal') && !root.has('at')) root.error('nominal', 'a bead\'s nominal impedance needs the frequency it is rated at ("at", e.g. at: 100M)');
    if (part.network && nominal !== undefined && part.ratedAtHz !== undefined) checkBeadRating(root, part.network, nominal, part.ratedAtHz, tolerance);
  }

  if (diagnostics.errorCount > before) return undefined;
  return part as Part;
}

/** Without a stated tolerance, a bead's model may miss its rated impedance by this much (common practice). */
export const BEAD_RATING_TOLERANCE = 0.25;

/** How far the model's |Z| at the rated frequency is from the rated impedance: |Z|/nominal − 1. */
export function beadRatingDeviation(network: Element, nominal: number, ratedAtHz: number): number {
  const [re, im] = impedanceAt(network, ratedAtHz);
  return Math.hypot(re, im) / nominal - 1;
}

/** A bead's model must reproduce its rating: |Z(at)| within the tolerance (else 25%) of nominal. */
function checkBeadRating(root: Fields, network: Element, nominal: number, ratedAtHz: number, bounds: Bounds | undefined): void {
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
function readCost(root: Fields): number | undefined {
  const cost = root.quantity('cost', 'ratio', { allowZero: true });
  if (cost === undefined || cost <= 1e9) return cost;
  root.error('cost', `expected a unit cost from 0 to 1e9, found ${quote(scalarText(root.valueNode('cost')) ?? '')}`);
  return undefined;
}

function readMarking(root: Fields, kind: PartKind, nominal: number | undefined): string | undefined {
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
function checkSafetyRating(root: Fields, safetyClass: string, ratings: readonly VoltageRating[]): void {
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

function readDcBias(root: Fields, ratingV: number | undefined): BiasPoint[] {
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

interface BuiltNetwork {
  network: Element;
  parameters: Record<string, number>;
}

/** The model topology of each kind (DESIGN.md): an absent series parasitic is 0, an absent parallel one open. */
function buildNetwork(root: Fields, kind: PartKind, nominal: number | undefined, spreads: Record<string, Bounds>): BuiltNetwork | undefined {
  if (kind === 'network') {
    if (!root.has('network')) return undefined;
    const network = readNetworkNode(root.ctx, root.valueNode('network'), 'network');
    return network ? { network, parameters: {} } : undefined;
  }
  if (kind === 'bead') {
    const model = root.map('model');
    if (!model) return undefined;
    model.expect(Object.keys(BEAD_MODEL), ['r', 'l'], (name) => expectationInBrackets(BEAD_MODEL[name]));
    const p = readParameters(model, BEAD_MODEL, spreads);
    if (p.r === undefined || p.l === undefined) return undefined;
    const core = parallel(...[resistor(p.r, 'R'), inductor(p.l, 'L'), p.c !== undefined ? capacitor(p.c, 'C') : undefined].filter(isElement));
    return { network: series(...[p.rdc !== undefined ? resistor(p.rdc, 'Rdc') : undefined, core].filter(isElement)), parameters: p };
  }
  const fields = PARASITICS[kind];
  const parasitics = root.map('parasitics');
  let p: Record<string, number> = {};
  if (parasitics) {
    parasitics.expect(Object.keys(fields));
    p = readParameters(parasitics, fields, spreads);
  }
  if (nominal === undefined) return undefined;
  let network: Element;
  switch (kind) {
    case 'capacitor': {
      // esr + esl + (C ‖ epr)
      const c = p.epr !== undefined ? parallel(capacitor(nominal, 'C'), resistor(p.epr, 'EPR')) : capacitor(nominal, 'C');
      network = series(...[p.esr !== undefined ? resistor(p.esr, 'ESR') : undefined, p.esl !== undefined ? inductor(p.esl, 'ESL') : undefined, c].filter(isElement));
      break;
    }
    case 'inductor': {
      // (dcr + L) ‖ cp ‖ rp
      const winding = series(...[p.dcr !== undefined ? resistor(p.dcr, 'DCR') : undefined, inductor(nominal, 'L')].filter(isElement));
      network = parallel(...[winding, p.cp !== undefined ? capacitor(p.cp, 'Cp') : undefined, p.rp !== undefined ? resistor(p.rp, 'Rp') : undefined].filter(isElement));
      break;
    }
    case 'resistor': {
      // (R + ls) ‖ cp
      const body = series(...[resistor(nominal, 'R'), p.ls !== undefined ? inductor(p.ls, 'Ls') : undefined].filter(isElement));
      network = parallel(...[body, p.cp !== undefined ? capacitor(p.cp, 'Cp') : undefined].filter(isElement));
      break;
    }
  }
  return { network, parameters: p };
}

function isElement(e: Element | undefined): e is Element {
  return e !== undefined;
}

function readParameters(fields: Fields, spec: Readonly<Record<string, Dimension>>, spreads: Record<string, Bounds>): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [name, dim] of Object.entries(spec)) {
    const value = readSpreadQuantity(fields, name, dim, spreads);
    if (value !== undefined) out[name] = value;
  }
  return out;
}

const NETWORK_LEAVES: Readonly<Record<string, Dimension>> = { r: 'resistance', l: 'inductance', c: 'capacitance' };
const NETWORK_KEYS = ['series', 'parallel', ...Object.keys(NETWORK_LEAVES)];

/** A network node: {r: 5m}, {l: 1.1n}, {c: 10u}, {series: [...]} or {parallel: [...]}. */
export function readNetworkNode(ctx: ReadContext, node: Node | null | undefined, label: string): Element | undefined {
  const at = positionOf(ctx.source, node);
  if (!isMap(node) || (node as YAMLMap).items.length !== 1) {
    const keys = isMap(node) ? (node as YAMLMap<Node, Node | null>).items.map((p) => scalarText(p.key) ?? '?') : [];
    const found = keys.length > 1 ? `a mapping of ${keys.length} elements (${keys.join(', ')}); give each element its own list item` : describeNode(node);
    ctx.diagnostics.error(at, `${label}: expected one element such as {r: 5m}, {l: 1n}, {c: 10u}, {series: [...]} or {parallel: [...]}, found ${found}`);
    return undefined;
  }
  const pair = (node as YAMLMap<Node, Node | null>).items[0];
  const key = scalarText(pair.key) ?? '';
  // Own keys only: "constructor" or "valueOf" is no element, whatever plain objects inherit.
  if (Object.hasOwn(NETWORK_LEAVES, key)) {
    const value = readQuantity(ctx, pair.value, `${label}.${key}`, NETWORK_LEAVES[key]);
    if (value === undefined) return undefined;
    return key === 'r' ? resistor(value) : key === 'l' ? inductor(value) : capacitor(value);
  }
  if (key === 'series' || key === 'parallel') {
    if (!isSeq(pair.value) || pair.value.items.length === 0) {
      ctx.diagnostics.error(positionOf(ctx.source, pair.value ?? pair.key), `${label}.${key}: expected a list of one or more elements, found ${describeNode(pair.value)}`);
      return undefined;
    }
    const children: Element[] = [];
    let failed = false;
    pair.value.items.forEach((item, i) => {
      const child = readNetworkNode(ctx, item as Node, `${label}.${key}[${i}]`);
      if (child) children.push(child);
      else failed = true;
    });
    if (failed) return undefined;
    return key === 'series' ? series(...children) : parallel(...children);
  }
  const guess = nearMiss(key, NETWORK_KEYS);
  ctx.diagnostics.error(positionOf(ctx.source, pair.key), `${label}: unknown element ${quote(key)}; expected one of ${NETWORK_KEYS.join(', ')}${guess ? `; did you mean "${guess}"?` : ''}`);
  return undefined;
}
