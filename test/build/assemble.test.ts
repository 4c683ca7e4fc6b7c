// A build asks for every comparison's chart at once, so the chart workers draw them side by side (asked one
// by one, one worker drew every comparison while the other sat idle), and the pages keep their order and
// each its own chart whatever order the charts come back in.

import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { assembleSite } from '../../src/build/assemble.js';
import type { ChartArtifact, ChartMaker } from '../../src/build/chart-maker.js';
import { silentProgress } from '../../src/build/progress.js';
import { loadLibrary } from '../../src/model/library.js';
import { noCharts } from './no-charts.js';

const REPO = join(import.meta.dirname, '..', '..');
const dirs: string[] = [];
afterAll(() => dirs.forEach((d) => rmSync(d, { recursive: true, force: true })));

function assemble(charts: ChartMaker) {
  const library = loadLibrary(REPO).library!;
  const siteDir = mkdtempSync(join(tmpdir(), 'zfolio-assemble-'));
  dirs.push(siteDir);
  return assembleSite({ library, siteDir, charts, progress: silentProgress, pdfLinks: { part: () => false, review: () => false } });
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
});
