// The chart pool makes a part's job (and so reads its analysis) only when a worker is about to take it, so
// a build's thousands of requests, made at once, hold a few analyses at a time rather than all of them.

import { afterAll, describe, expect, it } from 'vitest';
import type { PartAnalysis } from '../../src/analysis/part-figures.js';
import { ChartPool, compactCharts } from '../../src/build/chart-pool.js';
import { serialize } from 'node:v8';
import { readdirSync, rmSync } from 'node:fs';
import { tempDir } from '../site-helpers.js';
import { renderPartCharts } from '../../src/charts/part-charts.js';
import { chartInput } from '../../src/build/chart-jobs.js';
import type { Part } from '../../src/model/part.js';
import { ALL_PARTS, analysed, capacitorPart, resistorPart } from '../charts/fixtures.js';

/** An analysis that is made (and counted) the first time any figure of it is read. */
function counted(part: Part, made: Set<string>): PartAnalysis {
  let a: PartAnalysis | undefined;
  return new Proxy({ part } as PartAnalysis, {
    get(target, key) {
      if (key === 'part') return part;
      made.add(part.id);
      a ??= analysed(part);
      return a[key as keyof PartAnalysis];
    },
  });
}

describe('chart pool', () => {
  const pool = new ChartPool({ workers: 1, settingsKey: 'test' });
  afterAll(() => pool.close());

  it('reads a part only when a worker takes its job (or just before), and draws every part', async () => {
    const made = new Set<string>();
    const parts = Array.from({ length: 8 }, (_, i) => ({ ...(i % 2 ? capacitorPart : resistorPart), id: `P-${i}`, source: { path: `p${i}.yaml`, hash: `h${i}` } }) as unknown as Part);
    const requests = parts.map((p) => pool.partCharts(counted(p, made)));
    // One job sent to the one worker; the next is made while it draws, no more.
    expect(made.size).toBe(1);
    await new Promise((r) => setImmediate(r));
    expect(made.size).toBeLessThanOrEqual(2);
    const charts = await Promise.all(requests);
    expect(made.size).toBe(parts.length);
    // Each request answered with its own part's four charts.
    for (const [i, c] of charts.entries()) {
      expect(c).toHaveLength(4);
      for (const chart of c) expect(chart.title).toContain(`P-${i}`);
    }
  }, 120_000);
});

describe('a part\'s chart job', () => {
  it('carries only the columns the charts read, and every kind of part draws from it what it draws with every column', async () => {
    for (const part of ALL_PARTS) {
      const a = analysed(part);
      const input = chartInput(a);
      expect(Object.keys(input.columns).sort()).toEqual(['conductanceS', 'magnitudeOhm', 'phaseDeg', 'reactanceOhm', 'resistanceOhm', 'susceptanceS']);
      // Sent as a worker is sent it (structured clone): the same SVGs and words as with all of the resolved
      // sweep's columns (|Y|, Q, C_eff, L_eff too).
      const fromJob = await renderPartCharts(structuredClone(input));
      const fromAnalysis = await renderPartCharts({ ...input, columns: a.resolvedColumns });
      expect(Object.keys(a.resolvedColumns).length).toBeGreaterThan(6);
      for (const kind of Object.keys(fromAnalysis) as (keyof typeof fromAnalysis)[]) {
        expect(fromJob[kind].svg, `${part.id} ${kind}`).toBe(fromAnalysis[kind].svg);
        expect(fromJob[kind].description, `${part.id} ${kind}`).toBe(fromAnalysis[kind].description);
        expect(fromJob[kind].title, `${part.id} ${kind}`).toBe(fromAnalysis[kind].title);
      }
    }
  }, 120_000);
});

/**
 * How V8 holds a string, read from its own serialisation (V8's ValueSerializer, value-serializer.cc: after
 * the two-byte header, tag '"' for a one-byte string, 'c' for a two-byte one, which padding bytes (0) may
 * precede to align its characters).
 */
function storage(text: string): 'one-byte' | 'two-byte' | 'other' {
  const bytes = serialize(text);
  let at = 2;
  while (bytes[at] === 0) at++;
  const tag = bytes[at];
  return tag === 0x22 ? 'one-byte' : tag === 0x63 ? 'two-byte' : 'other';
}

/** The same text held two bytes a character (a slice of a two-byte string is held as its parent is). */
const twoByte = (text: string) => (text + '\u0100').slice(0, -1);

describe('charts kept one byte a character', () => {
  it('holds a drawn chart\'s SVG as a one-byte string with the same text; an SVG with a character beyond U+00FF stays as it is', async () => {
    const charts = await renderPartCharts(analysed(capacitorPart));
    // The renderer's strings may be two-byte (built from two-byte pieces): what this is for.
    const artifacts = Object.entries(charts).map(([key, c]) => ({ key, ...c, svg: twoByte(c.svg) }));
    for (const c of artifacts) expect(storage(c.svg), c.key).toBe('two-byte');
    const compact = compactCharts(artifacts);
    compact.forEach((c, i) => {
      expect(c.svg).toBe(artifacts[i].svg);
      expect(storage(c.svg), c.key).toBe('one-byte');
      expect(c.spec).toBe(artifacts[i].spec);
    });
    const wide = { ...artifacts[0], svg: '<svg><text>10 \u03a9</text></svg>' };
    expect(compactCharts([wide])[0]).toBe(wide);
  });
});

describe('a part\'s charts kept through the pruning', () => {
  const cacheDir = tempDir('chart-keys');
  afterAll(() => rmSync(cacheDir, { recursive: true, force: true }));
  // Content hashes as source.ts makes them (16 hex digits), two differing in one digit, and one of another form.
  const parts = ['0123456789abcdef', '0123456789abcdee', 'h-other-form'].map((hash, i) => ({ ...resistorPart, id: `K-${i}`, source: { path: `k${i}.yaml`, hash } }) as unknown as Part);
  const entries = () => readdirSync(cacheDir).sort();
  const keeping = async (settingsKey: string, kept: readonly Part[]) => {
    const pool = new ChartPool({ workers: 0, settingsKey, cacheDir });
    for (const part of kept) pool.keepPartCharts({ part });
    await pool.close();
    return entries();
  };

  it('keeps the entry a part\'s charts were drawn into, under the same settings only', async () => {
    const drawing = new ChartPool({ workers: 0, settingsKey: 'settings A', cacheDir });
    for (const part of parts) await drawing.partCharts(analysed(part));
    await drawing.close();
    const all = entries();
    // One entry a part, each named by a key of its own (32 characters and the entry's extension).
    expect(all).toHaveLength(3);
    expect(new Set(all.map((name) => name.slice(0, 32))).size).toBe(3);
    // A build that carries every part over keeps every entry; one that carries two keeps theirs.
    expect(await keeping('settings A', parts)).toEqual(all);
    const kept = await keeping('settings A', [parts[0], parts[2]]);
    expect(kept).toHaveLength(2);
    // The part file whose content hash differs in one digit was the one dropped.
    const again = new ChartPool({ workers: 0, settingsKey: 'settings A', cacheDir });
    for (const part of parts) await again.partCharts(analysed(part));
    await again.close();
    expect(again.stats.fromCache).toBe(2);
    expect(entries()).toEqual(all);
    // Under other settings no entry is the part's: the pruning drops them all.
    expect(await keeping('settings B', parts)).toEqual([]);
  }, 120_000);
});
