// A library folder: folio.yaml and every part file under parts/, read and checked as a whole.

import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { DiagnosticList, type Diagnostic } from './diagnostics.js';
import { readPart, type Part } from './part.js';
import { readPlan, uniqueRails, type Plan } from './plan.js';
import { comparisonKey, readComparison, type Comparison } from './comparison.js';
import { readReview, type Review } from './review.js';
import { DEFAULT_SETTINGS, readSettings, type FolioSettings } from './settings.js';
import { parseYamlSource, type SourceFile } from './source.js';

export interface Library {
  /** Absolute path of the library folder. */
  root: string;
  settings: FolioSettings;
  /** In file-path order. */
  parts: Part[];
  partsById: ReadonlyMap<string, Part>;
  /** Every file read, in path order, for hashes and appendices. */
  sources: SourceFile[];
  /** plans/*.yaml (rail decoupling plans), in path order; empty when there is no plans/ folder. */
  plans: Plan[];
  /** comparisons/*.yaml, in path order. */
  comparisons: Comparison[];
  /** reviews/*.yaml, in path order. */
  reviews: LibraryReview[];
}

/** A review as the library holds it: its comparisons and plans resolved. */
export type LibraryReview = Review<Comparison, Plan>;

export interface LoadResult {
  /** Present when the library has no errors (warnings allowed). */
  library?: Library;
  diagnostics: Diagnostic[];
}

const YAML_FILE = /\.ya?ml$/i;

/** YAML files under `dir` at any depth, as library-relative paths with forward slashes, sorted. */
export function yamlFilesUnder(root: string, dir: string): string[] {
  const absolute = join(root, dir);
  if (!existsSync(absolute)) return [];
  const out: string[] = [];
  const walk = (folder: string) => {
    for (const entry of readdirSync(folder, { withFileTypes: true })) {
      if (entry.name.startsWith('.')) continue;
      const path = join(folder, entry.name);
      if (entry.isDirectory()) walk(path);
      else if (entry.isFile() && YAML_FILE.test(entry.name)) out.push(relative(root, path).split(sep).join('/'));
    }
  };
  walk(absolute);
  return out.sort();
}

export function loadLibrary(root: string): LoadResult {
  const diagnostics = new DiagnosticList();
  const sources: SourceFile[] = [];
  const read = (path: string): SourceFile | undefined => {
    const text = readFileSync(join(root, path), 'utf8');
    const source = parseYamlSource(path, text, diagnostics);
    if (source) sources.push(source);
    return source;
  };

  let settings: FolioSettings | undefined = { ...DEFAULT_SETTINGS };
  if (existsSync(join(root, 'folio.yaml'))) {
    const source = read('folio.yaml');
    settings = source ? readSettings({ source, diagnostics }) : undefined;
  }

  if (!existsSync(join(root, 'parts')) || !statSync(join(root, 'parts')).isDirectory()) {
    diagnostics.error({ file: 'parts', line: 1, column: 1 }, 'no parts/ folder in the library; each part is a YAML file under parts/');
  }
  const parts: Part[] = [];
  const partsById = new Map<string, Part>();
  const idsIgnoringCase = new Map<string, Part>();
  for (const path of yamlFilesUnder(root, 'parts')) {
    const source = read(path);
    if (!source) continue;
    const part = readPart({ source, diagnostics });
    if (!part) continue;
    const earlier = partsById.get(part.id) ?? idsIgnoringCase.get(part.id.toLowerCase());
    if (earlier) {
      const how = earlier.id === part.id ? `duplicate id "${part.id}"` : `id "${part.id}" differs from "${earlier.id}" only in letter case, and their pages would collide on many file systems`;
      diagnostics.error(part.at, `${how}: already defined at ${earlier.at.file}:${earlier.at.line}:${earlier.at.column}`);
      continue;
    }
    partsById.set(part.id, part);
    idsIgnoringCase.set(part.id.toLowerCase(), part);
    parts.push(part);
  }

  const comparisons: Comparison[] = [];
  for (const path of yamlFilesUnder(root, 'comparisons')) {
    const source = read(path);
    const comparison = source && readComparison({ source, diagnostics }, partsById, parts);
    if (comparison) comparisons.push(comparison);
  }

  const planned: Plan[] = [];
  for (const path of yamlFilesUnder(root, 'plans')) {
    const source = read(path);
    const plan = source && readPlan({ source, diagnostics }, partsById, (settings ?? DEFAULT_SETTINGS).derating);
    if (plan) planned.push(plan);
  }
  const plans = uniqueRails(planned, diagnostics);

  const reviews: LibraryReview[] = [];
  const targets = {
    parts: partsById,
    comparisons: new Map(comparisons.map((c) => [comparisonKey(c), c])),
    plans: new Map(plans.map((p) => [p.rail, p])),
  };
  for (const path of yamlFilesUnder(root, 'reviews')) {
    const source = read(path);
    const review = source && readReview({ source, diagnostics }, targets);
    if (review) reviews.push(review);
  }

  const sorted = diagnostics.sorted();
  if (diagnostics.errorCount > 0 || !settings) return { diagnostics: sorted };
  return { library: { root, settings, parts, partsById, sources, comparisons, plans, reviews }, diagnostics: sorted };
}
