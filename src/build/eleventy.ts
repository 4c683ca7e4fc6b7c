// Rendering the site's pages with eleventy from the package's templates/, given the computed data.

import { join } from 'node:path';
import Eleventy from '@11ty/eleventy';
import { PACKAGE_ROOT } from '../version.js';

export const TEMPLATES_DIR = join(PACKAGE_ROOT, 'templates');

/** Render every template into `outDir` with `folio` as global data. Resolves to the count of pages written. */
export async function renderPages(outDir: string, folio: unknown): Promise<number> {
  const eleventy = new Eleventy(TEMPLATES_DIR, outDir, {
    configPath: join(PACKAGE_ROOT, '.eleventy.js'),
    quietMode: true,
    config(config) {
      config.addGlobalData('folio', folio);
    },
  });
  // zfolio reports its own progress and summary.
  eleventy.disableLogger();
  const results = (await eleventy.write()) as unknown;
  // eleventy.write() resolves to [passthroughCopies, templateResults].
  const written = Array.isArray(results) ? (results as unknown[]).flat().filter((r) => r && typeof r === 'object' && 'outputPath' in (r as object)) : [];
  return written.length;
}
