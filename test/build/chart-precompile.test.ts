// A chart worker compiles the part charts' kinds and the comparison's as it waits for its first job
// (precompilePartCharts, chart-draw.ts). A kind compiled ahead is not compiled again by its first chart, and
// draws what it draws compiled by that chart, byte for byte.

import { describe, expect, it } from 'vitest';
import { precompilePartCharts, renderChartJob } from '../../src/build/chart-draw.js';
import { chartInput, comparisonInput, type ChartJob } from '../../src/build/chart-jobs.js';
import { PART_CHART_KINDS } from '../../src/charts/part-charts.js';
import { chartStats, resetChartCache } from '../../src/charts/render.js';
import { analysed, capacitorPart, inductorPart } from '../charts/fixtures.js';

const KINDS = [...PART_CHART_KINDS, 'comparison'];
const compiles = () => Object.fromEntries(KINDS.map((k) => [k, chartStats()[k]?.compiles ?? 0]));
const turns = async (n: number) => {
  for (let i = 0; i < n; i++) await new Promise((r) => setImmediate(r));
};

describe('the chart kinds compiled ahead of the first job', () => {
  const cap = analysed(capacitorPart);
  const ind = analysed(inductorPart);
  const jobs: ChartJob[] = [
    { type: 'part', input: chartInput(cap) },
    { type: 'comparison', inputs: [comparisonInput(cap), comparisonInput(ind)], title: 'two parts' },
  ];
  const draw = async () => {
    const out = [];
    for (const job of jobs) out.push(...(await renderChartJob(job)).map((c) => c.svg));
    return out;
  };

  /** The charts drawn with nothing compiled beforehand, then the Views forgotten again; and the counts then. */
  const reference = async () => {
    resetChartCache();
    const cold = await draw();
    resetChartCache();
    return { cold, before: compiles() };
  };

  it('are each compiled once, one a turn, and the charts drawn after are those drawn without', async () => {
    const { cold, before } = await reference();
    precompilePartCharts();
    // One kind a turn of the event loop: none yet, then the first alone.
    expect(compiles()).toEqual(before);
    await turns(1);
    expect(compiles()[KINDS[0]]).toBe(before[KINDS[0]] + 1);
    expect(compiles()[KINDS[1]]).toBe(before[KINDS[1]]);
    await turns(KINDS.length + 1);
    const ahead = compiles();
    for (const k of KINDS) expect(ahead[k], k).toBe(before[k] + 1);
    const warm = await draw();
    expect(compiles()).toEqual(ahead);
    expect(warm).toHaveLength(5);
    expect(warm).toEqual(cold);
  }, 60_000);

  it('let a job that comes between two kinds compile what it needs itself, each kind still once', async () => {
    const { cold, before } = await reference();
    precompilePartCharts();
    await turns(2);
    const drawn = await draw();
    await turns(KINDS.length + 1);
    for (const k of KINDS) expect(compiles()[k], k).toBe(before[k] + 1);
    expect(drawn).toEqual(cold);
  }, 60_000);
});
