// A build without --pdf after one with it: the PDFs whose inputs are unchanged are kept (the very files, and
// the pages link them as before); the others are removed and the build says so in one line.

import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BrowserContext } from 'puppeteer-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildFolio } from '../../src/build/build.js';
import { pdfKeys } from '../../src/build/pdf-reuse.js';
import { siteKey } from '../../src/build/reuse.js';
import { loadLibrary } from '../../src/model/library.js';
import { run } from '../cli/fake-io.js';
import { copyLibrary, read, REPO, tempDir } from '../site-helpers.js';
import { GIT_ENV, useGitEnv } from '../history/git-repo.js';
import { startChrome, stopChrome } from '../print/site-tabs.js';

const GOOD = join(REPO, 'test/fixtures/good-library');
const IDS = ['BEAD-TEST-600R', 'CAP-TEST-100N', 'IND-TEST-10U', 'NET-TEST-BULK', 'RES-TEST-4K7'];

describe('the key of a PDF', () => {
  const keysAfter = (edit?: (root: string) => void) => {
    const root = copyLibrary(REPO, 'pdf-keys');
    edit?.(root);
    const library = loadLibrary(root).library!;
    return pdfKeys(library, siteKey(library));
  };
  const base = keysAfter();
  const changed = (other: Map<string, string>) => [...base.keys()].filter((path) => base.get(path) !== other.get(path));

  it('covers every part and review of the library', () => {
    expect([...base.keys()].filter((p) => p.startsWith('pdf/reviews/'))).toEqual(['pdf/reviews/dl3-power-integrity.pdf']);
    expect([...base.keys()].filter((p) => p.startsWith('pdf/parts/')).length).toBe(loadLibrary(REPO).library!.parts.length);
  });

  it('of a datasheet changes with its part file only; of a pack, with any file of the library', () => {
    const partFile = 'parts/capacitors/mlcc/orv-c-0402-100n-x7r.yaml';
    const afterPart = keysAfter((root) => writeFileSync(join(root, partFile), readFileSync(join(root, partFile), 'utf8') + '\n# edited\n'));
    expect(changed(afterPart).sort()).toEqual(['pdf/parts/ORV-C-0402-100N-X7R.pdf', 'pdf/reviews/dl3-power-integrity.pdf']);
    const afterPlan = keysAfter((root) => writeFileSync(join(root, 'plans', 'vdd-core.yaml'), readFileSync(join(root, 'plans', 'vdd-core.yaml'), 'utf8') + '\n# edited\n'));
    expect(changed(afterPlan)).toEqual(['pdf/reviews/dl3-power-integrity.pdf']);
  });

  it('changes everywhere with the library settings', () => {
    const afterSettings = keysAfter((root) => writeFileSync(join(root, 'folio.yaml'), readFileSync(join(root, 'folio.yaml'), 'utf8').replace(/^title: .*$/m, 'title: Another title (invented)')));
    expect(changed(afterSettings).length).toBe(base.size);
  });
});

describe('the key of a review pack', () => {
  it('holds the git revision its cover states: committing the library, or a commit that leaves its files as they were, changes it and no datasheet\'s', () => {
    const restore = useGitEnv();
    try {
      const root = copyLibrary(REPO, 'pdf-key-revision');
      const git = (...args: string[]) => execFileSync('git', ['-c', 'init.defaultBranch=main', ...args], { cwd: root, env: { ...process.env, ...GIT_ENV }, stdio: ['ignore', 'pipe', 'pipe'] });
      const keys = () => {
        const library = loadLibrary(root).library!;
        return pdfKeys(library, siteKey(library));
      };
      const pack = 'pdf/reviews/dl3-power-integrity.pdf';
      const datasheets = (k: Map<string, string>) => [...k].filter(([path]) => path.startsWith('pdf/parts/'));
      git('init', '-q');
      const uncommitted = keys();
      git('add', '-A');
      git('commit', '-q', '-m', 'library');
      const committed = keys();
      expect(committed.get(pack)).not.toBe(uncommitted.get(pack));
      expect(datasheets(committed)).toEqual(datasheets(uncommitted));
      // An edit and its undoing, each committed: every file as it was, the last commit touching a plan another.
      const plan = join(root, 'plans', 'vdd-core.yaml');
      const text = readFileSync(plan, 'utf8');
      writeFileSync(plan, `${text}# edited\n`);
      git('commit', '-q', '-am', 'edit');
      writeFileSync(plan, text);
      git('commit', '-q', '-am', 'undo');
      const again = keys();
      expect(again.get(pack)).not.toBe(committed.get(pack));
      expect(datasheets(again)).toEqual(datasheets(committed));
    } finally {
      restore();
    }
  });
});

