// What changed between two loaded revisions of a library: parts added, removed, renamed and changed (the
// fields and the figures that moved), every rail whose plan, placed parts or settings changed with its
// verdict and worst margin before and after and the changes that moved it, comparisons and reviews added,
// removed and changed. Only what changed is analysed: a part whose file is the same in both revisions (under
// the same sweep and band settings) has the same figures, so it is not analysed at all.

import { analysePart, type PartAnalysis } from '../analysis/part-figures.js';
import { analysePlan, type PlanFigures } from '../analysis/plan-figures.js';
import type { Library } from '../model/library.js';
import { comparisonKey } from '../model/comparison.js';
import { fileStem } from '../model/page-names.js';
import type { Part } from '../model/part.js';
import type { SourceFile } from '../model/source.js';
import { fieldChanges, sameValue, type FieldChange } from './field-changes.js';
import { movableFigures, movedFigures, type FigureChange, type FigureName } from './part-figure-changes.js';
import { pairParts } from './pairing.js';
import { withPartChange, withPlanChange, withSettingsChange } from './rail-attribution.js';

export interface PartChange {
  /** The id now. */
  id: string;
  /** The id before, when the part was renamed. */
  previousId: string | null;
  /** The part file now (library-relative). */
  file: string;
  /** The kind whose figures the part has now (capacitor, inductor, resistor, bead), or null. */
  behavesAs: string | null;
  /** Unit of the figure effectiveAtBandMiddle: F, H or Ω, or null when the part's kind has none. */
  effectiveUnit: string | null;
  /** Fields of the part file that changed, the id of a renamed part aside. */
  fields: FieldChange[];
  /** Figures that moved (relative change above MOVE_THRESHOLD), in SI units. */
  figures: Partial<Record<FigureName, FigureChange>>;
}

export interface RailVerdict {
  pass: boolean;
  worstMarginDb: number;
  worstFrequencyHz: number;
  /** The load step's verdict, deepest dip and budget, V; null when the plan gives no step. */
  loadStep: { status: LoadStepStatus; droopV: number; budgetV: number } | null;
}

/** A load step's verdict: NO VERDICT when its response could not be computed to the method's accuracy. */
export type LoadStepStatus = 'PASS' | 'FAIL' | 'NO VERDICT';

/** A change that can move a rail's verdict. */
export interface RailCause {
  kind: 'plan' | 'part' | 'settings';
  /** The part id (kind 'part'), else null. */
  id: string | null;
  /** The fields that changed. */
  fields: FieldChange[];
  /** The rail as it was with this change alone applied (the rail now, when it is the only change). */
  alone: { pass: boolean; worstMarginDb: number } | null;
}

export interface PlanChange {
  rail: string;
  status: 'added' | 'removed' | 'changed';
  before: RailVerdict | null;
  after: RailVerdict | null;
  /** The impedance verdict or the load step's turned (false for a rail added or removed). */
  verdictMoved: boolean;
  causes: RailCause[];
}

export interface FileChanges {
  added: string[];
  removed: string[];
  changed: { name: string; fields: FieldChange[] }[];
}

export interface LibraryDiff {
  /** folio.yaml fields that changed. */
  settings: FieldChange[];
  parts: { added: string[]; removed: string[]; renamed: { from: string; to: string }[]; changed: PartChange[] };
  /** Rails whose verdict moved first, then in rail order. */
  plans: PlanChange[];
  comparisons: FileChanges;
  reviews: FileChanges;
}

/** The analyses behind a diff, for pages that draw the curves before and after. */
export interface DiffAnalyses {
  parts: Map<string, { before: PartAnalysis; after: PartAnalysis }>;
  plans: Map<string, { before: PlanFigures | null; after: PlanFigures | null }>;
}

/** Code-unit order: the same on every machine, whatever its locale. */
const byText = (x: string, y: string) => (x < y ? -1 : x > y ? 1 : 0);

const dataOf = (source: SourceFile | undefined): unknown => (source ? source.document.toJS() : null);

