// Part families: every part of an invented, generated library (Orrinvale-style house list, no real part
// numbers) in exactly one family of at most 12, each family's title true of every member, checked by
// reading the titles with the test's own SI prefix table and decade rule.

import { spawn, spawnSync } from 'node:child_process';
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it, onTestFinished } from 'vitest';
import { FAMILY_FIELDS, FAMILY_SIZE, partFamilies } from '../../src/pages/families.js';
import { cachedFamilies, familiesKey } from '../../src/build/family-cache.js';
import { loadLibrary } from '../../src/model/library.js';
import type { Part } from '../../src/model/part.js';
import { pageName } from '../../src/model/page-names.js';
import { tempDir } from '../site-helpers.js';

const roots: string[] = [];
afterAll(() => roots.forEach((r) => rmSync(r, { recursive: true, force: true })));

/** A library of the given part files (name -> YAML) in a temporary folder. */
function library(files: Record<string, string>): Part[] {
  const root = tempDir('families');
  roots.push(root);
  mkdirSync(join(root, 'parts'));
  writeFileSync(join(root, 'folio.yaml'), 'title: Families test (invented parts)\n');
  for (const [name, text] of Object.entries(files)) writeFileSync(join(root, 'parts', `${name}.yaml`), text);
  const { library: lib, diagnostics } = loadLibrary(root);
  if (!lib) throw new Error(diagnostics.map((d) => d.message).join('\n'));
  return lib.parts;
}

