// A build prunes the chart cache only when its ledger says enough entries were written since the last
// pruning (chart-cache-ledger.ts); the builds between leave the stale entries and count what they write.

import { afterAll, describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ChartPool } from '../../src/build/chart-pool.js';
import { LEDGER_FILE, MIN_WRITTEN, PRUNE_SHARE, pruneDue } from '../../src/build/chart-cache-ledger.js';
import type { Part } from '../../src/model/part.js';
import { tempDir } from '../site-helpers.js';
import { analysed, resistorPart } from '../charts/fixtures.js';
import { buildFolio, CACHE_DIR } from '../../src/build/build.js';
import { writeGeneratedLibrary } from '../../bench/generate.js';

/** A part with content hash `hash` (16 hex digits, as source.ts makes them). */
const part = (n: number) => ({ ...resistorPart, id: `L-${n}`, source: { path: `l${n}.yaml`, hash: n.toString(16).padStart(16, '0') } }) as unknown as Part;

describe('the chart cache pruned when its ledger says so', () => {
  const cacheDir = tempDir('chart-ledger');
  afterAll(() => rmSync(cacheDir, { recursive: true, force: true }));
  const entries = () => readdirSync(cacheDir).filter((name) => name !== LEDGER_FILE).sort();
  const ledger = () => JSON.parse(readFileSync(join(cacheDir, LEDGER_FILE), 'utf8')) as { held: number; written: number };
  /** A build's use of the pool: parts drawn (or taken from the cache), parts carried over. */
  const build = async (drawn: readonly Part[], carried: readonly Part[], pruning: 'when due' | 'every build' = 'when due') => {
    const pool = new ChartPool({ workers: 0, settingsKey: 'ledger', cacheDir, pruning });
    for (const p of drawn) await pool.partCharts(analysed(p));
    for (const p of carried) pool.keepPartCharts({ part: p });
    await pool.close();
    return pool;
  };

  it('prunes without a ledger, then counts the entries later builds write until a pruning is due', async () => {
    const first = await build([part(0), part(1), part(2)], []);
    expect(first.prunes).toBe(true);
    expect(entries()).toHaveLength(3);
    expect(ledger()).toEqual({ format: 1, held: 3, written: 0 });
    const kept = entries();

    // Part 2 edited (a new content hash): its old entry stays, stale, and the ledger counts the new one.
    const edit = await build([part(3)], [part(0), part(1)]);
    expect(edit.prunes).toBe(false);
    expect(entries()).toHaveLength(4);
    expect(entries()).toEqual(expect.arrayContaining(kept));
    expect(ledger()).toEqual({ format: 1, held: 3, written: 1 });

    // More edits, each a part never drawn before, up to the count that makes a pruning due.
    const due = Math.max(MIN_WRITTEN, Math.ceil(3 / PRUNE_SHARE));
    for (let n = 4; ledger().written < due; n++) expect((await build([part(n)], [part(0), part(1)])).prunes).toBe(false);
    expect(ledger().written).toBe(due);
    expect(entries()).toHaveLength(3 + due);
    expect(pruneDue(cacheDir)).toBe(true);

    // The next build prunes to what it used: parts 0 and 1 carried over, part 3 drawn again (from the cache).
    const pruning = await build([part(3)], [part(0), part(1)]);
    expect(pruning.prunes).toBe(true);
    expect(pruning.stats.fromCache).toBe(1);
    expect(entries()).toHaveLength(3);
    expect(ledger()).toEqual({ format: 1, held: 3, written: 0 });
    // Nothing drawn: the ledger is left as it is.
    await build([], [part(0), part(1), part(3)]);
    expect(ledger()).toEqual({ format: 1, held: 3, written: 0 });
  }, 120_000);

  it('prunes when the ledger is unreadable or of another shape, and writes it again', async () => {
    for (const text of ['{"format":1,"held":3', '{"format":2,"held":3,"written":0}', '{"format":1,"held":-1,"written":0}', 'null']) {
      writeFileSync(join(cacheDir, LEDGER_FILE), text);
      expect(pruneDue(cacheDir)).toBe(true);
      const pool = await build([], [part(0)]);
      expect(pool.prunes).toBe(true);
      expect(entries()).toHaveLength(1);
      expect(ledger()).toEqual({ format: 1, held: 1, written: 0 });
    }
  }, 60_000);

  it('is pruned now when asked, though its ledger says no pruning is due, and a ledger of what was kept is written', async () => {
    writeFileSync(join(cacheDir, LEDGER_FILE), '{"format":1,"held":9,"written":0}');
    expect((await build([part(6), part(7), part(8)], [])).prunes).toBe(false);
    expect(pruneDue(cacheDir)).toBe(false);
    expect(entries().length).toBeGreaterThan(2);
    const pool = new ChartPool({ workers: 0, settingsKey: 'ledger', cacheDir, pruning: 'now' });
    await pool.partCharts(analysed(part(0)));
    pool.keepPartCharts({ part: part(1) });
    await pool.close();
    expect(pool.prunes).toBe(true);
    expect(entries().length).toBeLessThanOrEqual(2);
    expect(ledger()).toEqual({ format: 1, held: entries().length, written: 0 });
  }, 60_000);

  it('is pruned by every build by default, which leaves the ledger in place and writes none', async () => {
    writeFileSync(join(cacheDir, LEDGER_FILE), '{"format":1,"held":9,"written":0}');
    const pool = await build([part(5)], [], 'every build');
    expect(pool.prunes).toBe(true);
    expect(entries()).toHaveLength(1);
    expect(readFileSync(join(cacheDir, LEDGER_FILE), 'utf8')).toBe('{"format":1,"held":9,"written":0}');
  }, 60_000);
});

describe('a build that draws the charts of most parts', () => {
  it('prunes the chart cache itself, leaving none of the charts it replaced for the next build to remove', async () => {
    const root = writeGeneratedLibrary(16, 5);
    try {
      const build = async () => {
        const result = await buildFolio({ libraryRoot: root, workers: 0 });
        expect(result.ok).toBe(true);
        return result;
      };
      const charts = join(root, CACHE_DIR, 'charts');
      const cached = () => readdirSync(charts).filter((name) => name !== LEDGER_FILE).length;
      await build();
      const one = cached();
      // Another sweep: every chart's key changes, so every part's charts are drawn again.
      writeFileSync(join(root, 'folio.yaml'), `${readFileSync(join(root, 'folio.yaml'), 'utf8')}sweep: {from: 1k, to: 1G, per-decade: 40}\n`);
      const redrawn = await build();
      expect(redrawn.charts!.rendered).toBeGreaterThanOrEqual(16);
      // The cache holds what this build used, as many entries as the first build left; its ledger is new.
      expect(cached()).toBe(one);
      const ledger = JSON.parse(readFileSync(join(charts, LEDGER_FILE), 'utf8')) as { held: number; written: number };
      expect(ledger).toEqual({ format: 1, held: one, written: 0 });
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  }, 300_000);
});
