// What a datasheet page shows about one part, computed here and handed to the templates as ready text:
// facts, headline figures, Z at round frequencies, the model's parameters and the cautions.

import type { PartAnalysis } from '../analysis/part-figures.js';
import type { Part } from '../model/part.js';
import { formatDegrees, formatEng, formatNumber, formatPercent, formatDeviation } from '../units/format.js';
import { bandRuleText, bandText } from '../present/band-words.js';
import { cautionsFor, storedEnergyText } from '../present/cautions.js';
import { kindLabel } from '../present/kinds.js';
import { mainsBanner, type MainsBanner } from '../present/mains.js';
import { networkLeafMeaning, parameterMeaning } from '../present/model-words.js';
import { nominalText, signedPercent } from '../present/part-words.js';
import { extremumNote, resonanceNote } from '../present/resonance-words.js';
import type { Row } from '../present/row.js';
import { formatVoltageRating } from '../model/voltage-rating.js';
import { spreadSummary } from '../analysis/summary.js';
import { parasiticSpreadText, partCornerSentence, spreadFigureTexts, valueSpreadText } from '../present/corner-words.js';
import type { Element } from '../circuit/element.js';

export interface ImpedanceRow {
  frequency: string;
  resistance: string;
  reactance: string;
  magnitude: string;
  phase: string;
  /** Effective C or L, or the deviation of |Z| from R for a resistor; empty where it has no meaning. */
  effective: string;
  q: string;
}

export interface PartPageText {
  kindLabel: string;
  nominalText: string;
  facts: Row[];
  figures: Row[];
  impedanceTable: ImpedanceRow[];
  effectiveHeading: string;
  parameters: Row[];
  cautions: string[];
  /** The banner at the top of a mains part's sheet. */
  mainsBanner?: MainsBanner;
  srfText: string;
  bandText: string;
  /** What the spread rows mean and leave out, beside the figures; empty when nothing about the part moves. */
  spreadNote: string;
}

/** The figures over the part's spread: its value, SRF and band edges at the corners. */
function spreadRows(a: PartAnalysis): Row[] {
  const s = spreadSummary(a);
  // Nothing stated is said too: a reviewer asks for the corners of every part.
  if (!s) return [{ label: 'Spread', value: 'none stated', note: 'no tolerance, temperature characteristic or parasitic spread in the part file: every figure is nominal' }];
  const texts = spreadFigureTexts(s);
  const rows: Row[] = [];
  const value = valueSpreadText(a.part, s);
  if (value) rows.push({ label: 'Value over its spread', value, note: s.tolerance && s.temperatureChange ? 'tolerance × temperature change' : s.tolerance ? 'tolerance' : 'temperature change' });
  const parasitics = parasiticSpreadText(s);
  if (parasitics) rows.push({ label: 'Parasitic spread', value: parasitics });
  if (texts.srf) rows.push({ label: 'SRF over its spread', value: texts.srf, note: `over ${texts.corners}` });
  if (texts.bandBottom && s.usableBand && s.usableBand.fromHz.max > a.frequencies[0]) rows.push({ label: 'Band bottom over its spread', value: texts.bandBottom });
  if (texts.bandTop) rows.push({ label: 'Band top over its spread', value: texts.bandTop, note: 'each corner judged against its own value' });
  return rows;
}

function facts(part: Part): Row[] {
  const rows: Row[] = [{ label: 'Kind', value: kindLabel(part) }];
  rows.push({ label: part.behavesAs === 'bead' ? 'Rated impedance' : 'Nominal', value: nominalText(part) });
  if (part.marking) rows.push({ label: 'Marking', value: part.marking, note: 'IEC 60062 numeric code' });
  if (part.voltageRatings.length > 0) {
    const ac = part.voltageRatings.some((r) => r.kind === 'AC');
    rows.push({ label: 'Rated voltage', value: part.voltageRatings.map(formatVoltageRating).join(', '), note: ac ? 'AC as r.m.s.' : undefined });
  }
  if (part.currentA !== undefined) rows.push({ label: 'Rated current', value: formatEng(part.currentA, 'current') });
  if (part.powerW !== undefined) rows.push({ label: 'Rated power', value: formatEng(part.powerW, 'power') });
  if (part.package) rows.push({ label: 'Package', value: part.package });
  if (part.dielectric) rows.push({ label: 'Dielectric', value: part.dielectric });
  if (part.safetyClass) rows.push({ label: 'Safety class', value: part.safetyClass, note: 'IEC 60384-14' });
  if (part.dcBias.length > 0) {
    rows.push({ label: 'DC bias', value: part.dcBias.map((p) => `${formatPercent(p.fraction)} at ${formatEng(p.voltageV, 'voltage')}`).join(', ') });
  }
  if (part.cost !== undefined) rows.push({ label: 'Unit cost', value: formatNumber(part.cost, 4) });
  if (part.tags.length > 0) rows.push({ label: 'Tags', value: part.tags.join(', ') });
  return rows;
}

