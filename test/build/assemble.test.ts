// A build asks for every comparison's chart at once, so the chart workers draw them side by side (asked one
// by one, one worker drew every comparison while the other sat idle), and the pages keep their order and
// each its own chart whatever order the charts come back in. They are keyed while the parts' charts are
// still drawn (a rebuild after one edit waited for the part's charts before keying 903 comparisons), ask for
// their charts once their own parts' pages are made, and list the parts as their page data is.

import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { assembleSite, type UnitKeys } from '../../src/build/assemble.js';
import type { ChartArtifact, ChartMaker } from '../../src/build/chart-maker.js';
import { silentProgress } from '../../src/build/progress.js';
import { loadLibrary } from '../../src/model/library.js';
import { noCharts } from './no-charts.js';

const REPO = join(import.meta.dirname, '..', '..');
const dirs: string[] = [];
afterAll(() => dirs.forEach((d) => rmSync(d, { recursive: true, force: true })));

function assemble(charts: ChartMaker, units?: UnitKeys) {
  const library = loadLibrary(REPO).library!;
  const siteDir = mkdtempSync(join(tmpdir(), 'zfolio-assemble-'));
  dirs.push(siteDir);
  return assembleSite({ library, siteDir, charts, progress: silentProgress, pdfLinks: { part: () => false, review: () => false }, units });
}

describe('comparison charts', () => {
  it('are all asked for before any is answered, and each page keeps its place and its own chart', async () => {
    const reference = await assemble(noCharts);
    const asked: { title: string; answer: (chart: ChartArtifact) => void }[] = [];
    let answered = 0;
    const held: ChartMaker = {
      ...noCharts,
      comparisonChart: (_, title) =>
        new Promise<ChartArtifact>((resolve) => {
          asked.push({ title, answer: resolve });
          // Once every comparison has asked (none answered yet), answer them last first.
          if (asked.length === reference.comparisons.length) {
            setImmediate(() => {
              for (const a of [...asked].reverse()) {
                answered++;
                a.answer({ key: 'overlay', title: a.title, description: a.title, svg: `<svg xmlns="http://www.w3.org/2000/svg"><title>${a.title}</title></svg>`, spec: {} });
              }
            });
          }
        }),
    };
    const folio = await assemble(held);
    expect(reference.comparisons.length).toBeGreaterThan(3);
    expect(asked.length).toBe(reference.comparisons.length);
    expect(answered).toBe(asked.length);
    // The same pages in the same order as with charts answered one by one at once.
    expect(folio.comparisons.map((c) => c.slug)).toEqual(reference.comparisons.map((c) => c.slug));
    expect(folio.comparisonPages.map((c) => c.slug)).toEqual(reference.comparisonPages.map((c) => c.slug));
    for (const page of folio.comparisons) expect(page.chart?.svg).toContain(`<title>${page.title}</title>`);
  }, 120_000);

  it("are keyed while the parts' charts are still drawn, drawn once their parts' pages are made, and list each part as its page data has it", async () => {
    const reference = await assemble(noCharts);
    let keyed = 0;
    let comparisonsAsked = 0;
    let wholeAnalyses = 0;
    const partsHeld: (() => void)[] = [];
    const held: ChartMaker = {
      ...noCharts,
      partCharts: () => new Promise<ChartArtifact[]>((resolve) => partsHeld.push(() => resolve([]))),
      comparisonChart: (parts, title) => {
        comparisonsAsked++;
        // What is kept of a part once its page is made (comparedAnalysis), not its whole analysis.
        for (const a of parts) wholeAnalyses += 'decades' in a ? 1 : 0;
        return noCharts.comparisonChart(parts, title);
      },
    };
    const units: UnitKeys = { comparison: () => String(++keyed), kept: () => false };
    const assembling = assemble(held, units);
    // No part's charts answered yet: every comparison is keyed, none of their charts asked for (each waits for
    // its parts' pages, so that it reads only what is kept of each part's analysis).
    await new Promise((resolve) => setImmediate(resolve));
    expect(partsHeld.length).toBe(reference.parts.length);
    expect(keyed).toBe(reference.comparisons.length);
    expect(comparisonsAsked).toBe(0);
    partsHeld.forEach((answer) => answer());
    const folio = await assembling;
    expect(comparisonsAsked).toBe(reference.comparisons.length);
    expect(wholeAnalyses).toBe(0);
    const listed = new Map(folio.parts.map((p) => [p.id, p]));
    expect(folio.comparisons.map((c) => [c.slug, c.parts.map((p) => p.id)])).toEqual(reference.comparisons.map((c) => [c.slug, c.parts.map((p) => p.id)]));
    for (const c of folio.comparisons) for (const p of c.parts) expect(p).toBe(listed.get(p.id));
  }, 120_000);
});
