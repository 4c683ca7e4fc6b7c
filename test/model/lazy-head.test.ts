// Parts from the part cache handed out with their fields unparsed (lazy-head.ts): what a build reads of every
// part (id, kind, source, measurements, the facts of part-facts.ts) is answered without parsing, and the part
// is, in every other way it is used, the part a load without the cache gives.

import { readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { isDeepStrictEqual } from 'node:util';
import { afterAll, describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/model/library.js';
import { headParsed } from '../../src/model/lazy-head.js';
import { PartCache } from '../../src/model/part-cache.js';
import { FAMILY_FIELDS, familyText, hasSafetyClass, temperatureGap } from '../../src/model/part-facts.js';
import type { Part } from '../../src/model/part.js';
import { measuredLibrary } from '../measure/measured-library.js';

// A library with a measured capacitor (CAP-M), to which the test adds parts of every sort the row facts describe.
const root = measuredLibrary();
afterAll(() => rmSync(root, { recursive: true, force: true }));
const write = (name: string, text: string) => writeFileSync(join(root, 'parts', name), text);
write('plain.yaml', 'id: CAP-PLAIN\nkind: capacitor\ntitle: Plain capacitor (invented)\nnominal: 100n\nparasitics: {esr: 20m, esl: 0.5n}\npackage: "0402"\ntags: [test]\n');
// X7R: an EIA class 2 code, specified from -55 to 125 °C (EIA-198; from memory): covers 0 to 70 °C, not -60 to 70 °C.
write('x7r.yaml', 'id: CAP-X7R\nkind: capacitor\ntitle: X7R capacitor (invented)\nnominal: 1u\ndielectric: X7R\nparasitics: {esr: 5m, esl: 0.4n}\nvoltage: 16V\n');
write('mains.yaml', 'id: CAP-Y2\nkind: capacitor\ntitle: Y2 capacitor, µ in the title (invented)\nnominal: 4.7n\nsafety: Y2\nvoltage: 300V AC\nparasitics: {esr: 0.1, esl: 5n}\n');
write('coil.yaml', 'id: IND-1\nkind: inductor\ntitle: Inductor (invented)\nnominal: 10u\nparasitics: {dcr: 50m, cp: 2p}\ncurrent: 1.2A\n');
// A warning the reading gives: such a part is handed out parsed, as are parts with measurements.
write('warned.yaml', 'id: BEAD-W\nkind: bead\ntitle: Test bead (invented)\nnominal: 1000\nat: 100M\nmodel: {rdc: 0.05, r: 100, l: 1e-7, c: 1e-13}\n');

const cacheDir = join(root, '.zfolio-cache', 'parts');
function cachedLoad() {
  const cache = new PartCache(root, cacheDir, 'test code');
  const result = loadLibrary(root, { partCache: cache });
  cache.save();
  return { parts: result.library!.parts, cache, result };
}

const byId = (parts: readonly Part[]) => new Map(parts.map((p) => [p.id, p]));
/** A part as plain data, its source as path and hash (a cached source reads its text only when asked). */
const plainOf = ({ source, ...rest }: Part) => ({ ...rest, source: { path: source.path, hash: source.hash } });

describe('a cached part handed out unparsed', () => {
  cachedLoad();
  const plain = byId(loadLibrary(root).library!.parts);

  it('answers id, kind, source, measurements and its facts without parsing, the same as a part read afresh', () => {
    const { parts, cache } = cachedLoad();
    expect(cache.counts).toEqual({ parsed: 0, cached: plain.size });
    // The measured part and the warned one are handed out parsed; every other part waits.
    expect(parts.filter((p) => headParsed(p)).map((p) => p.id).sort()).toEqual(['BEAD-W', 'CAP-M']);
    const operating = [{ fromC: 0, toC: 70 }, { fromC: -60, toC: 70 }];
    for (const part of parts) {
      const fresh = plain.get(part.id)!;
      expect(part.kind).toBe(fresh.kind);
      expect(part.source.path).toBe(fresh.source.path);
      expect(part.source.hash).toBe(fresh.source.hash);
      expect(part.measurements.length).toBe(fresh.measurements.length);
      // The facts from the row against the facts made from the fields of the part read afresh.
      expect(familyText(part)).toBe(familyText(fresh));
      expect(JSON.parse(familyText(part))).toEqual(JSON.parse(JSON.stringify(FAMILY_FIELDS.map((f) => fresh[f]))));
      expect(hasSafetyClass(part)).toBe(fresh.safetyClass !== undefined);
      for (const range of operating) expect(temperatureGap(part, range)).toBe(temperatureGap(fresh, range));
    }
    expect(parts.filter((p) => headParsed(p)).map((p) => p.id).sort()).toEqual(['BEAD-W', 'CAP-M']);
    // X7R covers 0 to 70 °C but not -60 °C; the Y2 part is a mains part.
    const cached = byId(parts);
    expect(temperatureGap(cached.get('CAP-X7R')!, { fromC: 0, toC: 70 })).toBe(false);
    expect(temperatureGap(cached.get('CAP-X7R')!, { fromC: -60, toC: 70 })).toBe(true);
    expect(hasSafetyClass(cached.get('CAP-Y2')!)).toBe(true);
    expect(hasSafetyClass(cached.get('CAP-PLAIN')!)).toBe(false);
  });

  it('parses on first read of any other field, and is then the part read afresh', () => {
    const { parts } = cachedLoad();
    const part = byId(parts).get('CAP-PLAIN')!;
    expect(headParsed(part)).toBe(false);
    expect(part.nominal).toBe(plain.get('CAP-PLAIN')!.nominal);
    expect(headParsed(part)).toBe(true);
    for (const p of parts) expect(plainOf(p)).toEqual(plainOf(plain.get(p.id)!));
    expect(isDeepStrictEqual(parts.map(plainOf), [...plain.values()].map(plainOf))).toBe(true);
  });

  it('lists, spreads, serialises and compares as the part read afresh, whatever is asked first', () => {
    const asks: [string, (p: Part) => unknown][] = [
      ['keys', (p) => Object.keys(p).sort()],
      ['spread', (p) => plainOf({ ...p })],
      ['JSON', (p) => JSON.parse(JSON.stringify({ ...p, source: undefined }))],
      ['entries', (p) => Object.fromEntries(Object.entries(p).filter(([k]) => k !== 'source'))],
      ['in', (p) => ['title', 'voltageV', 'nominal', 'tags', 'id'].map((k) => k in p)],
      ['own', (p) => ['title', 'voltageV', 'nominal', 'tags', 'id'].map((k) => Object.hasOwn(p, k))],
      ['descriptor', (p) => Object.getOwnPropertyDescriptor(p, 'nominal')?.value],
    ];
    for (const [name, ask] of asks) {
      const part = byId(cachedLoad().parts).get('CAP-X7R')!;
      expect(headParsed(part), name).toBe(false);
      const fresh = plain.get('CAP-X7R')!;
      expect(ask(part), name).toEqual(ask({ ...fresh }));
    }
  });

  it('takes writes and deletions as a plain part does', () => {
    const part = byId(cachedLoad().parts).get('IND-1')!;
    (part as { title: string }).title = 'Renamed (invented)';
    expect(part.title).toBe('Renamed (invented)');
    expect(part.currentA).toBe(plain.get('IND-1')!.currentA);
    const other = byId(cachedLoad().parts).get('IND-1')! as Partial<Part>;
    delete other.tags;
    expect('tags' in other).toBe(false);
    expect(other.nominal).toBe(plain.get('IND-1')!.nominal);
    const frozen = Object.freeze(byId(cachedLoad().parts).get('CAP-PLAIN')!);
    expect(Object.isFrozen(frozen)).toBe(true);
    expect(frozen.title).toBe(plain.get('CAP-PLAIN')!.title);
  });

  it('gives its facts from its fields once parsed (the build may change a field)', () => {
    const part = byId(cachedLoad().parts).get('CAP-PLAIN')! as Part & { package: string };
    part.package = '1206';
    expect(JSON.parse(familyText(part))[FAMILY_FIELDS.indexOf('package')]).toBe('1206');
  });

  it('reads a damaged head from its part file, and refuses a part file changed since', () => {
    cachedLoad();
    const damage = () => {
      for (const name of readdirSync(cacheDir).filter((n) => n.endsWith('.lines'))) {
        const file = join(cacheDir, name);
        const text = readFileSync(file, 'latin1');
        if (text.includes('"CAP-PLAIN"')) writeFileSync(file, text.replace(/("id":"CAP-PLAIN")/, '$1,,'), 'latin1');
      }
    };
    damage();
    const part = byId(cachedLoad().parts).get('CAP-PLAIN')!;
    expect(headParsed(part)).toBe(false);
    expect(plainOf(part)).toEqual(plainOf(plain.get('CAP-PLAIN')!));
    // Damaged again, and the part file edited after the part was handed out: no mix of two versions.
    cachedLoad();
    damage();
    const stale = byId(cachedLoad().parts).get('CAP-PLAIN')!;
    const file = join(root, 'parts', 'plain.yaml');
    const original = readFileSync(file, 'utf8');
    writeFileSync(file, original + '# edited\n');
    expect(() => stale.nominal).toThrow(/changed while it was read/);
    writeFileSync(file, original);
  });
});
