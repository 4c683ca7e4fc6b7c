// Printing folio pages to PDF with the system Chromium: page furniture (running head, page x of y, build
// date, source hash) from Chromium's header and footer templates, document metadata set with pdf-lib.

import type { Page } from 'puppeteer-core';
import { ParseSpeeds, PDFArray, PDFDict, PDFDocument, PDFName, PDFRef } from 'pdf-lib';
import type { PaperSize } from '../model/settings.js';
import { VERSION } from '../version.js';
import { escapeXml } from '../present/escape.js';

export interface PdfMetadata {
  title: string;
  subject: string;
  keywords?: string[];
}

export interface PageFurniture {
  /** Left of the running head: the library's title. */
  headLeft: string;
  /** Right of the running head: the part id or review title. */
  headRight: string;
  /** Left of the footer, e.g. "built 2026-12-01 · sha256:1a2b…". */
  footLeft: string;
}

// Margins leave room for the furniture Chromium draws inside them.
const MARGIN = { top: '14mm', bottom: '13mm', left: '15mm', right: '15mm' };

const furnitureStyle = 'font-family: DejaVu Sans, Liberation Sans, Helvetica, Arial, sans-serif; font-size: 7.5pt; color: #4a515c; width: 100%; margin: 0 15mm; display: flex; justify-content: space-between;';

function headerTemplate(f: PageFurniture): string {
  return `<div style="${furnitureStyle} border-bottom: 0.5pt solid #9aa1ab; padding-bottom: 1.5mm;"><span>${escapeXml(f.headLeft)}</span><span style="font-weight: bold; color: #1b1e23;">${escapeXml(f.headRight)}</span></div>`;
}

function footerTemplate(f: PageFurniture): string {
  return `<div style="${furnitureStyle}"><span>${escapeXml(f.footLeft)}</span><span>page <span class="pageNumber"></span> of <span class="totalPages"></span></span></div>`;
}

/** Print the page currently loaded in `page`. */
export async function printLoadedPage(page: Page, paper: PaperSize, furniture: PageFurniture): Promise<Uint8Array> {
  return page.pdf({
    format: paper === 'Letter' ? 'letter' : 'a4',
    printBackground: true,
    displayHeaderFooter: true,
    headerTemplate: headerTemplate(furniture),
    footerTemplate: footerTemplate(furniture),
    margin: MARGIN,
    preferCSSPageSize: false,
    tagged: true,
    outline: true,
  });
}

/** Load a page (a file: URL of the built site) ready for printing: print media, fonts settled. */
export async function loadForPrint(page: Page, url: string): Promise<void> {
  await page.emulateMediaType('print');
  await page.goto(url, { waitUntil: 'load' });
  // Links between the site's files would become PDF links to the build's own folder, which is gone once the
  // site is in place; only links within the document (the pack's contents) stay live in print.
  await page.evaluate(() => {
    document.querySelectorAll('a[href]').forEach((a) => {
      if (!a.getAttribute('href')!.startsWith('#')) a.removeAttribute('href');
    });
    return document.fonts.ready.then(() => undefined);
  });
}

/**
 * pdf-lib by default stops every 100 objects read (50 written) to wait for a timer tick, which for a printed
 * page of vector charts (thousands of objects) is mostly waiting; these files are ours and in memory, so it
 * reads and writes them in one go. The bytes written are the same.
 */
const loadAtOnce = (pdf: Uint8Array) => PDFDocument.load(pdf, { updateMetadata: false, parseSpeed: ParseSpeeds.Fastest });

/** The 1-based page of each top-level heading in a PDF's outline, in outline order. */
export async function headingPages(pdf: Uint8Array): Promise<number[]> {
  const doc = await loadAtOnce(pdf);
  const pageRefs = doc.getPages().map((p) => p.ref);
  const outlines = doc.catalog.lookupMaybe(PDFName.of('Outlines'), PDFDict);
  const out: number[] = [];
  let item = outlines?.lookupMaybe(PDFName.of('First'), PDFDict);
  while (item) {
    const dest = item.lookupMaybe(PDFName.of('Dest'), PDFArray);
    const target = dest?.get(0);
    const index = target instanceof PDFRef ? pageRefs.indexOf(target) : -1;
    out.push(index + 1);
    item = item.lookupMaybe(PDFName.of('Next'), PDFDict);
  }
  return out;
}

export async function pageCount(pdf: Uint8Array): Promise<number> {
  return (await loadAtOnce(pdf)).getPageCount();
}

/**
 * Set title, subject, keywords, creator and producer; dates come from `date` so reruns agree. Resolves to
 * the finished file and its page count.
 */
export async function withMetadata(pdf: Uint8Array, meta: PdfMetadata, date: Date): Promise<{ bytes: Uint8Array; pages: number }> {
  const doc = await loadAtOnce(pdf);
  doc.setTitle(meta.title, { showInWindowTitleBar: true });
  doc.setSubject(meta.subject);
  if (meta.keywords) doc.setKeywords(meta.keywords);
  doc.setCreator(`zfolio ${VERSION}`);
  doc.setProducer(`zfolio ${VERSION} (Chromium print, pdf-lib)`);
  doc.setCreationDate(date);
  doc.setModificationDate(date);
  return { bytes: await doc.save({ useObjectStreams: false, objectsPerTick: Infinity }), pages: doc.getPageCount() };
}

/** True for a PDF that zfolio made (its creator says so); false for anything else, a broken file included. */
export async function madeByZfolio(bytes: Uint8Array): Promise<boolean> {
  try {
    const doc = await PDFDocument.load(bytes, { updateMetadata: false, ignoreEncryption: true });
    return /^zfolio\b/.test(doc.getCreator() ?? '');
  } catch {
    return false;
  }
}