/** Whether folio.yaml's changes reach the figures of every part (sweep, band criterion). */
function partSettingsChanged(before: Library, after: Library): boolean {
  return !sameValue(before.settings.sweep, after.settings.sweep) || before.settings.within !== after.settings.within;
}

function verdictOf(f: PlanFigures): RailVerdict {
  const t = f.transient;
  const loadStep = t ? { status: (!t.resolved ? 'NO VERDICT' : t.pass ? 'PASS' : 'FAIL') as LoadStepStatus, droopV: t.droopV, budgetV: t.budgetV } : null;
  return { pass: f.pass, worstMarginDb: f.worstMarginDb, worstFrequencyHz: f.worstFrequencyHz, loadStep };
}

/** The impedance verdict turned, or the load step's (both revisions having one). */
function verdictMoved(a: RailVerdict, b: RailVerdict): boolean {
  return a.pass !== b.pass || (a.loadStep !== null && b.loadStep !== null && a.loadStep.status !== b.loadStep.status);
}

export function diffLibraries(before: Library, after: Library): { diff: LibraryDiff; analyses: DiffAnalyses } {
  const settings = fieldChanges(dataOf(before.sources.find((s) => s.path === 'folio.yaml')) ?? {}, dataOf(after.sources.find((s) => s.path === 'folio.yaml')) ?? {});
  const reanalyseAll = partSettingsChanged(before, after);
  const pairing = pairParts(before.parts, after.parts);
  const analyses: DiffAnalyses = { parts: new Map(), plans: new Map() };

  const changed: PartChange[] = [];
  const changedIds = new Map<string, PartChange>();
  for (const { before: old, after: now, renamed } of pairing.pairs) {
    const sameFile = old.source.hash === now.source.hash;
    if (sameFile && !reanalyseAll) continue;
    const fields = sameFile ? [] : fieldChanges(dataOf(old.source), dataOf(now.source)).filter((f) => !(renamed && f.path === 'id'));
    // A file whose text changed but whose data did not (a comment) changes nothing, unless the settings did.
    if (fields.length === 0 && !reanalyseAll) continue;
    const a = analysePart(old, before.settings.sweep, before.settings.within);
    const b = analysePart(now, after.settings.sweep, after.settings.within);
    const [figuresBefore, figuresAfter] = [movableFigures(a), movableFigures(b)];
    const figures = movedFigures(figuresBefore, figuresAfter);
    if (fields.length === 0 && Object.keys(figures).length === 0) continue;
    const change: PartChange = {
      id: now.id,
      previousId: renamed ? old.id : null,
      file: now.source.path,
      behavesAs: now.behavesAs ?? null,
      effectiveUnit: figuresAfter.effectiveUnit ?? figuresBefore.effectiveUnit,
      fields,
      figures,
    };
    changed.push(change);
    changedIds.set(old.id, change);
    changedIds.set(now.id, change);
    analyses.parts.set(now.id, { before: a, after: b });
  }
  changed.sort((x, y) => byText(x.id, y.id));

  const parts = {
    added: pairing.added.map((p) => p.id).sort(),
    removed: pairing.removed.map((p) => p.id).sort(),
    renamed: pairing.pairs.filter((p) => p.renamed).map((p) => ({ from: p.before.id, to: p.after.id })).sort((x, y) => byText(x.to, y.to)),
    changed,
  };
  const earlier = new Map(pairing.pairs.map((p) => [p.after, p.before]));
  const plans = planChanges(before, after, { changedIds, earlier }, settings, analyses);
  const comparisons = fileChanges(
    new Map(before.comparisons.map((c) => [comparisonKey(c), c.source])),
    new Map(after.comparisons.map((c) => [comparisonKey(c), c.source])),
  );
  const reviews = fileChanges(
    new Map(before.reviews.map((r) => [fileStem(r.source.path, 'reviews'), r.source])),
    new Map(after.reviews.map((r) => [fileStem(r.source.path, 'reviews'), r.source])),
  );
  return { diff: { settings, parts, plans, comparisons, reviews }, analyses };
}

/** Settings that reach a rail's analysis or its warnings. */
const RAIL_SETTINGS = /^(sweep(\.per-decade)?|derating)$/;