function figures(a: PartAnalysis): Row[] {
  const { part } = a;
  const rows: Row[] = [];
  const srf = a.selfResonance;
  if (srf) {
    const atSrf = part.behavesAs === 'capacitor' ? 'ESR at SRF' : '|Z| at SRF';
    rows.push({ label: 'Self-resonant frequency', value: formatEng(srf.frequencyHz, 'frequency'), note: `${srf.type} resonance` });
    const beside = extremumNote(srf);
    rows.push({ label: atSrf, value: formatEng(srf.impedanceOhm, 'resistance'), ...(beside ? { note: beside } : {}) });
  } else {
    rows.push({ label: 'Self-resonant frequency', value: 'none in the sweep', note: `${formatEng(a.sweep.fromHz, 'frequency')} to ${formatEng(a.sweep.toHz, 'frequency')}` });
  }
  for (const r of a.resonances) {
    if (r === srf) continue;
    rows.push({ label: `${r.type === 'series' ? 'Series' : 'Parallel'} resonance`, value: formatEng(r.frequencyHz, 'frequency'), note: resonanceNote(r) });
  }
  const rule = bandRuleText(part.behavesAs, a.within);
  rows.push({ label: 'Usable band', value: a.bandRule ? bandText(a.usableBand) : 'not defined', note: rule ?? 'the network declares no behaves-as' });
  const peakQ = a.peakQuality;
  // A capacitor's Q only grows towards DC; the peak is an inductor's figure of merit.
  if (peakQ && part.behavesAs === 'inductor') {
    rows.push({ label: 'Peak Q', value: formatNumber(peakQ.q), note: `at ${formatEng(peakQ.frequencyHz, 'frequency')}` });
  }
  if (part.behavesAs === 'bead') {
    const peak = a.peakImpedance;
    rows.push({ label: 'Peak |Z|', value: formatEng(peak.impedanceOhm, 'resistance'), note: `${peak.atSweepEnd ? 'at the sweep end, ' : ''}at ${formatEng(peak.frequencyHz, 'frequency')}` });
    if (part.ratedAtHz !== undefined && a.ratedImpedanceOhm !== undefined) {
      const modelOhm = a.ratedImpedanceOhm;
      const rated = part.nominal !== undefined ? `; rated ${formatEng(part.nominal, 'resistance')}, ${signedPercent(modelOhm / part.nominal - 1)}` : '';
      rows.push({ label: `|Z| at ${formatEng(part.ratedAtHz, 'frequency')}`, value: formatEng(modelOhm, 'resistance'), note: `model${rated}` });
    }
  }
  return rows;
}

function impedanceTable(a: PartAnalysis): { heading: string; rows: ImpedanceRow[] } {
  const { behavesAs } = a.part;
  const heading = behavesAs === 'capacitor' ? 'C_eff' : behavesAs === 'inductor' ? 'L_eff' : behavesAs === 'resistor' ? '|Z|/R − 1' : '';
  const unit = behavesAs === 'capacitor' ? 'capacitance' : 'inductance';
  const d = a.decades;
  const rows = Array.from(d.frequencyHz, (f, i) => {
    const value = a.decadeEffective[i];
    const effective = Number.isNaN(value) ? '' : behavesAs === 'resistor' ? formatDeviation(value) : formatEng(value, unit);
    return {
      frequency: formatEng(f, 'frequency'),
      resistance: formatEng(d.resistanceOhm[i], 'resistance'),
      reactance: formatEng(d.reactanceOhm[i], 'resistance'),
      magnitude: formatEng(d.magnitudeOhm[i], 'resistance'),
      phase: formatDegrees(d.phaseDeg[i]),
      effective,
      q: d.resistanceOhm[i] > 0 ? formatNumber(d.q[i]) : '—',
    };
  });
  return { heading, rows };
}

/** Every leaf of the model with its role and value, in drawing order. */
function parameters(network: Element, kind: string): Row[] {
  // Names first (R1, L1, C2 … where the file gives none), so that a leaf's meaning can name its neighbours.
  const names = new Map<Element, string>();
  const counters: Record<string, number> = {};
  const name = (e: Element) => {
    if (e.type === 'series' || e.type === 'parallel') return e.parts.forEach(name);
    counters[e.type] = (counters[e.type] ?? 0) + 1;
    names.set(e, e.name ?? `${e.type}${counters[e.type]}`);
  };
  name(network);
  const rows: Row[] = [];
  const walk = (e: Element, parent: Element | undefined) => {
    if (e.type === 'series' || e.type === 'parallel') return e.parts.forEach((p) => walk(p, e));
    const label = names.get(e)!;
    const value = e.type === 'R' ? formatEng(e.ohms, 'resistance') : e.type === 'L' ? formatEng(e.henries, 'inductance') : formatEng(e.farads, 'capacitance');
    const meaning = parameterMeaning(label, kind);
    const others = parent && (parent.type === 'series' || parent.type === 'parallel') ? parent.parts.filter((p) => p !== e).map((p) => names.get(p) ?? (p.type === 'series' ? 'a series branch' : 'a parallel group')) : [];
    const note = meaning || networkLeafMeaning(e.type, parent?.type === 'parallel' ? 'parallel' : 'series', others);
    rows.push({ label, value, note });
  };
  walk(network, undefined);
  return rows;
}

export function partPageText(a: PartAnalysis): PartPageText {
  const table = impedanceTable(a);
  return {
    kindLabel: kindLabel(a.part),
    nominalText: nominalText(a.part),
    facts: facts(a.part),
    figures: [...figures(a), ...spreadRows(a)],
    impedanceTable: table.rows,
    effectiveHeading: table.heading,
    parameters: parameters(a.part.network, a.part.kind),
    cautions: cautionsFor(a.part),
    mainsBanner: mainsBanner(a.part, storedEnergyText(a.part)),
    srfText: a.selfResonance ? formatEng(a.selfResonance.frequencyHz, 'frequency') : '—',
    bandText: a.bandRule ? bandText(a.usableBand) : '—',
    spreadNote: a.corners ? partCornerSentence(a.corners.operating, a.part) : '',
  };
}
