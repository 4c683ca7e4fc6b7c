// What the chart cache keeps: a part's charts without their specs (its page offers the site's shared specs,
// spec-download.ts), a comparison's with its spec (written beside its page); an entry read back gives the
// charts the drawing gave, whether a worker or this thread drew them.

import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readCacheEntry } from '../../src/build/chart-cache-entry.js';
import { ChartPool } from '../../src/build/chart-pool.js';
import type { PartAnalysis } from '../../src/analysis/part-figures.js';
import type { Part } from '../../src/model/part.js';
import { analysed, capacitorPart, inductorPart } from '../charts/fixtures.js';

const root = mkdtempSync(join(tmpdir(), 'zfolio-cache-specs-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const withSource = (p: Part, hash: string): PartAnalysis => {
  const part = { ...p, source: { path: `${hash}.yaml`, hash } } as unknown as Part;
  return { ...analysed(p), part };
};

const entries = (dir: string) => readdirSync(dir).map((name) => readCacheEntry(join(dir, name)));

describe.each([
  ['in this thread', 0],
  ['in a worker', 1],
])('the chart cache, drawn %s', (_, workers) => {
  it('keeps a part\'s charts without specs and a comparison\'s with its spec; a second build reads the same charts', async () => {
    const cacheDir = join(root, `w${workers}`);
    const capacitor = withSource(capacitorPart, 'hc');
    const inductor = withSource(inductorPart, 'hl');
    const first = new ChartPool({ workers, cacheDir, settingsKey: 'test' });
    const drawn = await first.partCharts(capacitor);
    const comparison = await first.comparisonChart([capacitor, inductor], 'Two parts');
    await first.close();

    expect(drawn.map((c) => c.key)).toEqual(['impedance', 'phase', 'plane', 'admittance']);
    for (const c of drawn) expect(c).not.toHaveProperty('spec');
    expect(comparison.spec).toHaveProperty('datasets');
    const stored = entries(cacheDir);
    expect(stored).toHaveLength(2);
    const part = stored.find((e) => e.length === 4)!;
    const compared = stored.find((e) => e.length === 1)!;
    for (const c of part) expect(Object.keys(c).sort()).toEqual(['description', 'key', 'svg', 'title']);
    // In this thread the spec's rows are the objects vega was given (they carry its id symbol): compared as JSON.
    const asJson = (x: unknown) => JSON.parse(JSON.stringify(x)) as unknown;
    expect(compared[0]).toEqual(asJson(comparison));

    const second = new ChartPool({ workers, cacheDir, settingsKey: 'test' });
    expect(await second.partCharts(capacitor)).toEqual(drawn);
    expect(await second.comparisonChart([capacitor, inductor], 'Two parts')).toEqual(asJson(comparison));
    expect(second.stats.fromCache).toBe(2);
    expect(second.stats.rendered).toBe(0);
    await second.close();
  }, 120_000);
});
