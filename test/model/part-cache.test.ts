// The part cache: a library loaded with it gives the very parts and problems a load without it gives, and
// reads and parses only the part files that changed since (or that have errors, which are never kept).

import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { isDeepStrictEqual } from 'node:util';
import { afterAll, describe, expect, it } from 'vitest';
import { loadLibrary, type LoadResult } from '../../src/model/library.js';
import { PartCache } from '../../src/model/part-cache.js';
import { lateFieldsRead } from '../../src/model/lazy-part.js';
import { tempDir } from '../site-helpers.js';

const root = tempDir('part-cache');
const cacheDir = join(root, '.zfolio-cache', 'parts');
afterAll(() => rmSync(root, { recursive: true, force: true }));

const capacitor = (id: string, esr: string) => `id: ${id}\nkind: capacitor\ntitle: Test capacitor ${id} (invented)\nnominal: 100n\nparasitics: {esr: ${esr}, esl: 0.5n}\ntags: [test]\n`;

mkdirSync(join(root, 'parts'), { recursive: true });
for (let i = 0; i < 6; i++) writeFileSync(join(root, 'parts', `c${i}.yaml`), capacitor(`CAP-${i}`, '20m'));
// A warning the reading gives (a bead whose model misses its rated impedance), which a part from the cache must still give.
writeFileSync(join(root, 'parts', 'warned.yaml'), 'id: BEAD-W\nkind: bead\ntitle: Test bead (invented)\nnominal: 1000\nat: 100M\nmodel: {rdc: 0.05, r: 100, l: 1e-7, c: 1e-13}\n');

function load(): { result: LoadResult; cache: PartCache } {
  const cache = new PartCache(root, cacheDir, 'test code');
  const result = loadLibrary(root, { partCache: cache });
  cache.save();
  return { result, cache };
}

/** The parts as plain data, without their sources (a cached part reads its text only when asked). */
const partsOf = (r: LoadResult) => r.library?.parts.map(({ source, ...rest }) => ({ ...rest, source: { path: source.path, hash: source.hash } }));

