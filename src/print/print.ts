// Printing the built site's pages to PDF: one browser for the whole run, two tabs reused from page to page.
// A review pack is printed twice: the first print's outline (Chromium builds it from the headings) tells
// on which page each section's heading landed; the contents list is numbered from that, and printed again.

import { writeFileSync, mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Page } from 'puppeteer-core';
import type { PrintBrowser } from './browser.js';
import type { PaperSize } from '../model/settings.js';
import { headingPages, loadForPrint, printLoadedPage, withMetadata, type PageFurniture, type PdfMetadata } from './pdf.js';
import type { Progress } from '../build/progress.js';

export interface PrintJob {
  /** The built HTML page to print. */
  htmlFile: string;
  pdfFile: string;
  meta: PdfMetadata;
  furniture: PageFurniture;
  /** A review pack: each [data-pack-section] holds one h1; contents entries [data-pages-for=section id]. */
  pack: boolean;
}

export interface PrintedFile {
  pdfFile: string;
  pages: number;
  /** For a pack: the page each section starts on, as its contents list prints it. */
  sectionPages?: Record<string, number>;
}

/** Tabs printing at once: one per core on the machines zfolio targets. */
const CONCURRENCY = 2;

/** Print every job with `browser` (started with launchChrome, or a context of one; the caller closes it). */
export async function printJobs(browser: PrintBrowser, jobs: PrintJob[], paper: PaperSize, date: Date, progress: Progress): Promise<PrintedFile[]> {
  progress.stage('pdf', jobs.length);
  const results: PrintedFile[] = new Array(jobs.length);
  let next = 0;
  const lane = async () => {
    const page = await browser.newPage();
    while (next < jobs.length) {
      const index = next++;
      results[index] = await printOne(page, jobs[index], paper, date);
      progress.tick();
    }
    await page.close();
  };
  await Promise.all(Array.from({ length: Math.min(CONCURRENCY, jobs.length) }, lane));
  return results;
}

/** While set, a page paints only its h1 headings; visibility leaves every box where it was. */
const HEADINGS_ONLY_STYLE = 'zfolio-headings-only';

async function paintHeadingsOnly(page: Page, on: boolean): Promise<void> {
  await page.evaluate(
    (id, on) => {
      if (!on) return document.getElementById(id)?.remove();
      const style = document.createElement('style');
      style.id = id;
      style.textContent = 'body * { visibility: hidden !important; } h1, h1 * { visibility: visible !important; }';
      document.head.append(style);
    },
    HEADINGS_ONLY_STYLE,
    on,
  );
}

async function printOne(page: Page, job: PrintJob, paper: PaperSize, date: Date): Promise<PrintedFile> {
  await loadForPrint(page, pathToFileURL(job.htmlFile).href);
  // A pack's first print serves only to find the pages its sections start on, so it paints nothing but the
  // headings: the layout, and so every page break, stays as it is, and Chromium skips drawing every chart
  // and table (about half the time of a full print). Every print after it is whole, and the last is checked.
  if (job.pack) await paintHeadingsOnly(page, true);
  let raw = await printLoadedPage(page, paper, job.furniture);
  if (job.pack) await paintHeadingsOnly(page, false);
  let sectionPages: Record<string, number> | undefined;
  if (job.pack) {
    // Numbering the contents can move a page break only if a number changes a line's length; repeat until
    // the numbers printed are the pages the sections start on (twice at most in practice).
    for (let round = 0; round < 4; round++) {
      const found = await sectionStartPages(page, raw);
      if (sectionPages && sameNumbers(found, sectionPages)) break;
      sectionPages = found;
      await page.evaluate((starts) => {
        document.querySelectorAll<HTMLElement>('[data-pages-for]').forEach((entry) => {
          const start = starts[entry.dataset.pagesFor ?? ''];
          if (start !== undefined) entry.textContent = String(start);
        });
      }, found);
      raw = await printLoadedPage(page, paper, job.furniture);
    }
  }
  const pdf = await withMetadata(raw, job.meta, date);
  mkdirSync(dirname(job.pdfFile), { recursive: true });
  writeFileSync(job.pdfFile, pdf.bytes);
  return { pdfFile: job.pdfFile, pages: pdf.pages, sectionPages };
}

/** Pair each pack section (in document order) with the page of its h1 in the printed outline. */
async function sectionStartPages(page: Page, pdf: Uint8Array): Promise<Record<string, number>> {
  const ids = await page.$$eval('[data-pack-section]', (sections) => sections.map((s) => s.id));
  const pages = await headingPages(pdf);
  if (pages.length !== ids.length) {
    throw new Error(`review pack: ${ids.length} sections but ${pages.length} top-level headings in the printed outline; each section needs exactly one h1`);
  }
  return Object.fromEntries(ids.map((id, i) => [id, pages[i]]));
}

function sameNumbers(a: Record<string, number>, b: Record<string, number>): boolean {
  return Object.keys(a).every((k) => a[k] === b[k]) && Object.keys(a).length === Object.keys(b).length;
}

