// Rendering the site's pages with eleventy from the package's templates/, given the computed data.

import { readdirSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import './eleventy-resolver.js';
import Eleventy from '@11ty/eleventy';
import { PACKAGE_ROOT } from '../version.js';
import type { FolioData, FolioHeader, PartPageData } from '../pages/site-data.js';
import { collectGarbage } from './collect-garbage.js';
import type { PageCharts } from './svg-spill.js';

export const TEMPLATES_DIR = join(PACKAGE_ROOT, 'templates');

/**
 * Part pages rendered by one eleventy run. A run holds every page it renders, with its data and its HTML,
 * until it ends (its result lists them all): all of a 10,000-part library's pages at once took more memory
 * than the rest of the build. A build renders its part pages in runs as they are ready (part-page-runs.ts,
 * renderPartPages) and the other pages last (renderPages with no part pages); renderPages renders every
 * other page in its first run and part pages only in the runs after it, the other templates ignored.
 */
export const PART_PAGES_PER_RUN = 500;

/** The template that makes the part pages (paginated over `folio.partPages`). */
const PART_TEMPLATE = 'part.njk';

/**
 * Render every template into `outDir` with `folio` as global data. Resolves to the count of pages written.
 * With `charts`, the part pages' charts are loaded for the run that renders them and let go after it.
 */
export async function renderPages(outDir: string, folio: FolioData, perRun = PART_PAGES_PER_RUN, charts?: PageCharts): Promise<number> {
  const pages = folio.partPages;
  let written = 0;
  for (let i = 0; i === 0 || i < pages.length; i += perRun) {
    const run = pages.slice(i, i + perRun);
    charts?.load(run);
    try {
      written += await prepareRun(outDir, i > 0)({ ...folio, partPages: run });
    } finally {
      charts?.unload(run);
    }
    // What the run let go of is collected before the next run (collect-garbage.ts says why).
    if (i + perRun < pages.length) collectGarbage();
  }
  return written;
}

/**
 * Render part pages only (every other template ignored), with the site header as their global data: a part
 * page reads only its own part and the header, so it can be rendered before the rest of the site is known
 * (part-page-runs.ts). Resolves to the count of pages written.
 */
export async function renderPartPages(outDir: string, header: FolioHeader, pages: PartPageData[], charts?: PageCharts): Promise<number> {
  return preparePartPages(outDir, header, charts)(pages);
}

/** A run of part pages whose eleventy is made and started before its pages are known (preparePartPages). */
export type PreparedPartPages = (pages: PartPageData[]) => Promise<number>;

/**
 * A run of part pages (as renderPartPages) whose eleventy is made and started now: its configuration read,
 * its templates found. Started while the build's thread would wait for the chart workers, that start (some 30
 * to 130 ms a run) is off the time of the run once its pages are drawn.
 */
export function preparePartPages(outDir: string, header: FolioHeader, charts?: PageCharts): PreparedPartPages {
  const run = prepareRun(outDir, true);
  return async (pages) => {
    charts?.load(pages);
    try {
      return await run({ ...header, partPages: pages });
    } finally {
      charts?.unload(pages);
    }
  };
}

/** The page templates at the top of templates/ other than the part page's. */
function otherTemplates(): string[] {
  return readdirSync(TEMPLATES_DIR).filter((name) => name.endsWith('.njk') && name !== PART_TEMPLATE);
}

type RunData = FolioData | (FolioHeader & Pick<FolioData, 'partPages'>);

/** An eleventy made and started now, which renders once it is given its global data. */
function prepareRun(outDir: string, partPagesOnly: boolean): (folio: RunData) => Promise<number> {
  let data: RunData | undefined;
  // The templates by their path from the current folder: given as an absolute path outside it, eleventy's file
  // search starts at the file system's root and reads every folder above the current one on the way (the
  // library's parent folder, whatever its size, for each run); from "../" paths it starts at their common folder.
  const eleventy = new Eleventy(relative(process.cwd(), TEMPLATES_DIR) || '.', outDir, {
    configPath: join(PACKAGE_ROOT, '.eleventy.js'),
    quietMode: true,
    config(config) {
      // Read when the run renders: the data is given after the start.
      config.addGlobalData('folio', () => data);
      // eleventy matches an ignore against the template's path from the current folder, which starts with ../
      // when the templates are not under it (zfolio run from anywhere but its own folder): there a pattern
      // `**/name` matches nothing, so each template is ignored by its own path from the current folder.
      if (partPagesOnly) for (const name of otherTemplates()) config.ignores.add(relative(process.cwd(), join(TEMPLATES_DIR, name)).split(sep).join('/'));
    },
  });
  // zfolio reports its own progress and summary.
  eleventy.disableLogger();
  const started = eleventy.init();
  // A start that fails is reported by the run, if there is one.
  started.catch(() => {});
  return async (folio) => {
    data = folio;
    await started;
    const results = (await eleventy.write()) as unknown;
    // eleventy.write() resolves to [passthroughCopies, templateResults].
    const written = Array.isArray(results) ? (results as unknown[]).flat().filter((r) => r && typeof r === 'object' && 'outputPath' in (r as object)) : [];
    return written.length;
  };
}
