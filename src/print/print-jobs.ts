// Which PDFs a build prints: a datasheet per part and a pack per review, with their metadata and the page
// furniture (running head, footer with build date and source hash).

import { join } from 'node:path';
import type { Library } from '../model/library.js';
import { partPdfPath, reviewPdfPath } from '../pages/site-paths.js';
import type { PrintJob } from './print.js';
import type { FolioData } from '../pages/site-data.js';

/** $SOURCE_DATE_EPOCH (seconds) when set, as reproducible-build tools expect; else now. */
export function buildDate(env: Readonly<Record<string, string | undefined>>): Date {
  const epoch = Number(env.SOURCE_DATE_EPOCH);
  return env.SOURCE_DATE_EPOCH && Number.isFinite(epoch) ? new Date(epoch * 1000) : new Date();
}

export interface PrintSelection {
  /** Part ids to print; undefined: all. */
  parts?: ReadonlySet<string>;
  /** Review slugs to print; undefined: all. */
  reviews?: ReadonlySet<string>;
  /** Rail names whose plan to print on its own; undefined: none (a build prints plans inside review packs). */
  plans?: ReadonlySet<string>;
}

export const planPdfPath = (slug: string) => `pdf/plans/${slug}.pdf`;

export function printJobsFor(library: Library, folio: FolioData, siteDir: string, date: Date, selection: PrintSelection = {}): PrintJob[] {
  const day = date.toISOString().slice(0, 10);
  const libraryTitle = library.settings.title;
  const parts = folio.parts.filter((p) => !selection.parts || selection.parts.has(p.id));
  const reviews = folio.reviews.filter((r) => !selection.reviews || selection.reviews.has(r.slug));
  const plans = folio.plans.filter((p) => selection.plans?.has(p.rail));
  return [
    ...reviews.map((r) => ({
      htmlFile: join(siteDir, 'reviews', r.slug, 'pack.html'),
      pdfFile: join(siteDir, reviewPdfPath(r.slug)),
      meta: {
        title: `Review pack: ${r.title}`,
        subject: `Design review of ${r.board}, ${r.date}: ${r.coverText}; from ${libraryTitle}`,
        keywords: ['design review', r.board],
      },
      furniture: { headLeft: libraryTitle, headRight: `Review · ${r.title}`, footLeft: `built ${day} · ${r.sourceFile} · ${r.date}` },
      pack: true,
    })),
    ...plans.map((p) => ({
      htmlFile: join(siteDir, 'plans', p.slug, 'index.html'),
      pdfFile: join(siteDir, planPdfPath(p.slug)),
      meta: {
        title: `Rail plan ${p.rail} — ${p.title}`,
        subject: `Decoupling plan of rail ${p.rail} against its target impedance, from ${libraryTitle}`,
        keywords: ['rail plan', p.rail],
      },
      furniture: { headLeft: libraryTitle, headRight: `Rail plan ${p.rail}`, footLeft: `built ${day} · ${p.sourceFile} · sha256:${p.sourceHash}` },
      pack: false,
    })),
    ...parts.map((p) => ({
      htmlFile: join(siteDir, 'parts', p.id, 'index.html'),
      pdfFile: join(siteDir, partPdfPath(p.id)),
      meta: {
        title: `${p.id} — ${p.title}`,
        subject: `Impedance datasheet of ${p.id} (${p.text.kindLabel.toLowerCase()}), from ${libraryTitle}`,
        keywords: [p.kind, ...p.tagsText.split(', ').filter(Boolean)],
      },
      furniture: { headLeft: libraryTitle, headRight: p.id, footLeft: `built ${day} · ${p.sourceFile} · sha256:${p.sourceHash}` },
      pack: false,
    })),
  ];
}
