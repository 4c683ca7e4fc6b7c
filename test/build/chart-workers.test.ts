// Chart workers start before the library is read only on a cold build of many parts: a rebuild, a build
// whose charts are cached or a small library starts none early (it would pay their start for nothing).

import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import { afterAll, describe, expect, it } from 'vitest';
import { earlyChartWorkers, PARTS_PER_WORKER_START, rebuildChartWorker, REBUILD_WORKER_PARTS, WORKER_LIMITS, type StartedWorker } from '../../src/build/chart-workers.js';
import { ChartPool } from '../../src/build/chart-pool.js';
import { LEDGER_FILE } from '../../src/build/chart-cache-ledger.js';
import type { Part } from '../../src/model/part.js';
import { analysed, resistorPart } from '../charts/fixtures.js';

const root = mkdtempSync(join(tmpdir(), 'zfolio-early-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

/** A library folder with `count` part files (only their names are read here), half of them one folder down. */
function library(name: string, count: number, hidden = 0): string {
  const dir = join(root, name);
  mkdirSync(join(dir, 'parts', 'group'), { recursive: true });
  mkdirSync(join(dir, 'parts', '.hidden'), { recursive: true });
  for (let i = 0; i < count; i++) writeFileSync(join(dir, 'parts', i % 2 ? 'group' : '', `p${i}.yaml`), 'id: P\n');
  for (let i = 0; i < hidden; i++) writeFileSync(join(dir, 'parts', '.hidden', `h${i}.yaml`), 'id: H\n');
  writeFileSync(join(dir, 'parts', 'notes.txt'), 'not a part\n');
  return dir;
}

const stop = (started: StartedWorker[]) => Promise.all(started.map((s) => s.worker.terminate()));

describe('chart workers started early', () => {
  it('are started for a library of enough part files, at any depth, with no cache', async () => {
    const started = earlyChartWorkers({ libraryRoot: library('many', PARTS_PER_WORKER_START), workers: 1 });
    expect(started).toHaveLength(1);
    // The worker's own heap has the young generation asked for (Node reports the isolate's limits).
    await new Promise((resolve) => started[0].worker.once('online', resolve));
    expect(started[0].worker.resourceLimits?.maxYoungGenerationSizeMb).toBe(WORKER_LIMITS.maxYoungGenerationSizeMb);
    // Larger than V8's default, as Node reports it for a worker started without limits.
    const plain = new Worker('', { eval: true });
    await new Promise((resolve) => plain.once('online', resolve));
    expect(WORKER_LIMITS.maxYoungGenerationSizeMb).toBeGreaterThan(plain.resourceLimits!.maxYoungGenerationSizeMb!);
    await plain.terminate();
    await stop(started);
  }, 60_000);

  it('are not started for fewer part files (hidden folders and other files not counted), nor when asked for none', () => {
    expect(earlyChartWorkers({ libraryRoot: library('few', PARTS_PER_WORKER_START - 1, 5), workers: 1 })).toEqual([]);
    expect(earlyChartWorkers({ libraryRoot: library('none-asked', PARTS_PER_WORKER_START), workers: 0 })).toEqual([]);
  });

  it('are not started when a last build of the output folder is recorded, or when the chart cache holds a chart', () => {
    const libraryRoot = library('rebuild', PARTS_PER_WORKER_START);
    const cacheRoot = join(libraryRoot, '.zfolio-cache');
    const recordDir = join(cacheRoot, 'builds', 'site');
    mkdirSync(recordDir, { recursive: true });
    expect(earlyChartWorkers({ libraryRoot, cacheRoot, recordDir, workers: 1 })).toEqual([]);
    rmSync(recordDir, { recursive: true });
    mkdirSync(join(cacheRoot, 'charts'));
    writeFileSync(join(cacheRoot, 'charts', 'entry.json.gz'), '');
    expect(earlyChartWorkers({ libraryRoot, cacheRoot, recordDir, workers: 1 })).toEqual([]);
  });

  it('are started when the chart cache holds its ledger and no chart (chart-cache-ledger.ts)', async () => {
    const libraryRoot = library('ledger-only', PARTS_PER_WORKER_START);
    const cacheRoot = join(libraryRoot, '.zfolio-cache');
    mkdirSync(join(cacheRoot, 'charts'), { recursive: true });
    writeFileSync(join(cacheRoot, 'charts', LEDGER_FILE), '{"format":1,"held":0,"written":0}');
    const started = earlyChartWorkers({ libraryRoot, cacheRoot, workers: 1 });
    expect(started).toHaveLength(1);
    await stop(started);
  }, 60_000);

  it('are started by a rebuild of a large library that reads a part afresh: one, and only with enough part files', async () => {
    const early: StartedWorker[] = [];
    rebuildChartWorker(early, REBUILD_WORKER_PARTS - 1);
    rebuildChartWorker(early, REBUILD_WORKER_PARTS, { workers: 0 });
    // A process that has built before draws a rebuild's charts itself.
    rebuildChartWorker(early, REBUILD_WORKER_PARTS, { warm: true });
    expect(early).toEqual([]);
    rebuildChartWorker(early, REBUILD_WORKER_PARTS);
    expect(early).toHaveLength(1);
    // Never a second: the build asks once, and a build that started workers early has them already.
    rebuildChartWorker(early, 2 * REBUILD_WORKER_PARTS);
    expect(early).toHaveLength(1);
    await stop(early);
  }, 60_000);

  it('are taken over by the chart pool, which draws with them', async () => {
    const started = earlyChartWorkers({ libraryRoot: library('pool', PARTS_PER_WORKER_START), workers: 1 });
    const [worker] = started.map((s) => s.worker);
    const pool = new ChartPool({ workers: 1, settingsKey: 'test', started });
    // Taken out of the list, so the build does not stop it.
    expect(started).toEqual([]);
    const part = { ...resistorPart, id: 'P-EARLY', source: { path: 'p.yaml', hash: 'h' } } as unknown as Part;
    const charts = await pool.partCharts(analysed(part));
    expect(charts.map((c) => c.title.includes('P-EARLY'))).toEqual([true, true, true, true]);
    // The worker that drew them was the one started early: stopping the pool stops it.
    let exited = false;
    worker.once('exit', () => (exited = true));
    await pool.close();
    expect(exited).toBe(true);
  }, 120_000);
});
