// The words of a diff: one line a change, moved verdicts first, in engineering notation. The command line
// prints these lines; the changes page and the review section show the same ones.

import { formatDecibels, formatEng } from '../units/format.js';
import { valueText, type FieldChange } from '../history/field-changes.js';
import type { LibraryDiff, PartChange, PlanChange, RailCause, RailVerdict } from '../history/library-diff.js';
import type { FigureChange, FigureName } from '../history/part-figure-changes.js';

export type ChangeKind = 'verdict' | 'rail' | 'settings' | 'part' | 'comparison' | 'review';

export interface ChangeLine {
  kind: ChangeKind;
  /** The part id, rail, comparison or review the line is about (null for settings). */
  subject: string | null;
  text: string;
}

/** "a 0.45n → 0.75n": one field, as written before and after. */
export function fieldText(f: FieldChange): string {
  if (f.before === null) return `${f.path} added: ${valueText(withoutKey(f.path, f.after))}`;
  if (f.after === null) return `${f.path} removed (was ${valueText(withoutKey(f.path, f.before))})`;
  return `${f.path} ${valueText(f.before)} → ${valueText(f.after)}`;
}

/** An item added to or removed from a keyed list, without the key its path already names: "capacitors[P0] added: {count: 1}". */
function withoutKey(path: string, value: unknown): unknown {
  const key = /\[([^\]]*)\]$/.exec(path)?.[1];
  if (key === undefined || typeof value !== 'object' || value === null || Array.isArray(value)) return value;
  const entries = Object.entries(value);
  const at = entries.findIndex(([, v]) => v === key);
  return at < 0 ? value : Object.fromEntries(entries.filter((_, i) => i !== at));
}

const fieldsText = (fields: readonly FieldChange[]) => fields.map(fieldText).join('; ');

/** A signed percentage with the typographic minus: "+25.3%", "−8.02%". */
export function percentText(percent: number): string {
  const abs = Math.abs(percent);
  // Small moves keep two significant digits, so a figure that moved never reads "+0.00%".
  const text = abs >= 100 ? abs.toFixed(0) : abs >= 10 ? abs.toFixed(1) : abs >= 0.01 ? abs.toFixed(2) : String(Number(abs.toPrecision(2)));
  return `${percent < 0 ? '−' : '+'}${text}%`;
}

export function figureLabel(name: FigureName, part: { behavesAs?: string | null; effectiveUnit?: string | null } = {}): string {
  switch (name) {
    case 'srfHz':
      return 'SRF';
    case 'bandFromHz':
      return 'band bottom';
    case 'bandToHz':
      return 'band top';
    case 'esrAtSrfOhm':
      return part.behavesAs === 'capacitor' ? 'ESR at SRF' : 'R at SRF';
    case 'effectiveAtBandMiddle':
      return part.effectiveUnit === 'F' ? 'C at band middle' : part.effectiveUnit === 'H' ? 'L at band middle' : 'value at band middle';
  }
}

function figureUnit(name: FigureName, effectiveUnit: string | null): string {
  if (name === 'esrAtSrfOhm') return 'Ω';
  if (name === 'effectiveAtBandMiddle') return effectiveUnit ?? '';
  return 'Hz';
}

/** "SRF 23.7 MHz → 18.3 MHz (−22.8%)": enough digits that the two values differ in print. */
export function figureText(label: string, unit: string, change: FigureChange): string {
  const show = (value: number | null, digits: number) => (value === null ? 'none' : formatEng(value, unit, { digits }));
  let digits = 3;
  while (digits < 7 && change.before !== null && change.after !== null && show(change.before, digits) === show(change.after, digits)) digits++;
  const percent = change.changePercent === null ? '' : ` (${percentText(change.changePercent)})`;
  return `${label} ${show(change.before, digits)} → ${show(change.after, digits)}${percent}`;
}

export function partFiguresText(change: PartChange): string[] {
  return Object.entries(change.figures).map(([name, c]) => figureText(figureLabel(name as FigureName, change), figureUnit(name as FigureName, change.effectiveUnit), c));
}

export function verdictText(v: RailVerdict): string {
  const step = v.loadStep ? `; load step ${v.loadStep.status}, dip ${formatEng(v.loadStep.droopV, 'V')} (budget ${formatEng(v.loadStep.budgetV, 'V')})` : '';
  return `${v.pass ? 'PASS' : 'FAIL'}, worst margin ${formatDecibels(v.worstMarginDb)} at ${formatEng(v.worstFrequencyHz, 'Hz')}${step}`;
}