/** Seeded (mulberry32), so the library is the same every run. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const PACKAGES = ['0201', '0402', '0603', '0805'];
const DIELECTRICS = ['C0G', 'X5R', 'X7R'];
const VOLTAGES = [6.3, 10, 16, 25, 50];
const E6 = [1, 1.5, 2.2, 3.3, 4.7, 6.8];

function generated(count: number): Record<string, string> {
  const r = random(7);
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(r() * xs.length)];
  const files: Record<string, string> = {};
  for (let i = 0; i < count; i++) {
    const id = `ORV-T-${String(i).padStart(4, '0')}`;
    if (i % 4 === 3) {
      files[id] = `id: ${id}\nkind: inductor\ntitle: Invented inductor ${i}\nnominal: ${pick(E6)}e${-8 + Math.floor(r() * 3)}\ncurrent: ${pick([0.5, 1, 2])}A\npackage: "${pick(PACKAGES)}"\nparasitics: {dcr: 50m}\n`;
    } else {
      files[id] = `id: ${id}\nkind: capacitor\ntitle: Invented capacitor ${i}\nnominal: ${pick(E6)}e${-11 + Math.floor(r() * 6)}\nvoltage: ${pick(VOLTAGES)}V\npackage: "${pick(PACKAGES)}"\ndielectric: ${pick(DIELECTRICS)}\nparasitics: {esr: 20m, esl: 0.5n}\n`;
    }
  }
  return files;
}

// The test's own reading of engineering notation (SI Brochure prefixes).
const PREFIX: Record<string, number> = { p: 1e-12, n: 1e-9, 'µ': 1e-6, m: 1e-3, '': 1, k: 1e3, M: 1e6 };
const DECADE_LABEL = /(\d+(?:\.\d+)?) ([pnµmkM]?)[FHΩ]–(\d+(?:\.\d+)?) ([pnµmkM]?)[FHΩ]/;

describe('part families', () => {
  const parts = library(generated(600));
  const families = partFamilies(parts);

  it('put every part in exactly one family of at most 12 parts, with a unique folder name', () => {
    expect(families.flatMap((f) => f.parts.map((p) => p.id)).sort()).toEqual(parts.map((p) => p.id).sort());
    for (const f of families) {
      expect(f.parts.length).toBeGreaterThan(0);
      expect(f.parts.length).toBeLessThanOrEqual(FAMILY_SIZE);
      expect(pageName(f.slug)).toBe(f.slug);
    }
    expect(new Set(families.map((f) => f.slug)).size).toBe(families.length);
    // 600 parts need at least 50 families; packing neighbours keeps them from being many more.
    expect(families.length).toBeGreaterThanOrEqual(50);
    expect(families.length).toBeLessThan(150);
  });

  it('title each family with what its members share: kind, package, decade of value, dielectric', () => {
    let decades = 0;
    for (const f of families) {
      const [kinds, ...labels] = f.title.replace(/ \(\d+ of \d+: [^)]*\)$/, '').split(', ');
      for (const p of f.parts) expect(kinds.toLowerCase(), f.title).toBe(`${p.kind}s`);
      // A label of neighbours packed together lists them with "or".
      const pkg = labels.map((l) => l.split(' or ')).find((l) => l.every((x) => PACKAGES.includes(x)));
      if (pkg) for (const p of f.parts) expect(pkg, f.title).toContain(p.package);
      const decade = labels.map((l) => DECADE_LABEL.exec(l)).find(Boolean);
      if (decade) {
        decades++;
        const lo = Number(decade[1]) * PREFIX[decade[2]];
        const hi = Number(decade[3]) * PREFIX[decade[4]];
        // From the lower bound up to, not including, the upper; a relative margin for parsed decimals.
        for (const p of f.parts) {
          expect(p.nominal!, f.title).toBeGreaterThanOrEqual(lo * (1 - 1e-9));
          expect(p.nominal!, f.title).toBeLessThan(hi * (1 - 1e-9));
        }
      }
      const dielectric = labels.map((l) => l.split(' or ')).find((l) => l.every((x) => DIELECTRICS.includes(x)));
      if (dielectric) for (const p of f.parts) expect(dielectric, f.title).toContain(p.dielectric);
    }
    // 450 capacitors over 4 packages need splitting by value.
    expect(decades).toBeGreaterThan(10);
  });

  it('list members in order of value, and are the same whatever order the parts come in', () => {
    for (const f of families) {
      const values = f.parts.map((p) => p.nominal!);
      expect(values).toEqual([...values].sort((a, b) => a - b));
    }
    const shuffled = [...parts].reverse();
    const again = partFamilies(shuffled);
    expect(again.map((f) => [f.slug, f.title, f.parts.map((p) => p.id)])).toEqual(families.map((f) => [f.slug, f.title, f.parts.map((p) => p.id)]));
  });

  it('keep a kind of at most 12 parts as one family named by the kind alone', () => {
    const small = partFamilies(parts.filter((p) => p.kind === 'inductor').slice(0, 12));
    expect(small.map((f) => [f.title, f.selection, f.parts.length])).toEqual([['Inductors', 'every inductor', 12]]);
  });

  it('cut a set no field tells apart into near-equal runs in order of value', () => {
    const files: Record<string, string> = {};
    for (let i = 0; i < 40; i++) {
      const id = `ORV-C-SAME-${String(i).padStart(2, '0')}`;
      files[id] = `id: ${id}\nkind: capacitor\ntitle: Invented 100 nF capacitor\nnominal: ${100 + (i % 5)}n\nvoltage: 16V\npackage: "0402"\ndielectric: X7R\nparasitics: {esr: 20m, esl: 0.5n}\n`;
    }
    const runs = partFamilies(library(files));
    // 40 parts, at most 12 a run: 4 runs of 10.
    expect(runs.map((f) => f.parts.length)).toEqual([10, 10, 10, 10]);
    expect(runs[0].title).toBe('Capacitors (1 of 4: 100 nF to 101 nF)');
    expect(runs[3].selection).toBe('every capacitor; run 4 of 4 in order of value');
    const values = runs.flatMap((f) => f.parts.map((p) => p.nominal!));
    expect(values).toEqual([...values].sort((a, b) => a - b));
  });

  it('read no field of a part but those the families are kept by (FAMILY_FIELDS)', () => {
    const read = new Set<string | symbol>();
    const watched = parts.map((p) => new Proxy(p, { get: (target, key, receiver) => (read.add(key), Reflect.get(target, key, receiver)) }));
    const again = partFamilies(watched);
    expect(again.map((f) => [f.slug, f.title, f.parts.map((p) => p.id)])).toEqual(families.map((f) => [f.slug, f.title, f.parts.map((p) => p.id)]));
    // Fields of other kinds of part (a bead's, a resistor's) are not in this library: the list is checked by name too.
    expect([...read].filter((k) => !(FAMILY_FIELDS as readonly (string | symbol)[]).includes(k))).toEqual([]);
    expect(read.has('package') && read.has('voltageRatings') && read.has('currentA') && read.has('nominal')).toBe(true);
  });
});

describe('part families kept between builds', () => {
  const parts = library(generated(300));
  const byId = new Map(parts.map((p) => [p.id, p]));
  const dir = tempDir('family-cache');
  roots.push(dir);
  const file = join(dir, 'families.json');
  const shown = (fs: ReturnType<typeof partFamilies>) => fs.map((f) => ({ ...f, parts: f.parts.map((p) => p.id) }));

  it('are made and written when there is no file, and read back from it after', () => {
    const made = cachedFamilies(parts, byId, 'code A', file);
    expect(made).toEqual(partFamilies(parts));
    const again = cachedFamilies(parts, byId, 'code A', file);
    expect(again).toEqual(made);
    // The very part objects of the library, found by id.
    expect(again[0].parts[0]).toBe(byId.get(again[0].parts[0].id));
    // Read from the file: a title changed in it (under the same key) is what comes back.
    const text = JSON.parse(readFileSync(file, 'utf8'));
    text.families[0].title = 'Changed in the file';
    writeFileSync(file, JSON.stringify(text));
    expect(cachedFamilies(parts, byId, 'code A', file)[0].title).toBe('Changed in the file');
    // Another code key: made afresh (and written again).
    expect(shown(cachedFamilies(parts, byId, 'code B', file))).toEqual(shown(made));
    expect(JSON.parse(readFileSync(file, 'utf8')).families[0].title).toBe(made[0].title);
  });

  it('are keyed by every field they are made from, and by nothing else of a part', () => {
    const key = familiesKey(parts, 'code A');
    const changed = (field: string, value: unknown) => parts.map((p, i) => (i === 7 ? { ...p, [field]: value } : p));
    const first = parts[7];
    for (const [field, value] of [
      ['id', 'ORV-T-OTHER'],
      ['kind', first.kind === 'inductor' ? 'capacitor' : 'inductor'],
      ['behavesAs', 'resistor'],
      ['nominal', (first.nominal ?? 1) * (1 + 2 ** -40)],
      ['package', '1206'],
      ['dielectric', 'X8R'],
      ['voltageRatings', [{ volts: 16, kind: 'DC', stated: true }]],
      ['voltageV', 17],
      ['voltageAcV', 230],
      ['currentA', 3],
      ['powerW', 0.5],
    ] as const) {
      expect(familiesKey(changed(field, value), 'code A'), field).not.toBe(key);
    }
    expect(familiesKey(changed('title', 'Another title'), 'code A')).toBe(key);
    expect(familiesKey(parts.slice(1), 'code A')).not.toBe(key);
    expect(familiesKey(parts, 'code B')).not.toBe(key);
  });

  it('are made afresh from a file that is damaged or names a part the library lacks', () => {
    const made = cachedFamilies(parts, byId, 'code C', file);
    writeFileSync(file, '{"key": "');
    expect(cachedFamilies(parts, byId, 'code C', file)).toEqual(made);
    const text = JSON.parse(readFileSync(file, 'utf8'));
    text.families[0].parts[0] = 'ORV-T-MISSING';
    text.families[0].title = 'Not to be read';
    writeFileSync(file, JSON.stringify(text));
    expect(cachedFamilies(parts, byId, 'code C', file)).toEqual(made);
    // Damaged under its own key: a family without its list of parts, then no family at all.
    for (const damage of [{ title: 'no parts' }, null]) {
      const whole = JSON.parse(readFileSync(file, 'utf8'));
      whole.families[1] = damage;
      writeFileSync(file, JSON.stringify(whole));
      expect(cachedFamilies(parts, byId, 'code C', file)).toEqual(made);
    }
  });

  it('remove the drafts that stopped builds left when they write the file, not those of a running build', () => {
    const dead = Number(spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' }).stdout);
    const running = spawn(process.execPath, ['-e', 'setInterval(() => {}, 1000)'], { stdio: 'ignore' });
    onTestFinished(() => {
      running.kill();
    });
    const own = join(dir, 'leftovers');
    mkdirSync(own);
    const leftover = join(own, `families.json.${dead}.tmp`);
    const writing = join(own, `families.json.${running.pid}.tmp`);
    const other = join(own, `other.json.${dead}.tmp`);
    for (const path of [leftover, writing, other]) writeFileSync(path, '{"key": "');
    cachedFamilies(parts, byId, 'code D', join(own, 'families.json'));
    expect(readdirSync(own).sort()).toEqual(['families.json', `families.json.${running.pid}.tmp`, `other.json.${dead}.tmp`]);
  });
});
