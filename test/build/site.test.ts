// The demo library built into a site: a page per part with its four charts, figures as `zfolio figures
// --json` states them, self-contained (no outside URL), deterministic, and never half-written.

import { mkdirSync, readdirSync, readlinkSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { analysePart } from '../../src/analysis/part-figures.js';
import { partSummary } from '../../src/analysis/summary.js';
import { buildFolio, type BuildResult } from '../../src/build/build.js';
import { loadLibrary, type Library } from '../../src/model/library.js';
import { formatEng } from '../../src/units/format.js';
import { copyLibrary, filesUnder, read, REPO, tempDir, treeHashes } from '../site-helpers.js';
import { DEMO_SITE_OPTIONS, demoSite } from '../demo-site.js';
import { svgTexts } from '../charts/svg-text.js';

let library: Library;
let first: BuildResult;
let siteA: string;
let siteB: string;

beforeAll(async () => {
  library = loadLibrary(REPO).library!;
  siteA = join(tempDir('site-a'), '_site');
  // Two cold builds, one with no cache drawing charts in this thread and one in worker threads into an empty
  // cache folder: the second is the run's shared demo site (test/demo-site.ts).
  expect(DEMO_SITE_OPTIONS).toEqual({ workers: 2 });
  first = await buildFolio({ libraryRoot: REPO, outDir: siteA, cache: false, workers: 0 });
  siteB = await demoSite();
}, 240_000);

describe('the demo folio', () => {
  it('builds without problems', () => {
    expect(first.ok).toBe(true);
    expect(first.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    expect(first.parts).toBe(library.parts.length);
  });

  it('has one datasheet page per part, each with four charts as inline SVG', () => {
    for (const part of library.parts) {
      const html = read(siteA, `parts/${part.id}/index.html`);
      const charts = [...html.matchAll(/<figure class="chart" id="chart-(\w+)">\s*<svg[^>]*role="img"/g)].map((m) => m[1]);
      expect(charts, part.id).toEqual(['impedance', 'phase', 'plane', 'admittance']);
      // Each chart carries its text alternative.
      expect((html.match(/<svg[^>]*role="img"[\s\S]*?<title[^>]*>[^<]+<\/title>\s*<desc[^>]*>[^<]+<\/desc>/g) ?? []).length).toBeGreaterThanOrEqual(4);
    }
  });

  it("says on every part's phase chart which side of 0° is inductive and which capacitive", () => {
    // X > 0 is inductive and X < 0 capacitive (Z = R + jX, textbook convention): both notes beside the zero
    // line where the curve and the resonance labels leave room for them, else both in the key.
    for (const part of library.parts) {
      const html = read(siteA, `parts/${part.id}/index.html`);
      const phase = /<figure class="chart" id="chart-phase">([\s\S]*?)<\/svg>/.exec(html)![1];
      const texts = svgTexts(phase);
      const onPlot = texts.includes('↑ inductive (X > 0)') && texts.includes('↓ capacitive (X < 0)');
      const inKey = texts.join(' ').includes('above 0° inductive, below capacitive');
      expect(onPlot !== inKey, `${part.id}: both notes on the plot, or both in the key`).toBe(true);
    }
  });

  it('states the figures `zfolio figures --json` gives, on the page and in its figures.json', () => {
    for (const part of library.parts) {
      const summary = partSummary(analysePart(part, library.settings.sweep, library.settings.within, library.settings.temperature));
      const json = JSON.parse(read(siteA, `parts/${part.id}/figures.json`));
      expect(json).toEqual(JSON.parse(JSON.stringify(summary)));
      const html = read(siteA, `parts/${part.id}/index.html`);
      const srf = summary.selfResonanceHz === null ? '—' : formatEng(summary.selfResonanceHz, 'Hz');
      expect(html, part.id).toContain(`<dd class="srf">${srf}</dd>`);
    }
  });

  it('offers the sweep as CSV, one row per sweep point: frequency, R and X', () => {
    const part = library.parts[0];
    const csv = read(siteA, `parts/${part.id}/sweep.csv`).trim().split('\n');
    expect(csv[0]).toBe('frequency_Hz,R_ohm,X_ohm');
    expect(csv.length - 1).toBe(801); // 100 Hz to 10 GHz at 100 per decade, both ends
    // Every value to at most 6 significant digits, as the part page says: the digits between the first and
    // the last that is not zero ("1023290" is 1.02329e6).
    for (const cell of csv.slice(1).flatMap((line) => line.split(',')).filter((c) => c !== '' && !c.endsWith('inf'))) {
      expect(cell.replace(/^-/, '').replace(/e.*$/, '').replace('.', '').replace(/^0+/, '').replace(/0+$/, '').length, cell).toBeLessThanOrEqual(6);
    }
    expect(read(siteA, `parts/${part.id}/index.html`)).toContain('R and X (Z = R + jX) to 6 significant digits');
  });

  it('keeps each part\'s sweep once: its chart links go to the site\'s shared specs, which read sweep.csv; no spec is written into a part folder', () => {
    const files = filesUnder(siteA);
    for (const name of ['impedance', 'phase', 'admittance', 'plane-admittance', 'plane-impedance']) {
      const spec = JSON.parse(read(siteA, `assets/specs/${name}.vl.json`));
      expect(spec.data.url, name).toBe('sweep.csv');
      expect(spec.datasets, name).toBeUndefined();
    }
    for (const part of library.parts) {
      const html = read(siteA, `parts/${part.id}/index.html`);
      const plane = part.kind === 'capacitor' ? 'plane-admittance' : 'plane-impedance';
      for (const [chart, spec] of [['impedance', 'impedance'], ['phase', 'phase'], ['admittance', 'admittance'], ['plane', plane]]) {
        expect(html, `${part.id} ${chart}`).toMatch(new RegExp(`<figure class="chart" id="chart-${chart}">[\\s\\S]*?href="\\.\\./\\.\\./assets/specs/${spec}\\.vl\\.json" download>`));
        expect(files).not.toContain(`parts/${part.id}/${chart}.vl.json`);
      }
    }
  });

  it('offers the model as a one-port Touchstone file and a SPICE subcircuit, linked from every part page', () => {
    for (const part of library.parts) {
      const html = read(siteA, `parts/${part.id}/index.html`);
      expect(html).toContain(`href="../../parts/${part.id}/${part.id}.s1p" download>`);
      expect(html).toContain(`href="../../parts/${part.id}/${part.id}.subckt" download>`);
      const s1p = read(siteA, `parts/${part.id}/${part.id}.s1p`).split('\n');
      expect(s1p[0]).toBe('! zfolio export');
      expect(s1p[1].startsWith(`! ${part.id}: `) && s1p[1].endsWith(`(${part.kind})`)).toBe(true);
      // The same sweep as the CSV, at the CSV's frequencies: 801 points after the header and option line.
      const points = s1p.filter((l) => /^\d/.test(l));
      expect(points).toHaveLength(801);
      expect(points.map((l) => Number(l.split(' ')[0]))).toEqual(read(siteA, `parts/${part.id}/sweep.csv`).trim().split('\n').slice(1).map((l) => Number(l.split(',')[0])));
      expect(read(siteA, `parts/${part.id}/${part.id}.subckt`)).toContain(`.SUBCKT ${part.id} 1 2\n`);
    }
  });

  it('shows each measured part against its measurement: file, its opening comments, the miss, three charts and the model-vs-fit table; no such section elsewhere', () => {
    const measured = library.parts.filter((p) => p.measurements.length > 0);
    expect(measured.length).toBeGreaterThanOrEqual(4);
    for (const part of library.parts) {
      const html = read(siteA, `parts/${part.id}/index.html`);
      const sections = html.match(/<section class="measurement"/g) ?? [];
      expect(sections.length, part.id).toBe(part.measurements.length);
      if (part.measurements.length === 0) continue;
      expect(html).toContain(`<p class="measurement-source"><span class="mono">${part.measurements[0].file}</span> · `);
      expect(html).toMatch(/the model misses the measurement by \d+\.\d\d dB rms in \|Z\|/);
      // The demo's files are synthetic, and their own opening comments say so on the page.
      expect(html).toContain(`<span class="label">The file's opening comments:</span> <q>SYNTHETIC measurement for the zfolio demo library: no part was measured.`);
      for (const kind of ['measured-impedance-1', 'measured-phase-1', 'residual-1']) {
        expect(html).toContain(`<figure class="chart" id="chart-${kind}">`);
        expect(filesUnder(siteA)).toContain(`parts/${part.id}/${kind}.vl.json`);
      }
      expect(html).toContain('<h3>Model vs fit</h3>');
    }
  });

  it('has an index listing every part, and comparison pages including the automatic part families of every kind', () => {
    const index = read(siteA, 'index.html');
    for (const part of library.parts) expect(index).toContain(`href="parts/${part.id}/index.html"`);
    // The demo fits on one page of the index: no pager, no row scripts.
    expect(index).not.toContain('data-pager');
    expect(filesUnder(siteA).filter((f) => f.startsWith('list/'))).toEqual([]);
    const comparisons = read(siteA, 'comparisons/index.html');
    const families = [...comparisons.matchAll(/<a href="(family-[^"/]+)\/index.html">/g)].map((m) => m[1]);
    const members = families.map((slug) => [...read(siteA, `comparisons/${slug}/index.html`).matchAll(/href="..\/..\/parts\/([^/]+)\/index.html"/g)].map((m) => m[1]));
    // Every part is in exactly one family, and no family (one chart, a curve a part) holds more than 12.
    expect(members.flat().sort()).toEqual(library.parts.map((p) => p.id).sort());
    for (const ids of members) expect(ids.length).toBeLessThanOrEqual(12);
    for (const kind of new Set(library.parts.map((p) => p.kind))) expect(index).toContain(`href="comparisons/index.html#families-${kind}"`);
    for (const c of library.comparisons) expect(index).toContain(c.title.replace(/&/g, '&amp;'));
  });

  it('is self-contained: no http(s) URL in any src or href, no CSS import from elsewhere, and a strict CSP', () => {
    for (const file of filesUnder(siteA).filter((f) => /\.(html|css|svg|js)$/.test(f))) {
      const text = read(siteA, file);
      expect(text.match(/(?:src|href)\s*=\s*["']?\s*(?:https?:)?\/\//gi), file).toBeNull();
      expect(text.match(/url\(\s*["']?\s*(?:https?:)?\/\//gi), file).toBeNull();
      expect(text.match(/@import/gi), file).toBeNull();
      if (file.endsWith('.html')) expect(text, file).toContain(`content="default-src 'none';`);
    }
  });

  it('uses relative links only, so it works from the file system', () => {
    for (const file of filesUnder(siteA).filter((f) => f.endsWith('.html'))) {
      const links = [...read(siteA, file).matchAll(/(?:src|href)="([^"]*)"/g)].map((m) => m[1]);
      for (const link of links) expect(link.startsWith('/'), `${file}: ${link}`).toBe(false);
    }
  });

  it('is byte-identical from build to build, drawn in this thread or in workers', () => {
    const a = treeHashes(siteA);
    const b = treeHashes(siteB);
    expect([...b.keys()]).toEqual([...a.keys()]);
    for (const [file, hash] of a) expect(b.get(file), file).toBe(hash);
  });
});

describe('a library with problems', () => {
  it('stops the build before anything is written and leaves the previous site as it was', async () => {
    const root = copyLibrary(join(REPO, 'test/fixtures/good-library'), 'bad-build');
    const out = join(root, '_site');
    expect((await buildFolio({ libraryRoot: root, outDir: out, workers: 0 })).ok).toBe(true);
    const before = treeHashes(out);
    const holding = readdirSync(join(root, '._site.zfolio')).sort();
    writeFileSync(join(root, 'parts', 'broken.yaml'), 'id: BROKEN-1\nkind: capacitor\nnominal: 10 nH\n');
    const result = await buildFolio({ libraryRoot: root, outDir: out, workers: 0 });
    expect(result.ok).toBe(false);
    expect(result.diagnostics.map((d) => `${d.file}:${d.line}:${d.column}`)).toContain('parts/broken.yaml:3:10');
    expect(treeHashes(out)).toEqual(before);
    // No staging folder is left behind either: the holding folder keeps the site in place and its spare, as before.
    expect(readdirSync(join(root, '._site.zfolio')).sort()).toEqual(holding);
    expect(holding).toContain(readlinkSync(out).split('/')[1]);
  }, 120_000);
});

describe('text from YAML', () => {
  it('is escaped wherever it lands: a title with <script> and quotes renders as text', async () => {
    const root = tempDir('xss');
    mkdirSync(join(root, 'parts'));
    const evil = `<script>alert("x")</script> "quoted" & 'single' </textarea>`;
    writeFileSync(
      join(root, 'parts', 'evil.yaml'),
      `id: EVIL-1\nkind: capacitor\ntitle: ${JSON.stringify(evil)}\nnominal: 1u\ntags: ["<img src=x onerror=alert(1)>"]\nnotes: "</script><script>alert(2)</script>"\nparasitics: {esr: 10m, esl: 1n}\n`,
    );
    writeFileSync(join(root, 'folio.yaml'), `title: "<b>Lib</b> & co"\n`);
    const out = join(root, '_site');
    const result = await buildFolio({ libraryRoot: root, outDir: out, workers: 0, cache: false });
    expect(result.ok).toBe(true);
    for (const file of filesUnder(out).filter((f) => /\.(html|svg|json)$/.test(f))) {
      const text = read(out, file);
      expect(text, file).not.toContain('<script>alert');
      expect(text, file).not.toContain('<img src=x');
      expect(text, file).not.toContain('<b>Lib</b>');
    }
    const page = read(out, 'parts/EVIL-1/index.html');
    expect(page).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;');
    // The only script on a page is the folio's own file.
    expect(page.match(/<script\b[^>]*>/g)).toEqual(['<script src="../../assets/folio.js">']);
    rmSync(root, { recursive: true, force: true });
  }, 120_000);
});