interface PartHistory {
  /** Changed parts by their id before and by their id now. */
  changedIds: Map<string, PartChange>;
  /** Each part now that existed before, to its earlier version. */
  earlier: Map<Part, Part>;
}

function planChanges(before: Library, after: Library, history: PartHistory, settings: FieldChange[], analyses: DiffAnalyses): PlanChange[] {
  const old = new Map(before.plans.map((p) => [p.rail, p]));
  const now = new Map(after.plans.map((p) => [p.rail, p]));
  const rails = [...old.keys(), ...[...now.keys()].filter((r) => !old.has(r))].sort();
  const railSettings = settings.filter((f) => RAIL_SETTINGS.test(f.path));
  const out: PlanChange[] = [];
  for (const rail of rails) {
    const a = old.get(rail);
    const b = now.get(rail);
    const causes: RailCause[] = [];
    if (a && b) {
      if (a.source.hash !== b.source.hash) {
        const fields = fieldChanges(dataOf(a.source), dataOf(b.source));
        if (fields.length > 0) causes.push({ kind: 'plan', id: null, fields, alone: null });
      }
      const placed = new Set<Part>([...a.placements.map((p) => p.part), ...b.placements.map((p) => p.part)]);
      const seen = new Set<PartChange>();
      for (const part of placed) {
        const change = history.changedIds.get(part.id);
        if (!change || seen.has(change)) continue;
        seen.add(change);
        causes.push({ kind: 'part', id: change.id, fields: change.fields, alone: null });
      }
      if (railSettings.length > 0) causes.push({ kind: 'settings', id: null, fields: railSettings, alone: null });
      if (causes.length === 0) continue;
    }
    const figuresBefore = a ? analysePlan(a, before.settings.sweep.perDecade) : null;
    const figuresAfter = b ? analysePlan(b, after.settings.sweep.perDecade) : null;
    analyses.plans.set(rail, { before: figuresBefore, after: figuresAfter });
    const verdictBefore = figuresBefore && verdictOf(figuresBefore);
    const verdictAfter = figuresAfter && verdictOf(figuresAfter);
    if (a && b) {
      const perDecade = { before: before.settings.sweep.perDecade, after: after.settings.sweep.perDecade };
      for (const cause of causes) {
        if (causes.length === 1) cause.alone = { pass: figuresAfter!.pass, worstMarginDb: figuresAfter!.worstMarginDb };
        else if (cause.kind === 'plan') cause.alone = withPlanChange({ plan: b, perDecade: perDecade.after }, (p) => history.earlier.get(p), perDecade.before);
        else if (cause.kind === 'settings') cause.alone = withSettingsChange({ plan: a, perDecade: perDecade.before }, perDecade.after);
        else {
          const part = after.partsById.get(cause.id!)!;
          const earlierId = history.earlier.get(part)?.id ?? part.id;
          cause.alone = withPartChange({ plan: a, perDecade: perDecade.before }, earlierId, part);
        }
      }
    }
    out.push({
      rail,
      status: a && b ? 'changed' : a ? 'removed' : 'added',
      before: verdictBefore,
      after: verdictAfter,
      verdictMoved: verdictBefore !== null && verdictAfter !== null && verdictMoved(verdictBefore, verdictAfter),
      causes,
    });
  }
  // Moved verdicts first; the sort is stable, so rail order holds within each group.
  return out.sort((x, y) => Number(y.verdictMoved) - Number(x.verdictMoved));
}

function fileChanges(before: Map<string, SourceFile>, after: Map<string, SourceFile>): FileChanges {
  const changed: FileChanges['changed'] = [];
  for (const [name, source] of [...after].sort(([x], [y]) => byText(x, y))) {
    const old = before.get(name);
    if (!old || old.hash === source.hash) continue;
    const fields = fieldChanges(dataOf(old), dataOf(source));
    if (fields.length > 0) changed.push({ name, fields });
  }
  return {
    added: [...after.keys()].filter((k) => !before.has(k)).sort(),
    removed: [...before.keys()].filter((k) => !after.has(k)).sort(),
    changed,
  };
}