describe('PartCache', () => {
  it('gives what a load without it gives, parsing only what changed', () => {
    const plain = loadLibrary(root);
    expect(plain.diagnostics.map((d) => [d.file, d.severity])).toEqual([['parts/warned.yaml', 'warning']]);
    const first = load();
    expect(first.cache.counts).toEqual({ parsed: 7, cached: 0 });
    const second = load();
    expect(second.cache.counts).toEqual({ parsed: 0, cached: 7 });
    for (const r of [first.result, second.result]) {
      expect(r.diagnostics).toEqual(plain.diagnostics);
      expect(isDeepStrictEqual(partsOf(r), partsOf(plain))).toBe(true);
    }
    // A cached part's source reads its file when asked.
    expect(second.result.library!.parts[0].source.text).toBe(plain.library!.parts[0].source.text);

    writeFileSync(join(root, 'parts', 'c3.yaml'), capacitor('CAP-3', '33m'));
    const third = load();
    expect(third.cache.counts).toEqual({ parsed: 1, cached: 6 });
    expect(third.result.library!.partsById.get('CAP-3')!.parameters.esr).toBeCloseTo(0.033, 12);
  });

  it('lists each distinct holes text once a shard, and keeps the declared id only where it is not the part\'s own', () => {
    load();
    const heads = readdirSync(cacheDir).filter((name) => name.endsWith('.lines')).map((name) => readFileSync(join(cacheDir, name), 'latin1'));
    let rows = 0;
    for (const text of heads) {
      const [header, ...lines] = text.trimEnd().split('\n');
      const { holes } = JSON.parse(header) as { holes: string[] };
      expect(new Set(holes).size).toBe(holes.length);
      for (const line of lines) {
        const fields = line.split('\t');
        // path, stamp, hash, id, kind, flags, family fields, head, the index of its holes text, where its late text is
        expect(fields).toHaveLength(10);
        expect(fields[4]).toBe(fields[3].startsWith('CAP-') ? 'capacitor' : 'bead');
        expect(Number(fields[8])).toBeLessThan(holes.length);
        expect(fields[7]).not.toContain('"declared"');
        rows++;
      }
    }
    expect(rows).toBe(7);
    // Only the warned bead (a part with warnings) keeps them in its head.
    expect(heads.filter((text) => text.includes('"diagnostics"')).length).toBe(1);
  });

  it('tells the loader\'s caller of the first part file it reads afresh, once, with the number of part files', () => {
    load();
    const calls: number[] = [];
    const firstRead = (files: number) => calls.push(files);
    loadLibrary(root, { partCache: new PartCache(root, cacheDir, 'test code'), firstRead });
    expect(calls).toEqual([]);
    const file = join(root, 'parts', 'c1.yaml');
    const text = readFileSync(file, 'utf8');
    writeFileSync(file, text.replace('20m', '21m'));
    writeFileSync(join(root, 'parts', 'c2.yaml'), readFileSync(join(root, 'parts', 'c2.yaml'), 'utf8').replace('20m', '22m'));
    loadLibrary(root, { partCache: new PartCache(root, cacheDir, 'test code'), firstRead });
    expect(calls).toEqual([readdirSync(join(root, 'parts')).filter((name) => name.endsWith('.yaml')).length]);
    // Without a cache every file is read afresh, and the caller is told as the first is.
    loadLibrary(root, { firstRead });
    expect(calls).toHaveLength(2);
    writeFileSync(file, text);
    writeFileSync(join(root, 'parts', 'c2.yaml'), capacitor('CAP-2', '20m'));
    load();
  });

  it('never keeps a file with errors, and forgets a removed file', () => {
    writeFileSync(join(root, 'parts', 'bad.yaml'), 'id: CAP-BAD\nkind: capacitor\ntitle: Broken (invented)\nnominal: 10 bananas\n');
    for (let run = 0; run < 2; run++) {
      const { result, cache } = load();
      expect(result.library).toBeUndefined();
      expect(result.diagnostics.some((d) => d.file === 'parts/bad.yaml' && d.severity === 'error')).toBe(true);
      expect(cache.counts.parsed).toBe(1);
    }
    rmSync(join(root, 'parts', 'bad.yaml'));
    rmSync(join(root, 'parts', 'c0.yaml'));
    const { result, cache } = load();
    expect(result.library!.parts.map((p) => p.id)).not.toContain('CAP-0');
    expect(cache.counts).toEqual({ parsed: 0, cached: 6 });
    // A duplicate id is found whether the first file came from the cache or not.
    writeFileSync(join(root, 'parts', 'dup.yaml'), capacitor('CAP-1', '20m'));
    const dup = load();
    expect(dup.result.diagnostics.some((d) => d.file === 'parts/dup.yaml' && /duplicate id/.test(d.message))).toBe(true);
    rmSync(join(root, 'parts', 'dup.yaml'));
  });

  it('is ignored when made by other code', () => {
    const other = new PartCache(root, cacheDir, 'other code');
    loadLibrary(root, { partCache: other });
    expect(other.counts.cached).toBe(0);
  });

  it('reads a file again when its size changed but its mtime was set back, and when only its ctime says it changed', () => {
    load();
    const file = join(root, 'parts', 'c2.yaml');
    const { atime, mtime } = statSync(file);
    // Longer text, the modification time put back as it was.
    writeFileSync(file, capacitor('CAP-2', '47.5m'));
    utimesSync(file, atime, mtime);
    const longer = load();
    expect(longer.cache.counts).toEqual({ parsed: 1, cached: 5 });
    expect(longer.result.library!.partsById.get('CAP-2')!.parameters.esr).toBeCloseTo(0.0475, 12);
    // The same length and the same mtime: the change time (which utimes cannot set back) still differs.
    writeFileSync(file, capacitor('CAP-2', '39.5m'));
    utimesSync(file, atime, mtime);
    const same = load();
    expect(same.cache.counts).toEqual({ parsed: 1, cached: 5 });
    expect(same.result.library!.partsById.get('CAP-2')!.parameters.esr).toBeCloseTo(0.0395, 12);
  });

  it('follows files added and removed in a folder, and a folder renamed, as a load without it', () => {
    mkdirSync(join(root, 'parts', 'group'), { recursive: true });
    writeFileSync(join(root, 'parts', 'group', 'g1.yaml'), capacitor('CAP-G1', '11m'));
    writeFileSync(join(root, 'parts', 'group', 'g2.yaml'), capacitor('CAP-G2', '12m'));
    load();
    writeFileSync(join(root, 'parts', 'group', 'g3.yaml'), capacitor('CAP-G3', '13m'));
    rmSync(join(root, 'parts', 'group', 'g1.yaml'));
    const changed = load();
    expect(changed.cache.counts.parsed).toBe(1);
    expect(partsOf(changed.result)).toEqual(partsOf(loadLibrary(root)));
    expect(changed.result.library!.parts.map((p) => p.id)).toEqual(expect.arrayContaining(['CAP-G2', 'CAP-G3']));
    expect(changed.result.library!.parts.map((p) => p.id)).not.toContain('CAP-G1');
    renameSync(join(root, 'parts', 'group'), join(root, 'parts', 'renamed'));
    const renamed = load();
    // New paths: read afresh, and named by their new paths.
    expect(renamed.cache.counts.parsed).toBe(2);
    expect(partsOf(renamed.result)).toEqual(partsOf(loadLibrary(root)));
    expect(renamed.result.library!.partsById.get('CAP-G3')!.source.path).toBe('parts/renamed/g3.yaml');
    rmSync(join(root, 'parts', 'renamed'), { recursive: true });
  });

  it('saves a shard from its file, not from the parts the build has changed since', () => {
    const first = load();
    // The build adds to the parts it is given (measurement text, for one); here a field is changed outright.
    for (const part of first.result.library!.parts) part.title = 'changed by the build';
    // Every shard is written again: one file edited in each would do; removing one file marks every shard
    // that held it, so edit them all.
    for (const part of first.result.library!.parts) writeFileSync(join(root, part.source.path), readFileSync(join(root, part.source.path), 'utf8') + '# edited\n');
    const second = load();
    expect(second.cache.counts.cached).toBe(0);
    for (const part of second.result.library!.parts) part.title = 'changed again';
    second.cache.save();
    const third = load();
    expect(third.cache.counts.parsed).toBe(0);
    expect(third.result.library!.parts.map((p) => p.title).filter((t) => /changed/.test(t))).toEqual([]);
    expect(partsOf(third.result)).toEqual(partsOf(loadLibrary(root)));
  });

  it('reads a cached part\'s late fields only when one is asked for, from the part file when its shard\'s late file is lost or rewritten', () => {
    load();
    const plain = loadLibrary(root);
    const expected = new Map(plain.library!.parts.map((p) => [p.id, { title: p.title, parameters: p.parameters, network: p.network, tags: p.tags }]));
    const lateOf = (p: { title: string; parameters: unknown; network: unknown; tags: unknown }) => ({ title: p.title, parameters: p.parameters, network: p.network, tags: p.tags });

    const { result, cache } = load();
    expect(cache.counts.parsed).toBe(0);
    const parts = result.library!.parts;
    expect(parts.filter((p) => lateFieldsRead(p))).toEqual([]);
    // What every build reads of every part leaves the late fields unread.
    for (const p of parts) void [p.id, p.kind, p.nominal, p.package, p.voltageRatings, p.measurements, p.spread, p.source.hash];
    expect(parts.filter((p) => lateFieldsRead(p))).toEqual([]);
    expect(lateOf(parts[0])).toEqual(expected.get(parts[0].id));
    expect(parts.filter((p) => lateFieldsRead(p)).map((p) => p.id)).toEqual([parts[0].id]);

    // The late files gone (or written by another run since) after the parts were handed out: read from the part files.
    const lost = load();
    for (const name of readdirSync(cacheDir)) if (name.endsWith('.late')) rmSync(join(cacheDir, name));
    for (const p of lost.result.library!.parts) expect(lateOf(p)).toEqual(expected.get(p.id));
    const rewritten = load();
    expect(rewritten.cache.counts.parsed).toBe(0);
    for (const name of readdirSync(cacheDir)) if (name.endsWith('.late')) writeFileSync(join(cacheDir, name), readFileSync(join(cacheDir, name), 'latin1').replace(/"token":"/, '"token":"0'));
    for (const p of rewritten.result.library!.parts) expect(lateOf(p)).toEqual(expected.get(p.id));
    // A part file changed since it was handed out cannot give its late fields: the build stops rather than mix versions.
    const changed = load();
    for (const name of readdirSync(cacheDir)) if (name.endsWith('.late')) rmSync(join(cacheDir, name));
    const first = changed.result.library!.parts[0];
    writeFileSync(join(root, first.source.path), readFileSync(join(root, first.source.path), 'utf8') + '# edited\n');
    expect(() => first.title).toThrow(/changed while it was read/);
    // The next load reads the changed file again; the others' late fields still come from their part files.
    const again = load();
    expect(again.cache.counts.parsed).toBe(1);
    expect(partsOf(again.result)).toEqual(partsOf(loadLibrary(root)));
  });
});