/** "; load step PASS → FAIL, dip 14.2 mV → 31 mV (budget 27 mV)", or nothing when neither revision has a step. */
function loadStepChange(a: RailVerdict, b: RailVerdict): string {
  const [x, y] = [a.loadStep, b.loadStep];
  if (!x && !y) return '';
  if (!x || !y) return `; load step ${x ? `${x.status} → none` : `none → ${y!.status}`}`;
  const status = x.status === y.status ? x.status : `${x.status} → ${y.status}`;
  const dip = x.droopV === y.droopV ? formatEng(y.droopV, 'V') : `${formatEng(x.droopV, 'V')} → ${formatEng(y.droopV, 'V')}`;
  const budget = x.budgetV === y.budgetV ? formatEng(y.budgetV, 'V') : `${formatEng(x.budgetV, 'V')} → ${formatEng(y.budgetV, 'V')}`;
  return `; load step ${status}, dip ${dip} (budget ${budget})`;
}

function sameLoadStep(a: RailVerdict, b: RailVerdict): boolean {
  const [x, y] = [a.loadStep, b.loadStep];
  return x === y || (!!x && !!y && x.status === y.status && x.droopV === y.droopV && x.budgetV === y.budgetV);
}

export function causeText(c: RailCause, sole = true): string {
  const what = c.kind === 'plan' ? 'the plan' : c.kind === 'part' ? `part ${c.id}` : 'folio.yaml';
  const alone = c.alone && !sole ? `; alone ${c.alone.pass ? 'PASS' : 'FAIL'} ${formatDecibels(c.alone.worstMarginDb)}` : '';
  return c.fields.length > 0 || alone ? `${what} (${fieldsText(c.fields)}${alone})` : what;
}

export function railText(p: PlanChange): string {
  if (p.status === 'added') return `rail ${p.rail} added: ${p.after ? verdictText(p.after) : ''}`;
  if (p.status === 'removed') return `rail ${p.rail} removed (was ${p.before ? verdictText(p.before) : ''})`;
  const [a, b] = [p.before!, p.after!];
  const verdict = a.pass === b.pass ? (b.pass ? 'PASS' : 'FAIL') : `${a.pass ? 'PASS' : 'FAIL'} → ${b.pass ? 'PASS' : 'FAIL'}`;
  const same = a.worstMarginDb === b.worstMarginDb;
  const margin = same ? `worst margin ${formatDecibels(b.worstMarginDb)} unchanged` : `worst margin ${formatDecibels(a.worstMarginDb)} → ${formatDecibels(b.worstMarginDb)}`;
  // A change that reaches the rail but moves none of its figures (a part's measurement, cost or notes) is
  // named as an input that changed, not as what moved the rail.
  const still = same && a.pass === b.pass && sameLoadStep(a, b);
  const causes = p.causes.map((c) => causeText(c, p.causes.length === 1)).join(', ');
  const moved = p.causes.length > 0 ? (still ? `; inputs changed: ${causes}` : `; moved by ${causes}`) : '';
  return `rail ${p.rail}: ${verdict}, ${margin}${loadStepChange(a, b)}${moved}`;
}

/** Every change as one line: rails whose verdict moved first, then the other rails, settings, parts, comparisons, reviews. */
export function changeLines(diff: LibraryDiff): ChangeLine[] {
  const lines: ChangeLine[] = [];
  for (const p of diff.plans) lines.push({ kind: p.verdictMoved ? 'verdict' : 'rail', subject: p.rail, text: railText(p) });
  if (diff.settings.length > 0) lines.push({ kind: 'settings', subject: null, text: `folio.yaml changed: ${fieldsText(diff.settings)}` });
  const { parts } = diff;
  for (const id of parts.added) lines.push({ kind: 'part', subject: id, text: `part ${id} added` });
  for (const id of parts.removed) lines.push({ kind: 'part', subject: id, text: `part ${id} removed` });
  for (const r of parts.renamed) lines.push({ kind: 'part', subject: r.to, text: `part ${r.from} renamed ${r.to}` });
  for (const c of parts.changed) {
    const figures = partFiguresText(c);
    const what = [fieldsText(c.fields), figures.length > 0 ? figures.join(', ') : c.fields.length > 0 ? 'no figure moved' : ''].filter(Boolean);
    lines.push({ kind: 'part', subject: c.id, text: `part ${c.id} changed: ${what.join('; ')}` });
  }
  for (const [kind, changes] of [['comparison', diff.comparisons], ['review', diff.reviews]] as const) {
    for (const name of changes.added) lines.push({ kind, subject: name, text: `${kind} ${name} added` });
    for (const name of changes.removed) lines.push({ kind, subject: name, text: `${kind} ${name} removed` });
    for (const c of changes.changed) lines.push({ kind, subject: c.name, text: `${kind} ${c.name} changed: ${fieldsText(c.fields)}` });
  }
  return lines;
}
