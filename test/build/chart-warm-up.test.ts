// zfolio serve draws two invented parts' charts in its own thread after its first build, so the first edit
// does not pay for the chart kinds' first drawing there. What those charts leave in the reused Views must
// not show in any chart drawn after them.

import { describe, expect, it } from 'vitest';
import { warmChartDrawing } from '../../src/build/chart-warm-up.js';
import { renderChartJob } from '../../src/build/chart-draw.js';
import { chartInput, comparisonInput, type ChartJob } from '../../src/build/chart-jobs.js';
import { analysed, capacitorPart, inductorPart } from '../charts/fixtures.js';

describe('the chart warm-up', () => {
  it('draws without error, and the charts drawn after it are those drawn before it, byte for byte', async () => {
    const cap = analysed(capacitorPart);
    const ind = analysed(inductorPart);
    const jobs: ChartJob[] = [
      { type: 'part', input: chartInput(cap) },
      { type: 'part', input: chartInput(ind) },
      { type: 'comparison', inputs: [comparisonInput(cap), comparisonInput(ind)], title: 'two parts' },
    ];
    const before = [];
    for (const job of jobs) before.push(await renderChartJob(job));
    await warmChartDrawing();
    for (const [k, job] of jobs.entries()) {
      const after = await renderChartJob(job);
      expect(after.map((c) => c.key)).toEqual(before[k].map((c) => c.key));
      for (const [i, chart] of after.entries()) {
        // The same chart of the same part (its title names it), not an invented one's.
        expect(chart.svg.length).toBeGreaterThan(1000);
        expect(chart.svg).toBe(before[k][i].svg);
        expect(chart.title).toBe(before[k][i].title);
      }
    }
  }, 60_000);

  it('leaves no part of its own in the charts: no chart drawn after it names an invented part', async () => {
    await warmChartDrawing();
    const charts = await renderChartJob({ type: 'part', input: chartInput(analysed(capacitorPart)) });
    for (const chart of charts) expect(chart.svg).not.toContain('WARM-UP');
  }, 60_000);
});
