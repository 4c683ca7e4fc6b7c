// PDFs of the demo folio, every one printed once by the system Chromium and read back with poppler's pdftotext
// and pdfinfo (Debian poppler-utils): searchable text, the SRF as the HTML page states it, page x of y, metadata,
// a review pack whose contents list points at the pages its sections really start on, legible type, and a plain
// part's datasheet on two pages of A4 and of Letter.

import { execFileSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { BrowserContext } from 'puppeteer-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildFolio, CACHE_DIR, type BuildResult } from '../../src/build/build.js';
import { main } from '../../src/cli/main.js';
import { loadLibrary } from '../../src/model/library.js';
import { read, REPO, tempDir, copyLibrary } from '../site-helpers.js';
import { demoCache } from '../demo-site.js';
import { startChrome, stopChrome } from './site-tabs.js';
import { measurePdf, nearlyEmptyPages, shareUnder, type PdfLegibility } from '../../bench/print-legibility.js';

const DATE = new Date('2026-12-01T12:00:00Z');
const CAPACITOR = 'ORV-C-0402-100N-X7R';
const INDUCTOR = 'ORV-L-PWR-4U7-3A';
const BEAD = 'ORV-FB-0402-120R-2A';
/** A network part: its schematic is the widest drawing a sheet holds. */
const NETWORK = 'ORV-N-L-PWR-2U2-SKIN';
const library = loadLibrary(REPO).library!;
let result: BuildResult;
let site: string;
let browser: BrowserContext;
/** Each PDF read back once with pdftotext -bbox. */
const measured = new Map<string, PdfLegibility>();
const measure = (file: string) => measured.get(file) ?? measured.set(file, measurePdf(file)).get(file)!;
/** The text of an HTML text node as read. */
const decodeEntities = (text: string) => text.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&');

const pdftotext = (file: string, first?: number, last?: number) =>
  execFileSync('pdftotext', [...(first ? ['-f', String(first), '-l', String(last ?? first)] : []), '-layout', file, '-'], { encoding: 'utf8' });
const pdfinfo = (file: string) => Object.fromEntries(execFileSync('pdfinfo', [file], { encoding: 'utf8' }).split('\n').filter(Boolean).map((l) => [l.slice(0, l.indexOf(':')), l.slice(l.indexOf(':') + 1).trim()]));

beforeAll(async () => {
  site = join(tempDir('pdf'), '_site');
  // The charts the run's shared demo build drew (test/demo-site.ts), from a copy of its cache: this build
  // prints them rather than drawing them again, and writes nothing into the repository's own cache. It
  // prints with the run's Chromium for printing (test/setup/shared-chrome.ts), in this file's context of it; the
  // `zfolio print` below starts a Chromium of its own, as a build does.
  browser = await startChrome('print');
  result = await buildFolio({
    libraryRoot: REPO,
    outDir: site,
    cache: await demoCache(),
    pdf: { env: process.env, browser, date: DATE },
  });
  if (result.pdfProblem) throw new Error(`PDF tests need Chromium: ${result.pdfProblem}`);
}, 600_000);

afterAll(() => stopChrome(browser));

describe('part datasheets', () => {
  it('are written for every part, a pack for every review, and linked from their pages', () => {
    const files = result.pdfs.map((p) => p.pdfFile).sort();
    expect(files).toEqual([...library.parts.map((p) => `pdf/parts/${p.id}.pdf`), 'pdf/reviews/dl3-power-integrity.pdf'].sort());
    for (const id of [CAPACITOR, INDUCTOR, BEAD, NETWORK]) expect(files).toContain(`pdf/parts/${id}.pdf`);
    expect(read(site, `parts/${CAPACITOR}/index.html`)).toContain(`href="../../pdf/parts/${CAPACITOR}.pdf"`);
  });

  it.each([CAPACITOR, INDUCTOR])('%s: searchable text with its id, its SRF as the HTML page prints it, and page furniture', (id) => {
    const file = join(site, 'pdf', 'parts', `${id}.pdf`);
    const text = pdftotext(file);
    const srf = /<dd class="srf">([^<]+)<\/dd>/.exec(read(site, `parts/${id}/index.html`))![1];
    expect(text).toContain(id);
    expect(text).toContain(srf);
    const pages = Number(pdfinfo(file).Pages);
    expect(pages).toBeGreaterThanOrEqual(2);
    for (let n = 1; n <= pages; n++) expect(text).toContain(`page ${n} of ${pages}`);
    const part = library.partsById.get(id)!;
    expect(text).toContain(`built 2026-12-01 · ${part.source.path} · sha256:${part.source.hash}`);
    expect(text).toContain(library.settings.title);
  });

  it('hold no link to the build\'s own files (they would point into a folder that is gone)', () => {
    for (const pdf of result.pdfs) expect(readFileSync(join(site, pdf.pdfFile)).includes('file:'), pdf.pdfFile).toBe(false);
  });

  it('carry title, subject, creator and producer metadata', () => {
    const info = pdfinfo(join(site, 'pdf', 'parts', `${CAPACITOR}.pdf`));
    expect(info.Title).toBe(`${CAPACITOR} — ${library.partsById.get(CAPACITOR)!.title}`);
    expect(info.Subject).toMatch(/^Impedance datasheet of ORV-C-0402-100N-X7R \(capacitor\)/);
    expect(info.Creator).toMatch(/^zfolio \d+\.\d+\.\d+$/);
    expect(info.Producer).toMatch(/^zfolio/);
    expect(info['Page size']).toMatch(/A4/);
  });
});

describe('the review pack', () => {
  const file = () => join(site, 'pdf', 'reviews', 'dl3-power-integrity.pdf');
  const review = library.reviews[0];

  it('opens with a cover holding the review facts and a sign-off table', () => {
    const cover = pdftotext(file(), 1);
    expect(cover).toContain(review.title);
    expect(cover).toMatch(/Name\s+Role\s+Decision\s+Signature\s+Date/);
    for (const who of review.reviewers) expect(cover).toContain(who.name);
  });

  it('states each covered rail\'s verdict on the cover, as the rail\'s plan page does', () => {
    const cover = pdftotext(file(), 1);
    for (const plan of review.plans) {
      const page = read(site, `plans/${plan.rail.replace(/[^A-Za-z0-9._-]+/g, '-')}/index.html`);
      // The page's first verdict is the nominal one, the corner verdict follows it.
      const verdict = /\bverdict-(pass|fail)\b/.exec(page)![1].toUpperCase();
      const corner = /corner-verdict"><span class="verdict-label">Worst corner<\/span> <span class="verdict-(pass|fail)">/.exec(page)![1].toUpperCase();
      expect(cover).toMatch(new RegExp(`Rail ${plan.rail}: at nominal ${verdict}`));
      expect(cover).toMatch(new RegExp(`Rail ${plan.rail}: at nominal ${verdict}[^\\n]*\\n\\s*at its corners: ${corner}`));
    }
  });

  it('has a contents list whose page numbers are where each section starts, and pages that add up', () => {
    const contents = pdftotext(file(), 2);
    expect(contents).toContain('Contents');
    const entries = [...contents.matchAll(/^\s*(\S.*?)\s{2,}(\d+)\s*$/gm)].map((m) => ({ title: m[1].trim(), page: Number(m[2]) }));
    // Decisions, every plan, comparison and part, cautions, appendix.
    expect(entries.length).toBe(3 + review.plans.length + review.comparisons.length + review.parts.length);
    const pages = Number(pdfinfo(file()).Pages);
    const starts = entries.map((e) => e.page);
    expect(starts[0]).toBe(3);
    expect([...starts].sort((a, b) => a - b)).toEqual(starts);
    expect(starts[starts.length - 1]).toBeLessThanOrEqual(pages);
    for (const entry of entries) {
      const page = pdftotext(file(), entry.page);
      // The section's own heading is on the page the contents give (ids and titles as printed).
      const heading = entry.title.replace(/^Rail plan /, '').replace(/^Comparison: /, '').split(' — ')[0];
      expect(page, `${entry.title} on page ${entry.page}`).toContain(heading);
      if (entry.page > 1) expect(pdftotext(file(), entry.page - 1)).not.toMatch(new RegExp(`^\\s*${heading.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}\\s*$`, 'm'));
    }
    // Every page carries "page x of N" with the true N.
    const all = pdftotext(file());
    for (let n = 1; n <= pages; n++) expect(all).toContain(`page ${n} of ${pages}`);
    expect(result.pdfs.find((p) => p.pdfFile.endsWith('dl3-power-integrity.pdf'))!.pages).toBe(pages);
  });

  it('ends with the cautions and an appendix of every source file with its hash', () => {
    const all = pdftotext(file());
    expect(all).toContain('Appendix: source files');
    expect(all).toContain(`${review.source.path}`);
    for (const part of review.parts) expect(all).toContain(part.source.hash);
    expect(all).toMatch(/licensed practice/);
  });
});

// Paper a reviewer can read: word sizes and words per page read back with pdftotext -bbox (bench/print-legibility.ts).
describe('legible paper', () => {
  const files = () => result.pdfs.map((p) => join(site, p.pdfFile));

  it('prints at most 1% of its words under 6.5 pt, and almost none under 7 pt (charts are drawn for their printed size)', () => {
    expect(files().length).toBe(library.parts.length + library.reviews.length);
    for (const file of files()) {
      const { words } = measure(file);
      expect(words.length, file).toBeGreaterThan(300);
      expect(shareUnder(words, 6.5), file).toBeLessThanOrEqual(0.01);
      expect(shareUnder(words, 7), file).toBeLessThanOrEqual(0.01);
    }
  });

  it('sets body text at 9 to 10 pt: the commonest size of every PDF\'s words outside its charts and schematics', () => {
    for (const pdf of result.pdfs) {
      const file = join(site, pdf.pdfFile);
      const html = read(site, pdf.pdfFile.startsWith('pdf/reviews/') ? `reviews/${pdf.pdfFile.slice('pdf/reviews/'.length, -4)}/pack.html` : `parts/${pdf.pdfFile.slice('pdf/parts/'.length, -4)}/index.html`);
      // The words the page's drawings hold, each as often as it is drawn: set at the drawings' own sizes (7–9 pt).
      const drawn = new Map<string, number>();
      for (const m of html.matchAll(/<text\b[^>]*>([\s\S]*?)<\/text>/g)) {
        for (const word of decodeEntities(m[1].replace(/<[^>]+>/g, ' ')).split(/\s+/).filter(Boolean)) drawn.set(word, (drawn.get(word) ?? 0) + 1);
      }
      const counts = new Map<number, number>();
      for (const w of measure(file).words) {
        const left = drawn.get(w.text) ?? 0;
        if (left > 0) {
          drawn.set(w.text, left - 1);
          continue;
        }
        const size = Math.round(w.sizePt * 2) / 2;
        counts.set(size, (counts.get(size) ?? 0) + 1);
      }
      const commonest = [...counts].sort((a, b) => b[1] - a[1])[0][0];
      expect(commonest, file).toBeGreaterThanOrEqual(9);
      expect(commonest, file).toBeLessThanOrEqual(10);
    }
  });

  it('has no nearly empty page (fewer than 70 words, running head and footer included)', () => {
    for (const file of files()) expect(nearlyEmptyPages(measure(file)), file).toEqual([]);
  });
});

/**
 * A plain part: no measurement to set beside its model (a section of two charts, a residual chart and a fit
 * table) and no mains safety class (a banner and a page of safety cautions). Those two may take a third page.
 */
const plain = (id: string) => {
  const part = library.partsById.get(id)!;
  return part.measurements.length === 0 && part.safetyClass === undefined;
};
const sheetFile = (id: string) => join(site, 'pdf', 'parts', `${id}.pdf`);
/** Points to a millimetre (1 in = 25.4 mm = 72 pt). */
const PT_PER_MM = 72 / 25.4;
/** How far down its last page a PDF's text reaches, as a share of the page above a 13 mm foot margin (the footer's). */
function lastPageFill(pdf: PdfLegibility): number {
  const height = pdf.pageHeightsPt[pdf.pages - 1];
  const foot = height - 13 * PT_PER_MM;
  const bottoms = pdf.words.filter((w) => w.page === pdf.pages && w.bottomPt < foot).map((w) => w.bottomPt);
  return Math.max(...bottoms) / foot;
}

describe('a datasheet\'s length', () => {
  it('is two A4 pages for a plain part of every kind, networks included', () => {
    const plainIds = library.parts.map((p) => p.id).filter(plain);
    expect(new Set(plainIds.map((id) => library.partsById.get(id)!.kind))).toEqual(new Set(['capacitor', 'inductor', 'bead', 'resistor', 'network']));
    for (const id of plainIds) expect(measure(sheetFile(id)).pages, id).toBe(2);
  });

  it('is at most three A4 pages for a part with measurements or a mains part', () => {
    const others = library.parts.map((p) => p.id).filter((id) => !plain(id));
    expect(others.length).toBeGreaterThan(0);
    for (const id of others) expect(measure(sheetFile(id)).pages, id).toBeLessThanOrEqual(3);
  });
});

/**
 * One `zfolio print` on Letter paper, run once for the tests below (each print builds the library and starts
 * Chromium): the inductor's datasheet over a PDF zfolio made, the plain datasheets that reach furthest down
 * their second A4 page, the review pack, and two rail plans, one named by its rail and one by its plan file.
 */
interface LetterPrint {
  code: number;
  out: string;
  lines: string;
  fullest: string[];
  leftover: string;
  /** The library's built site before the print: its files and their text. */
  siteBefore: string;
  siteAfter: string;
}
let letter: Promise<LetterPrint> | undefined;
function printOnLetter(): Promise<LetterPrint> {
  letter ??= (async () => {
    const out = tempDir('print');
    // A copy of the demo library with the charts the shared demo build drew as its cache (print builds the
    // library, drawing only charts its cache lacks), and a built site of its own that print must leave alone.
    const root = copyLibrary(REPO, 'print-library');
    await demoCache(join(root, CACHE_DIR));
    const librarySite = join(root, '_site');
    mkdirSync(librarySite);
    writeFileSync(join(librarySite, 'index.html'), 'the site built before the print');
    const siteFiles = () => JSON.stringify(readdirSync(librarySite).map((f) => [f, readFileSync(join(librarySite, f), 'utf8'), statSync(join(librarySite, f)).mtimeMs]));
    const siteBefore = siteFiles();
    const lines: string[] = [];
    // What a killed print left behind: its scratch folder, named with its (ended) process id.
    const dead = Number(execFileSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' }));
    const leftover = join(tmpdir(), `zfolio-print-${dead}-Ab12Cd`);
    mkdirSync(join(leftover, 'site'), { recursive: true });
    // A PDF zfolio made, under the name print writes: replaced without a word.
    copyFileSync(join(site, 'pdf', 'parts', `${CAPACITOR}.pdf`), join(out, `${INDUCTOR}.pdf`));
    // Letter's page is 17.6 mm shorter than A4's: the plain datasheets that reach furthest down their
    // second A4 page are the ones that could spill onto a third.
    const fullest = library.parts.map((p) => p.id).filter((id) => plain(id) && id !== INDUCTOR).sort((a, b) => lastPageFill(measure(sheetFile(b))) - lastPageFill(measure(sheetFile(a)))).slice(0, 3);
    // The review pack too: Letter breaks its pages elsewhere than A4.
    const names = [INDUCTOR, ...fullest, 'dl3-power-integrity', 'VDD_CORE', 'plans/vdd-3v3.yaml'];
    const code = await main(['print', ...names, '--paper', 'letter', '--out', out, '--library', root], { cwd: root, env: process.env, isTTY: false, out: (t) => lines.push(t), err: () => {} });
    return { code, out, lines: lines.join(''), fullest, leftover, siteBefore, siteAfter: siteFiles() };
  })();
  return letter;
}

describe('zfolio print', () => {
  it('prints datasheets on Letter paper into the folder asked for, leaving the site alone; a plain part\'s on two pages', async () => {
    const { code, out, lines, fullest, leftover, siteBefore, siteAfter } = await printOnLetter();
    expect(code).toBe(0);
    expect(existsSync(leftover)).toBe(false);
    const file = join(out, `${INDUCTOR}.pdf`);
    expect(lines).toMatch(new RegExp(`${INDUCTOR}\\.pdf  2 pages\\n`));
    for (const id of fullest) expect(Number(pdfinfo(join(out, `${id}.pdf`)).Pages), id).toBe(2);
    for (const name of [INDUCTOR, ...fullest, 'dl3-power-integrity']) expect(nearlyEmptyPages(measurePdf(join(out, `${name}.pdf`))), name).toEqual([]);
    // US Letter is 612 × 792 pt (ANSI/ASME Y14.1).
    expect(pdfinfo(file)['Page size']).toMatch(/^612 x 792 pts \(letter\)/);
    expect(pdftotext(file)).toContain(INDUCTOR);
    expect(siteAfter).toBe(siteBefore);
  }, 300_000);

  it('prints a rail plan on its own, named by its rail or its plan file', async () => {
    const { code, out, lines } = await printOnLetter();
    expect(code).toBe(0);
    expect(lines).toMatch(/VDD_CORE\.pdf  \d+ pages?\n/);
    const text = pdftotext(join(out, 'VDD_CORE.pdf'));
    const page = read(site, 'plans/VDD_CORE/index.html');
    const verdict = /\bverdict-(pass|fail)\b/.exec(page)![1].toUpperCase();
    expect(text).toContain('VDD_CORE');
    expect(text).toContain(`${verdict} — worst margin`);
    expect(text).toContain('Anti-resonance peaks'.toUpperCase());
    expect(text).not.toContain('Sign-off'.toUpperCase());
    expect(text).toContain(`Rail plan VDD_CORE`);
    const pages = Number(pdfinfo(join(out, 'VDD_CORE.pdf')).Pages);
    for (let n = 1; n <= pages; n++) expect(text).toContain(`page ${n} of ${pages}`);
    expect(pdfinfo(join(out, 'VDD_3V3.pdf')).Title).toMatch(/^Rail plan VDD_3V3 — /);
  }, 300_000);

  it('names what it cannot find', async () => {
    const err: string[] = [];
    const code = await main(['print', 'ORV-C-0402-100N-X7X', '--library', REPO], { cwd: REPO, env: process.env, isTTY: false, out: () => {}, err: (t) => err.push(t) });
    expect(code).toBe(2);
    expect(err.join('')).toContain('no part, rail or review called "ORV-C-0402-100N-X7X"; did you mean ORV-C-0402-100N-X7R?');
  });
});

describe('without Chromium', () => {
  it('build --pdf still writes the site, then exits 1 with one line saying how to get PDFs', async () => {
    const root = copyLibrary(join(REPO, 'test/fixtures/good-library'), 'nochrome');
    const out: string[] = [];
    const err: string[] = [];
    const code = await main(['build', '--pdf', '--library', root, '--chrome', '/nonexistent/chromium', '--workers', '0'], {
      cwd: root,
      env: {},
      isTTY: false,
      out: (t) => out.push(t),
      err: (t) => err.push(t),
    });
    expect(code).toBe(1);
    expect(existsSync(join(root, '_site', 'index.html'))).toBe(true);
    const lines = err.join('').split('\n').filter((l) => l.includes('Chromium'));
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/--chrome PATH or ZFOLIO_CHROME=PATH/);
  }, 120_000);

  it('build without --pdf asks nothing of the browser', async () => {
    const root = copyLibrary(join(REPO, 'test/fixtures/good-library'), 'nopdf');
    const err: string[] = [];
    const code = await main(['build', '--library', root, '--workers', '0'], { cwd: root, env: { ZFOLIO_CHROME: '/nonexistent' }, isTTY: false, out: () => {}, err: (t) => err.push(t) });
    expect(code).toBe(0);
    expect(err.join('')).not.toMatch(/Chromium/);
  }, 120_000);
});
