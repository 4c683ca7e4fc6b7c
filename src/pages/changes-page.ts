// What the "Changes since REV" page and a review's "What changed since REV" section show: the summary, one
// line a change (moved verdicts first), and for every changed rail and part its |Z| at the revision and now
// on one chart, whose spec is written beside the page.

import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { PartAnalysis } from '../analysis/part-figures.js';
import type { PlanFigures } from '../analysis/plan-figures.js';
import type { ChangeChartData, ChangeCurve } from '../charts/change-chart.js';
import type { RevisionComparison } from '../history/compare.js';
import { changeLines, railText, type ChangeKind } from '../present/diff-text.js';
import type { ChartArtifact, ChartMaker } from '../build/chart-maker.js';
import type { ChartOnPage } from './site-data.js';
import { escapeJsonMarkup } from '../present/escape.js';
import type { BuildHistory } from '../build/build-history.js';
import type { FolioData } from './site-data.js';

export interface ChangesData {
  revision: string;
  /** The first 12 hex digits of the commit. */
  shortCommit: string;
  commit: string;
  /** "1 rail verdict moved; 2 rails and 3 parts changed, 1 part added …" */
  summary: string;
  lines: { kind: ChangeKind; text: string; verdict: boolean }[];
  rails: { rail: string; text: string; verdictMoved: boolean; chart: ChartOnPage }[];
  parts: { id: string; text: string; chart: ChartOnPage }[];
}

function partCurve(a: PartAnalysis): ChangeCurve {
  const { frequencies, z } = a.resolved;
  return {
    frequencies: Array.from(frequencies),
    ohm: Array.from(frequencies, (_, i) => Math.hypot(z.re[i], z.im[i])),
    marks: a.selfResonance ? [{ frequencyHz: a.selfResonance.frequencyHz, impedanceOhm: a.selfResonance.impedanceOhm }] : [],
  };
}

function railCurve(f: PlanFigures): ChangeCurve {
  return { frequencies: f.frequenciesHz, ohm: f.impedanceOhm, marks: [{ frequencyHz: f.worstFrequencyHz, impedanceOhm: f.worstImpedanceOhm }] };
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

export function changesSummary(c: RevisionComparison): string {
  const { diff } = c;
  const moved = diff.plans.filter((p) => p.verdictMoved).length;
  const parts = diff.parts;
  const pieces = [
    moved > 0 ? `${plural(moved, 'rail verdict')} moved` : diff.plans.some((p) => p.status === 'changed') ? 'no rail verdict moved' : '',
    ...(['changed', 'added', 'removed'] as const).map((status) => {
      const n = diff.plans.filter((p) => p.status === status).length;
      return n > 0 ? `${plural(n, 'rail')} ${status}` : '';
    }),
    parts.changed.length > 0 ? `${plural(parts.changed.length, 'part')} changed` : '',
    parts.added.length > 0 ? `${plural(parts.added.length, 'part')} added` : '',
    parts.removed.length > 0 ? `${plural(parts.removed.length, 'part')} removed` : '',
    parts.renamed.length > 0 ? `${plural(parts.renamed.length, 'part')} renamed` : '',
    diff.settings.length > 0 ? 'folio.yaml changed' : '',
    diff.comparisons.added.length + diff.comparisons.removed.length + diff.comparisons.changed.length > 0 ? 'comparisons changed' : '',
    diff.reviews.added.length + diff.reviews.removed.length + diff.reviews.changed.length > 0 ? 'reviews changed' : '',
  ].filter(Boolean);
  return pieces.length > 0 ? pieces.join('; ') : 'nothing changed';
}

/**
 * The page data, the charts drawn (or taken from the cache) and their specs written into `folder` (the
 * page's own folder), named change-rail-RAIL and change-part-ID.
 */
export async function changesData(c: RevisionComparison, charts: ChartMaker, folder: string): Promise<ChangesData> {
  const since = c.revision.name;
  const place = (chart: ChartArtifact, key: string): ChartOnPage => {
    mkdirSync(folder, { recursive: true });
    writeFileSync(join(folder, `${key}.vl.json`), escapeJsonMarkup(JSON.stringify(chart.spec, null, 2)) + '\n');
    return { key, title: chart.title, description: chart.description, svg: chart.svg, specFile: `${key}.vl.json` };
  };
  const all = changeLines(c.diff);
  const lines = all.map((l) => ({ kind: l.kind, text: l.text, verdict: l.kind === 'verdict' }));
  const partText = (id: string) => all.find((l) => l.kind === 'part' && l.subject === id && l.text.startsWith(`part ${id} changed`))?.text ?? '';

  const rails: ChangesData['rails'] = [];
  for (const p of c.diff.plans) {
    const figures = c.analyses.plans.get(p.rail);
    if (!figures) continue;
    const data: ChangeChartData = {
      subject: p.rail,
      kind: 'rail',
      since,
      before: figures.before && railCurve(figures.before),
      after: figures.after && railCurve(figures.after),
      target: { before: figures.before?.targetOhm ?? null, after: figures.after?.targetOhm ?? null },
      band: figures.after?.band ?? figures.before?.band ?? null,
      markName: 'worst point',
    };
    rails.push({ rail: p.rail, text: railText(p), verdictMoved: p.verdictMoved, chart: place(await charts.changeChart(data), `change-rail-${p.rail}`) });
  }
  const parts: ChangesData['parts'] = [];
  for (const change of c.diff.parts.changed) {
    const analyses = c.analyses.parts.get(change.id);
    if (!analyses) continue;
    const data: ChangeChartData = { subject: change.id, kind: 'part', since, before: partCurve(analyses.before), after: partCurve(analyses.after), markName: 'SRF' };
    parts.push({ id: change.id, text: partText(change.id), chart: place(await charts.changeChart(data), `change-part-${change.id}`) });
  }
  return { revision: since, commit: c.revision.commit, shortCommit: c.revision.commit.slice(0, 12), summary: changesSummary(c), lines, rails, parts };
}

/** The site's changes: the page `--since` asked for (folio.changes, and folio.changesPages for its template), and each review's section. */
export async function addChanges(folio: FolioData & { changes?: ChangesData; changesPages?: ChangesData[] }, history: BuildHistory, charts: ChartMaker, siteDir: string): Promise<void> {
  folio.changesPages = [];
  if (history.since) {
    folio.changes = await changesData(history.since, charts, join(siteDir, 'changes'));
    folio.changesPages.push(folio.changes);
  }
  for (const page of folio.reviews) {
    const comparison = history.reviews.get(page.slug);
    if (!comparison) continue;
    page.changes = await changesData(comparison, charts, join(siteDir, 'reviews', page.slug));
    // In the pack, right after the decisions.
    const at = page.sections.findIndex((s) => s.id === 'pack-decisions') + 1;
    page.sections.splice(at, 0, { id: 'pack-changes', title: `What changed since ${comparison.revision.name}` });
  }
}
