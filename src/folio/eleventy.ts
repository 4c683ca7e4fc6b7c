// Rendering the site's pages with eleventy from the package's templates/, given the computed data.

import { join } from 'node:path';
import Eleventy from '@11ty/eleventy';
import { PACKAGE_ROOT } from '../version.js';

export const TEMPLATES_DIR = join(PACKAGE_ROOT, 'templates');

/** The pagination data of the template that writes one page per part. */
const PART_PAGES = 'folio.parts';

export interface RenderOptions {
  /** Write the pages of only these parts (the others are carried over from the last build); default: all. */
  partPages?: ReadonlySet<string>;
}

/** Eleventy's config API as used here (src/types/eleventy.d.ts declares only addGlobalData). */
interface EleventyConfig {
  addGlobalData(name: string, value: unknown): void;
  addPreprocessor(name: string, extensions: string, callback: (data: { pagination?: { data?: string; before?: unknown } }) => void): void;
}

/** Render every template into `outDir` with `folio` as global data. Resolves to the count of pages written. */
export async function renderPages(outDir: string, folio: unknown, options: RenderOptions = {}): Promise<number> {
  const { partPages } = options;
  const eleventy = new Eleventy(TEMPLATES_DIR, outDir, {
    configPath: join(PACKAGE_ROOT, '.eleventy.js'),
    quietMode: true,
    config(declared) {
      const config = declared as EleventyConfig;
      config.addGlobalData('folio', folio);
      if (partPages) {
        // Every other page still reads all parts; only the paging over them is narrowed (eleventy's
        // documented `pagination.before` hook, set on the template's data before it is paged).
        config.addPreprocessor('part-pages-to-write', 'njk', (data) => {
          if (data.pagination?.data === PART_PAGES) {
            data.pagination.before = (items: { id: string }[]) => items.filter((p) => partPages.has(p.id));
          }
        });
      }
    },
  });
  // zfolio reports its own progress and summary.
  eleventy.disableLogger();
  const results = (await eleventy.write()) as unknown;
  // eleventy.write() resolves to [passthroughCopies, templateResults].
  const written = Array.isArray(results) ? (results as unknown[]).flat().filter((r) => r && typeof r === 'object' && 'outputPath' in (r as object)) : [];
  return written.length;
}
