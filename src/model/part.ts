// The part file: one passive part, its nominal value and the parasitics that make it real.

import { isMap, type Node, type YAMLMap } from 'yaml';
import type { Element } from '../circuit/element.js';
import { NOMINAL_DIMENSION as NOMINAL_BY_BEHAVIOUR, type Dimension } from '../units/quantity.js';
import { quote, type SourcePosition } from './diagnostics.js';
import { Fields, describeNode, expectationInBrackets, nearMiss, type ReadContext } from './fields.js';
import { buildNetwork } from './part-network.js';
import { checkBeadRating, checkSafetyRating, readCost, readDcBias, readMarking } from './part-ratings.js';
import { MAX_ID_LENGTH } from './page-names.js';
import { positionOf, type SourceFile } from './source.js';
import { readVoltageRatings, type VoltageRating } from './voltage-rating.js';
import { readCoefficient, readDielectricCharacteristic, readTemperatureBlock, readTolerance, type PartSpread } from './spread.js';
import { readMeasurementEntries, type MeasurementEntry } from './measurement-entry.js';

export const PART_KINDS = ['capacitor', 'inductor', 'resistor', 'bead', 'network'] as const;
export type PartKind = (typeof PART_KINDS)[number];
export const BEHAVIOURS = ['capacitor', 'inductor', 'resistor', 'bead'] as const;
export type Behaviour = (typeof BEHAVIOURS)[number];

/** The dimension of a nominal value, by the kind the part behaves as. */
export const NOMINAL_DIMENSION: Readonly<Record<Behaviour, Dimension>> = NOMINAL_BY_BEHAVIOUR;

// At least one letter or digit: an id names a folder of the site, so "." and ".." must not be ids.
export const ID_PATTERN = /^(?=.*[A-Za-z0-9])[A-Za-z0-9._-]+$/;

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