describe('build after build --pdf', () => {
  let root: string;
  let site: string;
  const pdf = (id: string) => join(site, 'pdf', 'parts', `${id}.pdf`);
  const inode = (file: string) => statSync(file).ino;

  let browser: BrowserContext;

  beforeAll(async () => {
    root = copyLibrary(GOOD, 'pdf-keep');
    site = join(root, '_site');
    // Printed by the run's Chromium for printing (test/setup/shared-chrome.ts), in this file's context of it.
    browser = await startChrome('print');
    const printed = await buildFolio({ libraryRoot: root, outDir: site, cwd: root, workers: 0, pdf: { env: process.env, browser, date: new Date('2026-12-01T12:00:00Z') } });
    expect(printed.pdfProblem).toBeUndefined();
    expect(printed.pdfs.map((p) => p.pdfFile).sort()).toEqual(IDS.map((id) => `pdf/parts/${id}.pdf`));
  }, 120_000);

  afterAll(() => stopChrome(browser));

  it('keeps every PDF when nothing changed: the same files, linked from the same pages', async () => {
    const inodes = IDS.map((id) => inode(pdf(id)));
    const page = read(site, 'parts/CAP-TEST-100N/index.html');
    expect(page).toContain('pdf/parts/CAP-TEST-100N.pdf');
    const r = await run(['build', '--workers', '0'], root);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^built 5 parts \(5 unchanged, carried over\), \d+ pages, 5 PDFs of the last build kept in [\d.]+ s: _site\/index.html\n$/);
    expect(r.err).not.toMatch(/removed/);
    expect(IDS.map((id) => inode(pdf(id)))).toEqual(inodes);
    expect(read(site, 'parts/CAP-TEST-100N/index.html')).toBe(page);
  }, 120_000);

  it('removes the PDF of an edited part, keeps the others, and says so in one line', async () => {
    const file = join(root, 'parts', 'capacitor.yaml');
    writeFileSync(file, readFileSync(file, 'utf8').replace(/^title: .*$/m, 'title: An edited test capacitor (invented)'));
    const r = await run(['build', '--workers', '0'], root);
    expect(r.code).toBe(0);
    expect(r.out).toContain(', 4 PDFs of the last build kept');
    expect(r.err.split('\n').filter((l) => l.includes('removed'))).toEqual([
      'zfolio build: removed 1 PDF of the last build whose inputs changed (pdf/parts/CAP-TEST-100N.pdf); build --pdf prints them again',
    ]);
    expect(existsSync(pdf('CAP-TEST-100N'))).toBe(false);
    expect(read(site, 'parts/CAP-TEST-100N/index.html')).not.toContain('.pdf');
    expect(read(site, 'parts/IND-TEST-10U/index.html')).toContain('pdf/parts/IND-TEST-10U.pdf');
  }, 120_000);

  it('does not keep a PDF changed since it was printed', async () => {
    utimesSync(pdf('IND-TEST-10U'), new Date(), new Date('2020-01-01'));
    const r = await buildFolio({ libraryRoot: root, outDir: site, cwd: root, workers: 0 });
    expect(r.removedPdfs).toEqual(['pdf/parts/IND-TEST-10U.pdf']);
    expect(r.keptPdfs).toBe(3);
  }, 120_000);

  it('without the record of the last build (no cache), removes them all and says so', async () => {
    const r = await buildFolio({ libraryRoot: root, outDir: site, cwd: root, workers: 0, cache: false });
    expect(r.keptPdfs).toBe(0);
    expect(r.removedPdfs.length).toBe(3);
    expect(existsSync(join(site, 'pdf'))).toBe(false);
  }, 120_000);
});
