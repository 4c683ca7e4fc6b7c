// A chart cache entry is written by the thread that drew the charts and read back whole; one that cannot be
// written never stops a build, and one written in part is refused when read (and drawn again).

import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gunzipSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { readCacheEntry, writeCacheEntry } from '../../src/build/chart-cache-entry.js';
import type { ChartArtifact } from '../../src/build/chart-maker.js';

const root = mkdtempSync(join(tmpdir(), 'zfolio-cache-entry-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const charts: ChartArtifact[] = [
  { key: 'impedance', title: '|Z| of P-1 (Ω)', description: 'from 1 kHz to 10 GHz', svg: '<svg>&#937;</svg>', spec: { layer: [{ data: { name: 'curves' } }], datasets: { curves: [{ f: 1e3, v: 0.5 }] } } },
  { key: 'phase', title: 'Phase', description: '', svg: '<svg/>', spec: {} },
];

describe('chart cache entry', () => {
  it('reads back what was written, as gzip-compressed JSON (RFC 1952, read with node:zlib)', () => {
    const file = join(root, 'a.json.gz');
    writeCacheEntry(file, charts);
    expect(readCacheEntry(file)).toEqual(charts);
    expect(JSON.parse(gunzipSync(readFileSync(file)).toString('utf8'))).toEqual(charts);
  });

  it('does not throw when the entry cannot be written', () => {
    const file = join(root, 'no-such-folder', 'b.json.gz');
    expect(() => writeCacheEntry(file, charts)).not.toThrow();
    expect(existsSync(file)).toBe(false);
  });

  it('refuses an entry written in part', () => {
    const file = join(root, 'c.json.gz');
    writeCacheEntry(file, charts);
    const whole = readFileSync(file);
    writeFileSync(file, whole.subarray(0, Math.floor(whole.length / 2)));
    expect(() => readCacheEntry(file)).toThrow();
  });
});
